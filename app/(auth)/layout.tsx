import type { Metadata } from 'next';
import Link from 'next/link';
import { PUBLIC_METADATA } from '../public-metadata';

export const metadata: Metadata = PUBLIC_METADATA;

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-sunk px-3 py-8 sm:px-4 sm:py-12">
      <Link href="/" className="mb-6 text-lg font-semibold tracking-tight text-tide-700">
        Tidewarden
      </Link>
      <main id="content" tabIndex={-1} className="w-full max-w-sm rounded-[4px] border border-rule bg-paper-raised p-4 shadow-sm outline-none sm:p-6">{children}</main>
    </div>
  );
}
