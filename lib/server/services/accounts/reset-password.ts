import type { EntityManager } from '@mikro-orm/postgresql';
import { SessionSchema } from '@/entities';
import { resetPasswordSchema } from '@/lib/schemas/accounts';
import { hashPassword } from '../../auth/password';
import { auditEvent } from '../../audit';
import { consumeUserToken, retireUserTokens } from './use-user-token';

/**
 * Sets a new password from an e-mailed token (used once, however many tabs submit it at the same time),
 * retires every other reset link of the user and signs the user out everywhere; the caller sends them to sign in.
 */
export async function resetPassword({ em, input, ip }: { em: EntityManager; input: unknown; ip?: string | null }) {
  const { token, password } = resetPasswordSchema.parse(input);
  const { user } = await consumeUserToken(em, 'reset-password', token);
  await retireUserTokens(em, user.id, 'reset-password');
  user.passwordHash = await hashPassword(password);
  // The link proved the mailbox, so the address counts as confirmed.
  user.emailVerifiedAt ??= new Date();
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.password-reset', ipAddress: ip });
  await em.nativeDelete(SessionSchema, { user: user.id });
  return user;
}
