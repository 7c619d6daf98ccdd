/**
 * The CSV format for uploading survey readings (diver, drop-cell and ROV surveys).
 *
 * Format (see SURVEY_CSV_COLUMNS for the user-facing description)
 * - A header row naming the columns, case-insensitive, in any order; unknown columns are
 *   refused. Columns: location (required), potential_v, electrode, anode_group, remaining,
 *   comment. Header cells left blank (trailing separators from a spreadsheet) are ignored
 *   as long as the rows leave them blank too.
 * - Separator: comma, or semicolon (European spreadsheets). It is taken from the header row
 *   (column names contain neither), with papaparse's own detection over `,` and `;` when the
 *   header is ambiguous. An Excel "sep=;" first line is honoured.
 * - Decimal commas ("-0,945") are read only in semicolon-separated files.
 * - Blank lines, and rows whose cells are all blank, are skipped.
 *
 * Line numbers
 * `line` is the row number a spreadsheet shows: the header is 1, the next record 2, and so
 * on; blank lines count as rows (a spreadsheet shows them as empty rows), and a quoted field
 * spanning several text lines is one row. Where the record starts on a different line of the
 * text (after a multi-line field, or below an Excel "sep=" line), errors also carry
 * `textLine`, the 1-based line in a text editor.
 */
import Papa from 'papaparse';
import { convertPotential, type ReferenceElectrode } from '@/lib/cp';

/** Reference electrodes accepted in a survey file. */
export type Electrode = Extract<ReferenceElectrode, 'ag-agcl-seawater' | 'cse' | 'sce' | 'zinc'>;

export const SURVEY_ELECTRODES: readonly Electrode[] = ['ag-agcl-seawater', 'cse', 'sce', 'zinc'];

export const SURVEY_CSV_COLUMN_NAMES = ['location', 'potential_v', 'electrode', 'anode_group', 'remaining', 'comment'] as const;
export type SurveyCsvColumn = (typeof SURVEY_CSV_COLUMN_NAMES)[number];

export const DEFAULT_MAX_ROWS = 5000;
export const MAX_LOCATION_CHARS = 80;
export const MAX_COMMENT_CHARS = 500;
/** Plausible range of a reading against any accepted electrode, V. */
export const POTENTIAL_MIN_V = -2.0;
export const POTENTIAL_MAX_V = 0.5;
/** Smallest magnitude read as a plausible potential in millivolts (0.1 V); below it no millivolt hint is given. */
export const MIN_PLAUSIBLE_MILLIVOLTS = 100;
/** Errors listed before the "and N more" entry. */
export const MAX_REPORTED_ERRORS = 200;

export interface ParsedReading {
  /** Spreadsheet row number (header = 1). */
  line: number;
  location: string;
  /** As measured, V against `electrode`. */
  potentialV: number | null;
  /** The electrode of `potentialV`; null when no potential was given. */
  electrode: Electrode | null;
  /** `potentialV` converted to Ag/AgCl/seawater, rounded to the microvolt. */
  potentialAgAgClV: number | null;
  anodeGroupLabel: string | null;
  /** Share of the original anode mass remaining, 0..1. */
  remainingFraction: number | null;
  comment: string | null;
}

export interface SurveyCsvError {
  /** Spreadsheet row number (header = 1). */
  line: number;
  /** Line in a text editor, given only where it differs from `line`. */
  textLine?: number;
  column?: SurveyCsvColumn;
  message: string;
}

/**
 * A failed parse still lists the rows that are valid (`goodRows`), so the user can import them alone after
 * seeing the errors; it is empty when the file itself is unusable (header, size).
 */
export type ParseSurveyCsvResult = { ok: true; rows: ParsedReading[] } | { ok: false; errors: SurveyCsvError[]; goodRows: ParsedReading[] };

export interface ParseSurveyCsvOptions {
  /** Electrode for rows that give a potential but leave `electrode` blank. */
  defaultElectrode?: Electrode;
  /** Labels of the anode groups installed on the asset. */
  knownGroupLabels: string[];
  /** Most data rows accepted; default 5000. */
  maxRows?: number;
}

// ---------------------------------------------------------------------------------------
// Electrode names

const key = (s: string): string => s.toLowerCase().replace(/[\s/_.\-]+/g, '');

