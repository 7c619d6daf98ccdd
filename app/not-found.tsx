import Link from 'next/link';

export default function NotFound() {
  return (
    <main id="content" tabIndex={-1} className="mx-auto max-w-xl px-6 py-24 text-center outline-none">
      <p className="text-xs font-semibold uppercase tracking-[0.18em] text-brass-700">Not found</p>
      <h1 className="mt-2 text-2xl font-semibold">There is nothing at this address.</h1>
      <p className="mt-2 text-sm text-ink-soft">It may have been moved, or it belongs to an organisation you are not a member of.</p>
      <Link href="/" className="mt-6 inline-block text-sm text-tide-600 underline">
        Back to the start
      </Link>
    </main>
  );
}
