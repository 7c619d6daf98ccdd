import type { AnodeList, AnodeListLine, AnodeListOrderLine, AnodeListTotals } from '@/lib/anode-list/build-anode-list';
import { alloyWords, ANODE_LIST_LINE_COLUMNS, DIMENSIONS_KEY, dimensionsWords, dockingKindWords, mountingWords, statusWords, zoneWords } from '@/lib/labels/anode-list';
import { CAUTION_TEXT, PagePlanner, rowParts as cutRow, sheetArea, textParts, type DrawnColumn, type SheetColumn, type SheetPlan } from '../pdf-kit';
import { formatDateOnly } from '@/lib/dates/date-only';
import { count, kgNumber, kgText } from './format';
import { FONT, LINE_HEIGHT, lineCount } from '../measure-text';

/*
 * The page plan of the dry-dock anode list, A4 LANDSCAPE: geometry, columns, the texts of
 * every cell, and where the sheets break. render.tsx draws what this plans.
 *
 * Why landscape: each line has twelve columns, one of them free-text positions
 * ("Fr 144-150 P/S, 2.5 m above keel"). In portrait (523 pt of width) the positions column
 * would be about 85 pt and most lines would wrap to two or three rows, so a 300-line list
 * would run to twice the pages and the yard would read across broken rows. Landscape
 * (770 pt) keeps nearly every line on one row, and the sheet still prints and files on A4.
 *
 * The sheets are planned here rather than by react-pdf (why: pdf-kit's PagePlanner): a 300-line
 * list in one wrapping <Page> took about 1.6-2 s on two cores and grew with pages x lines, and
 * react-pdf 4.9 drops a page-number footer on the pages it splits. planAnodeListPages estimates
 * every block's height from Inter's glyph widths (rounded up, measure-text.ts) and cuts the list
 * into sheets itself; each sheet is a <Page wrap={false}> with its number written in. Rows and
 * warnings taller than a sheet are cut into parts at line breaks, so every block fits. A test
 * renders the same plan with wrapping pages (`pagination="checked"`) and checks react-pdf needs
 * no more sheets than planned, i.e. the estimate never runs short.
 *
 * The column heads and rows are not laid out by react-pdf at all: the plan keeps each cell's
 * lines, wrapped with the widths of the weight they are printed in, and render.tsx writes them as
 * planned (pdf-kit's DrawnRows), so their heights are exact. That cut the time of a 300-line list
 * to about a third (npm run bench prints its ratio to the baseline).
 */

// ---------- geometry (points) ----------
const SHEET = sheetArea('landscape');
export const CONTENT_WIDTH = SHEET.width;
const CONTENT_HEIGHT = SHEET.height;
const LINE = FONT * LINE_HEIGHT;
export const CELL_PAD = 3;
/** Share of the content width taken by the left (organisation and title) half of the title block. */
export const TITLE_LEFT_SHARE = 0.72;

// ---------- tables ----------
type Col = SheetColumn;

export type TableKind = 'line' | 'order' | 'asset' | 'docking';

