'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { startSession } from '@/lib/server/auth/session';
import { verifyEmail } from '@/lib/server/services/accounts/verify-email';

export const verifyEmailAction = publicAction(async ({ em, effects, user: current }, formData) => {
  const user = await verifyEmail({ em, token: String(formData.get('token') ?? '') });
  // The link proved the mailbox: the browser that opened it is signed in as its owner (a new session).
  if (current?.id !== user.id) effects.onCommit(() => startSession(user.id));
  redirect('/orgs?verified=1');
});
