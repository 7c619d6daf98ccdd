import { CAUTION_TEXT, PagePlanner, rowParts, sheetArea, textParts, type PlannedBlock, type SheetColumn, type SheetPlan } from '../pdf-kit';
import { FONT, LINE_HEIGHT, lineCount } from '../measure-text';
import {
  AGED_COATING_NOTE,
  EQUATIONS,
  EQUATIONS_NOTE,
  NOTE_TITLE,
  anodeRows,
  basisRows,
  criteriaRows,
  densityNote,
  hasAgedCoating,
  headline,
  inputRows,
  messages,
  performanceRows,
  resultsSourceLine,
  revisionLine,
  signatureRows,
  titleLine,
  zoneAreaRows,
  zoneDemandRows,
  type CalculationNoteData,
} from './note-data';

/*
 * The page plan of the calculation note, A4 PORTRAIT on every sheet: geometry, columns, text
 * styles and their heights, and where the sheets break. render.tsx draws what this plans; the
 * heights here follow the styles it uses (all defined in this file), so change them together.
 * Why the note plans its own sheets (page numbers, speed): pdf-kit's PagePlanner.
 */

const SHEET = sheetArea('portrait');
export const CONTENT_WIDTH = SHEET.width;
const BODY_HEIGHT = SHEET.height;
const LINE = FONT * LINE_HEIGHT;
/** Right padding of every cell, pt; a left-aligned column after a right-aligned one pads its left by as much. */
export const CELL_PAD = 5;
/** Share of the width taken by the left (organisation and title) half of the title block. */
export const TITLE_LEFT_SHARE = 0.7;

// ---------- tables ----------
type Col = SheetColumn;

export type NoteTable = 'particulars' | 'inputs' | 'anode' | 'zone-areas' | 'zone-demand' | 'equations' | 'criteria' | 'performance' | 'basis' | 'signatures';

export const COLUMNS: Record<NoteTable, Col[]> = {
  particulars: [
    { label: 'Particular', share: 0.35 },
    { label: 'Value', share: 0.65 },
  ],
  inputs: [
    { label: 'Input', share: 0.3 },
    { label: 'Value', share: 0.7 },
  ],
  anode: [
    { label: 'Quantity', share: 0.27 },
    { label: 'Value', share: 0.36 },
    { label: 'Source', share: 0.37 },
  ],
  'zone-areas': [
    { label: 'Zone', share: 0.15 },
    { label: 'Kind', share: 0.12 },
    { label: 'Area m²', share: 0.08, right: true },
    { label: 'Area source', share: 0.19, gap: true },
    { label: 'Depth', share: 0.08 },
    { label: 'Coating', share: 0.14 },
    { label: 'Age yr', share: 0.06, right: true },
    { label: 'Coating constants', share: 0.18, gap: true },
  ],
  'zone-demand': [
    { label: 'Zone', share: 0.19 },
    { label: 'ic i / m / f mA/m²', share: 0.19 },
    { label: 'fc i / m / f', share: 0.18 },
    { label: 'Ici A', share: 0.09, right: true },
    { label: 'Icm A', share: 0.09, right: true },
    { label: 'Icf A', share: 0.09, right: true },
    { label: 'Anodes', share: 0.17, right: true },
  ],
  equations: [
    { label: 'Quantity', share: 0.3 },
    { label: 'Relation', share: 0.42 },
    { label: 'Source', share: 0.28 },
  ],
  criteria: [
    { label: 'Criterion', share: 0.56 },
    { label: 'Exact', share: 0.22, right: true },
    { label: 'At least', share: 0.22, right: true },
  ],
  performance: [
    { label: 'Quantity', share: 0.45 },
    { label: 'Value', share: 0.55, right: true },
  ],
  basis: [
    { label: 'Topic', share: 0.38 },
    { label: 'Source', share: 0.38 },
    { label: 'Status', share: 0.24 },
  ],
  signatures: [
    { label: '', share: 0.16 },
    { label: 'Name', share: 0.34 },
    { label: 'Date', share: 0.2 },
    { label: 'Signature', share: 0.3 },
  ],
};

export const colWidth = (c: Col) => c.share * CONTENT_WIDTH;
/** Room for text inside a cell. */
const textRoom = (c: Col) => colWidth(c) - CELL_PAD * (c.gap ? 2 : 1);
const rooms = (table: NoteTable) => COLUMNS[table].map(textRoom);

