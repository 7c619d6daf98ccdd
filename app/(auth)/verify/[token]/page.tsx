import type { Metadata } from 'next';
import { TokenConfirmForm } from '@/components/auth/token-confirm-form';
import { verifyEmailAction } from './actions';

export const metadata: Metadata = { title: 'Confirm your e-mail' };

export default async function VerifyPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="mb-2 text-xl font-semibold">Confirm your e-mail address</h1>
      <p className="mb-4 text-sm text-ink-soft">Opening the link confirms it; if nothing happens, press the button.</p>
      <TokenConfirmForm token={token} label="Confirm my e-mail address" action={verifyEmailAction} submitOnOpen />
    </>
  );
}
