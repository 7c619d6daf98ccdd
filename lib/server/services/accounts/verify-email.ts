import type { EntityManager } from '@mikro-orm/postgresql';
import { auditEvent } from '../../audit';
import { consumeUserToken } from './use-user-token';

export async function verifyEmail({ em, token }: { em: EntityManager; token: string }) {
  const row = await consumeUserToken(em, 'verify-email', token);
  row.user.emailVerifiedAt ??= new Date();
  auditEvent(em, { actor: { id: row.user.id, email: row.user.email }, action: 'user.email-verified', targetType: 'user', targetId: row.user.id });
  return row.user;
}
