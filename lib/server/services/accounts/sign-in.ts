import type { EntityManager } from '@mikro-orm/postgresql';
import { UserSchema } from '@/entities';
import { signInSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { burnVerifyTime, verifyPassword } from '../../auth/password';
import { LIMITS, MAX_DELAY_SECONDS, clear, giveBack, take, waitWords } from '../../auth/rate-limit';
import { auditEvent } from '../../audit';
import { getEm } from '../../db';

export const MAX_FAILURES_PER_PAIR = LIMITS.signInPair.points;
export const MAX_FAILURES_PER_ADDRESS = LIMITS.signInAddress.points;
export const FREE_ATTEMPTS_PER_ACCOUNT = LIMITS.signInAccount.points;

/** The wait before the n-th attempt past the free ones on an account: 1, 2, 4 … seconds, at most a minute. */
export const accountDelaySeconds = (past: number) => Math.min(2 ** Math.max(0, past - 1), MAX_DELAY_SECONDS);

/** The lock-out is audited although the refusal rolls the request back: through a connection of its own. */
async function auditLockOut(email: string, ip: string, details: Record<string, unknown>) {
  const own = await getEm();
  auditEvent(own, { action: 'user.sign-in-locked', actor: { id: null, email }, details: { email, ...details }, ipAddress: ip });
  await own.flush();
}

/**
 * Checks the password behind three limits, each counted atomically BEFORE the password is verified (so
 * simultaneous guesses cannot all slip past a count that has not been written yet):
 * - one address on one account: 5 failures, then that pair is blocked for 15 minutes; a success clears it.
 *   An attacker elsewhere therefore never locks the owner out;
 * - one address across accounts: 50 failures in 15 minutes (spraying one password over many accounts);
 * - one account from anywhere: after 5 attempts in 15 minutes, one attempt per gap, the gap doubling up to
 *   a minute (a slow-down, not a lock-out).
 * A success gives its address its count back and clears the counts of the pair and of the account.
 */
export async function signIn({ em, input, ip }: { em: EntityManager; input: unknown; ip: string }) {
  const { email, password } = signInSchema.parse(input);
  const pairKey = `${ip}|${email}`;

  const pair = await take(LIMITS.signInPair, pairKey);
  if (!pair.allowed) {
    if (pair.used === MAX_FAILURES_PER_PAIR + 1) await auditLockOut(email, ip, { by: 'address and account' });
    throw new AppError('rate-limited', `Too many failed sign-ins. Wait ${waitWords(pair.retryAfterSeconds)} and try again, or reset your password.`);
  }
  const address = await take(LIMITS.signInAddress, ip);
  if (!address.allowed) {
    if (address.used === MAX_FAILURES_PER_ADDRESS + 1) await auditLockOut(email, ip, { by: 'address' });
    throw new AppError('rate-limited', `Too many failed sign-ins from your network. Wait ${waitWords(address.retryAfterSeconds)} and try again.`);
  }
  const account = await take(LIMITS.signInAccount, email);
  if (!account.allowed) {
    const gate = await take(LIMITS.signInAccountGate, email, { windowSeconds: accountDelaySeconds(account.used - FREE_ATTEMPTS_PER_ACCOUNT) });
    if (!gate.allowed) {
      throw new AppError('rate-limited', `This account has had many failed sign-ins recently. Wait ${waitWords(gate.retryAfterSeconds)} and try again.`);
    }
  }

  const user = await em.findOne(UserSchema, { email });
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await burnVerifyTime(password), false);
  if (!ok || !user) {
    throw new AppError('invalid', 'The e-mail address or password is not right.', { password: ['The e-mail address or password is not right.'] });
  }
  await clear(LIMITS.signInPair, pairKey);
  await giveBack(LIMITS.signInAddress, ip);
  await clear(LIMITS.signInAccount, email);
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.signed-in', ipAddress: ip });
  return user;
}
