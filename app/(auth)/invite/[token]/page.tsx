import type { Metadata } from 'next';
import Link from 'next/link';
import { getEm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { getCurrentUser } from '@/lib/server/auth/session';
import { describeInvitation } from '@/lib/server/services/team/find-invitation';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/server/permissions';
import { TokenConfirmForm } from '@/components/auth/token-confirm-form';
import { AcceptInvitationNewUserForm } from '@/components/auth/accept-invitation-form';
import { acceptInvitationAction } from './actions';

export const metadata: Metadata = { title: 'Invitation' };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const em = await getEm();
  let found;
  try {
    found = await describeInvitation(em, token);
  } catch (error) {
    if (!(error instanceof AppError)) throw error;
    return (
      <>
        <h1 className="mb-2 text-xl font-semibold">This invitation cannot be used</h1>
        <p role="alert" className="text-sm text-state-action">{error.message}</p>
        <Link href="/sign-in" className="mt-4 inline-block text-sm text-tide-600 underline">Sign in</Link>
      </>
    );
  }
  const user = await getCurrentUser();
  const { invitation, hasAccount } = found;
  return (
    <>
      <h1 className="mb-1 text-xl font-semibold">Join {invitation.organisation.name}</h1>
      <p className="mb-4 text-sm text-ink-soft">
        {invitation.invitedBy?.name ?? 'An owner'} invited <strong>{invitation.email}</strong> as <strong>{ROLE_LABELS[invitation.role]}</strong>: {ROLE_DESCRIPTIONS[invitation.role]}
      </p>
      {user ? (
        user.email === invitation.email ? (
          <TokenConfirmForm token={token} label="Accept the invitation" action={acceptInvitationAction} />
        ) : (
          <p role="alert" className="text-sm text-state-action">
            You are signed in as {user.email}. This invitation is for {invitation.email}: sign out, then open the link again.
          </p>
        )
      ) : hasAccount ? (
        <Link href={`/sign-in?next=${encodeURIComponent(`/invite/${token}`)}`} className="inline-block rounded-[3px] border border-tide-700 bg-tide-600 px-3 py-1.5 text-sm text-white no-underline">
          Sign in to accept
        </Link>
      ) : (
        <AcceptInvitationNewUserForm token={token} email={invitation.email} />
      )}
    </>
  );
}
