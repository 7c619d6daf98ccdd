'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { verifyEmail } from '@/lib/server/services/accounts/verify-email';

export const verifyEmailAction = publicAction(async ({ em }, formData) => {
  await verifyEmail({ em, token: String(formData.get('token') ?? '') });
  redirect('/orgs?verified=1');
});
