import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, UserSchema } from '@/entities';
import { acceptInvitationNewUserSchema, acceptInvitationSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { hashPassword } from '../../auth/password';
import { auditEvent } from '../../audit';
import type { CurrentUser } from '../../org-context';
import { findOpenInvitationOrThrow } from './find-invitation';

/** An existing, signed-in user accepts; the invitation must be addressed to their e-mail. */
export async function acceptInvitationAsUser({ em, user, input, ip }: { em: EntityManager; user: CurrentUser; input: unknown; ip?: string | null }) {
  const { token } = acceptInvitationSchema.parse(input);
  const invitation = await findOpenInvitationOrThrow(em, token);
  if (invitation.email !== user.email) {
    throw new AppError('forbidden', `This invitation is for ${invitation.email}. Sign in with that address to accept it.`);
  }
  const already = await em.findOne(MembershipSchema, { organisation: invitation.organisation, user: user.id });
  if (!already) em.create(MembershipSchema, { organisation: invitation.organisation, user: em.getReference(UserSchema, user.id), role: invitation.role });
  invitation.acceptedAt = new Date();
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
  const user = em.create(UserSchema, { email: invitation.email, name, passwordHash: await hashPassword(password), emailVerifiedAt: new Date() });
  em.create(MembershipSchema, { organisation: invitation.organisation, user, role: invitation.role });
  invitation.acceptedAt = new Date();
  auditEvent(em, { organisationId: invitation.organisation.id, actor: { id: user.id, email: user.email }, action: 'member.joined', targetType: 'invitation', targetId: invitation.id, details: { role: invitation.role, newAccount: true }, ipAddress: ip });
  return { user, organisation: invitation.organisation };
}
