import path from 'node:path';
import type { ComponentProps, ReactNode } from 'react';
import { Canvas, Font, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { CAUTION_SENTENCE } from '@/lib/labels';
import { FONT, LINE_HEIGHT, textWidth, wrapLines, type TextWeight } from './measure-text';

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
 * callers get copies of the glyph list and of the positions. The
 * result is the same glyphs and positions, so the page plan and the printed sheets do not change.
 */
const SHAPED_LIMIT = 20_000;
function cacheShaping(proto: { layout: Layout; __shapingCached?: boolean }) {
  if (proto.__shapingCached) return;
  const layout = proto.layout;
  const caches = new WeakMap<object, Map<string, Shaped>>();
  // The features come as the same few objects again and again (the styles' and the drawn tables'): each is written out once.
  const featureKeys = new WeakMap<object, string>();
  const featureKey = (features: unknown) => {
    if (!features || typeof features !== 'object') return JSON.stringify(features ?? null);
    let key = featureKeys.get(features);
    if (key === undefined) featureKeys.set(features, (key = JSON.stringify(features)));
    return key;
  };
  proto.layout = function cachedLayout(this: object, text: string, features?: unknown, ...rest: unknown[]) {
    let cache = caches.get(this);
    if (!cache) caches.set(this, (cache = new Map()));
    const key = `${featureKey(features)}|${rest.length ? rest.map(String).join('|') : ''}|${text}`;
    let run = cache.get(key);
    if (!run) {
      run = layout.call(this, text, features, ...rest);
      if (cache.size >= SHAPED_LIMIT) cache.clear();
      cache.set(key, run);
    }
    // Copies of the lists and the positions: react-pdf changes glyph lists, pdfkit (a drawn table) scales positions in place.
    return Object.assign(Object.create(Object.getPrototypeOf(run)), run, { glyphs: run.glyphs.slice(), positions: run.positions.map((p) => ({ ...(p as object) })) });
  };
  proto.__shapingCached = true;
}

/** A4 in points, portrait. */
export const A4 = { width: 595.28, height: 841.89 } as const;
/** The padding of every page (pdf.page); the footer sits in the bottom margin. */
export const PAGE_MARGIN = { top: 36, bottom: 48, side: 36 } as const;
const FOOTER = { bottom: 20, size: 7, maxLines: 2 } as const;
/** The colour of the body text. */
export const INK = '#1c232b';

export const pdf = StyleSheet.create({
  page: {
    fontFamily: ['Inter', 'InterGreek'] as unknown as string,
    fontSize: FONT,
    color: INK,
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
  footer: { position: 'absolute', bottom: FOOTER.bottom, left: PAGE_MARGIN.side, right: PAGE_MARGIN.side, flexDirection: 'row', justifyContent: 'space-between', fontSize: FOOTER.size, color: '#5f6872' },
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
 * taller than `maxHeight`, so every part fits a sheet. `height(lines)` is the row's height. Each
 * part has its cells' texts and their lines (what a drawn table writes, line by line); a drawn
 * table measures with its `weight`'s own widths.
 */
export function rowParts(cells: string[], rooms: number[], height: (lines: number) => number, maxHeight: number, size = FONT, weight?: TextWeight): { cells: string[]; lines: string[][]; height: number }[] {
  const wrapped = cells.map((c, i) => wrapLines(c, rooms[i], size, weight));
  const lines = Math.max(...wrapped.map((w) => w.length));
  if (height(lines) <= maxHeight) return [{ cells, lines: wrapped, height: height(lines) }];
  const perPart = Math.max(1, Math.floor((maxHeight - height(0)) / (size * LINE_HEIGHT)));
  const parts: { cells: string[]; lines: string[][]; height: number }[] = [];
  for (let k = 0; k * perPart < lines; k++) {
    const part = wrapped.map((w) => w.slice(k * perPart, (k + 1) * perPart));
    parts.push({ cells: part.map((w) => w.join('\n')), lines: part, height: height(Math.min(perPart, lines - k * perPart)) });
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

// ---------- tables drawn straight onto the sheet ----------
/*
 * Why long tables are drawn rather than laid out: in a 300-line anode list about 4,000 table
 * cells were each a react-pdf <Text>, and laying them out (a yoga node, an attributed string and
 * a line breaker per cell, then a render pass over each) was most of the time, with a quarter of
 * it in garbage collection. The plan already knows every cell's lines (wrapLines) and every row's
 * height, so a run of rows becomes one <Canvas> of the planned height that writes each line of
 * each cell at its place with the page's own Inter fonts: the same glyphs, searchable and
 * copyable as before, in reading order (row by row, cell by cell), at a small part of the cost.
 * The lines are the plan's (widths rounded up, measure-text.ts), so a line never runs past its
 * cell; a test measures them with the real fonts.
 */

/** The fonts of the sheet, loaded: drawn tables use them directly (call before rendering). */
export async function loadPdfFonts() {
  registerPdfFonts();
  await Promise.all(DRAWN_WEIGHTS.flatMap((fontWeight) => [Font.load({ fontFamily: 'Inter', fontWeight }), Font.load({ fontFamily: 'InterGreek', fontWeight })]));
}

const DRAWN_WEIGHTS = [400, 600] as const satisfies readonly TextWeight[];
type DrawnWeight = (typeof DRAWN_WEIGHTS)[number];

/** The parts of a fontkit font a drawn table uses. */
interface LoadedFont {
  unitsPerEm: number;
  ascent: number;
  descent: number;
  hasGlyphForCodePoint(codePoint: number): boolean;
  layout(text: string, features?: unknown): { advanceWidth: number };
}

function loadedFont(family: 'Inter' | 'InterGreek', fontWeight: DrawnWeight): LoadedFont {
  const data = (Font.getFont({ fontFamily: family, fontWeight }) as unknown as { data: LoadedFont | null } | null)?.data;
  // react-pdf loads every font its texts use before drawing; a sheet always has headings in both weights.
  if (!data) throw new Error(`The PDF font ${family} ${fontWeight} is not loaded: call loadPdfFonts() before rendering.`);
  return data;
}

/*
 * A font as the drawn tables write with it: the same glyphs, with the sheet's features (calt off,
 * tabular figures in number columns) as its defaults, under a name of its own. pdfkit shapes a text
 * given without features word by word and keeps each word it has shaped, which a long list repeats
 * all the time; a text given with features it shapes whole, every time, twice (to measure and to
 * write). The name keeps pdfkit from taking it for the font react-pdf embedded (same file).
 */
const views = new WeakMap<LoadedFont, Map<string, LoadedFont>>();
function withFeatures(font: LoadedFont, features: object, name: string): LoadedFont {
  let byName = views.get(font);
  if (!byName) views.set(font, (byName = new Map()));
  let view = byName.get(name);
  if (!view) {
    view = Object.create(font, {
      layout: { value: (text: string, given?: unknown, ...rest: unknown[]) => (font.layout as (...args: unknown[]) => { advanceWidth: number })(text, given ?? features, ...rest) },
      // Inter and its Greek subset carry the same PostScript name: the view's name says which file it is.
      postscriptName: { value: name },
    }) as LoadedFont;
    byName.set(name, view);
  }
  return view;
}

/** A column of a drawn table: where it starts and how wide it is (pt), numbers right-aligned. */
export interface DrawnColumn {
  x: number;
  width: number;
  right?: boolean;
  /** Left padding (pt). */
  padLeft: number;
  /** Right padding (pt). */
  padRight: number;
}

/** One row of a drawn table: each cell's lines, the row's height (pt), bold, and its bottom rule. */
export interface DrawnRow {
  lines: string[][];
  height: number;
  strong: boolean;
  rule: { width: number; color: string };
}

/** The features of the page's text (calt off, as the sheets set it) and of number columns (tabular figures). */
const TEXT_FEATURES = { calt: false };
const NUMBER_FEATURES = { calt: false, tnum: true };
/** pdfkit's options for a line written at a place: no wrapping, the font's own features (withFeatures). */
const TEXT_OPTIONS = { lineBreak: false };

interface Painter {
  font(font: LoadedFont, family: string, size: number): Painter;
  fillColor(color: string): Painter;
  text(text: string, x: number, y: number, options: object): Painter;
  moveTo(x: number, y: number): Painter;
  lineTo(x: number, y: number): Painter;
  lineWidth(width: number): Painter;
  strokeColor(color: string): Painter;
  stroke(): Painter;
}

/** Runs of a text by the font that has its glyphs (Inter, else its Greek subset for ρ, ε, Ω…). */
function fontRuns(text: string, latin: LoadedFont, greek: LoadedFont): { text: string; font: LoadedFont }[] {
  let plain = true;
  for (let i = 0; i < text.length && plain; i++) plain = text.charCodeAt(i) < 128;
  if (plain) return [{ text, font: latin }];
  const runs: { text: string; font: LoadedFont }[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    const font = cp < 128 || latin.hasGlyphForCodePoint(cp) || !greek.hasGlyphForCodePoint(cp) ? latin : greek;
    const last = runs[runs.length - 1];
    if (last && last.font === font) last.text += ch;
    else runs.push({ text: ch, font });
  }
  return runs;
}

/**
 * Writes the rows onto the sheet: each cell's lines at their place (left or right aligned), and
 * each row's bottom rule, with the geometry of a react-pdf row (padding 2 pt above and below the
 * lines, the rule inside the bottom of the row).
 */
function paintRows(painter: Painter, width: number, columns: DrawnColumn[], rows: DrawnRow[], size: number, color: string) {
  const fonts = Object.fromEntries(DRAWN_WEIGHTS.map((w) => [w, { latin: loadedFont('Inter', w), greek: loadedFont('InterGreek', w), weight: w }])) as Record<
    DrawnWeight,
    { latin: LoadedFont; greek: LoadedFont; weight: DrawnWeight }
  >;
  const line = size * LINE_HEIGHT;
  // The baseline in a line box, as react-pdf sets it: the leading shared above and below the font's ascent and descent.
  const latin = fonts[400].latin;
  const leading = (line - ((latin.ascent - latin.descent) / latin.unitsPerEm) * size) / 2;
  let current: LoadedFont | null = null;
  // Named, pdfkit finds the font again by the name instead of opening it once more for every switch.
  const use = (font: LoadedFont) => {
    if (font !== current) painter.font(font, (font as unknown as { postscriptName: string }).postscriptName, size);
    current = font;
  };
  const advance = (font: LoadedFont, text: string, features: object) => (font.layout(text, features).advanceWidth / font.unitsPerEm) * size;
  painter.fillColor(color);
  let top = 0;
  for (const row of rows) {
    const set = fonts[row.strong ? 600 : 400];
    row.lines.forEach((cellLines, c) => {
      const col = columns[c];
      const [features, tag] = col.right ? [NUMBER_FEATURES, 'tnum'] : [TEXT_FEATURES, 'text'];
      cellLines.forEach((text, k) => {
        if (!text) return;
        const runs = fontRuns(text, set.latin, set.greek).map((r) => ({ text: r.text, font: withFeatures(r.font, features, `Tidewarden-${r.font === set.latin ? 'Inter' : 'InterGreek'}-${set.weight}-${tag}`) }));
        // Widths only where they place something: a right-aligned text, or a run after another.
        const widths = col.right || runs.length > 1 ? runs.map((r) => advance(r.font, r.text, features)) : [0];
        let x = col.right ? col.x + col.width - col.padRight - widths.reduce((a, b) => a + b, 0) : col.x + col.padLeft;
        // pdfkit places a text by the top of the font's ascent; react-pdf's line box adds the leading above it.
        const y = top + 2 + k * line + leading;
        runs.forEach((r, i) => {
          use(r.font);
          painter.text(r.text, x, y, TEXT_OPTIONS);
          x += widths[i];
        });
      });
    });
    const ruleY = top + row.height - row.rule.width / 2;
    painter.moveTo(0, ruleY).lineTo(width, ruleY).lineWidth(row.rule.width).strokeColor(row.rule.color).stroke();
    top += row.height;
  }
}

/** A run of table rows drawn as one block of the planned height (see above). */
export function DrawnRows({ width, columns, rows, size = FONT, color = INK }: { width: number; columns: DrawnColumn[]; rows: DrawnRow[]; size?: number; color?: string }) {
  const height = rows.reduce((sum, r) => sum + r.height, 0);
  return <Canvas style={{ width, height }} paint={(painter) => (paintRows(painter as unknown as Painter, width, columns, rows, size, color), null)} />;
}
