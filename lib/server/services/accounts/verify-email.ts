import type { EntityManager } from '@mikro-orm/postgresql';
import { auditEvent } from '../../audit';
import { consumeUserToken } from './use-user-token';

/** Confirms the address from the e-mailed link (used once, however many times it is submitted at once). */
export async function verifyEmail({ em, token }: { em: EntityManager; token: string }) {
  const { user } = await consumeUserToken(em, 'verify-email', token);
  user.emailVerifiedAt ??= new Date();
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.email-verified', targetType: 'user', targetId: user.id });
  return user;
}
