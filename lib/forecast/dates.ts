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
  return new Date(addMonthsMs(d.getTime(), months));
}

/** addMonthsUTC through the Date object's fields: the reference, used outside the fast path's range. */
function addMonthsViaDate(d: Date, months: number): Date {
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + months;
  const targetYear = y + Math.floor(m / 12);
  const targetMonth = ((m % 12) + 12) % 12;
  const day = Math.min(d.getUTCDate(), daysInMonthUTC(targetYear, targetMonth));
  return new Date(
    Date.UTC(targetYear, targetMonth, day, d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds(), d.getUTCMilliseconds()),
  );
}

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const isLeapYear = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

/**
 * addMonthsUTC on epoch milliseconds, in integer arithmetic (no Date objects: the scheduler
 * calls it for every group). The civil-calendar conversions are H. Hinnant's days_from_civil
 * and civil_from_days (proleptic Gregorian, as Date is). The same result as the Date fields
 * give; years the fast path does not take (before 100, where Date.UTC reads 0-99 as 1900-1999,
 * or near the end of Date's range) and fractional months go through the Date fields.
 */
export function addMonthsMs(t: number, months: number): number {
  const days = Math.floor(t / MS_PER_DAY);
  const msOfDay = t - days * MS_PER_DAY;
  // civil_from_days: March-based years of 400-year eras.
  const z = days + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const dayOfMonth = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const monthIndex = mp < 10 ? mp + 2 : mp - 10;
  const year = yoe + era * 400 + (monthIndex < 2 ? 1 : 0);

  const m = monthIndex + months;
  const targetYear = year + Math.floor(m / 12);
  if (!Number.isInteger(months) || targetYear < 100 || targetYear > 275_000) return addMonthsViaDate(new Date(t), months).getTime();
  const targetMonth = ((m % 12) + 12) % 12;
  const monthDays = targetMonth === 1 && isLeapYear(targetYear) ? 29 : MONTH_DAYS[targetMonth];
  const day = Math.min(dayOfMonth, monthDays);
  // days_from_civil
  const y = targetMonth < 2 ? targetYear - 1 : targetYear;
  const targetEra = Math.floor(y / 400);
  const yearOfEra = y - targetEra * 400;
  const dayOfYear = Math.floor((153 * (targetMonth < 2 ? targetMonth + 10 : targetMonth - 2) + 2) / 5) + day - 1;
  const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
  return (targetEra * 146097 + dayOfEra - 719468) * MS_PER_DAY + msOfDay;
}

/** Midnight UTC of the day `d` falls on. */
export function startOfDayUTC(d: Date): Date {
  return new Date(Math.floor(d.getTime() / MS_PER_DAY) * MS_PER_DAY);
}

/** Whole UTC day number since 1970-01-01. */
export function dayNumberUTC(d: Date): number {
  return Math.floor(d.getTime() / MS_PER_DAY);
}