export const COLUMNS: Record<TableKind, Col[]> = {
  // The labels are the CSV's too (words.ts); positions keeps the widest room (the free text that wraps).
  line: lineColumns([0.075, 0.08, 0.1, 0.065, 0.08, 0.03, 0.055, 0.06, 0.06, 0.065, 0.18, 0.07, 0.08], [5, 6, 7, 8, 9], 10),
  order: [
    { label: 'Model', share: 0.12 },
    { label: 'Dimensions, mm', share: 0.14 },
    { label: 'Alloy', share: 0.12 },
    { label: 'Mounting', share: 0.12 },
    { label: 'Quantity', share: 0.08, right: true },
    { label: 'Net each, kg', share: 0.1, right: true },
    { label: 'Gross each, kg', share: 0.1, right: true },
    { label: 'Net total, kg', share: 0.11, right: true },
    { label: 'Gross total, kg', share: 0.11, right: true },
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

function lineColumns(shares: number[], right: number[], gap: number): Col[] {
  return ANODE_LIST_LINE_COLUMNS.map((label, i) => ({ label, share: shares[i], ...(right.includes(i) ? { right: true } : {}), ...(i === gap ? { gap: true } : {}) }));
}

export const colWidth = (c: Col) => c.share * CONTENT_WIDTH;
/** Room for text inside a cell. */
export const textRoom = (c: Col) => colWidth(c) - CELL_PAD - (c.gap ? CELL_PAD * 2 : 0);

/** The columns as the drawn tables place them (render.tsx): x from the left of the content, padding as textRoom leaves it. */
export const DRAWN_COLUMNS = Object.fromEntries(
  (Object.keys(COLUMNS) as TableKind[]).map((kind) => {
    let x = 0;
    return [kind, COLUMNS[kind].map((c): DrawnColumn => {
      const col = { x, width: colWidth(c), right: c.right ?? false, padLeft: c.gap ? CELL_PAD * 2 : 0, padRight: CELL_PAD };
      x += col.width;
      return col;
    })];
  }),
) as Record<TableKind, DrawnColumn[]>;

// Heights the plan uses, from the styles in render.tsx and pdf-kit's (font size x line height
// + padding + border; a drawn row is exactly this high): change one and the other together, or
// the plan runs short.
export const RULE = { row: { width: 0.4, color: '#d9d5cc' }, strong: { width: 0.8, color: '#7b8590' } } as const;
const H = {
  row: (lines: number) => lines * LINE + 4 + RULE.row.width,
  totalRow: (lines: number) => lines * LINE + 4 + RULE.strong.width,
  /** The column heads of the two particulars tables (one line each). */
  head: LINE + 4 + RULE.strong.width,
  zoneTitle: (lines: number) => lines * 9.5 * 1.35 + 6 + 2,
  section: 10.5 * 1.35 + 12 + 4 + 2 + 0.6,
  warning: (lines: number) => lines * 8 * 1.35 + 8 + 3,
};

// ---------- cell texts (measured here, printed by render.tsx) ----------
export const lineCells = (l: AnodeListLine): string[] => [
  l.groupLabel,
  l.designation,
  dimensionsWords(l.dimensions),
  alloyWords(l.alloy),
  mountingWords(l.mounting),
  count(l.quantity),
  kgNumber(l.netMassEachKg),
  kgNumber(l.grossMassEachKg),
  kgNumber(l.netMassTotalKg),
  kgNumber(l.grossMassTotalKg),
  // The engineer's words as written; how they were read, when that adds anything, on a second line.
  l.positions ? (l.positionReadAs ? `${l.positions}\nRead as: ${l.positionReadAs}` : l.positions) : '–',
  l.renewBy ? formatDateOnly(l.renewBy) : '–',
  statusWords(l.status),
];
const subtotalCells = (t: AnodeListTotals): string[] => ['Subtotal', '', '', '', '', count(t.quantity), '', '', kgNumber(t.netMassKg), kgNumber(t.grossMassKg), '', '', ''];
const orderCells = (o: AnodeListOrderLine): string[] => [
  o.designation,
  dimensionsWords(o.dimensions),
  alloyWords(o.alloy),
  mountingWords(o.mounting),
  count(o.quantity),
  kgNumber(o.netMassEachKg),
  kgNumber(o.grossMassEachKg),
  kgNumber(o.netMassTotalKg),
  kgNumber(o.grossMassTotalKg),
];
const grandTotalCells = (t: AnodeListTotals): string[] => ['Grand total', '', '', '', count(t.quantity), '', '', kgNumber(t.netMassKg), kgNumber(t.grossMassKg)];

export function dockingRows(list: AnodeList): string[][] {
  const d = list.docking;
  return [
    ['Kind', dockingKindWords(d.kind)],
    ['Planned', d.plannedEnd ? `${formatDateOnly(d.plannedStart)} to ${formatDateOnly(d.plannedEnd)}` : `from ${formatDateOnly(d.plannedStart)}`],
    ...(d.actualStart ? [['Actual start', formatDateOnly(d.actualStart)]] : []),
    [list.words.worksBy, d.yard ?? 'not yet chosen'],
    ...(d.reference ? [['Reference', d.reference]] : []),
    ['Anodes to fit', `${count(list.totals.quantity)} on ${count(list.lineCount)} line${list.lineCount === 1 ? '' : 's'}`],
    ['Net / gross mass', `${kgText(list.totals.netMassKg)} / ${kgText(list.totals.grossMassKg)}`],
  ];
}
export const assetRows = (list: AnodeList): string[][] => [['Name', list.asset.name], ...list.asset.particulars];
export const assetTitle = (list: AnodeList) => list.words.assetTitle;

export const titleLine = (list: AnodeList) => {
  const d = list.docking;
  return `${list.asset.name} (${list.words.assetTitle.toLowerCase()}) · ${dockingKindWords(d.kind)} from ${formatDateOnly(d.plannedStart)}${d.yard ? ` · ${d.yard}` : ''}`;
};
export const referenceLine = (list: AnodeList) => (list.docking.reference ? `${list.words.reference} ${list.docking.reference}` : '');
const titleHeight = (list: AnodeList) =>
  Math.max(
    lineCount(list.organisation.name, CONTENT_WIDTH * TITLE_LEFT_SHARE, 7.5) * 7.5 * 1.35 + lineCount(list.words.title, CONTENT_WIDTH * TITLE_LEFT_SHARE, 15) * 15 * 1.25 + 3 + lineCount(titleLine(list), CONTENT_WIDTH * TITLE_LEFT_SHARE) * LINE,
    LINE + lineCount(referenceLine(list), CONTENT_WIDTH * (1 - TITLE_LEFT_SHARE), 7.5) * 7.5 * 1.35,
  );

/** The signature block's rows: step, name, role, date (the person who prepared is the one who printed). */
export function signatureRows(list: AnodeList, when: (d: Date | null) => string): [string, string, string, string][] {
  const r = list.revision;
  return [
    ['Prepared', r.preparedBy ?? '', r.preparedByRole ?? '', when(r.preparedAt)],
    ['Checked', r.checkedBy ?? '', '', when(r.checkedAt)],
    ['Approved', r.approvedBy ?? '', '', when(r.approvedAt)],
    [list.words.fittedBy, '', '', ''],
    ['Accepted by (owner)', '', '', ''],
  ];
}
export const SIGNATURE_SHARES = [0.18, 0.26, 0.14, 0.12, 0.3] as const;
export const SIGNATURE_HEADS = ['Step', 'Name', 'Role', 'Date', 'Signature'] as const;

// ---------- page plan ----------
export type PlanItem =
  | { kind: 'title' }
  | { kind: 'header-tables' }
  | { kind: 'warning'; text: string; first: boolean }
  | { kind: 'section'; title: string }
  | { kind: 'zone-title'; title: string; continued: boolean; withSection: boolean }
  /** Column heads and rows carry their cells' lines and their height: render.tsx draws them as planned. */
  | { kind: 'head'; table: TableKind; lines: string[][]; height: number }
  | { kind: 'row'; table: TableKind; cells: string[]; lines: string[][]; height: number; total: boolean }
  | { kind: 'empty' }
  | { kind: 'key' }
  | { kind: 'notes' }
  | { kind: 'signatures' };

export type AnodeListPagePlan = SheetPlan<PlanItem>;

interface PlannedRow {
  cells: string[];
  lines: string[][];
  total: boolean;
  height: number;
}

/** A table row, cut into parts at line breaks when it is taller than `maxHeight`. */
function rowParts(cells: string[], table: TableKind, total: boolean, maxHeight: number, drawn = true): PlannedRow[] {
  // A drawn row (render.tsx) is written as planned, so it is measured with the widths of its weight (heads and totals 600);
  // the particulars tables side by side are laid out by react-pdf, so they keep the estimate that never runs short.
  const weight = drawn ? (total ? 600 : 400) : undefined;
  return cutRow(cells, COLUMNS[table].map(textRoom), (n) => (total ? H.totalRow(n) : H.row(n)), maxHeight, FONT, weight).map((part) => ({ ...part, total }));
}

/** A table's column heads, wrapped to their columns (a head like "Net each, kg" takes two lines). */
function headRow(table: TableKind): { kind: 'head'; table: TableKind; lines: string[][]; height: number } {
  const [head] = rowParts(COLUMNS[table].map((c) => c.label), table, true, Infinity);
  return { kind: 'head', table, lines: head.lines, height: head.height };
}

/**
 * Cuts the list into sheets. Tables continue over sheets with their title (marked
 * "continued") and column heads repeated; a title never ends a sheet; a subtotal or grand
 * total stays with the row above it; the fitting notes, and the signatures with the cautions,
 * are kept whole. Heights are estimates that never run short (see the file comment).
 */
export function planAnodeListPages(list: AnodeList): AnodeListPagePlan {
  const planner = new PagePlanner<PlanItem>(CONTENT_HEIGHT);
  const put = (item: PlanItem, height: number) => planner.put(item, height);
  const ensure = (height: number) => planner.ensure(height);

  /** A table under a title that is repeated, marked continued, on each further sheet. */
  const table = (kind: TableKind, rows: { cells: string[]; total?: boolean }[], title: (continued: boolean) => { item: PlanItem; height: number }) => {
    const head = headRow(kind);
    const lead = Math.max(title(false).height, title(true).height) + head.height;
    // A part must fit a fresh sheet under the title, with room for a total row after it.
    const maxRow = CONTENT_HEIGHT - lead - H.totalRow(1);
    const planned = rows.flatMap((r) => rowParts(r.cells, kind, r.total ?? false, maxRow));
    planner.table(
      planned.map((row) => ({ item: { kind: 'row', table: kind, cells: row.cells, lines: row.lines, height: row.height, total: row.total }, height: row.height, withPrevious: row.total })),
      (continued) => [title(continued), { item: head, height: head.height }],
    );
  };
  const section = (name: string) => (continued: boolean) => ({ item: { kind: 'section', title: continued ? `${name} (continued)` : name } as PlanItem, height: H.section });

  // Title, then the two particulars tables side by side, or one under the other if too tall together.
  put({ kind: 'title' }, titleHeight(list));
  const sideHeight = (kind: TableKind, rows: string[][]) => H.section + H.head + rows.reduce((sum, cells) => sum + rowParts(cells, kind, false, Infinity, false)[0].height, 0);
  const sideBySide = Math.max(sideHeight('asset', assetRows(list)), sideHeight('docking', dockingRows(list)));
  if (sideBySide <= planner.room) {
    put({ kind: 'header-tables' }, sideBySide);
  } else {
    table('asset', assetRows(list).map((cells) => ({ cells })), section(assetTitle(list)));
    table('docking', dockingRows(list).map((cells) => ({ cells })), section('Docking'));
  }

  list.warnings.forEach((w, i) => {
    const maxLines = Math.floor((CONTENT_HEIGHT - H.warning(0) - 8) / (8 * LINE_HEIGHT));
    textParts(`Warning: ${w}`, CONTENT_WIDTH - 8, 8, maxLines).forEach((part, k) => {
      const first = i === 0 && k === 0;
      const h = H.warning(part.lines) + (first ? 8 : 0);
      ensure(h);
      put({ kind: 'warning', text: part.text, first }, h);
    });
  });

  if (list.zones.length === 0) {
    ensure(H.section + LINE);
    put({ kind: 'section', title: 'Anodes to fit, by zone' }, H.section);
    put({ kind: 'empty' }, LINE);
  }
  list.zones.forEach((z, zi) => {
    const name = `${zoneWords(z.zone)} · ${count(z.subtotal.quantity)} anode${z.subtotal.quantity === 1 ? '' : 's'}`;
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
    table('order', rows, section('Models and totals, for ordering'));
    const key = lineCount(DIMENSIONS_KEY, CONTENT_WIDTH, 7.5) * 7.5 * 1.35 + 3;
    ensure(key);
    put({ kind: 'key' }, key);
  }

  const notes = H.section + list.fittingNotes.reduce((sum, n) => sum + lineCount(n, CONTENT_WIDTH - 14) * LINE + 2, 0);
  ensure(notes);
  put({ kind: 'notes' }, notes);
  const signatures = H.section + H.head + 5 * (10 + LINE + 0.6 + 2) + 10 + 12 + lineCount(CAUTION_TEXT, CONTENT_WIDTH - 12, 8) * 8 * 1.35;
  ensure(signatures);
  put({ kind: 'signatures' }, signatures);

  return planner.plan();
}
