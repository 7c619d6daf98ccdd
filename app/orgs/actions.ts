'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { AppError } from '@/lib/server/errors';
import { endSession } from '@/lib/server/auth/session';
import { createOrganisation } from '@/lib/server/services/accounts/create-organisation';
import { resendVerification } from '@/lib/server/services/accounts/resend-verification';

export const createOrganisationAction = publicAction(async ({ em, ip, user }, formData) => {
  if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
  const organisation = await createOrganisation({ em, ip, user, input: { name: formData.get('name') } });
  redirect(`/o/${organisation.slug}`);
});

export const resendVerificationAction = publicAction(async ({ em, effects, user }) => {
  if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
  const { alreadyVerified } = await resendVerification({ em, effects, userId: user.id });
  return { ok: true, message: alreadyVerified ? 'Your address is already confirmed.' : `A new confirmation link is on its way to ${user.email}.` };
});

export async function signOutAction() {
  await endSession();
  redirect('/sign-in');
}
