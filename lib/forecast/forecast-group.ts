import { HOURS_PER_YEAR, MS_PER_YEAR, addMonthsUTC, addYears8760 } from './dates';
import { ForecastInputError } from './errors';
import { date, fraction, list, nonNegative, positive, record, unitFraction, whole } from './validate';

/**
 * Depletion forecast of one installed anode group.
 *
 * Consumption (handbook practice, design-basis.md "remaining life from a survey"):
 *   rate, kg/yr = I x 8760 / eps        remaining life Y = eps x W / (8760 x I)
 * with W the usable mass left. The group reaches its end of life when the consumed mass
 * is u x installed mass, i.e. when the remaining fraction falls to 1 - u.
 *
 * Survey correction (the rule, kept simple on purpose):
 * 1. No survey: a straight line from (installation, 1) at the design rate.
 * 2. Surveys: the forecast starts from the LATEST survey (its date and remaining
 *    fraction). Several surveys on the same day count as one, with the lowest fraction
 *    (the conservative reading).
 *    a. The latest survey is at least half a year after installation ("informative"):
 *       the observed rate is its average since installation, (1 - f) / t, and the
 *       forecast continues at that rate. The forecast is then the straight line from
 *       installation through the latest survey: the longest baseline, so the least
 *       affected by the +/- several per cent of a visual estimate. Evidence outranks the
 *       input: this holds even when currentA is 0.
 *    b. The latest survey is under half a year after installation: too short a baseline
 *       for a rate (a 0.05 reading error over 3 months is 0.20 per year), so the design
 *       rate continues from the survey point.
 * 3. A latest survey at or below the end fraction (1 - u) means the group is spent: its
 *    end of life is the first time the recorded history (installation and surveys joined
 *    by straight lines) reached 1 - u, and the band collapses onto that date.
 * 4. A forecast rate of zero (no current and no informative survey, or an informative
 *    survey that shows no loss at all) never depletes: endOfLife, early and late are null.
 *    So does a life beyond MAX_FORECAST_YEARS (1000 years); a late end beyond it is null.
 *
 * Band (early / late), practice: the rates implied by the surveys are
 *   - each informative survey's average since installation, (1 - f) / t, and
 *   - each pair of consecutive surveys at least half a year apart, (f1 - f2) / (t2 - t1),
 * ignoring rates that are not positive (a survey that shows no loss says the loss is below
 * what the eye resolves, not that it is zero). The band runs from the forecast start at
 * the highest and the lowest of those rates, widened so it is never narrower than
 * +/- 20 % of the forecast rate (the resolution of a visual estimate; with one survey or
 * none the band is exactly +/- 20 %). A recent interval faster than the average (coating
 * breakdown raising the current) therefore pulls the early date forward.
 *
 * Time: a year is 8760 h, the year of the consumption rate (see dates.ts).
 */

export interface SurveyReading {
  date: Date;
  /** Estimated remaining fraction of the original net mass, 0..1. */
  remainingFraction: number;
}

export interface GroupForecastInput {
  installedOn: Date;
  quantity: number;
  netMassPerAnodeKg: number;
  /** u, in (0, 1]. */
  utilisationFactor: number;
  /** eps, Ah/kg. */
  capacityAhPerKg: number;
  /** The group's share of its design's mean current, or a measured output, A. */
  currentA: number;
  surveys?: readonly SurveyReading[];
}

export type ForecastBasis = 'design-rate' | 'survey-corrected';

export interface RemainingPoint {
  date: Date;
  remainingFraction: number;
}

export interface GroupForecast {
  installedMassKg: number;
  /** Remaining fraction at end of life, 1 - u. */
  endFraction: number;
  /** I x 8760 / eps, kg/yr. */
  designRatePerYearKg: number;
  /** The rate the forecast uses after the start point, kg/yr. */
  ratePerYearKg: number;
  /** The average rate since installation shown by the latest survey, when informative. */
  observedRatePerYearKg?: number;
  basis: ForecastBasis;
  /** Where the forecast line starts: installation, or the latest survey. */
  startsFrom: RemainingPoint;
  /** True when the latest survey already found the group at or below 1 - u. */
  spent: boolean;
  /** When the remaining fraction reaches 1 - u; null when it never depletes. */
  endOfLife: Date | null;
  /** Early end of the band; null only with endOfLife. */
  early: Date | null;
  /** Late end of the band; null with endOfLife, or when beyond MAX_FORECAST_YEARS. */
  late: Date | null;
  /**
   * Remaining fraction on a date, clamped to 0..1: 1 before installation, the recorded
   * history (straight lines between installation and surveys) up to the latest survey,
   * the forecast line after it.
   */
  remainingFractionAt(at: Date): number;
  /** remainingFractionAt x installed mass, kg. */
  remainingMassKgAt(at: Date): number;
  /**
   * Points for a chart: `from`, then every `stepMonths` calendar months while not after
   * `to`, and `to` itself last (at most MAX_SERIES_POINTS points).
   */
  remainingSeries(from: Date, to: Date, stepMonths: number): RemainingPoint[];
}

