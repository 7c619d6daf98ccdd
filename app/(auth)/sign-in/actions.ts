'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { startSession } from '@/lib/server/auth/session';
import { signIn } from '@/lib/server/services/accounts/sign-in';
import { landingPath } from '@/lib/server/services/accounts/landing-path';

export const signInAction = publicAction(async ({ em, effects, ip }, formData) => {
  const user = await signIn({ em, ip, input: { email: formData.get('email'), password: formData.get('password') } });
  effects.onCommit(() => startSession(user.id));
  // Straight to the only organisation when there is one and no page asked for.
  redirect(await landingPath(em, user.id, formData.get('next')));
});
