import { addHours } from 'date-fns';
import { UserSchema, UserTokenSchema } from '@/entities';
import { requestResetSchema } from '@/lib/schemas/accounts';
import { LIMITS, take, takeOrRefuse } from '../../auth/rate-limit';
import { newToken, hashToken } from '../../tokens';
import { enqueueMail } from '../../mail/outbox';
import { noAccountMail, resetPasswordMail } from '../../mail/templates';
import { auditEvent } from '../../audit';
import { getEnv } from '../../env';
import type { Work } from '../../unit-of-work';

/**
 * Always answers the same way and does the same work, so neither the answer nor its timing reveals which
 * addresses have accounts: the address is mailed either way, a reset link if it has an account and a note
 * that it has none otherwise. A few mails an hour per address at most; more requests are dropped quietly.
 */
export async function requestPasswordReset({ em, effects, input, ip }: Work & { input: unknown; ip?: string | null }) {
  const { email } = requestResetSchema.parse(input);
  if (ip) await takeOrRefuse(LIMITS.resetAddress, ip, (wait) => `Too many password reset requests from your network. Wait ${wait} and try again.`);
  const user = await em.findOne(UserSchema, { email });
  if (!(await take(LIMITS.mailToAddress, `reset|${email}`)).allowed) return;
  if (!user) {
    enqueueMail({ em, effects }, { to: email, ...noAccountMail(`${getEnv().APP_URL}/sign-up`) });
    auditEvent(em, { actor: { id: null, email }, action: 'user.password-reset-requested', details: { account: false }, ipAddress: ip });
    return;
  }
  const token = newToken();
  em.create(UserTokenSchema, { user, kind: 'reset-password', tokenHash: hashToken(token), expiresAt: addHours(new Date(), 1) });
  enqueueMail({ em, effects }, { to: user.email, ...resetPasswordMail(user.name, `${getEnv().APP_URL}/reset/${token}`) });
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.password-reset-requested', ipAddress: ip });
}
