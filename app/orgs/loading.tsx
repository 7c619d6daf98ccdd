// Shown while the organisation list loads. Kept out of /o/[org] so that access checks there answer a real 404.
export default function Loading() {
  return (
    <div role="status" className="mx-auto max-w-xl px-6 py-24 text-center text-sm text-ink-faint">
      Loading…
    </div>
  );
}
