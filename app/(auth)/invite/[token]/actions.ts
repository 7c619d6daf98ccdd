'use server';
import { redirect } from 'next/navigation';
import { publicAction } from '@/lib/server/action';
import { AppError } from '@/lib/server/errors';
import { startSession } from '@/lib/server/auth/session';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/server/services/team/accept-invitation';

export const acceptInvitationAction = publicAction(async ({ em, ip, user }, formData) => {
  if (!user) throw new AppError('unauthenticated', 'Sign in first, then accept the invitation.');
  const organisation = await acceptInvitationAsUser({ em, ip, user, input: { token: formData.get('token') } });
  redirect(`/o/${organisation.slug}`);
});

export const acceptInvitationNewUserAction = publicAction(async ({ em, effects, ip }, formData) => {
  const { user, organisation } = await acceptInvitationAsNewUser({ em, ip, input: { token: formData.get('token'), name: formData.get('name'), password: formData.get('password') } });
  // The session row refers to the new user, so it is written once the account is committed.
  effects.onCommit(() => startSession(user.id));
  redirect(`/o/${organisation.slug}`);
});
