import type { EntityManager } from '@mikro-orm/postgresql';
import { SessionSchema, UserSchema } from '@/entities';
import { changePasswordSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { hashPassword, verifyPassword } from '../../auth/password';
import { auditEvent } from '../../audit';

/** Changes the password and ends every session of the user; the caller opens a new one. */
export async function changePassword({ em, userId, input, ip }: { em: EntityManager; userId: string; input: unknown; ip?: string | null }) {
  const { currentPassword, password } = changePasswordSchema.parse(input);
  const user = await em.findOneOrFail(UserSchema, { id: userId });
  if (!(await verifyPassword(user.passwordHash, currentPassword))) {
    throw new AppError('invalid', 'The current password is not right.', { currentPassword: ['The current password is not right.'] });
  }
  user.passwordHash = await hashPassword(password);
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.password-changed', ipAddress: ip });
  await em.nativeDelete(SessionSchema, { user: user.id });
  return user;
}
