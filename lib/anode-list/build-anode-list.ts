import { compareDateOnly, isDateOnly } from '../dates/date-only';
import { AnodeListInputError } from './errors';
import { fittingNotesFor } from './fitting-notes';
import { anodeListWords, type AnodeListDimensions, type AnodeListWords } from '@/lib/labels/anode-list';

/**
 * The anode list: what a yard orders and fits at one docking, or a contractor at one diving
 * campaign (its words follow which: words.ts).
 * Pure: validates the renewals booked for the docking, groups them by zone, and totals them
 * by zone, overall, and by anode model for ordering. Masses in kg; totals are quantity x each.
 *
 * Rules
 * - Zones appear in the order of their first line in the input; a line without a zone goes
 *   under `zone: null` ("no zone"), also in input order. Inside a zone, lines are sorted by
 *   group label in natural order ("P2" before "P10"), then by model, then input order.
 * - Ordering totals are one line per model, sorted by designation. Lines that carry the same
 *   designation with different alloy, mounting or masses (a catalogue entry edited between
 *   bookings) are NOT merged: each variant gets its own ordering line and a warning.
 * - Totals are rounded to 1e-6 kg so that sums such as 3 x 7.7 do not print float noise.
 */

export const ANODE_LIST_ALLOYS = ['al-zn-in', 'zinc', 'magnesium', 'magnesium-high-potential'] as const;
export const ANODE_LIST_MOUNTINGS = ['flush-weld', 'flush-bolt', 'standoff', 'bracelet', 'pile-mounted'] as const;
export const ANODE_LIST_STATUSES = ['proposed', 'confirmed', 'ordered', 'fitted'] as const;

export interface AnodeListRenewalInput {
  /** Zone name; null = no zone. */
  zone: string | null;
  groupLabel: string;
  /** Anode model designation. */
  designation: string;
  /** 'al-zn-in' | 'zinc' | 'magnesium' | 'magnesium-high-potential' */
  alloy: string;
  /** 'flush-weld' | 'flush-bolt' | 'standoff' | 'bracelet' | 'pile-mounted' */
  mounting: string;
  quantity: number;
  /** Each, kg. */
  netMassKg: number;
  /** Each, kg (net plus strap, insert or core). */
  grossMassKg: number;
  /** The model's overall dimensions from the catalogue, m; null or absent when unknown. */
  dimensions?: AnodeListDimensions | null;
  /** The position exactly as the engineer wrote it: the yard works from these words. */
  positions: string | null;
  /** How Tidewarden read the position (lib/drawings formatPosition), printed under it as "Read as: …"; null or absent when it says nothing more. */
  positionReadAs?: string | null;
  /** e.g. 'forecast depletion', 'survey finding', 'damage'. */
  reason: string;
  /** 'proposed' | 'confirmed' | 'ordered' | 'fitted' */
  status: string;
  /**
   * The group's forecast renew-by date, YYYY-MM-DD (lib/forecast GroupForecast.renewBy): the date
   * the renewal is scheduled on. Null or absent when there is none (a fitted group, no forecast).
   */
  renewBy?: string | null;
}

export interface AnodeListInput {
  organisation: { name: string };
  asset: {
    name: string;
    kind: 'vessel' | 'structure';
    /** [label, value], already formatted. */
    particulars: [string, string][];
  };
  docking: {
    kind: string;
    /** YYYY-MM-DD */
    plannedStart: string;
    plannedEnd: string | null;
    actualStart?: string | null;
    yard: string | null;
    reference?: string | null;
  };
  renewals: AnodeListRenewalInput[];
  revision: {
    number: number;
    /** The name of whoever prepared (and printed) the list, never an e-mail address. */
    preparedBy: string | null;
    /** Their role in the organisation, in words ("Planner"). */
    preparedByRole?: string | null;
    preparedAt: Date;
    checkedBy?: string | null;
    checkedAt?: Date | null;
    approvedBy?: string | null;
    approvedAt?: Date | null;
  };
  printedAt: Date;
  printedBy: string;
}

export interface AnodeListLine {
  zone: string | null;
  groupLabel: string;
  designation: string;
  alloy: string;
  mounting: string;
  quantity: number;
  netMassEachKg: number;
  grossMassEachKg: number;
  netMassTotalKg: number;
  grossMassTotalKg: number;
  dimensions: AnodeListDimensions | null;
  positions: string | null;
  /** The structured reading of the position, or null when there is none or it repeats the text. */
  positionReadAs: string | null;
  reason: string;
  status: string;
  /** YYYY-MM-DD, or null. */
  renewBy: string | null;
}

