import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/components/auth/sign-in-form';
import { SignedInMark } from '@/components/offline/signed-in-mark';
import { getCurrentUser } from '@/lib/server/auth/session';
import { getEm } from '@/lib/server/db';
import { landingPath } from '@/lib/server/services/accounts/landing-path';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; reset?: string }> }) {
  const { next, reset } = await searchParams;
  const current = await getCurrentUser();
  if (current) redirect(await landingPath(await getEm(), current.id, next));
  return (
    <>
      <h1 className="mb-4 text-xl font-semibold">Sign in</h1>
      {reset ? <p className="mb-3 rounded-[3px] bg-state-soundbg px-3 py-2 text-sm text-state-sound">Your password was changed. Sign in with the new one.</p> : null}
      <SignInForm next={next} />
      <SignedInMark userId={null} />
    </>
  );
}
