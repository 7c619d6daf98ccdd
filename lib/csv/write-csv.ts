import Papa, { type UnparseConfig } from 'papaparse';

/*
 * CSV for spreadsheets, written by Papa.unparse (RFC 4180: comma-separated, CRLF line ends,
 * a field quoted when it holds a quote, comma or line break, inner quotes doubled).
 *
 * Formula injection (common practice, OWASP "CSV Injection"): a spreadsheet runs a cell that
 * starts with =, +, -, @, a tab or a carriage return as a formula (see FORMULA_START for the rest), and our cells carry texts
 * users typed (group labels, positions, zone names). Such a text is prefixed with an
 * apostrophe so it shows as text. A plain number (JS number, or a text such as "-0.85" or
 * "+1.5e3") is left alone so it still reads as a number.
 *
 * Why not papaparse's own `escapeFormulae`: it escapes every matching text, "-0.85" included
 * (only JS numbers are exempt, and the writers pass masses as texts rounded for print), and it
 * quotes every escaped field; so the check is done here, before unparse, and only for texts.
 */

export type CsvCell = string | number | null | undefined;

/** A plain decimal number, optionally signed, with an optional exponent. */
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// Also a line feed (some importers drop a leading line break and then read the formula), and the
// full-width = + - @ that spreadsheets with an East Asian input method turn into their ASCII forms.
const FORMULA_START = /^[=+\-@\t\r\n\uFF1D\uFF0B\uFF0D\uFF20]/;

/** The text with an apostrophe in front when a spreadsheet would run it as a formula. */
function neutraliseFormula(value: CsvCell): CsvCell {
  return typeof value === 'string' && FORMULA_START.test(value) && !NUMBER.test(value) ? `'${value}` : value;
}

const UNPARSE: UnparseConfig = {
  delimiter: ',',
  newline: '\r\n',
  quoteChar: '"',
  escapeChar: '"',
  header: false,
  skipEmptyLines: false,
  escapeFormulae: false,
  // Also quote a semicolon: spreadsheets set to a semicolon list separator would split the field there.
  quotes: (value: unknown) => typeof value === 'string' && value.includes(';'),
};

/** One CSV field, formula-safe and quoted when needed. */
export function csvField(value: CsvCell): string {
  return Papa.unparse([[neutraliseFormula(value)]], UNPARSE);
}

/**
 * Rows as a CSV text, every line ended by CRLF (the last one too). Rows may differ in length;
 * an empty row writes a blank line.
 */
export function writeCsv(rows: readonly (readonly CsvCell[])[]): string {
  if (rows.length === 0) return '';
  return `${Papa.unparse(rows.map((row) => row.map(neutraliseFormula)), UNPARSE)}\r\n`;
}
