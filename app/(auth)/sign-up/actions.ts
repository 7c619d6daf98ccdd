'use server';
import { publicAction } from '@/lib/server/action';
import { answerNoSoonerThan, SIGN_UP_FLOOR_MS } from '@/lib/server/auth/even-timing';
import { signUp } from '@/lib/server/services/accounts/sign-up';

export const signUpAction = publicAction(async ({ em, effects, ip }, formData) => {
  answerNoSoonerThan(effects, SIGN_UP_FLOOR_MS);
  const email = String(formData.get('email') ?? '').trim();
  await signUp({ em, effects, ip, input: { name: formData.get('name'), email, password: formData.get('password') } });
  // The same answer (and timing) whether or not the address already has an account; its owner is mailed instead.
  return { ok: true, message: `Check your e-mail: we sent a message to ${email}. Open the link in it to confirm the address and sign in.` };
});
