'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { answerNoSoonerThan, RESET_REQUEST_FLOOR_MS } from '@/lib/server/auth/even-timing';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { resetPassword } from '@/lib/server/services/accounts/reset-password';

export const requestResetAction = publicAction(async ({ em, effects, ip }, formData) => {
  // The same answer and the same timing whether or not the address has an account.
  answerNoSoonerThan(effects, RESET_REQUEST_FLOOR_MS);
  await requestPasswordReset({ em, effects, ip, input: { email: formData.get('email') } });
  return { ok: true, message: 'If an account exists for that address, a reset link is on its way. It works once, for one hour.' };
});

export const resetPasswordAction = publicAction(async ({ em, ip }, formData) => {
  await resetPassword({ em, ip, input: { token: formData.get('token'), password: formData.get('password') } });
  redirect('/sign-in?reset=1');
});
