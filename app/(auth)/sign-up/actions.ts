'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { startSession } from '@/lib/server/auth/session';
import { signUp } from '@/lib/server/services/accounts/sign-up';

export const signUpAction = publicAction(async ({ em, effects, ip }, formData) => {
  const user = await signUp({ em, effects, ip, input: { name: formData.get('name'), email: formData.get('email'), password: formData.get('password') } });
  // The session row refers to the user, so it is written once the account is committed.
  effects.onCommit(() => startSession(user.id));
  redirect('/orgs');
});
