import { MS_PER_DAY, addMonthsUTC, dayNumberUTC } from './dates';
import { formatDateOnly } from '../dates/date-only';
import { date, finite, record, whole } from './validate';
import { ForecastInputError } from './errors';

/**
 * Future dockings of a vessel under class practice (design-basis.md, Ship hulls,
 * published): two bottom inspections in each five-year period, no more than 36 months
 * apart, one of them in dry dock at the renewal survey.
 *
 * Rules:
 * 1. Renewal surveys: every 5-year (60 calendar month) anniversary of lastRenewalSurvey
 *    after lastDocking and within the horizon is a docking of kind 'renewal-survey', on
 *    that very day (the date is the caller's: pass the last renewal survey, not an older
 *    one, when the last docking was the renewal survey).
 * 2. Between two fixed dockings (lastDocking, then each anniversary) G days apart, the
 *    gap is split evenly into n parts with n = max(1, round(G / interval),
 *    ceil(G / 1095)): as near the practice interval (default 30 months) as a whole number
 *    of dockings allows, and never a gap above 1095 days, which is never more than 36
 *    calendar months (three calendar years hold 1095 or 1096 days). The usual five-year
 *    cycle (G of about 60 months) thus gets one intermediate docking at about 30 months,
 *    which is the "two bottom inspections in each five-year period".
 * 3. After the last anniversary in the horizon (or from lastDocking when no renewal
 *    survey is given) intermediate dockings follow every `intervalMonths` calendar
 *    months while within the horizon.
 * 4. Dates are whole UTC days (midnight); rounding only ever moves a date earlier within
 *    its interval, never lengthening a gap past the limit.
 * The horizon ends horizonYears (rounded to whole months) after lastDocking.
 */

export type DockingKind = 'intermediate' | 'renewal-survey';

export interface ProposedDocking {
  date: Date;
  kind: DockingKind;
  reason: string;
}

export interface ProposeNextDockingsInput {
  lastDocking: Date;
  lastRenewalSurvey?: Date | null;
  horizonYears: number;
  /** Practice interval between dockings, whole months, 1 to 36; default 30. */
  intervalMonths?: number;
}

/** Class limit between bottom inspections, months (published). */
export const MAX_DOCKING_INTERVAL_MONTHS = 36;
/** Practice interval between dockings, months. */
export const DEFAULT_DOCKING_INTERVAL_MONTHS = 30;
/** Renewal (special) survey cycle, months (published: five-year period). */
export const RENEWAL_SURVEY_CYCLE_MONTHS = 60;
/** The longest gap, in days, that is within 36 calendar months from any start date. */
export const MAX_DOCKING_GAP_DAYS = 1095;
/** Mean calendar month, days (365.25 / 12), to compare a gap in days with months. */
const MEAN_MONTH_DAYS = 30.4375;
const MAX_HORIZON_YEARS = 100;

export function proposeNextDockings(input: ProposeNextDockingsInput): ProposedDocking[] {
  const inp = record(input, 'input');
  const lastDocking = date(inp.lastDocking, 'lastDocking');
  const lastRenewal = inp.lastRenewalSurvey === undefined || inp.lastRenewalSurvey === null ? null : date(inp.lastRenewalSurvey, 'lastRenewalSurvey');
  const horizonYears = finite(inp.horizonYears, 'horizonYears', 'years');
  const horizonMonths = Math.round(horizonYears * 12);
  if (horizonMonths < 1 || horizonYears > MAX_HORIZON_YEARS) {
    throw new ForecastInputError('horizonYears', `horizonYears must be from one month to ${MAX_HORIZON_YEARS} years (got ${horizonYears}).`);
  }
  const interval =
    inp.intervalMonths === undefined ? DEFAULT_DOCKING_INTERVAL_MONTHS : whole(inp.intervalMonths, 'intervalMonths', 1, MAX_DOCKING_INTERVAL_MONTHS);

  const startDay = dayNumberUTC(lastDocking);
  const endDay = dayNumberUTC(addMonthsUTC(lastDocking, horizonMonths));
  const out: ProposedDocking[] = [];
  const dayDate = (day: number) => new Date(day * MS_PER_DAY);
  const intermediate = (day: number, prevDay: number): ProposedDocking => ({
    date: dayDate(day),
    kind: 'intermediate',
    reason: `Intermediate docking about ${Math.round((day - prevDay) / MEAN_MONTH_DAYS)} months after the previous one, keeping bottom inspections no more than ${MAX_DOCKING_INTERVAL_MONTHS} months apart.`,
  });

  // Rules 1 and 2: anniversaries of the renewal survey, with the gaps before them split.
  let prevDay = startDay;
  let prevDate = lastDocking;
  if (lastRenewal) {
    for (let k = 1; ; k++) {
      const anniversary = addMonthsUTC(lastRenewal, RENEWAL_SURVEY_CYCLE_MONTHS * k);
      const aDay = dayNumberUTC(anniversary);
      if (aDay > endDay) break;
      if (aDay <= startDay) continue;
      const gap = aDay - prevDay;
      const parts = Math.max(1, Math.round(gap / (interval * MEAN_MONTH_DAYS)), Math.ceil(gap / MAX_DOCKING_GAP_DAYS));
      let before = prevDay;
      for (let j = 1; j < parts; j++) {
        const d = prevDay + Math.floor((j * gap) / parts);
        out.push(intermediate(d, before));
        before = d;
      }
      out.push({
        date: dayDate(aDay),
        kind: 'renewal-survey',
        reason: `Renewal survey ${5 * k} years after the renewal survey of ${formatDateOnly(lastRenewal)}, with the bottom inspected in dry dock.`,
      });
      prevDay = aDay;
      prevDate = dayDate(aDay);
    }
  }

  // Rule 3: the tail at the practice interval.
  for (;;) {
    const next = addMonthsUTC(prevDate, interval);
    const nDay = dayNumberUTC(next);
    if (nDay > endDay) break;
    out.push(intermediate(nDay, prevDay));
    prevDay = nDay;
    prevDate = next;
  }
  return out;
}
