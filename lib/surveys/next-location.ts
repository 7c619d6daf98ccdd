/**
 * The location the capture form proposes after a reading: the number that changed between the last two locations,
 * when they differ in that number only, moved on by the same step ("Fr 20 P", "Fr 22 P" → "Fr 24 P"; "Pile B6
 * -2 m", "Pile B7 -2 m" → "Pile B8 -2 m"); else the last number moved on by one ("Pile B7" → "Pile B8"). Leading zeros and decimals keep their width ("P07" → "P08",
 * "KP 1.5" after "KP 1.0" → "KP 2.0"). A location without a number, or a step that would go below zero, is
 * proposed unchanged; the inspector types over it. Pure: the phone runs it offline.
 */
export function nextLocation(previous: string, beforePrevious?: string | null): string {
  const last = splitNumbers(previous);
  if (!last.numbers.length) return previous;
  // The numbers that moved between the last two locations, when the words around them stay the same and they all
  // moved by one step ("Pile B6 -2 m", "Pile B7 -2 m": the pile moves on, the depth stays; "Fr 20-22 S",
  // "Fr 24-26 S": both ends); else the last number, by one.
  let moving = [last.numbers.length - 1];
  let step: number | null = null;
  const before = beforePrevious ? splitNumbers(beforePrevious) : null;
  if (before && before.texts.join('\u0000') === last.texts.join('\u0000')) {
    const moved = last.numbers.map((_, i) => i).filter((i) => last.numbers[i].value !== before.numbers[i].value);
    const steps = new Set(moved.map((i) => roundStep(last.numbers[i].value - before.numbers[i].value)));
    if (moved.length && steps.size === 1) {
      moving = moved;
      step = [...steps][0];
    }
  }
  const nextDigits = new Map<number, string>();
  for (const index of moving) {
    const digits = movedOn(last.numbers[index], step ?? 10 ** -last.numbers[index].decimals);
    if (digits === null) return previous;
    nextDigits.set(index, digits);
  }
  return last.texts.map((text, i) => text + (i < last.numbers.length ? (nextDigits.get(i) ?? last.numbers[i].digits) : '')).join('');
}

/** The number moved on by the step, keeping its leading zeros and decimals; null below zero. */
function movedOn(number: LocationNumber, step: number): string | null {
  const decimals = Math.max(number.decimals, decimalsOf(step));
  const next = Math.round((number.value + step) * 10 ** decimals) / 10 ** decimals;
  if (next < 0) return null;
  const digits = next.toFixed(decimals);
  const integerWidth = number.digits.split('.')[0].length;
  const [whole, fraction] = digits.split('.');
  if (number.digits.startsWith('0') && whole.length < integerWidth) return whole.padStart(integerWidth, '0') + (fraction !== undefined ? `.${fraction}` : '');
  return digits;
}

function roundStep(step: number): number {
  return Math.round(step * 1e6) / 1e6;
}

interface LocationNumber {
  digits: string;
  value: number;
  decimals: number;
}

/** The location as the words between its numbers (one more than the numbers) and the numbers themselves. */
function splitNumbers(text: string): { texts: string[]; numbers: LocationNumber[] } {
  const texts: string[] = [];
  const numbers: LocationNumber[] = [];
  let at = 0;
  for (const match of text.matchAll(/\d+(?:\.\d+)?/g)) {
    const digits = match[0];
    texts.push(text.slice(at, match.index));
    numbers.push({ digits, value: Number(digits), decimals: digits.includes('.') ? digits.split('.')[1].length : 0 });
    at = (match.index ?? 0) + digits.length;
  }
  texts.push(text.slice(at));
  return { texts, numbers };
}

function decimalsOf(value: number): number {
  const text = String(Math.abs(value));
  if (text.includes('e')) return 0;
  return text.includes('.') ? Math.min(text.split('.')[1].length, 6) : 0;
}
