import { format } from 'date-fns';

/**
 * Date-only values: a calendar day with no time of day (installedOn, surveyedOn, docking dates,
 * removedOn, fittedOn, renew-by dates, end-of-life days). They are written 'YYYY-MM-DD' or held as a
 * Date at midnight UTC, and are parsed, compared and formatted in UTC, never in the time zone of
 * the server or the browser: '2027-03-14' reads 14 Mar 2027 in New York and on Kiritimati alike.
 * A Date that is not at midnight (a forecast's end of life) stands for the UTC day it falls on.
 * Pure (date-fns only): safe in client components, server code, PDFs and e-mails.
 */

/** 'YYYY-MM-DD', or a Date read as its UTC calendar day. */
type DateOnlyValue = string | Date;

/** How a date-only value is shown to people: screens, PDFs and e-mails. */
const DATE_ONLY_DISPLAY = 'd MMM yyyy';

const MS_PER_DAY = 86_400_000;
const DATE_ONLY_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

function utcMidnight(text: string): Date | null {
  const m = DATE_ONLY_PATTERN.exec(text);
  if (!m) return null;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const d = new Date(Date.UTC(2000, month - 1, day));
  d.setUTCFullYear(year); // Date.UTC reads years 0-99 as 1900-1999
  // Round trip: 2026-02-30 would roll over to 2 March, 2026-13-01 to January of the next year.
  return d.getUTCFullYear() === year && d.getUTCMonth() === month - 1 && d.getUTCDate() === day ? d : null;
}

function validDate(value: Date): Date {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) throw new RangeError('Invalid date.');
  return value;
}

/** Whether `value` is a real calendar day written exactly 'YYYY-MM-DD' (no 2026-02-30, no 2026-2-3). */
export function isDateOnly(value: unknown): value is string {
  return typeof value === 'string' && utcMidnight(value) !== null;
}

/** 'YYYY-MM-DD' as a Date at midnight UTC; a RangeError for anything else (2026-02-30, 2026-2-3, ''). */
export function parseDateOnly(text: string): Date {
  const d = typeof text === 'string' ? utcMidnight(text) : null;
  if (!d) throw new RangeError(`Not a date written YYYY-MM-DD: ${JSON.stringify(text)}.`);
  return d;
}

/** The UTC calendar day of `value` as a Date at midnight UTC. */
function dayOf(value: DateOnlyValue): Date {
  if (typeof value === 'string') return parseDateOnly(value);
  return new Date(Math.floor(validDate(value).getTime() / MS_PER_DAY) * MS_PER_DAY);
}

/** The UTC calendar day of `date`, 'YYYY-MM-DD'. */
export function toDateOnly(date: Date): string {
  const d = validDate(date);
  const year = d.getUTCFullYear();
  if (year < 0 || year > 9999) throw new RangeError(`Year ${year} cannot be written YYYY-MM-DD.`);
  return `${String(year).padStart(4, '0')}-${String(d.getUTCMonth() + 1).padStart(2, '0')}-${String(d.getUTCDate()).padStart(2, '0')}`;
}

/** Today's UTC calendar day, 'YYYY-MM-DD' (the day against which stored days are compared). */
export function todayDateOnly(now: Date = new Date()): string {
  return toDateOnly(now);
}

/** Negative, zero or positive as `a` is a calendar day before, the same as, or after `b` (UTC). */
export function compareDateOnly(a: DateOnlyValue, b: DateOnlyValue): number {
  return Math.sign(dayOf(a).getTime() - dayOf(b).getTime());
}

/**
 * A date-only value in a date-fns pattern of day, month and year tokens (default 'd MMM yyyy',
 * e.g. 14 Mar 2027), printed from the UTC calendar day whatever the host's time zone.
 */
export function formatDateOnly(value: DateOnlyValue, pattern: string = DATE_ONLY_DISPLAY): string {
  const day = typeof value === 'string' ? parseDateOnly(value) : validDate(value);
  const [year, month, date] = [day.getUTCFullYear(), day.getUTCMonth(), day.getUTCDate()];
  // The display pattern written out directly, as date-fns would: the forecast puts several in
  // every reason it gives, for thousands of groups at a time.
  if (pattern === DATE_ONLY_DISPLAY && year >= 0) return `${date} ${MONTHS[month]} ${String(year).padStart(4, '0')}`;
  // date-fns formats in the host's zone, so hand it a local date with the same calendar fields.
  // Noon, not midnight: no zone moves its clocks at noon, so the local day cannot slip.
  const local = new Date(2000, 0, 1, 12);
  local.setFullYear(year, month, date);
  return format(local, pattern);
}
