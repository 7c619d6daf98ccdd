import type { EntityManager } from '@mikro-orm/postgresql';
import { InvitationSchema, UserSchema } from '@/entities';
import { AppError } from '../../errors';
import { hashToken } from '../../tokens';

/** The open invitation behind a link; unknown, used, revoked and expired links get one clear message each. */
export async function findOpenInvitationOrThrow(em: EntityManager, token: string) {
  const invitation = await em.findOne(InvitationSchema, { tokenHash: hashToken(token) }, { populate: ['organisation', 'invitedBy'] });
  if (!invitation) throw new AppError('not-found', 'This invitation link is not valid. Ask the organisation owner to invite you again.');
  if (invitation.acceptedAt) throw new AppError('invalid', 'This invitation was already accepted. Sign in to reach the organisation.');
  if (invitation.revokedAt) throw new AppError('invalid', 'This invitation was withdrawn. Ask the organisation owner for a new one.');
  if (invitation.expiresAt.getTime() <= Date.now()) throw new AppError('invalid', 'This invitation has expired. Ask the organisation owner for a new one.');
  return invitation;
}

/** What the invitation page shows: the open invitation and whether its address already has an account. */
export async function describeInvitation(em: EntityManager, token: string) {
  const invitation = await findOpenInvitationOrThrow(em, token);
  const hasAccount = (await em.count(UserSchema, { email: invitation.email })) > 0;
  return { invitation, hasAccount };
}