/** Half a year of 8760-h years: the shortest baseline that gives an observed rate (practice). */
export const MIN_SURVEY_BASELINE_YEARS = 0.5;
/** Half-width of the band when the surveys do not spread wider, as a fraction of the rate (practice). */
export const BAND_FRACTION = 0.2;
/**
 * Forecasts further out than this (a near-zero rate) are treated as never depleting:
 * endOfLife (or late) is null rather than a date beyond any plan or JS Date's range.
 */
export const MAX_FORECAST_YEARS = 1000;
/** Cap on remainingSeries so a wrong step cannot allocate without bound. */
export const MAX_SERIES_POINTS = 5000;

interface Point {
  t: number; // ms
  f: number;
}

export function forecastGroup(input: GroupForecastInput): GroupForecast {
  const inp = record(input, 'input');
  const installedOn = date(inp.installedOn, 'installedOn');
  const quantity = whole(inp.quantity, 'quantity', 1);
  const netMass = positive(inp.netMassPerAnodeKg, 'netMassPerAnodeKg', 'kg');
  const u = unitFraction(inp.utilisationFactor, 'utilisationFactor');
  const eps = positive(inp.capacityAhPerKg, 'capacityAhPerKg', 'Ah/kg');
  const currentA = nonNegative(inp.currentA, 'currentA', 'A');
  const surveys = readSurveys(inp.surveys, installedOn);

  const installedMassKg = quantity * netMass;
  const endFraction = 1 - u;
  const designRatePerYearKg = (currentA * HOURS_PER_YEAR) / eps;
  if (!Number.isFinite(installedMassKg) || !Number.isFinite(designRatePerYearKg)) {
    throw new ForecastInputError('currentA', 'The inputs are too large to give a finite forecast; check the units.');
  }
  const designRateFrac = designRatePerYearKg / installedMassKg;

  // History: installation, then one point per survey day (lowest reading of the day).
  const history: Point[] = [{ t: installedOn.getTime(), f: 1 }, ...surveys];
  const start = history[history.length - 1];
  const hasSurvey = history.length > 1;
  const startYears = (start.t - installedOn.getTime()) / MS_PER_YEAR;
  const informative = hasSurvey && startYears >= MIN_SURVEY_BASELINE_YEARS;

  const observedRateFrac = informative ? (1 - start.f) / startYears : undefined;
  const rateFrac = observedRateFrac ?? designRateFrac;
  const basis: ForecastBasis = hasSurvey ? 'survey-corrected' : 'design-rate';
  const spent = start.f <= endFraction;

  let endOfLife: Date | null = null;
  let early: Date | null = null;
  let late: Date | null = null;
  if (spent) {
    endOfLife = new Date(firstCrossing(history, endFraction));
    early = endOfLife;
    late = endOfLife;
  } else if (rateFrac > 0) {
    const usable = start.f - endFraction; // > 0 here
    const startDate = new Date(start.t);
    const after = (years: number): Date | null => (years <= MAX_FORECAST_YEARS ? addYears8760(startDate, years) : null);
    endOfLife = after(usable / rateFrac);
    if (endOfLife !== null) {
      const { low, high } = bandRates(history, rateFrac, informative);
      early = after(usable / high);
      late = after(usable / low);
    }
  }

  const remainingFractionAt = (at: Date): number => {
    const t = date(at, 'date').getTime();
    return clamp01(fractionAt(history, rateFrac, t));
  };

  const remainingSeries = (from: Date, to: Date, stepMonths: number): RemainingPoint[] => {
    const a = date(from, 'from');
    const b = date(to, 'to');
    const step = whole(stepMonths, 'stepMonths', 1);
    if (b.getTime() < a.getTime()) throw new ForecastInputError('to', 'to must not be before from.');
    const out: RemainingPoint[] = [];
    for (let k = 0; ; k++) {
      const d = addMonthsUTC(a, k * step);
      if (d.getTime() > b.getTime()) break;
      if (out.length >= MAX_SERIES_POINTS) {
        throw new ForecastInputError('stepMonths', `The series would exceed ${MAX_SERIES_POINTS} points; use a longer step.`);
      }
      out.push({ date: d, remainingFraction: remainingFractionAt(d) });
    }
    if (out[out.length - 1].date.getTime() < b.getTime()) out.push({ date: new Date(b.getTime()), remainingFraction: remainingFractionAt(b) });
    return out;
  };

  return {
    installedMassKg,
    endFraction,
    designRatePerYearKg,
    ratePerYearKg: rateFrac * installedMassKg,
    ...(observedRateFrac !== undefined ? { observedRatePerYearKg: observedRateFrac * installedMassKg } : {}),
    basis,
    startsFrom: { date: new Date(start.t), remainingFraction: start.f },
    spent,
    endOfLife,
    early,
    late,
    remainingFractionAt,
    remainingMassKgAt: (at: Date) => remainingFractionAt(at) * installedMassKg,
    remainingSeries,
  };
}

