import { subMinutes } from 'date-fns';
import { UserSchema, UserTokenSchema } from '@/entities';
import { AppError } from '../../errors';
import { queueVerification } from './sign-up';
import type { Work } from '../../unit-of-work';

export async function resendVerification({ em, effects, userId }: Work & { userId: string }) {
  const user = await em.findOneOrFail(UserSchema, { id: userId });
  if (user.emailVerifiedAt) return { alreadyVerified: true };
  const recent = await em.count(UserTokenSchema, { user: userId, kind: 'verify-email', createdAt: { $gte: subMinutes(new Date(), 1) } });
  if (recent) throw new AppError('rate-limited', 'A confirmation e-mail was sent less than a minute ago; please check your inbox.');
  queueVerification({ em, effects }, user);
  return { alreadyVerified: false };
}