// ---------- text styles (render.tsx uses these objects, so heights and drawing agree) ----------
export type TextStyle = 'small' | 'caption' | 'headline' | 'warning' | 'notice' | 'caution';
// A type alias, not an interface: react-pdf's Style takes it only with an implicit index signature.
type BoxText = {
  fontSize: number;
  fontWeight?: number;
  color?: string;
  backgroundColor?: string;
  padding?: number;
  marginTop?: number;
  marginBottom?: number;
};
export const TEXT_STYLES: Record<TextStyle, BoxText> = {
  small: { fontSize: 7.5, color: '#46505b', marginTop: 2, marginBottom: 2 },
  caption: { fontSize: 7.5, color: '#46505b', fontWeight: 600, marginTop: 8, marginBottom: 2 },
  headline: { fontSize: 11, fontWeight: 700, marginTop: 2, marginBottom: 4 },
  warning: { fontSize: 8, padding: 4, marginBottom: 3, backgroundColor: '#faefd6' },
  notice: { fontSize: 8, padding: 4, marginBottom: 3, backgroundColor: '#eef1f2' },
  caution: { fontSize: 8, padding: 6, marginTop: 4, marginBottom: 6, backgroundColor: '#f4ead7', color: '#7a5718' },
};
const textWidthOf = (style: TextStyle) => CONTENT_WIDTH - 2 * (TEXT_STYLES[style].padding ?? 0);
const textHeight = (style: TextStyle, lines: number) => {
  const s = TEXT_STYLES[style];
  return lines * s.fontSize * LINE_HEIGHT + 2 * (s.padding ?? 0) + (s.marginTop ?? 0) + (s.marginBottom ?? 0);
};

/** Extra height of a signature row, room to sign (render.tsx pads the row by it). */
export const SIGNATURE_GAP = 10;

// Heights from pdf-kit's styles (font size x line height + padding + border): change one and the other together.
const H = {
  row: (lines: number) => lines * LINE + 4 + 0.4,
  head: (lines: number) => lines * LINE + 4 + 0.8,
  heading: (lines: number) => lines * 10.5 * LINE_HEIGHT + 12 + 4 + 2 + 0.6,
};

function titleHeight(data: CalculationNoteData) {
  const left = CONTENT_WIDTH * TITLE_LEFT_SHARE;
  const right = CONTENT_WIDTH - left;
  return Math.max(
    lineCount(data.organisation, left, 7.5) * 7.5 * LINE_HEIGHT + lineCount(NOTE_TITLE, left, 15) * 15 * 1.25 + 3 + lineCount(titleLine(data), left) * LINE,
    lineCount(revisionLine(data), right) * LINE + 2 * 7.5 * LINE_HEIGHT,
  );
}

// ---------- page plan ----------
export type PlanItem =
  | { kind: 'title' }
  | { kind: 'heading'; text: string }
  | { kind: 'text'; style: TextStyle; text: string }
  | { kind: 'head'; table: NoteTable }
  | { kind: 'row'; table: NoteTable; cells: string[]; bold: boolean };

export type CalculationNotePlan = SheetPlan<PlanItem>;

const heading = (text: string): PlannedBlock<PlanItem> => ({ item: { kind: 'heading', text }, height: H.heading(lineCount(text, CONTENT_WIDTH, 10.5)) });
const headHeight = (table: NoteTable) => H.head(Math.max(...COLUMNS[table].map((c) => lineCount(c.label, textRoom(c)))));
/** A paragraph in parts that each fit a sheet. */
const paragraph = (style: TextStyle, text: string): PlannedBlock<PlanItem>[] => {
  const maxLines = Math.floor((BODY_HEIGHT - textHeight(style, 0)) / (TEXT_STYLES[style].fontSize * LINE_HEIGHT));
  return textParts(text, textWidthOf(style), TEXT_STYLES[style].fontSize, maxLines).map((part) => ({ item: { kind: 'text', style, text: part.text }, height: textHeight(style, part.lines) }));
};
const sum = (blocks: PlannedBlock<PlanItem>[]) => blocks.reduce((t, b) => t + b.height, 0);

/**
 * Cuts the note into sheets. Tables continue over sheets with their title (marked "continued")
 * and column heads repeated; a heading never ends a sheet; a total stays with the row above it;
 * the results headline stays with the caution, and the revision block with the closing caution.
 */
