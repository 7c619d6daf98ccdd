/**
 * The frame every wide table sits in: it scrolls sideways inside itself (never the page) and can be scrolled from
 * the keyboard (a named, focusable region); the first column stays in view while the rest scrolls past it.
 * The frame is positioned so that visually hidden text in a cell (sr-only, absolutely placed) is clipped with the
 * table instead of widening the page. The sticky cells take the background of their part of the table (`head`: the header row's), so the cells
 * scrolled under them do not show through. The classes are utilities of app/globals.css (table-frame…).
 */
// Written out whole: Tailwind generates only the classes it finds in the source text.
const HEAD = { sunk: 'table-frame-head-sunk', raised: 'table-frame-head-raised' } as const;

export interface FrameOptions {
  className?: string;
  head?: keyof typeof HEAD;
  stickyFirstColumn?: boolean;
  // A table keeps at least 44rem (table-frame-min) and scrolls in its frame below it: squeezed into a phone's width,
  // a column of sentences (a renewal's reason) would shrink to a word per line and make every row a screen tall.
  minWidth?: boolean;
}

/** The frame's classes (TableFrame's, and tableFrameHtml's for a table built as static markup). */
export function tableFrameClassName({ className = '', head = 'raised', stickyFirstColumn = true, minWidth = true }: FrameOptions = {}): string {
  return `table-frame ${minWidth ? 'table-frame-min' : ''} ${stickyFirstColumn ? `table-frame-sticky ${HEAD[head]}` : ''} ${className}`;
}

export function TableFrame({ label, children, ...options }: { label: string; children: React.ReactNode } & FrameOptions) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className={tableFrameClassName(options)}>
      {children}
    </div>
  );
}
