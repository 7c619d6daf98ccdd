/*
 * How the anode list writes masses and counts (days: formatDateOnly from lib/dates/date-only; words: lib/labels/anode-list). Shared by the page plan, which measures
 * these texts, and the rendering, which prints them: both must see the same strings.
 */

// Formatters made once: Number.toLocaleString builds a new one on every call, which showed in the profile.
const KG_1 = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const KG_2 = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const COUNT = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** A mass in kg with one decimal, two when the value needs them (a 0.25 kg anode stays 0.25), no unit: for columns headed "…, kg". */
export function kgNumber(x: number): string {
  if (!Number.isFinite(x)) return '–';
  const oneDecimal = Math.abs(x * 10 - Math.round(x * 10)) < 1e-6;
  return (oneDecimal ? KG_1 : KG_2).format(x);
}

/** kg with its unit, as kgNumber; the style of lib/format's fmt. */
export function kgText(x: number): string {
  return Number.isFinite(x) ? `${kgNumber(x)} kg` : '–';
}

export const count = (n: number) => COUNT.format(n);