export function planCalculationNote(data: CalculationNoteData): CalculationNotePlan {
  const planner = new PagePlanner<PlanItem>(BODY_HEIGHT);

  /** A table under a lead (heading or caption) repeated, marked continued, on each further sheet. */
  const table = (kind: NoteTable, rows: { cells: string[]; total?: boolean }[], lead: (continued: boolean) => PlannedBlock<PlanItem>[]) => {
    const head = { item: { kind: 'head', table: kind } as PlanItem, height: headHeight(kind) };
    // A part must fit a fresh sheet under the lead, with room for a total row after it.
    const maxRow = BODY_HEIGHT - Math.max(sum(lead(false)), sum(lead(true))) - head.height - H.row(1);
    const planned = rows.flatMap((r) =>
      rowParts(r.cells, rooms(kind), H.row, maxRow).map((part) => ({ item: { kind: 'row', table: kind, cells: part.cells, bold: r.total ?? false } as PlanItem, height: part.height, withPrevious: r.total })),
    );
    planner.table(planned, (continued) => [...lead(continued), head]);
  };
  const titled = (title: string) => (continued: boolean) => [heading(continued ? `${title} (continued)` : title)];
  const captioned = (first: PlannedBlock<PlanItem>[], caption: string) => (continued: boolean) =>
    continued ? paragraph('caption', `${caption} (continued)`) : [...first, ...paragraph('caption', caption)];
  /** Paragraphs placed one after the other, the first kept with what must precede it. */
  const paragraphs = (before: PlannedBlock<PlanItem>[], blocks: PlannedBlock<PlanItem>[]) => {
    planner.keep([...before, ...blocks.slice(0, 1)]);
    for (const b of blocks.slice(1)) {
      planner.ensure(b.height);
      planner.put(b.item, b.height);
    }
  };
  const rowsOf = (cells: string[][]) => cells.map((c) => ({ cells: c }));

  planner.put({ kind: 'title' }, titleHeight(data));
  table('particulars', rowsOf(data.asset.particulars), titled('1. Asset'));
  table('inputs', rowsOf(inputRows(data)), titled('2. Design basis and inputs'));
  table('anode', rowsOf(anodeRows(data)), titled('3. Anode'));

  const zones = '4. Zones';
  table('zone-areas', rowsOf(zoneAreaRows(data)), captioned([heading(zones)], 'Areas and coatings'));
  if (hasAgedCoating(data)) paragraphs([], paragraph('small', AGED_COATING_NOTE));
  const demand = zoneDemandRows(data);
  if (demand.length) {
    table('zone-demand', demand, captioned([], 'Current demand: densities used, breakdown factors, currents and anodes'));
    paragraphs([], paragraph('small', densityNote(data)));
  }

  table('equations', rowsOf(EQUATIONS), titled('5. Equations'));
  paragraphs([], paragraph('small', EQUATIONS_NOTE));

  const result = data.result;
  const resultsLead = [heading('6. Results'), ...paragraph('small', resultsSourceLine(data))];
  if (result) {
    // The headline and the caution share the results sheet.
    planner.keep([...resultsLead, ...paragraph('headline', headline(data, result)), ...paragraph('caution', CAUTION_TEXT)]);
    table('criteria', criteriaRows(result), captioned([], 'Anode count by criterion (each a minimum)'));
    table('performance', rowsOf(performanceRows(result)), captioned([], 'Anode performance and masses'));
  } else {
    planner.keep([...resultsLead, ...paragraph('warning', `No valid results: ${data.resultError ?? 'the inputs cannot be sized.'}`), ...paragraph('caution', CAUTION_TEXT)]);
  }

  const said = messages(data);
  paragraphs(
    [heading('7. Notices and warnings')],
    said.length ? said.flatMap((m) => paragraph(m.kind, m.text)) : paragraph('small', 'None raised by the checks.'),
  );

  const basis = basisRows(data);
  if (basis.length) table('basis', rowsOf(basis), titled('8. Sources'));
  else paragraphs([heading('8. Sources')], paragraph('small', 'No results, so no sources are listed.'));

  // The revision block and the closing caution, kept whole.
  const signatures = signatureRows(data).flatMap((cells) => rowParts(cells, rooms('signatures'), (n) => H.row(n) + SIGNATURE_GAP, Infinity));
  planner.keep([
    heading('9. Revision block'),
    { item: { kind: 'head', table: 'signatures' }, height: headHeight('signatures') },
    ...signatures.map((r) => ({ item: { kind: 'row', table: 'signatures', cells: r.cells, bold: false } as PlanItem, height: r.height })),
    ...paragraph('caution', CAUTION_TEXT),
  ]);

  return planner.plan();
}
