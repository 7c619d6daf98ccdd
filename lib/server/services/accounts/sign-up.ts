import { addHours } from 'date-fns';
import { UserSchema, UserTokenSchema, type User } from '@/entities';
import { signUpSchema } from '@/lib/schemas/accounts';
import { hashPassword } from '../../auth/password';
import { LIMITS, take, takeOrRefuse } from '../../auth/rate-limit';
import { newToken, hashToken } from '../../tokens';
import { enqueueMail } from '../../mail/outbox';
import { accountExistsMail, verifyEmailMail } from '../../mail/templates';
import { auditEvent } from '../../audit';
import { getEnv } from '../../env';
import type { Work } from '../../unit-of-work';

/**
 * Creates an unconfirmed account and mails the confirmation link. The requester is told the same thing
 * whether or not the address already has an account (the password is hashed either way, so the timing
 * matches too); the existing account's owner is mailed instead. Returns the new user, or null.
 */
export async function signUp({ em, effects, input, ip }: Work & { input: unknown; ip?: string | null }): Promise<User | null> {
  const data = signUpSchema.parse(input);
  if (ip) await takeOrRefuse(LIMITS.signUpAddress, ip, (wait) => `Too many sign-ups from your network. Wait ${wait} and try again.`);
  const passwordHash = await hashPassword(data.password);
  const existing = await em.findOne(UserSchema, { email: data.email });
  if (existing) {
    // A few such mails an hour at most, so the form cannot be used to flood someone's mailbox.
    if ((await take(LIMITS.mailToAddress, `sign-up|${data.email}`)).allowed) {
      const url = getEnv().APP_URL;
      enqueueMail({ em, effects }, { to: existing.email, ...accountExistsMail(existing.name, `${url}/sign-in`, `${url}/reset`) });
    }
    auditEvent(em, { actor: { id: null, email: data.email }, action: 'user.sign-up-for-existing-account', targetType: 'user', targetId: existing.id, ipAddress: ip });
    return null;
  }
  const user = em.create(UserSchema, { email: data.email, name: data.name, passwordHash, emailVerifiedAt: null });
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
