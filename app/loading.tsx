export default function Loading() {
  return (
    <div role="status" className="mx-auto max-w-xl px-6 py-24 text-center text-sm text-ink-faint">
      Loading…
    </div>
  );
}
