'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { startSession } from '@/lib/server/auth/session';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { kickOutbox } from '@/lib/server/mail/outbox';
import { getEm } from '@/lib/server/db';

export const signUpAction = publicAction(async ({ em, ip }, formData) => {
  const user = await signUp({ em, ip, input: { name: formData.get('name'), email: formData.get('email'), password: formData.get('password') } });
  kickOutbox(getEm);
  await startSession(user.id);
  redirect('/orgs');
});