/** Friendly names, keyed without case, spaces, slashes, dots, dashes or underscores. */
const ELECTRODE_ALIASES: ReadonlyMap<string, Electrode> = new Map<string, Electrode>([
  ...['ag-agcl-seawater', 'Ag/AgCl', 'AgAgCl', 'Ag/AgCl/seawater', 'Ag/AgCl seawater', 'silver chloride', 'silver/silver chloride', 'silver-silver chloride'].map(
    (a) => [key(a), 'ag-agcl-seawater'] as const,
  ),
  ...['cse', 'Cu/CuSO4', 'CuCuSO4', 'copper sulphate', 'copper sulfate', 'copper/copper sulphate', 'copper/copper sulfate', 'copper-copper sulphate', 'copper-copper sulfate'].map(
    (a) => [key(a), 'cse'] as const,
  ),
  ...['sce', 'calomel', 'saturated calomel'].map((a) => [key(a), 'sce'] as const),
  ...['zinc', 'Zn'].map((a) => [key(a), 'zinc'] as const),
]);

/** The accepted electrode for a name or alias, or null. */
export function electrodeFromName(name: string): Electrode | null {
  return ELECTRODE_ALIASES.get(key(name.trim())) ?? null;
}

const ELECTRODE_HELP = 'ag-agcl-seawater (Ag/AgCl), cse (Cu/CuSO4), sce (calomel) or zinc (Zn)';

// ---------------------------------------------------------------------------------------
// Numbers

const NUMBER_RE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;

