import type { EntityManager } from '@mikro-orm/postgresql';
import { subMinutes } from 'date-fns';
import { SignInAttemptSchema, UserSchema } from '@/entities';
import { signInSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { burnVerifyTime, verifyPassword } from '../../auth/password';
import { auditEvent } from '../../audit';
import { getEm } from '../../db';
import { inSequence } from '../../sql';

export const SIGN_IN_WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_ADDRESS = 20;

/**
 * A refused sign-in must still count against the limits, although the refusal rolls the request's own
 * transaction back: the record is written through a connection of its own and commits on its own.
 */
async function recordRefusal(write: (em: EntityManager) => unknown) {
  const own = await getEm();
  write(own);
  await own.flush();
}

/** Checks the password, with failures limited per account and per client address over 15 minutes. */
export async function signIn({ em, input, ip }: { em: EntityManager; input: unknown; ip: string }) {
  const { email, password } = signInSchema.parse(input);
  const since = subMinutes(new Date(), SIGN_IN_WINDOW_MINUTES);
  const [accountFailures, addressFailures] = await inSequence(
    () => em.count(SignInAttemptSchema, { email, succeeded: false, createdAt: { $gte: since } }),
    () => em.count(SignInAttemptSchema, { ipAddress: ip, succeeded: false, createdAt: { $gte: since } }),
  );
  if (accountFailures >= MAX_FAILURES_PER_ACCOUNT || addressFailures >= MAX_FAILURES_PER_ADDRESS) {
    await recordRefusal((own) => auditEvent(own, { action: 'user.sign-in-locked', actor: { id: null, email }, details: { email, byAccount: accountFailures >= MAX_FAILURES_PER_ACCOUNT }, ipAddress: ip }));
    throw new AppError('rate-limited', `Too many failed sign-ins. Wait ${SIGN_IN_WINDOW_MINUTES} minutes and try again, or reset your password.`);
  }
  const user = await em.findOne(UserSchema, { email });
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await burnVerifyTime(password), false);
  if (!ok || !user) {
    await recordRefusal((own) => own.create(SignInAttemptSchema, { email, ipAddress: ip, succeeded: false }));
    throw new AppError('invalid', 'The e-mail address or password is not right.', { password: ['The e-mail address or password is not right.'] });
  }
  em.create(SignInAttemptSchema, { email, ipAddress: ip, succeeded: true });
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.signed-in', ipAddress: ip });
  return user;
}