/** Validated surveys as history points, sorted by time, one per instant (lowest reading). */
function readSurveys(value: unknown, installedOn: Date): Point[] {
  if (value === undefined || value === null) return [];
  const raw = list(value, 'surveys');
  const points: Point[] = raw.map((s, i) => {
    const r = record(s, `surveys[${i}]`);
    const d = date(r.date, `surveys[${i}].date`);
    if (d.getTime() < installedOn.getTime()) {
      throw new ForecastInputError(`surveys[${i}].date`, `surveys[${i}].date must not be before installedOn.`);
    }
    return { t: d.getTime(), f: fraction(r.remainingFraction, `surveys[${i}].remainingFraction`) };
  });
  points.sort((a, b) => a.t - b.t || a.f - b.f);
  // Same instant: keep the first after sorting, the lowest fraction.
  return points.filter((p, i) => i === 0 || p.t !== points[i - 1].t);
}

/** Lowest and highest rate (fraction per year) of the band; see the module comment. */
function bandRates(history: Point[], rateFrac: number, informative: boolean): { low: number; high: number } {
  let low = (1 - BAND_FRACTION) * rateFrac;
  let high = (1 + BAND_FRACTION) * rateFrac;
  if (!informative) return { low, high };
  const t0 = history[0].t;
  const consider = (r: number) => {
    if (r > 0 && Number.isFinite(r)) {
      low = Math.min(low, r);
      high = Math.max(high, r);
    }
  };
  for (let i = 1; i < history.length; i++) {
    const p = history[i];
    const sinceInstall = (p.t - t0) / MS_PER_YEAR;
    if (sinceInstall >= MIN_SURVEY_BASELINE_YEARS) consider((1 - p.f) / sinceInstall);
    if (i >= 2) {
      const q = history[i - 1];
      const gap = (p.t - q.t) / MS_PER_YEAR;
      if (gap >= MIN_SURVEY_BASELINE_YEARS) consider((q.f - p.f) / gap);
    }
  }
  return { low, high };
}

/** The first time the piecewise-linear history reaches fraction `target` (history ends at or below it). */
function firstCrossing(history: Point[], target: number): number {
  for (let i = 1; i < history.length; i++) {
    const a = history[i - 1];
    const b = history[i];
    if (a.f > target && b.f <= target) return a.t + ((a.f - target) / (a.f - b.f)) * (b.t - a.t);
  }
  // Unreachable: history starts at 1 > 1 - u and ends at or below it.
  return history[history.length - 1].t;
}

function fractionAt(history: Point[], rateFrac: number, t: number): number {
  if (t < history[0].t) return 1;
  const last = history[history.length - 1];
  if (t >= last.t) return last.f - rateFrac * ((t - last.t) / MS_PER_YEAR);
  // Binary search for the last point at or before t (history is sorted, length >= 2 here).
  let lo = 0;
  let hi = history.length - 1; // history[hi].t > t
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (history[mid].t <= t) lo = mid;
    else hi = mid;
  }
  const a = history[lo];
  const b = history[hi];
  return a.f + ((b.f - a.f) * (t - a.t)) / (b.t - a.t);
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}