export interface AnodeListTotals {
  quantity: number;
  netMassKg: number;
  grossMassKg: number;
}

export interface AnodeListZone {
  /** null = lines without a zone. */
  zone: string | null;
  lines: AnodeListLine[];
  subtotal: AnodeListTotals;
}

export interface AnodeListOrderLine {
  designation: string;
  alloy: string;
  mounting: string;
  quantity: number;
  netMassEachKg: number;
  grossMassEachKg: number;
  netMassTotalKg: number;
  grossMassTotalKg: number;
  dimensions: AnodeListDimensions | null;
}

export interface AnodeList {
  organisation: { name: string };
  asset: AnodeListInput['asset'];
  docking: {
    kind: string;
    plannedStart: string;
    plannedEnd: string | null;
    actualStart: string | null;
    yard: string | null;
    reference: string | null;
  };
  revision: {
    number: number;
    preparedBy: string | null;
    preparedByRole: string | null;
    preparedAt: Date;
    checkedBy: string | null;
    checkedAt: Date | null;
    approvedBy: string | null;
    approvedAt: Date | null;
  };
  printedAt: Date;
  printedBy: string;
  zones: AnodeListZone[];
  totals: AnodeListTotals;
  /** By model, for ordering; sorted by designation. */
  orderTotals: AnodeListOrderLine[];
  /** The words that follow the asset and the kind of work (words.ts). */
  words: AnodeListWords;
  /** The fitting notes that apply to this list (see fitting-notes.ts). */
  fittingNotes: string[];
  /** Things to settle before ordering (unconfirmed lines, inconsistent model data). */
  warnings: string[];
  lineCount: number;
}

/** Rounds a mass to 1e-6 kg: removes float noise from sums, keeps every printed digit. */
export const roundKg = (x: number): number => Math.round(x * 1e6) / 1e6;

const naturalOrder = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

export function buildAnodeList(input: AnodeListInput): AnodeList {
  const inp = record(input, 'input');
  const organisation = record(inp.organisation, 'organisation');
  const asset = record(inp.asset, 'asset');
  const docking = record(inp.docking, 'docking');
  const revision = record(inp.revision, 'revision');

  const assetKind = oneOf(asset.kind, ['vessel', 'structure'] as const, 'asset.kind');
  const particulars = list(asset.particulars, 'asset.particulars').map((p, i): [string, string] => {
    if (!Array.isArray(p) || p.length !== 2 || typeof p[0] !== 'string' || typeof p[1] !== 'string') {
      throw new AnodeListInputError(`asset.particulars[${i}]`, `asset.particulars[${i}] must be a [label, value] pair of texts.`);
    }
    return [p[0], p[1]];
  });

  const plannedStart = isoDay(docking.plannedStart, 'docking.plannedStart');
  const plannedEnd = nullable(docking.plannedEnd, (v) => isoDay(v, 'docking.plannedEnd'));
  if (plannedEnd !== null && compareDateOnly(plannedEnd, plannedStart) < 0) {
    throw new AnodeListInputError('docking.plannedEnd', `docking.plannedEnd (${plannedEnd}) must not be before docking.plannedStart (${plannedStart}).`);
  }

  const lines = list(inp.renewals, 'renewals').map((r, i) => readLine(r, `renewals[${i}]`));

  // Zones in order of first appearance; Map keeps insertion order and accepts null as a key.
  const byZone = new Map<string | null, { line: AnodeListLine; index: number }[]>();
  lines.forEach((line, index) => {
    const bucket = byZone.get(line.zone);
    if (bucket) bucket.push({ line, index });
    else byZone.set(line.zone, [{ line, index }]);
  });
  const zones: AnodeListZone[] = [...byZone].map(([zone, bucket]) => {
    bucket.sort((a, b) => naturalOrder.compare(a.line.groupLabel, b.line.groupLabel) || naturalOrder.compare(a.line.designation, b.line.designation) || a.index - b.index);
    const zoneLines = bucket.map((b) => b.line);
    return { zone, lines: zoneLines, subtotal: totalsOf(zoneLines) };
  });

  const orderTotals = orderLinesOf(lines);
  const warnings: string[] = [];
  const designations = new Map<string, number>();
  for (const o of orderTotals) designations.set(o.designation, (designations.get(o.designation) ?? 0) + 1);
  const mixed = [...designations].filter(([, variants]) => variants > 1).map(([designation]) => designation);
  if (mixed.length > 0) {
    warnings.push(
      `${mixed.length === 1 ? `Model ${mixed[0]} is` : `Models ${mixed.join(', ')} are`} booked with different data (alloy, mounting, masses or dimensions) on different lines, so each variant has its own ordering line. Check the catalogue before ordering.`,
    );
  }
  const unconfirmed = lines.filter((l) => l.status === 'proposed').length;
  if (unconfirmed > 0) {
    warnings.push(`${unconfirmed} of ${lines.length} line${lines.length === 1 ? '' : 's'} ${unconfirmed === 1 ? 'is' : 'are'} still proposed, not confirmed: confirm ${unconfirmed === 1 ? 'it' : 'them'} before ordering.`);
  }

  const words = anodeListWords(assetKind, text(docking.kind, 'docking.kind'));
  return {
    organisation: { name: text(organisation.name, 'organisation.name') },
    asset: { name: text(asset.name, 'asset.name'), kind: assetKind, particulars },
    docking: {
      kind: text(docking.kind, 'docking.kind'),
      plannedStart,
      plannedEnd,
      actualStart: nullable(docking.actualStart, (v) => isoDay(v, 'docking.actualStart')),
      yard: nullable(docking.yard, (v) => text(v, 'docking.yard')),
      reference: nullable(docking.reference, (v) => text(v, 'docking.reference')),
    },
    revision: {
      number: whole(revision.number, 'revision.number'),
      preparedBy: nullable(revision.preparedBy, (v) => text(v, 'revision.preparedBy')),
      preparedByRole: nullable(revision.preparedByRole, (v) => text(v, 'revision.preparedByRole')),
      preparedAt: date(revision.preparedAt, 'revision.preparedAt'),
      checkedBy: nullable(revision.checkedBy, (v) => text(v, 'revision.checkedBy')),
      checkedAt: nullable(revision.checkedAt, (v) => date(v, 'revision.checkedAt')),
      approvedBy: nullable(revision.approvedBy, (v) => text(v, 'revision.approvedBy')),
      approvedAt: nullable(revision.approvedAt, (v) => date(v, 'revision.approvedAt')),
    },
    printedAt: date(inp.printedAt, 'printedAt'),
    printedBy: text(inp.printedBy, 'printedBy'),
    zones,
    totals: totalsOf(lines),
    orderTotals,
    words,
    fittingNotes: fittingNotesFor(assetKind, lines.map((l) => l.mounting), words.occasion),
    warnings,
    lineCount: lines.length,
  };
}

