'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';

/**
 * A `<details>` whose content is rendered only once it is first opened (and kept after, so a half-filled form
 * survives closing it). Pages carry many closed edit forms: rendering each on every request cost more than the
 * rest of the page (measured on the asset page, `npm run bench`). Without JavaScript the content does not appear;
 * the app's tables and forms need it anyway.
 */
export function Disclosure({ summary, children, className, summaryClassName = 'cursor-pointer text-sm text-tide-600', defaultOpen = false, id }: { summary: ReactNode; children: ReactNode; className?: string; summaryClassName?: string; defaultOpen?: boolean; id?: string }) {
  const [open, setOpen] = useState(defaultOpen);
  const [rendered, setRendered] = useState(defaultOpen);
  const ref = useRef<HTMLDetailsElement>(null);
  // Opened before the page came to life (a click while it loaded): the toggle event was missed, so catch up.
  useEffect(() => {
    if (ref.current?.open) {
      setOpen(true);
      setRendered(true);
    }
  }, []);
  return (
    <details
      ref={ref}
      id={id}
      className={className}
      open={open}
      onToggle={(event) => {
        const isOpen = event.currentTarget.open;
        setOpen(isOpen);
        if (isOpen) setRendered(true);
      }}
    >
      <summary className={summaryClassName}>{summary}</summary>
      {rendered ? children : null}
    </details>
  );
}
