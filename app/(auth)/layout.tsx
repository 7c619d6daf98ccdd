import Link from 'next/link';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-sunk px-4 py-12">
      <Link href="/" className="mb-6 text-lg font-semibold tracking-tight text-tide-700">
        Tidewarden
      </Link>
      <main className="w-full max-w-sm rounded-[4px] border border-rule bg-paper-raised p-6 shadow-sm">{children}</main>
    </div>
  );
}
