import { addHours } from 'date-fns';
import { UserSchema, UserTokenSchema, type User } from '@/entities';
import { signUpSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { hashPassword } from '../../auth/password';
import { newToken, hashToken } from '../../tokens';
import { enqueueMail } from '../../mail/outbox';
import { verifyEmailMail } from '../../mail/templates';
import { auditEvent } from '../../audit';
import { getEnv } from '../../env';
import type { Work } from '../../unit-of-work';

export async function signUp({ em, effects, input, ip }: Work & { input: unknown; ip?: string | null }) {
  const data = signUpSchema.parse(input);
  if (await em.count(UserSchema, { email: data.email })) {
    throw new AppError('conflict', 'An account with this e-mail address already exists.', {
      email: ['An account with this e-mail address already exists. Sign in, or reset the password.'],
    });
  }
  const user = em.create(UserSchema, { email: data.email, name: data.name, passwordHash: await hashPassword(data.password), emailVerifiedAt: null });
  queueVerification({ em, effects }, user);
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.signed-up', targetType: 'user', targetId: user.id, ipAddress: ip });
  return user;
}

export function queueVerification({ em, effects }: Work, user: User) {
  const token = newToken();
  em.create(UserTokenSchema, { user, kind: 'verify-email', tokenHash: hashToken(token), expiresAt: addHours(new Date(), 24) });
  const mail = verifyEmailMail(user.name, `${getEnv().APP_URL}/verify/${token}`);
  enqueueMail({ em, effects }, { to: user.email, ...mail });
}
