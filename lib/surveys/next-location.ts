/**
 * The location the capture form proposes after a reading: the last number in the previous location moved on by
 * the step between the last two locations when they differ only in that number ("Fr 20 P", "Fr 22 P" →
 * "Fr 24 P"), else by one ("Pile B7" → "Pile B8"). Leading zeros and decimals keep their width ("P07" → "P08",
 * "KP 1.5" after "KP 1.0" → "KP 2.0"). A location without a number, or a step that would go below zero, is
 * proposed unchanged; the inspector types over it. Pure: the phone runs it offline.
 */
export function nextLocation(previous: string, beforePrevious?: string | null): string {
  const last = splitLastNumber(previous);
  if (!last) return previous;
  let step = 10 ** -last.decimals;
  const before = beforePrevious ? splitLastNumber(beforePrevious) : null;
  if (before && before.prefix === last.prefix && before.suffix === last.suffix) {
    const learned = last.value - before.value;
    if (learned !== 0) step = learned;
  }
  const decimals = Math.max(last.decimals, decimalsOf(step));
  const next = Math.round((last.value + step) * 10 ** decimals) / 10 ** decimals;
  if (next < 0) return previous;
  let digits = next.toFixed(decimals);
  const integerWidth = last.digits.split('.')[0].length;
  const [whole, fraction] = digits.split('.');
  if (last.digits.startsWith('0') && whole.length < integerWidth) digits = whole.padStart(integerWidth, '0') + (fraction !== undefined ? `.${fraction}` : '');
  return `${last.prefix}${digits}${last.suffix}`;
}

interface LastNumber {
  prefix: string;
  digits: string;
  value: number;
  decimals: number;
  suffix: string;
}

function splitLastNumber(text: string): LastNumber | null {
  const matches = [...text.matchAll(/\d+(?:\.\d+)?/g)];
  const match = matches.at(-1);
  if (!match || match.index === undefined) return null;
  const digits = match[0];
  return { prefix: text.slice(0, match.index), digits, value: Number(digits), decimals: digits.includes('.') ? digits.split('.')[1].length : 0, suffix: text.slice(match.index + digits.length) };
}

function decimalsOf(value: number): number {
  const text = String(Math.abs(value));
  if (text.includes('e')) return 0;
  return text.includes('.') ? Math.min(text.split('.')[1].length, 6) : 0;
}
