import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, UserSchema } from '@/entities';
import { acceptInvitationNewUserSchema, acceptInvitationSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { hashPassword } from '../../auth/password';
import { auditEvent } from '../../audit';
import type { CurrentUser } from '../../org-context';
import { hashToken } from '../../tokens';
import { findOpenInvitationOrThrow } from './find-invitation';

/**
 * Marks the invitation accepted with ONE conditional update: of simultaneous acceptances exactly one gets
 * the row; the others wait for its lock, then find it accepted and are refused.
 */
async function claimInvitation(em: EntityManager, token: string) {
  const rows: unknown[] = await em.execute(
    `update "invitation" set "accepted_at" = now()
      where "token_hash" = ? and "accepted_at" is null and "revoked_at" is null and "expires_at" > now()
      returning "id"`,
    [hashToken(token)],
  );
  if (rows.length !== 1) throw new AppError('invalid', 'This invitation was already accepted. Sign in to reach the organisation.');
}

/** An existing, signed-in user accepts; the invitation must be addressed to their e-mail. */
export async function acceptInvitationAsUser({ em, user, input, ip }: { em: EntityManager; user: CurrentUser; input: unknown; ip?: string | null }) {
  const { token } = acceptInvitationSchema.parse(input);
  const invitation = await findOpenInvitationOrThrow(em, token);
  if (invitation.email !== user.email) {
    throw new AppError('forbidden', `This invitation is for ${invitation.email}. Sign in with that address to accept it.`);
  }
  const already = await em.findOne(MembershipSchema, { organisation: invitation.organisation, user: user.id });
  await claimInvitation(em, token);
  if (!already) em.create(MembershipSchema, { organisation: invitation.organisation, user: em.getReference(UserSchema, user.id), role: invitation.role });
  const dbUser = await em.findOneOrFail(UserSchema, { id: user.id });
  dbUser.emailVerifiedAt ??= new Date(); // the link proved the mailbox
  auditEvent(em, { organisationId: invitation.organisation.id, actor: user, action: 'member.joined', targetType: 'invitation', targetId: invitation.id, details: { role: invitation.role }, ipAddress: ip });
  return invitation.organisation;
}

/** Someone without an account accepts: the account is created with the invited address, already confirmed. */
export async function acceptInvitationAsNewUser({ em, input, ip }: { em: EntityManager; input: unknown; ip?: string | null }) {
  const { token, name, password } = acceptInvitationNewUserSchema.parse(input);
  const invitation = await findOpenInvitationOrThrow(em, token);
  if (await em.count(UserSchema, { email: invitation.email })) {
    throw new AppError('conflict', `An account for ${invitation.email} already exists. Sign in to accept the invitation.`);
  }
  await claimInvitation(em, token);
  const user = em.create(UserSchema, { email: invitation.email, name, passwordHash: await hashPassword(password), emailVerifiedAt: new Date() });
  em.create(MembershipSchema, { organisation: invitation.organisation, user, role: invitation.role });
  auditEvent(em, { organisationId: invitation.organisation.id, actor: { id: user.id, email: user.email }, action: 'member.joined', targetType: 'invitation', targetId: invitation.id, details: { role: invitation.role, newAccount: true }, ipAddress: ip });
  return { user, organisation: invitation.organisation };
}
