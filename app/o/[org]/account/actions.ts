'use server';
import { publicAction } from '@/lib/server/action';
import { AppError } from '@/lib/server/errors';
import { startSession } from '@/lib/server/auth/session';
import { changePassword } from '@/lib/server/services/accounts/change-password';

export const changePasswordAction = publicAction(async ({ em, effects, ip, user }, formData) => {
  if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
  await changePassword({ em, ip, userId: user.id, input: { currentPassword: formData.get('currentPassword'), password: formData.get('password') } });
  // Every session was ended by the change; keep this browser signed in with a new one.
  effects.onCommit(() => startSession(user.id));
  return { ok: true, message: 'Password changed. Every other device has been signed out.' };
});
