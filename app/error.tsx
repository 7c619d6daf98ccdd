'use client';

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main id="content" tabIndex={-1} className="mx-auto max-w-xl px-6 py-24 text-center outline-none">
      <p className="text-xs font-semibold uppercase tracking-[0.18em] text-state-action">Error</p>
      <h1 className="mt-2 text-2xl font-semibold">Something went wrong on our side.</h1>
      <p className="mt-2 text-sm text-ink-soft">Nothing you entered was changed by this error. Try again; if it repeats, tell your administrator.</p>
      <button onClick={reset} className="mt-6 rounded-[3px] border border-tide-700 bg-tide-600 px-3 py-1.5 text-sm text-white">
        Try again
      </button>
    </main>
  );
}
