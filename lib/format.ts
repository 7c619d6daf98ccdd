// Number formatting for engineering screens and printed lists: fixed digits, thin grouping, unit beside.
// One formatter per number of digits, made once: toLocaleString with options builds a new one on every call,
// which was the single largest cost of rendering a page of figures.
const formatters = new Map<number, Intl.NumberFormat>();
function formatterFor(digits: number): Intl.NumberFormat {
  let formatter = formatters.get(digits);
  if (!formatter) {
    formatter = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formatters.set(digits, formatter);
  }
  return formatter;
}

export function fmt(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return formatterFor(digits).format(value);
}

/** Significant-figure formatting for quantities whose size varies a lot (resistances, currents). */
export function fmtSig(value: number | null | undefined, significant = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const digits = Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(value))));
  return fmt(value, Math.min(digits, 6));
}

export const fmtInt = (value: number | null | undefined) => fmt(value, 0);