/** A plain decimal number; a decimal comma only when `decimalComma`. Null if not a number. */
function parseDecimal(raw: string, decimalComma: boolean): number | null {
  let s = raw.trim().replace(/^\u2212/, '-'); // spreadsheets sometimes write the Unicode minus sign
  if (decimalComma) {
    if (s.includes('.') && s.includes(',')) return null; // thousands separators are not accepted
    s = s.replace(',', '.');
  }
  if (!NUMBER_RE.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

const roundMicro = (v: number): number => Math.round(v * 1e6) / 1e6;

// ---------------------------------------------------------------------------------------
// Template and documentation

/** Group labels used by SURVEY_CSV_TEMPLATE (an asset needs these groups for it to import as is). */
export const SURVEY_CSV_TEMPLATE_GROUP_LABELS: readonly string[] = ['Bent 1 piles'];

/** Downloadable template: the header and three invented example rows. */
export const SURVEY_CSV_TEMPLATE = [
  'location,potential_v,electrode,anode_group,remaining,comment',
  'B1-A,-0.945,ag-agcl-seawater,Bent 1 piles,0.65,Diver survey; anode sound',
  'B1-B,-0.99,cse,Bent 1 piles,55%,"Marine growth cleaned, reading at mudline"',
  'Fr 42 P,-1.02,ag-agcl-seawater,,,Hull reading at frame 42 port',
  '',
].join('\r\n');

export interface SurveyCsvColumnDoc {
  name: SurveyCsvColumn;
  required: boolean;
  description: string;
  example: string;
}

export const SURVEY_CSV_COLUMNS: readonly SurveyCsvColumnDoc[] = [
  {
    name: 'location',
    required: true,
    description: `Where the reading was taken, up to ${MAX_LOCATION_CHARS} characters: a pile by bent and letter, a chainage along a wall, or a hull position by frame and side.`,
    example: 'B3-A',
  },
  {
    name: 'potential_v',
    required: false,
    description: `Potential in volts (e.g. -0.945), or in millivolts with the unit (e.g. -945 mV). Plausible range ${POTENTIAL_MIN_V.toFixed(1)} to +${POTENTIAL_MAX_V.toFixed(1)} V. Each row needs a potential, a remaining value, or both.`,
    example: '-0.945',
  },
  {
    name: 'electrode',
    required: false,
    description: `Reference electrode of the potential: ${ELECTRODE_HELP}; names such as "silver chloride", "copper sulphate" or "calomel" are also read. May be left blank when the upload names a default electrode.`,
    example: 'ag-agcl-seawater',
  },
  {
    name: 'anode_group',
    required: false,
    description: 'Label of an anode group installed on the asset, exactly as recorded.',
    example: 'Bent 1 piles',
  },
  {
    name: 'remaining',
    required: false,
    description: 'Share of the original anode mass remaining: a fraction from 0 to 1 (0.65) or a percent (65%).',
    example: '65%',
  },
  {
    name: 'comment',
    required: false,
    description: `Free text, up to ${MAX_COMMENT_CHARS} characters. Put it in double quotes if it contains the separator or a line break.`,
    example: 'Anode intact, light marine growth',
  },
];

// ---------------------------------------------------------------------------------------
// Byte checks

export type CheckCsvBytesResult = { ok: true; text: string } | { ok: false; code: 'too-large' | 'binary' | 'encoding' | 'empty'; message: string };

const MB = 1024 * 1024;
const formatMb = (bytes: number): string => {
  const mb = bytes / MB;
  if (mb < 0.1) return `${Math.max(1, Math.round(bytes / 1024))} KB`; // tiny limits read better in KB
  return `${Number.isInteger(mb) ? mb : mb >= 10 ? Math.round(mb) : Math.round(mb * 10) / 10} MB`;
};

const startsWith = (bytes: Uint8Array, magic: readonly number[]): boolean => bytes.length >= magic.length && magic.every((b, i) => bytes[i] === b);

const ascii = (s: string): number[] => [...s].map((c) => c.charCodeAt(0));

function containsAscii(bytes: Uint8Array, needle: string, limit: number): boolean {
  const n = ascii(needle);
  const end = Math.min(bytes.length, limit) - n.length;
  outer: for (let i = 0; i <= end; i++) {
    for (let j = 0; j < n.length; j++) if (bytes[i + j] !== n[j]) continue outer;
    return true;
  }
  return false;
}

const WORKBOOK_MESSAGE = 'This looks like a spreadsheet workbook; save it from the spreadsheet as CSV (comma separated) first.';

/**
 * Checks an uploaded file before parsing: size, binary content, UTF-8, emptiness.
 * Returns the text with any UTF-8 byte-order mark removed.
 */
export function checkCsvBytes(bytes: Uint8Array, { maxBytes }: { maxBytes: number }): CheckCsvBytesResult {
  if (bytes.length > maxBytes) {
    return { ok: false, code: 'too-large', message: `The file is ${formatMb(bytes.length)}; the limit is ${formatMb(maxBytes)}. Split the survey into smaller files.` };
  }
  if (bytes.length === 0) return { ok: false, code: 'empty', message: 'The file is empty.' };

  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06]) || startsWith(bytes, [0x50, 0x4b, 0x07, 0x08])) {
    const excel = containsAscii(bytes, 'xl/', 1 << 20) || containsAscii(bytes, '[Content_Types].xml', 1 << 20);
    return { ok: false, code: 'binary', message: excel ? WORKBOOK_MESSAGE : 'This is a ZIP archive, not a CSV file; upload the CSV file itself.' };
  }
  if (startsWith(bytes, [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1])) {
    return { ok: false, code: 'binary', message: WORKBOOK_MESSAGE }; // legacy .xls (OLE2 compound file)
  }
  if (startsWith(bytes, ascii('%PDF'))) return { ok: false, code: 'binary', message: 'This is a PDF document, not a CSV file.' };
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { ok: false, code: 'binary', message: 'This is a PNG image, not a CSV file.' };
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return { ok: false, code: 'binary', message: 'This is a JPEG image, not a CSV file.' };
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff])) {
    return { ok: false, code: 'encoding', message: 'The file is saved as UTF-16 ("Unicode text"); save it as CSV UTF-8 (or plain CSV) instead.' };
  }
  if (bytes.includes(0)) return { ok: false, code: 'binary', message: 'The file contains binary data, not text; upload a CSV file.' };

  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    return { ok: false, code: 'encoding', message: 'The file is not valid UTF-8 text; save it as "CSV UTF-8" from the spreadsheet.' };
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '') return { ok: false, code: 'empty', message: 'The file is empty.' };
  return { ok: true, text };
}

// ---------------------------------------------------------------------------------------
// Parsing

interface RawRecord {
  cells: string[];
  line: number;
  textLine: number;
  quoteError: string | null;
}

/** Start offsets of each text line (after \r\n, \n or a lone \r). */
function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) starts.push(i + 1);
    else if (c === 13 && text.charCodeAt(i + 1) !== 10) starts.push(i + 1);
  }
  return starts;
}

function lineOfOffset(starts: number[], offset: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= offset) lo = mid;
    else hi = mid - 1;
  }
  return lo + 1;
}

const isBlank = (cells: string[]): boolean => cells.every((c) => c.trim() === '');

function chooseDelimiter(body: string): string | undefined {
  const firstLine = body.split(/\r\n|\n|\r/).find((l) => l.trim() !== '') ?? '';
  const comma = firstLine.includes(',');
  const semi = firstLine.includes(';');
  if (comma && !semi) return ',';
  if (semi && !comma) return ';';
  return undefined; // papaparse guesses between the two
}

