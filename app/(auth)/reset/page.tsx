import type { Metadata } from 'next';
import { RequestResetForm } from '@/components/auth/reset-forms';

export const metadata: Metadata = { title: 'Reset password' };

export default function ResetPage() {
  return (
    <>
      <h1 className="mb-1 text-xl font-semibold">Reset your password</h1>
      <p className="mb-4 text-sm text-ink-soft">Enter the address you sign in with; we e-mail you a link.</p>
      <RequestResetForm />
    </>
  );
}
