import { Document, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { format } from 'date-fns';
import type { AnodeList, AnodeListLine, AnodeListOrderLine, AnodeListTotals } from '@/lib/anode-list/build-anode-list';
import { ALLOY_LABELS, MOUNTING_LABELS } from '@/lib/design/labels';
import { CAUTION_TEXT, pdf } from './pdf-kit';

/*
 * The dry-dock anode list, A4 LANDSCAPE.
 *
 * Why landscape: each line has eleven columns, one of them free-text positions
 * ("Fr 144-150 P/S, 2.5 m above keel"). In portrait (523 pt of width) the positions column
 * would be about 85 pt and most lines would wrap to two or three rows, so a 300-line list
 * would run to twice the pages and the yard would read across broken rows. Landscape
 * (770 pt) keeps nearly every line on one row, and the sheet still prints and files on A4.
 *
 * Why the sheets are planned here rather than by react-pdf:
 * 1. Speed. react-pdf 4.9 paginates a <Page> by laying out everything not yet placed again
 *    for every sheet it cuts off (twice with a page-number footer): a 300-line list in one
 *    <Page> took about 1.6-2 s on two cores and grows with pages x lines.
 * 2. Page numbers. In react-pdf 4.9 a `render` (page number) node inside a <Page> that
 *    wraps is dropped together with its fixed footer; it is printed only on pages that do
 *    not wrap.
 * So planAnodeListPages estimates every block's height from Inter's glyph widths (rounded up)
 * and cuts the list into sheets itself; each sheet is a <Page wrap={false}> with its number
 * written in. Rows and warnings taller than a sheet are cut into parts at line breaks, so every
 * block fits. A test renders the same plan with wrapping pages (`pagination="checked"`) and
 * checks react-pdf needs no more sheets than planned, i.e. the estimate never runs short.
 */

// ---------- geometry (points) ----------
const PAGE_WIDTH = 841.89;
const PAGE_HEIGHT = 595.28;
const CONTENT_WIDTH = PAGE_WIDTH - 2 * 36; // pdf.page paddingHorizontal
/** pdf.page paddingTop 36 and paddingBottom 48, less a little slack. */
const CONTENT_HEIGHT = PAGE_HEIGHT - 36 - 48 - 6;
const FONT = 8.5;
const LINE = FONT * 1.35; // pdf.page lineHeight
const CELL_PAD = 3;

// Advance widths of Inter (the widest of weights 400, 600 and 700) for ASCII 32-126, in 1/100 em.
const ASCII_WIDTHS = [
  29, 34, 56, 65, 66, 102, 68, 34, 38, 38, 56, 68, 34, 47, 34, 39, 68, 44, 63, 65, 68, 63, 65, 59, 66, 65, 34, 35, 68, 68, 68, 56, 102, 75, 67, 74, 73, 61, 60, 76, 75, 29, 59, 72, 57,
  94, 77, 78, 65, 78, 66, 66, 67, 75, 75, 104, 74, 74, 67, 38, 39, 38, 49, 48, 37, 59, 64, 59, 64, 60, 40, 64, 63, 28, 28, 59, 28, 92, 63, 62, 64, 64, 41, 57, 37, 63, 60, 86, 59,
  61, 58, 47, 38, 47, 68,
];
const OTHER_WIDTH = 105; // anything else (× – · ², Greek, CJK fallback): wider than any of those glyphs in Inter

const charWidth = (code: number, size: number) => ((code >= 32 && code <= 126 ? ASCII_WIDTHS[code - 32] : OTHER_WIDTH) / 100) * size * 1.03;

/** Width of a text in points at `size`, over-estimated by 3 % so plans never run short. */
export function textWidth(text: string, size = FONT): number {
  let w = 0;
  for (let i = 0; i < text.length; i++) w += charWidth(text.charCodeAt(i), size);
  return w;
}

/**
 * The lines a text takes in a box `width` wide: greedy word wrap, as react-pdf does (no
 * hyphenation); a word wider than the box is cut where it overflows.
 */
export function wrapLines(text: string, width: number, size = FONT): string[] {
  const lines: string[] = [];
  const space = textWidth(' ', size);
  for (const paragraph of text.split('\n')) {
    let line = '';
    let used = 0;
    for (const word of paragraph.split(' ')) {
      if (word === '') continue;
      const w = textWidth(word, size);
      if (line && used + space + w <= width) {
        line += ` ${word}`;
        used += space + w;
        continue;
      }
      if (line) lines.push(line);
      if (w <= width) {
        line = word;
        used = w;
        continue;
      }
      // Cut a word wider than the box.
      let piece = '';
      let pieceWidth = 0;
      for (const ch of word) {
        const cw = charWidth(ch.charCodeAt(0), size);
        if (piece && pieceWidth + cw > width) {
          lines.push(piece);
          piece = '';
          pieceWidth = 0;
        }
        piece += ch;
        pieceWidth += cw;
      }
      line = piece;
      used = pieceWidth;
    }
    lines.push(line);
  }
  return lines;
}

export const lineCount = (text: string, width: number, size = FONT) => wrapLines(text, width, size).length;

// ---------- formatting ----------
const STATUS_WORDS: Record<string, string> = { proposed: 'Proposed', confirmed: 'Confirmed', ordered: 'Ordered', fitted: 'Fitted' };
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** '2027-03-14' -> '14 Mar 2027', read as a calendar day (no time-zone shift). */
export function dayText(iso: string | null): string {
  if (!iso) return '–';
  const [y, m, d] = iso.split('-').map(Number);
  return `${d} ${MONTHS[m - 1]} ${y}`;
}

// Formatters made once: Number.toLocaleString builds a new one on every call, which showed in the profile.
const KG_1 = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const KG_2 = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const COUNT = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** kg with one decimal, two when the value needs them (a 0.25 kg anode stays 0.25 kg); the style of lib/format's fmt. */
export function kgText(x: number): string {
  if (!Number.isFinite(x)) return '–';
  const oneDecimal = Math.abs(x * 10 - Math.round(x * 10)) < 1e-6;
  return `${(oneDecimal ? KG_1 : KG_2).format(x)} kg`;
}
const count = (n: number) => COUNT.format(n);

/** 'special-survey' -> 'Special survey'. */
function humanise(s: string): string {
  const t = s.replace(/[-_]+/g, ' ').trim();
  return t ? t[0].toUpperCase() + t.slice(1) : t;
}
const zoneName = (zone: string | null) => zone ?? 'No zone';
const when = (d: Date | null) => (d ? format(d, 'd MMM yyyy') : '');

// ---------- tables ----------
interface Col {
  label: string;
  /** Fraction of the content width. */
  share: number;
  right?: boolean;
  /** Extra left padding (the positions column, right after right-aligned numbers). */
  gap?: boolean;
}

type TableKind = 'line' | 'order' | 'asset' | 'docking';

const COLUMNS: Record<TableKind, Col[]> = {
  line: [
    { label: 'Group', share: 0.1 },
    { label: 'Model', share: 0.09 },
    { label: 'Alloy', share: 0.08 },
    { label: 'Mounting', share: 0.09 },
    { label: 'Qty', share: 0.045, right: true },
    { label: 'Net each', share: 0.07, right: true },
    { label: 'Gross each', share: 0.075, right: true },
    { label: 'Net total', share: 0.08, right: true },
    { label: 'Gross total', share: 0.085, right: true },
    { label: 'Positions', share: 0.205, gap: true },
    { label: 'Status', share: 0.08 },
  ],
  order: [
    { label: 'Model', share: 0.14 },
    { label: 'Alloy', share: 0.15 },
    { label: 'Mounting', share: 0.13 },
    { label: 'Quantity', share: 0.1, right: true },
    { label: 'Net each', share: 0.11, right: true },
    { label: 'Gross each', share: 0.11, right: true },
    { label: 'Net total', share: 0.13, right: true },
    { label: 'Gross total', share: 0.13, right: true },
  ],
  // The two header tables sit side by side, each 49 % of the width.
  asset: [
    { label: 'Particular', share: 0.49 * 0.45 },
    { label: 'Value', share: 0.49 * 0.55 },
  ],
  docking: [
    { label: 'Item', share: 0.49 * 0.35 },
    { label: 'Value', share: 0.49 * 0.65 },
  ],
};

const colWidth = (c: Col) => c.share * CONTENT_WIDTH;
/** Room for text inside a cell. */
const textRoom = (c: Col) => colWidth(c) - CELL_PAD - (c.gap ? CELL_PAD * 2 : 0);

// Number columns use tabular figures so right-aligned digits line up (Inter's tnum also widens
// hyphens, which is why it is not set for the whole page).
const NUMBER_FEATURES = { calt: false, tnum: true };
// Styles made once: react-pdf resolves every style object it meets, so shared objects are cheaper.
const CELL_STYLES = Object.fromEntries(
  (Object.keys(COLUMNS) as TableKind[]).map((kind) => [
    kind,
    COLUMNS[kind].map(
      (c) =>
        StyleSheet.create({
          s: c.right
            ? { width: colWidth(c), textAlign: 'right', paddingRight: CELL_PAD, fontFeatureSettings: NUMBER_FEATURES }
            : { width: colWidth(c), textAlign: 'left', paddingRight: CELL_PAD, paddingLeft: c.gap ? CELL_PAD * 2 : 0 },
        }).s,
    ),
  ]),
) as Record<TableKind, ReturnType<typeof StyleSheet.create>[string][]>;

const s = StyleSheet.create({
  row: { flexDirection: 'row', borderBottomWidth: 0.4, borderBottomColor: '#d9d5cc', paddingVertical: 2 },
  totalRow: { flexDirection: 'row', borderBottomWidth: 0.8, borderBottomColor: '#7b8590', paddingVertical: 2, fontWeight: 600 },
  headRow: { flexDirection: 'row', borderBottomWidth: 0.8, borderBottomColor: '#7b8590', paddingVertical: 2, fontWeight: 600 },
  zoneTitle: { fontWeight: 600, fontSize: 9.5, marginTop: 6, marginBottom: 2 },
  continued: { fontWeight: 400, color: '#46505b' },
  warning: { ...pdf.warning },
  firstWarning: { ...pdf.warning, marginTop: 8 },
});

// Heights the plan uses, from the styles above and pdf-kit's (font size x line height + padding + border).
const H = {
  row: (lines: number) => lines * LINE + 4 + 0.4,
  totalRow: (lines: number) => lines * LINE + 4 + 0.8,
  head: LINE + 4 + 0.8,
  zoneTitle: (lines: number) => lines * 9.5 * 1.35 + 6 + 2,
  section: 10.5 * 1.35 + 12 + 4 + 2 + 0.6,
  warning: (lines: number) => lines * 8 * 1.35 + 8 + 3,
};

const lineCells = (l: AnodeListLine): string[] => [
  l.groupLabel,
  l.designation,
  ALLOY_LABELS[l.alloy] ?? l.alloy,
  MOUNTING_LABELS[l.mounting] ?? l.mounting,
  count(l.quantity),
  kgText(l.netMassEachKg),
  kgText(l.grossMassEachKg),
  kgText(l.netMassTotalKg),
  kgText(l.grossMassTotalKg),
  l.positions ?? '–',
  STATUS_WORDS[l.status] ?? l.status,
];
const subtotalCells = (t: AnodeListTotals): string[] => ['Subtotal', '', '', '', count(t.quantity), '', '', kgText(t.netMassKg), kgText(t.grossMassKg), '', ''];
const orderCells = (o: AnodeListOrderLine): string[] => [
  o.designation,
  ALLOY_LABELS[o.alloy] ?? o.alloy,
  MOUNTING_LABELS[o.mounting] ?? o.mounting,
  count(o.quantity),
  kgText(o.netMassEachKg),
  kgText(o.grossMassEachKg),
  kgText(o.netMassTotalKg),
  kgText(o.grossMassTotalKg),
];
const grandTotalCells = (t: AnodeListTotals): string[] => ['Grand total', '', '', count(t.quantity), '', '', kgText(t.netMassKg), kgText(t.grossMassKg)];

function dockingRows(list: AnodeList): string[][] {
  const d = list.docking;
  return [
    ['Kind', humanise(d.kind)],
    ['Planned', d.plannedEnd ? `${dayText(d.plannedStart)} to ${dayText(d.plannedEnd)}` : `from ${dayText(d.plannedStart)}`],
    ...(d.actualStart ? [['Actual start', dayText(d.actualStart)]] : []),
    ['Yard', d.yard ?? 'not yet chosen'],
    ...(d.reference ? [['Reference', d.reference]] : []),
    ['Anodes to fit', `${count(list.totals.quantity)} on ${count(list.lineCount)} line${list.lineCount === 1 ? '' : 's'}`],
    ['Net / gross mass', `${kgText(list.totals.netMassKg)} / ${kgText(list.totals.grossMassKg)}`],
  ];
}
const assetRows = (list: AnodeList): string[][] => [['Name', list.asset.name], ...list.asset.particulars];
const assetTitle = (list: AnodeList) => (list.asset.kind === 'vessel' ? 'Vessel' : 'Structure');

// ---------- page plan ----------
export type PlanItem =
  | { kind: 'title' }
  | { kind: 'header-tables' }
  | { kind: 'warning'; text: string; first: boolean }
  | { kind: 'section'; title: string }
  | { kind: 'zone-title'; title: string; continued: boolean; withSection: boolean }
  | { kind: 'head'; table: TableKind }
  | { kind: 'row'; table: TableKind; cells: string[]; total: boolean }
  | { kind: 'empty' }
  | { kind: 'notes' }
  | { kind: 'signatures' };

export interface AnodeListPagePlan {
  pages: PlanItem[][];
  /** Estimated content height of each sheet, pt. */
  heights: number[];
  /** Every sheet's estimate within the content area (always, as tall blocks are cut). */
  fits: boolean;
}

interface PlannedRow {
  cells: string[];
  total: boolean;
  height: number;
}

/** A table row, cut into parts at line breaks when it is taller than `maxHeight`. */
function rowParts(cells: string[], table: TableKind, total: boolean, maxHeight: number): PlannedRow[] {
  const cols = COLUMNS[table];
  const wrapped = cells.map((c, i) => wrapLines(c, textRoom(cols[i])));
  const lines = Math.max(...wrapped.map((w) => w.length));
  const height = (n: number) => (total ? H.totalRow(n) : H.row(n));
  if (height(lines) <= maxHeight) return [{ cells, total, height: height(lines) }];
  const perPart = Math.max(1, Math.floor((maxHeight - height(0)) / LINE));
  const parts: PlannedRow[] = [];
  for (let k = 0; k * perPart < lines; k++) {
    const slice = wrapped.map((w) => w.slice(k * perPart, (k + 1) * perPart).join('\n'));
    parts.push({ cells: slice, total, height: height(Math.min(perPart, lines - k * perPart)) });
  }
  return parts;
}

const TITLE_LEFT_SHARE = 0.72;
const titleLine = (list: AnodeList) => {
  const d = list.docking;
  return `${list.asset.name} (${list.asset.kind}) · ${d.kind === 'campaign' ? 'Diving or works campaign' : `${humanise(d.kind)} docking`} from ${dayText(d.plannedStart)}${d.yard ? ` · ${d.yard}` : ''}`;
};
const titleHeight = (list: AnodeList) =>
  Math.max(
    lineCount(list.organisation.name, CONTENT_WIDTH * TITLE_LEFT_SHARE, 7.5) * 7.5 * 1.35 + 15 * 1.25 + 3 + lineCount(titleLine(list), CONTENT_WIDTH * TITLE_LEFT_SHARE) * LINE,
    LINE + lineCount(`Docking reference ${list.docking.reference ?? ''}`, CONTENT_WIDTH * (1 - TITLE_LEFT_SHARE), 7.5) * 7.5 * 1.35,
  );

/**
 * Cuts the list into sheets. Tables continue over sheets with their title (marked
 * "continued") and column heads repeated; a title never ends a sheet; a subtotal or grand
 * total stays with the row above it; the fitting notes, and the signatures with the cautions,
 * are kept whole. Heights are estimates that never run short (see the file comment).
 */
export function planAnodeListPages(list: AnodeList): AnodeListPagePlan {
  const pages: PlanItem[][] = [[]];
  const heights: number[] = [0];
  let used = 0;
  const newPage = () => {
    pages.push([]);
    heights.push(0);
    used = 0;
  };
  const put = (item: PlanItem, height: number) => {
    pages[pages.length - 1].push(item);
    used += height;
    heights[heights.length - 1] = used;
  };
  /** Starts a new sheet unless `height` still fits (an empty sheet takes anything). */
  const ensure = (height: number) => {
    if (used > 0 && used + height > CONTENT_HEIGHT) newPage();
  };

  /** A table under a title that is repeated, marked continued, on each further sheet. */
  const table = (kind: TableKind, rows: { cells: string[]; total?: boolean }[], title: (continued: boolean) => { item: PlanItem; height: number }) => {
    const lead = Math.max(title(false).height, title(true).height) + H.head;
    // A part must fit a fresh sheet under the title, with room for a total row after it.
    const maxRow = CONTENT_HEIGHT - lead - H.totalRow(1);
    const planned = rows.flatMap((r) => rowParts(r.cells, kind, r.total ?? false, maxRow));
    planned.forEach((row, i) => {
      const next = planned[i + 1];
      const need = row.height + (next?.total ? next.height : 0);
      if (i === 0) {
        const first = title(false);
        ensure(first.height + H.head + need);
        put(first.item, first.height);
        put({ kind: 'head', table: kind }, H.head);
      } else if (!row.total && used + need > CONTENT_HEIGHT) {
        newPage();
        const again = title(true);
        put(again.item, again.height);
        put({ kind: 'head', table: kind }, H.head);
      }
      put({ kind: 'row', table: kind, cells: row.cells, total: row.total }, row.height);
    });
  };
  const section = (name: string) => (continued: boolean) => ({ item: { kind: 'section', title: continued ? `${name} (continued)` : name } as PlanItem, height: H.section });

  // Title, then the two particulars tables side by side, or one under the other if too tall together.
  put({ kind: 'title' }, titleHeight(list));
  const sideHeight = (kind: TableKind, rows: string[][]) => H.section + H.head + rows.reduce((sum, cells) => sum + rowParts(cells, kind, false, Infinity)[0].height, 0);
  const sideBySide = Math.max(sideHeight('asset', assetRows(list)), sideHeight('docking', dockingRows(list)));
  if (used + sideBySide <= CONTENT_HEIGHT) {
    put({ kind: 'header-tables' }, sideBySide);
  } else {
    table('asset', assetRows(list).map((cells) => ({ cells })), section(assetTitle(list)));
    table('docking', dockingRows(list).map((cells) => ({ cells })), section('Docking'));
  }

  list.warnings.forEach((w, i) => {
    const lines = wrapLines(`Warning: ${w}`, CONTENT_WIDTH - 8, 8);
    const perPart = Math.floor((CONTENT_HEIGHT - H.warning(0) - 8) / (8 * 1.35));
    for (let k = 0; k * perPart < lines.length; k++) {
      const part = lines.slice(k * perPart, (k + 1) * perPart);
      const first = i === 0 && k === 0;
      const h = H.warning(part.length) + (first ? 8 : 0);
      ensure(h);
      put({ kind: 'warning', text: part.join(lines.length > perPart ? '\n' : ' '), first }, h);
    }
  });

  if (list.zones.length === 0) {
    ensure(H.section + LINE);
    put({ kind: 'section', title: 'Anodes to fit, by zone' }, H.section);
    put({ kind: 'empty' }, LINE);
  }
  list.zones.forEach((z, zi) => {
    const name = `${zoneName(z.zone)} · ${count(z.subtotal.quantity)} anode${z.subtotal.quantity === 1 ? '' : 's'}`;
    const zoneTitleHeight = (continued: boolean) => H.zoneTitle(lineCount(continued ? `${name} (continued)` : name, CONTENT_WIDTH, 9.5));
    const rows = [...z.lines.map((l) => ({ cells: lineCells(l) })), { cells: subtotalCells(z.subtotal), total: true }];
    // The section title goes above the first zone, on the same sheet.
    const withSection = (continued: boolean) => zi === 0 && !continued;
    table('line', rows, (continued) => ({
      item: { kind: 'zone-title', title: name, continued, withSection: withSection(continued) },
      height: zoneTitleHeight(continued) + (withSection(continued) ? H.section : 0),
    }));
  });

  if (list.orderTotals.length > 0) {
    const rows = [...list.orderTotals.map((o) => ({ cells: orderCells(o) })), { cells: grandTotalCells(list.totals), total: true }];
    table('order', rows, section('Totals by model, for ordering'));
  }

  const notes = H.section + list.fittingNotes.reduce((sum, n) => sum + lineCount(n, CONTENT_WIDTH - 14) * LINE + 2, 0);
  ensure(notes);
  put({ kind: 'notes' }, notes);
  const signatures = H.section + H.head + 5 * (10 + LINE + 0.6 + 2) + 10 + 12 + lineCount(CAUTION_TEXT, CONTENT_WIDTH - 12, 8) * 8 * 1.35;
  ensure(signatures);
  put({ kind: 'signatures' }, signatures);

  return { pages, heights, fits: heights.every((h) => h <= CONTENT_HEIGHT) };
}

// ---------- blocks ----------
function Row({ table, cells, rowStyle }: { table: TableKind; cells: string[]; rowStyle: typeof s.row }) {
  const styles = CELL_STYLES[table];
  return (
    <View style={rowStyle} wrap={false}>
      {cells.map((cell, i) => (
        <Text key={i} style={styles[i]}>
          {cell}
        </Text>
      ))}
    </View>
  );
}

function SmallTable({ table, title, rows }: { table: TableKind; title: string; rows: string[][] }) {
  return (
    <View>
      <Text style={pdf.h2}>{title}</Text>
      <Row table={table} cells={COLUMNS[table].map((c) => c.label)} rowStyle={s.headRow} />
      {rows.map((cells, i) => (
        <Row key={i} table={table} cells={cells} rowStyle={s.row} />
      ))}
    </View>
  );
}

function Title({ list }: { list: AnodeList }) {
  const d = list.docking;
  return (
    <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' }}>
      <View style={{ width: CONTENT_WIDTH * TITLE_LEFT_SHARE }}>
        <Text style={pdf.small}>{list.organisation.name}</Text>
        <Text style={pdf.h1}>Dry-dock anode list</Text>
        <Text>{titleLine(list)}</Text>
      </View>
      <View style={{ width: CONTENT_WIDTH * (1 - TITLE_LEFT_SHARE), alignItems: 'flex-end' }}>
        <Text style={{ fontWeight: 600 }}>{`Revision ${list.revision.number}`}</Text>
        {d.reference ? <Text style={[pdf.small, { textAlign: 'right' }]}>{`Docking reference ${d.reference}`}</Text> : null}
      </View>
    </View>
  );
}

function Signatures({ list }: { list: AnodeList }) {
  const r = list.revision;
  const rows: [string, string, string][] = [
    ['Prepared', r.preparedBy ?? '', when(r.preparedAt)],
    ['Checked', r.checkedBy ?? '', when(r.checkedAt)],
    ['Approved', r.approvedBy ?? '', when(r.approvedAt)],
    ['Fitted by (yard)', '', ''],
    ['Accepted by (owner)', '', ''],
  ];
  const cell = (share: number) => ({ width: share * CONTENT_WIDTH, paddingRight: 8 });
  const line = { borderBottomWidth: 0.6, borderBottomColor: '#7b8590' };
  return (
    <View wrap={false}>
      <Text style={pdf.h2}>{`Revision ${r.number} and signatures`}</Text>
      <View style={s.headRow}>
        <Text style={cell(0.2)}>Role</Text>
        <Text style={cell(0.3)}>Name</Text>
        <Text style={cell(0.16)}>Date</Text>
        <Text style={cell(0.34)}>Signature</Text>
      </View>
      {rows.map(([role, name, date]) => (
        <View key={role} style={{ flexDirection: 'row', alignItems: 'flex-end', paddingTop: 10, paddingBottom: 2 }}>
          <Text style={{ ...cell(0.2), fontWeight: 600 }}>{role}</Text>
          <View style={cell(0.3)}>
            <Text style={line}>{name || ' '}</Text>
          </View>
          <View style={cell(0.16)}>
            <Text style={line}>{date || ' '}</Text>
          </View>
          <View style={cell(0.34)}>
            <Text style={line}> </Text>
          </View>
        </View>
      ))}
      <Text style={pdf.caution}>{CAUTION_TEXT}</Text>
    </View>
  );
}

function PlanItemView({ item, list }: { item: PlanItem; list: AnodeList }) {
  switch (item.kind) {
    case 'title':
      return <Title list={list} />;
    case 'header-tables':
      return (
        <View style={{ flexDirection: 'row', justifyContent: 'space-between' }}>
          <SmallTable table="asset" title={assetTitle(list)} rows={assetRows(list)} />
          <SmallTable table="docking" title="Docking" rows={dockingRows(list)} />
        </View>
      );
    case 'warning':
      return <Text style={item.first ? s.firstWarning : s.warning}>{item.text}</Text>;
    case 'section':
      return <Text style={pdf.h2}>{item.title}</Text>;
    case 'zone-title':
      return (
        <View>
          {item.withSection ? <Text style={pdf.h2}>Anodes to fit, by zone</Text> : null}
          <Text style={s.zoneTitle}>
            {item.title}
            {item.continued ? <Text style={s.continued}> (continued)</Text> : null}
          </Text>
        </View>
      );
    case 'head':
      return <Row table={item.table} cells={COLUMNS[item.table].map((c) => c.label)} rowStyle={s.headRow} />;
    case 'row':
      return <Row table={item.table} cells={item.cells} rowStyle={item.total ? s.totalRow : s.row} />;
    case 'empty':
      return <Text>No renewals are booked for this docking.</Text>;
    case 'notes':
      return (
        <View wrap={false}>
          <Text style={pdf.h2}>Fitting notes</Text>
          {list.fittingNotes.map((note, i) => (
            <View key={i} style={{ flexDirection: 'row', marginBottom: 2 }}>
              <Text style={{ width: 14 }}>{`${i + 1}.`}</Text>
              <Text style={{ flex: 1 }}>{note}</Text>
            </View>
          ))}
        </View>
      );
    case 'signatures':
      return <Signatures list={list} />;
  }
}

// Inter's contextual alternates (calt) change nothing in these texts but took about a fifth of
// the text-shaping time in the profile of a 300-line list: off for the whole document.
const PAGE_STYLE = [pdf.page, StyleSheet.create({ p: { fontFeatureSettings: { calt: false } } }).p];

/**
 * The dry-dock anode list: per zone what to fit, totals by model for ordering, fitting notes,
 * signatures and cautions, one <Page> per planned sheet with "page N of M" written in.
 * `pagination="checked"` lets every sheet wrap instead, so a test can compare react-pdf's page
 * count with the plan (the numbers printed are still the plan's).
 */
export function AnodeListDocument({ list, pagination = 'planned' }: { list: AnodeList; pagination?: 'planned' | 'checked' }) {
  const d = list.docking;
  const footer = `${list.organisation.name} · ${list.asset.name} · ${d.kind === 'campaign' ? 'anode list, campaign' : 'dry-dock anode list, docking'} from ${dayText(d.plannedStart)} · revision ${list.revision.number}`;
  const printed = `Printed ${format(list.printedAt, 'd MMM yyyy HH:mm')} by ${list.printedBy}`;
  const plan = planAnodeListPages(list);
  // Should an estimate ever exceed a sheet, let react-pdf continue it rather than cut text off.
  const wrap = pagination === 'checked' || !plan.fits;
  return (
    <Document title={`Dry-dock anode list: ${list.asset.name}, ${d.plannedStart}, revision ${list.revision.number}`} author="Tidewarden" subject="Sacrificial anodes to order and fit at a docking">
      {plan.pages.map((items, p) => (
        <Page key={p} size="A4" orientation="landscape" style={PAGE_STYLE} wrap={wrap}>
          {items.map((item, i) => (
            <PlanItemView key={i} item={item} list={list} />
          ))}
          <View style={pdf.footer} fixed>
            <Text>{footer}</Text>
            <Text>{`${printed} · page ${p + 1} of ${plan.pages.length}`}</Text>
          </View>
        </Page>
      ))}
    </Document>
  );
}
