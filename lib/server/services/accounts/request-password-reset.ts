import { addHours, subMinutes } from 'date-fns';
import { UserSchema, UserTokenSchema } from '@/entities';
import { requestResetSchema } from '@/lib/schemas/accounts';
import { newToken, hashToken } from '../../tokens';
import { enqueueMail } from '../../mail/outbox';
import { resetPasswordMail } from '../../mail/templates';
import { auditEvent } from '../../audit';
import { getEnv } from '../../env';
import type { Work } from '../../unit-of-work';

/** Always answers the same way, so the form does not reveal which addresses have accounts. */
export async function requestPasswordReset({ em, effects, input, ip }: Work & { input: unknown; ip?: string | null }) {
  const { email } = requestResetSchema.parse(input);
  const user = await em.findOne(UserSchema, { email });
  if (!user) return;
  const recent = await em.count(UserTokenSchema, { user: user.id, kind: 'reset-password', createdAt: { $gte: subMinutes(new Date(), 1) } });
  if (recent) return;
  const token = newToken();
  em.create(UserTokenSchema, { user, kind: 'reset-password', tokenHash: hashToken(token), expiresAt: addHours(new Date(), 1) });
  enqueueMail({ em, effects }, { to: user.email, ...resetPasswordMail(user.name, `${getEnv().APP_URL}/reset/${token}`) });
  auditEvent(em, { actor: { id: user.id, email: user.email }, action: 'user.password-reset-requested', ipAddress: ip });
}