function quoteMessage(e: Papa.ParseError): string {
  if (e.code === 'MissingQuotes') return 'A quoted field is never closed: check for a missing double quote (") on this row; the rest of the file was read into it.';
  if (e.code === 'InvalidQuotes') return 'A quoted field has text after its closing double quote; write a double quote inside a quoted field as "".';
  return `The row could not be read: ${e.message}.`;
}

/** Parses a survey CSV. Reports every row error (up to 200 and a count of the rest). */
export function parseSurveyCsv(text: string, options: ParseSurveyCsvOptions): ParseSurveyCsvResult {
  const maxRows = options.maxRows ?? DEFAULT_MAX_ROWS;
  if (!Number.isInteger(maxRows) || maxRows < 1) throw new RangeError('maxRows must be a positive whole number.');
  if (options.defaultElectrode !== undefined && !SURVEY_ELECTRODES.includes(options.defaultElectrode)) {
    throw new RangeError(`defaultElectrode must be one of ${SURVEY_ELECTRODES.join(', ')}.`);
  }
  const knownLabels = options.knownGroupLabels.map((l) => l.trim()).filter((l) => l !== '');

  let body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  // Excel's "sep=;" hint line: honoured and, as in Excel, not counted as a row.
  let forcedDelimiter: string | undefined;
  let textLineShift = 0;
  const sep = /^"?sep=([,;])"?[ \t]*(?:\r\n|\n|\r|$)/i.exec(body);
  if (sep) {
    forcedDelimiter = sep[1];
    body = body.slice(sep[0].length);
    textLineShift = 1;
  }
  const delimiter = forcedDelimiter ?? chooseDelimiter(body);

  const starts = lineStarts(body);
  const records: RawRecord[] = [];
  let dataRows = 0;
  let headerSeen = false;
  const overflow: { record: RawRecord | null } = { record: null };
  let rowStart = 0;
  let usedDelimiter = delimiter ?? ',';

  Papa.parse<string[]>(body, {
    header: false,
    skipEmptyLines: false,
    dynamicTyping: false,
    ...(delimiter ? { delimiter } : { delimitersToGuess: [',', ';'] }),
    step: (res, parser) => {
      usedDelimiter = res.meta.delimiter || usedDelimiter;
      const textLine = lineOfOffset(starts, rowStart) + textLineShift;
      rowStart = res.meta.cursor;
      const cells = (res.data ?? []).map((c) => (c ?? '').toString());
      const quoteErr = res.errors.find((e) => e.type === 'Quotes') ?? null;
      const rec: RawRecord = { cells, line: records.length + 1, textLine, quoteError: quoteErr ? quoteMessage(quoteErr) : null };
      if (isBlank(cells) && !rec.quoteError) {
        records.push({ ...rec, cells: [] });
        return;
      }
      if (headerSeen && ++dataRows > maxRows) {
        overflow.record = rec;
        parser.abort();
        return;
      }
      headerSeen = true;
      records.push(rec);
      if (quoteErr?.code === 'MissingQuotes') parser.abort();
    },
  });
  const decimalComma = usedDelimiter === ';';

  const errors: SurveyCsvError[] = [];
  const err = (rec: { line: number; textLine: number }, message: string, column?: SurveyCsvColumn): void => {
    errors.push({ line: rec.line, ...(rec.textLine !== rec.line ? { textLine: rec.textLine } : {}), ...(column ? { column } : {}), message });
  };

  // ---- header
  const headerIndex = records.findIndex((r) => r.cells.length > 0);
  if (headerIndex < 0) return { ok: false, errors: [{ line: 1, message: 'The file has no header row.' }], goodRows: [] };
  const header = records[headerIndex];
  if (header.quoteError) return { ok: false, errors: [{ line: header.line, message: header.quoteError }], goodRows: [] };
  const columnIndex = new Map<SurveyCsvColumn, number>();
  const unknown: string[] = [];
  const duplicate: string[] = [];
  header.cells.forEach((raw, i) => {
    const name = raw.trim().toLowerCase();
    if (name === '') return;
    if (!(SURVEY_CSV_COLUMN_NAMES as readonly string[]).includes(name)) unknown.push(raw.trim());
    else if (columnIndex.has(name as SurveyCsvColumn)) duplicate.push(name);
    else columnIndex.set(name as SurveyCsvColumn, i);
  });
  if (unknown.length > 0) {
    const tabHint = header.cells.some((c) => c.includes('\t')) ? ' The file looks tab-separated; save it as CSV (comma separated).' : '';
    err(
      header,
      `Unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.map((u) => `"${u}"`).join(', ')}. The columns are ${SURVEY_CSV_COLUMN_NAMES.join(', ')}.${tabHint}`,
    );
  }
  for (const d of duplicate) err(header, `The column "${d}" appears more than once.`, d as SurveyCsvColumn);
  if (!columnIndex.has('location')) err(header, 'The header has no "location" column; it is required.', 'location');
  if (!columnIndex.has('potential_v') && !columnIndex.has('remaining')) {
    err(header, 'The header needs a "potential_v" column, a "remaining" column, or both.');
  }
  if (errors.length > 0) return { ok: false, errors, goodRows: [] };

  // ---- rows
  const rows: ParsedReading[] = [];
  const cell = (rec: RawRecord, col: SurveyCsvColumn): string => {
    const i = columnIndex.get(col);
    return i === undefined ? '' : (rec.cells[i] ?? '').trim();
  };
  const headerWidth = header.cells.length;

  for (const rec of records.slice(headerIndex + 1)) {
    if (rec.cells.length === 0) continue;
    if (rec.quoteError) {
      err(rec, rec.quoteError);
      continue;
    }
    const before = errors.length;
    if (rec.cells.slice(headerWidth).some((c) => c.trim() !== '')) {
      err(
        rec,
        `The row has ${rec.cells.length} values but the header has ${headerWidth} columns${decimalComma ? '' : ' (a decimal comma, or a comment with a comma that is not in double quotes?)'}.`,
      );
      continue;
    }
    if (header.cells.some((h, i) => h.trim() === '' && (rec.cells[i] ?? '').trim() !== '')) {
      err(rec, 'The row has a value under a column with no header.');
    }

    // location
    const location = cell(rec, 'location');
    if (location === '') {
      err(rec, 'Location is required: a pile such as "B3-A", a chainage such as "CH 120.5" or a hull position such as "Fr 42 P".', 'location');
    } else if (/[\r\n]/.test(location)) {
      err(rec, 'Location must be on one line.', 'location');
    } else if (location.length > MAX_LOCATION_CHARS) {
      err(rec, `Location is ${location.length} characters; the limit is ${MAX_LOCATION_CHARS}.`, 'location');
    }

    // potential
    const rawPotential = cell(rec, 'potential_v');
    let potentialV: number | null = null;
    if (rawPotential !== '') {
      const m = /^(.*?)\s*(mv|v)?$/i.exec(rawPotential);
      const n = m ? parseDecimal(m[1], decimalComma) : null;
      if (n === null) {
        const commaHint = !decimalComma && rawPotential.includes(',') ? ' Use a point as the decimal separator (decimal commas are read only in semicolon-separated files).' : '';
        err(rec, `"${rawPotential}" is not a potential: give volts such as -0.945 or millivolts with the unit such as -945 mV.${commaHint}`, 'potential_v');
      } else {
        const v = m?.[2]?.toLowerCase() === 'mv' ? n / 1000 : n;
        if (v < POTENTIAL_MIN_V || v > POTENTIAL_MAX_V) {
          // A reading in millivolts is a number of hundreds (-945, -1050); a value like -5.2 is not one, so it gets no millivolt hint.
          const mvHint = !m?.[2] && Math.abs(n) >= MIN_PLAUSIBLE_MILLIVOLTS && n / 1000 >= POTENTIAL_MIN_V && n / 1000 <= POTENTIAL_MAX_V ? ` If it is in millivolts, add the unit: "${rawPotential} mV".` : ' Potentials are in volts (-0.945) or in millivolts with the unit (-945 mV).';
          err(rec, `${rawPotential} is outside the plausible range ${POTENTIAL_MIN_V.toFixed(1)} to +${POTENTIAL_MAX_V.toFixed(1)} V.${mvHint}`, 'potential_v');
        } else {
          potentialV = roundMicro(v);
        }
      }
    }

    // electrode
    const rawElectrode = cell(rec, 'electrode');
    let electrode: Electrode | null = null;
    if (rawElectrode !== '') {
      electrode = electrodeFromName(rawElectrode);
      if (!electrode) err(rec, `"${rawElectrode}" is not an accepted reference electrode: use ${ELECTRODE_HELP}.`, 'electrode');
    } else if (rawPotential !== '') {
      electrode = options.defaultElectrode ?? null;
      if (!electrode) err(rec, `Give the reference electrode of this potential: ${ELECTRODE_HELP}.`, 'electrode');
    }

    // anode group
    const rawGroup = cell(rec, 'anode_group');
    let anodeGroupLabel: string | null = null;
    if (rawGroup !== '') {
      anodeGroupLabel = matchGroupLabel(rawGroup, knownLabels);
      if (anodeGroupLabel === null) {
        if (knownLabels.length === 0) {
          err(rec, `Unknown anode group "${rawGroup}": no anode groups are recorded for this asset.`, 'anode_group');
        } else {
          const shown = knownLabels.slice(0, 5).map((l) => `"${l}"`).join(', ');
          const more = knownLabels.length > 5 ? ` and ${knownLabels.length - 5} more` : '';
          err(rec, `Unknown anode group "${rawGroup}". Known groups: ${shown}${more}.`, 'anode_group');
        }
      }
    }

    // remaining
    const rawRemaining = cell(rec, 'remaining');
    let remainingFraction: number | null = null;
    if (rawRemaining !== '') {
      const pct = /^(.*?)\s*%$/.exec(rawRemaining);
      const n = parseDecimal(pct ? pct[1] : rawRemaining, decimalComma);
      if (n === null) {
        err(rec, `"${rawRemaining}" is not a remaining value: give a fraction from 0 to 1 (0.65) or a percent (65%).`, 'remaining');
      } else if (pct) {
        if (n < 0 || n > 100) err(rec, `${rawRemaining} is outside 0 % to 100 %.`, 'remaining');
        else remainingFraction = roundMicro(n / 100);
      } else if (n < 0 || n > 1) {
        const hint = n > 1 && n <= 100 ? ` For a percent, add the sign: "${rawRemaining}%".` : '';
        err(rec, `${rawRemaining} is not a fraction from 0 to 1.${hint}`, 'remaining');
      } else {
        remainingFraction = n;
      }
    }

    if (rawPotential === '' && rawRemaining === '') {
      err(rec, 'Give a potential_v or a remaining value (or both).');
    }

    // comment
    const rawComment = cell(rec, 'comment').replace(/\r\n?/g, '\n');
    if (rawComment.length > MAX_COMMENT_CHARS) {
      err(rec, `Comment is ${rawComment.length} characters; the limit is ${MAX_COMMENT_CHARS}.`, 'comment');
    }

    if (errors.length > before) continue;
    const agAgCl = potentialV !== null && electrode !== null ? roundMicro(convertPotential({ valueV: potentialV, from: electrode, to: 'ag-agcl-seawater' })) : null;
    rows.push({
      line: rec.line,
      location,
      potentialV,
      electrode: potentialV === null ? null : electrode,
      potentialAgAgClV: agAgCl,
      anodeGroupLabel,
      remainingFraction,
      comment: rawComment === '' ? null : rawComment,
    });
  }

  if (overflow.record) {
    err(overflow.record, `The file has more than ${maxRows} readings; split it into files of at most ${maxRows} rows.`);
  }
  if (errors.length === 0 && rows.length === 0) {
    return { ok: false, errors: [{ line: header.line + 1, message: 'The file has a header row but no readings.' }], goodRows: [] };
  }
  // A file cut short at the row limit is not offered in part: its good lines would not be the whole of them.
  const goodRows = overflow.record ? [] : rows;
  if (errors.length > 0) {
    if (errors.length <= MAX_REPORTED_ERRORS) return { ok: false, errors, goodRows };
    const rest = errors.length - MAX_REPORTED_ERRORS;
    const firstOmitted = errors[MAX_REPORTED_ERRORS];
    return {
      ok: false,
      errors: [...errors.slice(0, MAX_REPORTED_ERRORS), { line: firstOmitted.line, message: `…and ${rest} more error${rest === 1 ? '' : 's'} not listed (the first at line ${firstOmitted.line}).` }],
      goodRows,
    };
  }
  return { ok: true, rows };
}

/** Exact label, else a unique case- and space-insensitive match; the recorded spelling is returned. */
function matchGroupLabel(raw: string, known: string[]): string | null {
  if (known.includes(raw)) return raw;
  const norm = (s: string): string => s.toLowerCase().replace(/\s+/g, ' ');
  const hits = known.filter((k) => norm(k) === norm(raw));
  return hits.length === 1 ? hits[0] : null;
}