function readLine(value: unknown, field: string): AnodeListLine {
  const r = record(value, field);
  const quantity = whole(r.quantity, `${field}.quantity`);
  const netMassEachKg = positive(r.netMassKg, `${field}.netMassKg`);
  const grossMassEachKg = positive(r.grossMassKg, `${field}.grossMassKg`);
  if (grossMassEachKg < netMassEachKg) {
    throw new AnodeListInputError(`${field}.grossMassKg`, `${field}.grossMassKg (${grossMassEachKg} kg) cannot be less than the net mass (${netMassEachKg} kg).`);
  }
  const zone = nullable(r.zone, (v) => {
    if (typeof v !== 'string') throw new AnodeListInputError(`${field}.zone`, `${field}.zone must be a text or null.`);
    return v.trim() === '' ? null : v.trim();
  });
  return {
    zone,
    groupLabel: text(r.groupLabel, `${field}.groupLabel`),
    designation: text(r.designation, `${field}.designation`),
    alloy: oneOf(r.alloy, ANODE_LIST_ALLOYS, `${field}.alloy`),
    mounting: oneOf(r.mounting, ANODE_LIST_MOUNTINGS, `${field}.mounting`),
    quantity,
    netMassEachKg,
    grossMassEachKg,
    netMassTotalKg: roundKg(quantity * netMassEachKg),
    grossMassTotalKg: roundKg(quantity * grossMassEachKg),
    dimensions: readDimensions(r.dimensions, `${field}.dimensions`),
    positions: nullable(r.positions, (v) => {
      if (typeof v !== 'string') throw new AnodeListInputError(`${field}.positions`, `${field}.positions must be a text or null.`);
      return v.trim() === '' ? null : v.trim();
    }),
    positionReadAs: nullable(r.positionReadAs, (v) => {
      if (typeof v !== 'string') throw new AnodeListInputError(`${field}.positionReadAs`, `${field}.positionReadAs must be a text or null.`);
      const readAs = v.trim();
      // Nothing to add when there is no text to read, or the reading says the text again.
      return readAs === '' || typeof r.positions !== 'string' || r.positions.trim() === '' || readAs === r.positions.trim() ? null : readAs;
    }),
    reason: typeof r.reason === 'string' ? r.reason.trim() : fail(`${field}.reason`, `${field}.reason must be a text.`),
    status: oneOf(r.status, ANODE_LIST_STATUSES, `${field}.status`),
    renewBy: nullable(r.renewBy, (v) => isoDay(v, `${field}.renewBy`)),
  };
}

