const STICKY = '[&_tr>*:first-child]:sticky [&_tr>*:first-child]:left-0 [&_tr>*:first-child]:z-[1] [&_tbody_tr>*:first-child]:bg-paper-raised [&_tfoot_tr>*:first-child]:bg-paper-raised';
const HEAD = { sunk: '[&_thead_tr>*:first-child]:bg-paper-sunk', raised: '[&_thead_tr>*:first-child]:bg-paper-raised' } as const;

/**
 * The frame every wide table sits in: it scrolls sideways inside itself (never the page) and can be scrolled from
 * the keyboard (a named, focusable region); the first column stays in view while the rest scrolls past it.
 * The frame is positioned so that visually hidden text in a cell (sr-only, absolutely placed) is clipped with the
 * table instead of widening the page. The sticky cells take the background of their part of the table (`head`: the header row's), so the cells
 * scrolled under them do not show through.
 */
// A table keeps at least this width and scrolls in its frame below it: squeezed into a phone's width, a column of
// sentences (a renewal's reason) would shrink to a word per line and make every row a screen tall.
const MIN_TABLE_WIDTH = '[&_table]:min-w-[44rem]';

export interface FrameOptions {
  className?: string;
  head?: keyof typeof HEAD;
  stickyFirstColumn?: boolean;
  minWidth?: boolean;
}

/** The frame's classes (TableFrame's, and tableFrameHtml's for a table built as static markup). */
export function tableFrameClassName({ className = '', head = 'raised', stickyFirstColumn = true, minWidth = true }: FrameOptions = {}): string {
  return `relative max-w-full overflow-x-auto ${minWidth ? MIN_TABLE_WIDTH : ''} ${stickyFirstColumn ? `${STICKY} ${HEAD[head]}` : ''} ${className}`;
}

export function TableFrame({ label, children, ...options }: { label: string; children: React.ReactNode } & FrameOptions) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className={tableFrameClassName(options)}>
      {children}
    </div>
  );
}
