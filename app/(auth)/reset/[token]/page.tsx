import type { Metadata } from 'next';
import { ResetPasswordForm } from '@/components/auth/reset-forms';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function ResetTokenPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="mb-4 text-xl font-semibold">Choose a new password</h1>
      <ResetPasswordForm token={token} />
    </>
  );
}
