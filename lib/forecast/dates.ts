/**
 * Date arithmetic in UTC only (never the host's time zone).
 *
 * Two kinds of time are used on purpose:
 * - consumption time: a year is 8760 h (365 days), the same year that the handbook
 *   consumption rate I x 8760 / eps is expressed in, so a life of Y years is exactly
 *   Y x 8760 hours after its start;
 * - planning time: margins and docking intervals are calendar months (the way owners
 *   and class count them), added with end-of-month clamping (31 Jan + 1 month = 28/29 Feb).
 */

export const HOURS_PER_YEAR = 8760;
export const MS_PER_HOUR = 3_600_000;
export const MS_PER_DAY = 86_400_000;
/** One consumption year (8760 h) in milliseconds. */
export const MS_PER_YEAR = HOURS_PER_YEAR * MS_PER_HOUR;

/** Years of 8760 h from a to b (negative when b is before a). */
export function yearsBetween(a: Date, b: Date): number {
  return (b.getTime() - a.getTime()) / MS_PER_YEAR;
}

/** The instant `years` (of 8760 h) after `d`. */
export function addYears8760(d: Date, years: number): Date {
  return new Date(d.getTime() + years * MS_PER_YEAR);
}

function daysInMonthUTC(year: number, monthIndex: number): number {
  return new Date(Date.UTC(year, monthIndex + 1, 0)).getUTCDate();
}

/**
 * Calendar months added in UTC, keeping the time of day; the day of month is clamped to
 * the target month's length (as date-fns addMonths does, but without local time).
 */
export function addMonthsUTC(d: Date, months: number): Date {
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + months;
  const targetYear = y + Math.floor(m / 12);
  const targetMonth = ((m % 12) + 12) % 12;
  const day = Math.min(d.getUTCDate(), daysInMonthUTC(targetYear, targetMonth));
  return new Date(
    Date.UTC(targetYear, targetMonth, day, d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds(), d.getUTCMilliseconds()),
  );
}

/** Midnight UTC of the day `d` falls on. */
export function startOfDayUTC(d: Date): Date {
  return new Date(Math.floor(d.getTime() / MS_PER_DAY) * MS_PER_DAY);
}

/** Whole UTC day number since 1970-01-01. */
export function dayNumberUTC(d: Date): number {
  return Math.floor(d.getTime() / MS_PER_DAY);
}
