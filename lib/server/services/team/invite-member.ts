import { addDays } from 'date-fns';
import { InvitationSchema, MembershipSchema, UserSchema } from '@/entities';
import { inviteMemberSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { newToken, hashToken } from '../../tokens';
import { enqueueMail } from '../../mail/outbox';
import { invitationMail } from '../../mail/templates';
import { audit } from '../../audit';
import { getEnv } from '../../env';
import { ROLE_LABELS } from '../../permissions';
import { invitationMailKey } from '@/lib/labels';
import { requirePermission, type OrgContext } from '../../org-context';
import { lockRow } from '../../sql';
import { LIMITS, takeOrRefuse } from '../../auth/rate-limit';

export const INVITATION_DAYS = 7;

export async function inviteMember(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const { email, role } = inviteMemberSchema.parse(input);
  const { em, organisation } = ctx;
  // Invitations of one organisation are made one at a time: one live invitation per address (also a unique index).
  await lockRow(em, 'organisation', organisation.id);
  await takeOrRefuse(LIMITS.inviteAddress, ctx.ip ?? 'unknown', (wait) => `Too many invitations from your network. Wait ${wait} and try again.`);
  await takeOrRefuse(LIMITS.inviteEmail, `${organisation.id}|${email}`, (wait) => `Too many invitations to ${email}. Wait ${wait} before sending another.`);
  const existingUser = await em.findOne(UserSchema, { email });
  if (existingUser && (await em.count(MembershipSchema, { organisation, user: existingUser }))) {
    throw new AppError('conflict', 'That person is already a member.', { email: ['That person is already a member of this organisation.'] });
  }
  // A new invitation replaces any open one for the same address.
  await em.nativeUpdate(InvitationSchema, { organisation, email, acceptedAt: null, revokedAt: null }, { revokedAt: new Date() });
  const token = newToken();
  const invitation = em.create(InvitationSchema, {
    organisation,
    email,
    role,
    tokenHash: hashToken(token),
    invitedBy: em.getReference(UserSchema, ctx.user.id),
    expiresAt: addDays(new Date(), INVITATION_DAYS),
  });
  enqueueMail(ctx, { to: email, organisationId: organisation.id, dedupeKey: invitationMailKey(invitation.id), ...invitationMail(organisation.name, ctx.user.name, ROLE_LABELS[role], `${getEnv().APP_URL}/invite/${token}`) });
  audit(ctx, { action: 'member.invited', targetType: 'invitation', targetId: invitation.id, details: { email, role } });
  return { invitation, token };
}
