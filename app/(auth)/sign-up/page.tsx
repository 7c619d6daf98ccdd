import type { Metadata } from 'next';
import { SignUpForm } from '@/components/auth/sign-up-form';

export const metadata: Metadata = { title: 'Create an account' };

export default function SignUpPage() {
  return (
    <>
      <h1 className="mb-4 text-xl font-semibold">Create an account</h1>
      <SignUpForm />
    </>
  );
}