const DIMENSION_FIELDS = ['lengthM', 'widthM', 'thicknessM', 'radiusM', 'innerDiameterM'] as const;

function readDimensions(value: unknown, field: string): AnodeListDimensions | null {
  if (value === null || value === undefined) return null;
  const r = record(value, field);
  const out: AnodeListDimensions = { lengthM: positive(r.lengthM, `${field}.lengthM`) };
  for (const key of DIMENSION_FIELDS.slice(1)) {
    if (r[key] !== undefined && r[key] !== null) out[key] = positive(r[key], `${field}.${key}`);
  }
  return out;
}

function totalsOf(lines: readonly AnodeListLine[]): AnodeListTotals {
  let quantity = 0;
  let net = 0;
  let gross = 0;
  for (const l of lines) {
    quantity += l.quantity;
    net += l.netMassTotalKg;
    gross += l.grossMassTotalKg;
  }
  return { quantity, netMassKg: roundKg(net), grossMassKg: roundKg(gross) };
}

function orderLinesOf(lines: readonly AnodeListLine[]): AnodeListOrderLine[] {
  const byModel = new Map<string, AnodeListOrderLine>();
  for (const l of lines) {
    const key = JSON.stringify([l.designation, l.alloy, l.mounting, l.netMassEachKg, l.grossMassEachKg, l.dimensions]);
    const o = byModel.get(key);
    if (o) {
      o.quantity += l.quantity;
      o.netMassTotalKg += l.netMassTotalKg;
      o.grossMassTotalKg += l.grossMassTotalKg;
    } else {
      byModel.set(key, {
        designation: l.designation,
        alloy: l.alloy,
        mounting: l.mounting,
        quantity: l.quantity,
        netMassEachKg: l.netMassEachKg,
        grossMassEachKg: l.grossMassEachKg,
        netMassTotalKg: l.netMassTotalKg,
        grossMassTotalKg: l.grossMassTotalKg,
        dimensions: l.dimensions,
      });
    }
  }
  return [...byModel.values()]
    .map((o) => ({ ...o, netMassTotalKg: roundKg(o.netMassTotalKg), grossMassTotalKg: roundKg(o.grossMassTotalKg) }))
    .sort((a, b) => naturalOrder.compare(a.designation, b.designation) || a.netMassEachKg - b.netMassEachKg || a.alloy.localeCompare(b.alloy) || a.mounting.localeCompare(b.mounting));
}

// ---------- validation helpers (each throws AnodeListInputError naming the field) ----------

function fail(field: string, message: string): never {
  throw new AnodeListInputError(field, message);
}

function show(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (Array.isArray(value)) return 'a list';
  if (value instanceof Date) return 'an invalid date';
  return `a ${typeof value}`;
}

function record(value: unknown, field: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) fail(field, `${field} must be an object (got ${show(value)}).`);
  return value as Record<string, unknown>;
}

function list(value: unknown, field: string): unknown[] {
  if (!Array.isArray(value)) fail(field, `${field} must be a list (got ${show(value)}).`);
  return value;
}

function text(value: unknown, field: string): string {
  if (typeof value !== 'string' || value.trim() === '') fail(field, `${field} must be a non-empty text (got ${show(value)}).`);
  return value.trim();
}

function oneOf<T extends string>(value: unknown, allowed: readonly T[], field: string): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    fail(field, `${field} must be one of ${allowed.map((a) => `'${a}'`).join(', ')} (got ${show(value)}).`);
  }
  return value as T;
}

/** A positive whole number: counts of anodes, revision numbers. */
function whole(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 1) fail(field, `${field} must be a whole number of at least 1 (got ${show(value)}).`);
  return value;
}

/** A positive finite number: masses in kg. */
function positive(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) fail(field, `${field} must be a positive number of kg (got ${show(value)}).`);
  return value;
}

function date(value: unknown, field: string): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) fail(field, `${field} must be a valid date (got ${show(value)}).`);
  return value;
}

/** A calendar day written YYYY-MM-DD that exists (no 2027-02-30). */
function isoDay(value: unknown, field: string): string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value)) fail(field, `${field} must be a date written YYYY-MM-DD (got ${show(value)}).`);
  if (!isDateOnly(value)) fail(field, `${field} is not a real date (got ${show(value)}).`);
  return value;
}

function nullable<T>(value: unknown, read: (v: unknown) => T): T | null {
  return value === null || value === undefined ? null : read(value);
}
