import path from 'node:path';
import type { ComponentProps, ReactNode } from 'react';
import { Font, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { CAUTION_SENTENCE } from '@/lib/labels';
import { FONT, LINE_HEIGHT, textWidth, wrapLines } from './measure-text';

// Inter ships in fonts/ as TrueType for the PDFs (made from @fontsource's woff by scripts/woff-to-ttf.mjs):
// fontkit inflates a woff's whole glyph table again for every glyph it reads, which was most of the
// time of a long anode list. Registered once per process.
let registered = false;
export function registerPdfFonts() {
  if (registered) return;
  const file = (w: number) => path.join(process.cwd(), 'fonts', `inter-latin-${w}-normal.ttf`);
  const greek = (w: number) => path.join(process.cwd(), 'fonts', `inter-greek-${w}-normal.ttf`);
  Font.register({ family: 'Inter', fonts: [{ src: file(400), fontWeight: 400 }, { src: file(600), fontWeight: 600 }, { src: file(700), fontWeight: 700 }] });
  // Greek letters (ρ, ε, π, Ω) come from Inter's Greek subset as a fallback family.
  Font.register({ family: 'InterGreek', fonts: [{ src: greek(400), fontWeight: 400 }, { src: greek(600), fontWeight: 600 }, { src: greek(700), fontWeight: 700 }] });
  Font.registerHyphenationCallback((word) => [word]);
  // Once Inter is loaded, its shaping is cached (fontkit's font class is shared by every weight).
  const body = Font.getFont({ fontFamily: 'Inter', fontWeight: 400 }) as unknown as { load: () => Promise<void>; data: object | null } | null;
  if (body) {
    const load = body.load.bind(body);
    body.load = async () => {
      await load();
      if (body.data) cacheShaping(Object.getPrototypeOf(body.data));
    };
  }
  registered = true;
}

interface Shaped {
  glyphs: unknown[];
  positions: unknown[];
}
type Layout = (this: object, text: string, features?: unknown, ...rest: unknown[]) => Shaped;

/**
 * Text shaping (fontkit's layout: substitutions and positioning from the font's tables) was most of
 * the time of a long anode list, and its texts repeat: alloys, mountings, statuses, masses, dates,
 * the column heads of every sheet. Each font keeps the runs it has shaped, by text and features;
 * callers get a copy of the glyph list (react-pdf copies positions before changing them). The
 * result is the same glyphs and positions, so the page plan and the printed sheets do not change.
 */
const SHAPED_LIMIT = 20_000;
function cacheShaping(proto: { layout: Layout; __shapingCached?: boolean }) {
  if (proto.__shapingCached) return;
  const layout = proto.layout;
  const caches = new WeakMap<object, Map<string, Shaped>>();
  proto.layout = function cachedLayout(this: object, text: string, features?: unknown, ...rest: unknown[]) {
    let cache = caches.get(this);
    if (!cache) caches.set(this, (cache = new Map()));
    const key = `${JSON.stringify(features ?? null)}|${rest.map(String).join('|')}|${text}`;
    let run = cache.get(key);
    if (!run) {
      run = layout.call(this, text, features, ...rest);
      if (cache.size >= SHAPED_LIMIT) cache.clear();
      cache.set(key, run);
    }
    return Object.assign(Object.create(Object.getPrototypeOf(run)), run, { glyphs: run.glyphs.slice() });
  };
  proto.__shapingCached = true;
}

/** A4 in points, portrait. */
export const A4 = { width: 595.28, height: 841.89 } as const;
/** The padding of every page (pdf.page); the footer sits in the bottom margin. */
export const PAGE_MARGIN = { top: 36, bottom: 48, side: 36 } as const;
const FOOTER = { bottom: 20, size: 7, maxLines: 2 } as const;

export const pdf = StyleSheet.create({
  page: {
    fontFamily: ['Inter', 'InterGreek'] as unknown as string,
    fontSize: FONT,
    color: '#1c232b',
    paddingTop: PAGE_MARGIN.top,
    paddingBottom: PAGE_MARGIN.bottom,
    paddingHorizontal: PAGE_MARGIN.side,
    lineHeight: LINE_HEIGHT,
  },
  h1: { fontSize: 15, fontWeight: 700, color: '#1a474b', lineHeight: 1.25, marginBottom: 3 },
  h2: { fontSize: 10.5, fontWeight: 600, color: '#1a474b', marginTop: 12, marginBottom: 4, borderBottomWidth: 0.6, borderBottomColor: '#b9b3a7', paddingBottom: 2 },
  small: { fontSize: 7.5, color: '#46505b' },
  row: { flexDirection: 'row', borderBottomWidth: 0.4, borderBottomColor: '#d9d5cc', paddingVertical: 2 },
  headRow: { flexDirection: 'row', borderBottomWidth: 0.8, borderBottomColor: '#7b8590', paddingVertical: 2, fontWeight: 600 },
  caution: { marginTop: 10, padding: 6, backgroundColor: '#f4ead7', color: '#7a5718', fontSize: 8 },
  warning: { padding: 4, marginBottom: 3, backgroundColor: '#faefd6', fontSize: 8 },
  footer: { position: 'absolute', bottom: FOOTER.bottom, left: PAGE_MARGIN.side, right: PAGE_MARGIN.side, flexDirection: 'row', justifyContent: 'space-between', fontSize: FOOTER.size, color: '#7b8590' },
});

export const CAUTION_TEXT = `Caution. ${CAUTION_SENTENCE} Tidewarden does not replace that review.`;

// ---------- planned sheets ----------
/*
 * Why the PDFs cut themselves into sheets rather than let react-pdf do it:
 * 1. Page numbers. In react-pdf 4.9 a fixed footer holding a `render` (page number) node is dropped,
 *    whole, on every page that react-pdf splits itself; it prints only on pages that do not wrap.
 * 2. Speed. react-pdf paginates a wrapping <Page> by laying out everything not yet placed again for
 *    every sheet it cuts off.
 * So a document estimates every block's height from Inter's glyph widths (measure-text.ts, rounded
 * up), cuts itself into sheets with a PagePlanner, and draws each sheet as a PlannedSheet: a
 * <Page wrap={false}> held to A4 with its footer's "page N of M" written in. Each document has a
 * test that renders the same plan with wrapping pages and checks that react-pdf needs no more
 * sheets than planned.
 */

/** Room for the body of an A4 sheet: the width inside the margins, and the height less a little slack. */
export function sheetArea(orientation: 'portrait' | 'landscape') {
  const [width, height] = orientation === 'portrait' ? [A4.width, A4.height] : [A4.height, A4.width];
  return { width: width - 2 * PAGE_MARGIN.side, height: height - PAGE_MARGIN.top - PAGE_MARGIN.bottom - 6 };
}

/** Something placed on a sheet, with its estimated height in points. */
export interface PlannedBlock<T> {
  item: T;
  height: number;
}

export interface SheetPlan<T> {
  pages: T[][];
  /** Estimated body height of each sheet, pt. */
  heights: number[];
  /** Every sheet's estimate is within the body area (always, when tall blocks are cut). */
  fits: boolean;
}

/** Cuts a document into sheets, block by block, from estimated heights. */
export class PagePlanner<T> {
  private readonly pages: T[][] = [[]];
  private readonly heights: number[] = [0];
  private used = 0;

  constructor(readonly bodyHeight: number) {}

  /** Room left on the current sheet, pt. */
  get room() {
    return this.bodyHeight - this.used;
  }

  newPage() {
    this.pages.push([]);
    this.heights.push(0);
    this.used = 0;
  }

  put(item: T, height: number) {
    this.pages[this.pages.length - 1].push(item);
    this.used += height;
    this.heights[this.heights.length - 1] = this.used;
  }

  /** Starts a new sheet unless `height` still fits (an empty sheet takes anything). */
  ensure(height: number) {
    if (this.used > 0 && this.used + height > this.bodyHeight) this.newPage();
  }

  /** Blocks kept on one sheet: a heading with what it heads, a signature block. */
  keep(blocks: PlannedBlock<T>[]) {
    this.ensure(blocks.reduce((sum, b) => sum + b.height, 0));
    for (const b of blocks) this.put(b.item, b.height);
  }

  /**
   * Table rows under a lead (a title, the column heads) that is repeated, marked continued, on each
   * further sheet. The lead never ends a sheet; a row `withPrevious` (a total) stays with the row above.
   */
  table(rows: (PlannedBlock<T> & { withPrevious?: boolean })[], lead: (continued: boolean) => PlannedBlock<T>[]) {
    rows.forEach((row, i) => {
      const next = rows[i + 1];
      const need = row.height + (next?.withPrevious ? next.height : 0);
      if (i === 0) {
        const first = lead(false);
        this.ensure(first.reduce((sum, b) => sum + b.height, 0) + need);
        for (const b of first) this.put(b.item, b.height);
      } else if (!row.withPrevious && this.used + need > this.bodyHeight) {
        this.newPage();
        for (const b of lead(true)) this.put(b.item, b.height);
      }
      this.put(row.item, row.height);
    });
  }

  plan(): SheetPlan<T> {
    return { pages: this.pages, heights: this.heights, fits: this.heights.every((h) => h <= this.bodyHeight) };
  }
}

/**
 * A table row: its cells wrapped to their columns' rooms (pt), cut into parts at line breaks when
 * taller than `maxHeight`, so every part fits a sheet. `height(lines)` is the row's height.
 */
export function rowParts(cells: string[], rooms: number[], height: (lines: number) => number, maxHeight: number, size = FONT): { cells: string[]; height: number }[] {
  const wrapped = cells.map((c, i) => wrapLines(c, rooms[i], size));
  const lines = Math.max(...wrapped.map((w) => w.length));
  if (height(lines) <= maxHeight) return [{ cells, height: height(lines) }];
  const perPart = Math.max(1, Math.floor((maxHeight - height(0)) / (size * LINE_HEIGHT)));
  const parts: { cells: string[]; height: number }[] = [];
  for (let k = 0; k * perPart < lines; k++) {
    parts.push({ cells: wrapped.map((w) => w.slice(k * perPart, (k + 1) * perPart).join('\n')), height: height(Math.min(perPart, lines - k * perPart)) });
  }
  return parts;
}

/** A paragraph in a box `width` wide, cut at line breaks into parts of at most `maxLines` lines. */
export function textParts(text: string, width: number, size: number, maxLines: number): { text: string; lines: number }[] {
  const lines = wrapLines(text, width, size);
  if (lines.length <= maxLines) return [{ text, lines: lines.length }];
  const parts: { text: string; lines: number }[] = [];
  for (let k = 0; k < lines.length; k += maxLines) {
    const part = lines.slice(k, k + maxLines);
    parts.push({ text: part.join('\n'), lines: part.length });
  }
  return parts;
}

/** A column of a planned table: its share of the content width; numbers right-aligned. */
export interface SheetColumn {
  label: string;
  /** Fraction of the content width. */
  share: number;
  right?: boolean;
  /** Left padding as well (a text column right after right-aligned numbers). */
  gap?: boolean;
}

/** One row of a planned table, never split: a text per cell, each in its column's style. */
export function SheetRow({ cells, cellStyles, style }: { cells: string[]; cellStyles: ComponentProps<typeof View>['style'][]; style: ComponentProps<typeof View>['style'] }) {
  return (
    <View style={style} wrap={false}>
      {cells.map((cell, i) => (
        <Text key={i} style={cellStyles[i]}>
          {cell}
        </Text>
      ))}
    </View>
  );
}

/** A text held to `maxLines` lines in a box `width` wide (cut with an ellipsis), its line breaks written in. */
export function clampLines(text: string, width: number, size: number, maxLines: number): string {
  const lines = wrapLines(text, width, size);
  if (lines.length <= maxLines) return text;
  let last = lines[maxLines - 1];
  while (last && textWidth(`${last}…`, size) > width) last = last.slice(0, -1);
  return [...lines.slice(0, maxLines - 1), `${last.trimEnd()}…`].join('\n');
}

const SHEET_HEIGHT = {
  portrait: StyleSheet.create({ s: { minHeight: A4.height, maxHeight: A4.height } }).s,
  landscape: StyleSheet.create({ s: { minHeight: A4.width, maxHeight: A4.width } }).s,
};

/**
 * One planned sheet, A4 in the given orientation, with its footer. The height is held as well as
 * the size: react-pdf 4.9 lays a <Page wrap={false}> out to the height of its content, so without
 * it every sheet but a full one came out shorter than A4. `wrap` lets react-pdf split the sheet
 * (the tests' check of a plan, or a plan that does not fit).
 */
export function PlannedSheet({
  orientation,
  wrap,
  style,
  footer,
  children,
}: {
  orientation: 'portrait' | 'landscape';
  wrap: boolean;
  style?: ComponentProps<typeof Page>['style'];
  footer: { left: string; right: string; page: number; pages: number };
  children: ReactNode;
}) {
  return (
    <Page size="A4" orientation={orientation} style={[pdf.page, ...(style ? [style].flat() : []), SHEET_HEIGHT[orientation]]} wrap={wrap}>
      {children}
      <PageFooter {...footer} width={sheetArea(orientation).width} />
    </Page>
  );
}

/**
 * The footer of a planned sheet: `left` (what the document is) and `right` (who printed it) with
 * "page N of M" written in. Each side is held to two lines, so the footer stays in the bottom
 * margin and never reaches the body.
 */
export function PageFooter({ left, right, page, pages, width }: { left: string; right: string; page: number; pages: number; width: number }) {
  const pageText = `page ${page} of ${pages}`;
  const oneLine = `${right} · ${pageText}`;
  const rightRoom = Math.min(textWidth(oneLine, FOOTER.size), width / 2);
  const rightText = textWidth(oneLine, FOOTER.size) <= rightRoom ? oneLine : `${clampLines(right, rightRoom, FOOTER.size, FOOTER.maxLines - 1)}\n${pageText}`;
  const leftRoom = width - rightRoom - 12;
  return (
    <View style={pdf.footer} fixed>
      <Text style={{ width: leftRoom }}>{clampLines(left, leftRoom, FOOTER.size, FOOTER.maxLines)}</Text>
      <Text style={{ width: rightRoom, textAlign: 'right' }}>{rightText}</Text>
    </View>
  );
}
