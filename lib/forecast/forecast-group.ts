import { HOURS_PER_YEAR, MS_PER_YEAR, addMonthsUTC } from './dates';
import { chargeAYears, constantProfile, currentAtA, meanCurrentA, readDemandProfile, yearsToCharge, type DemandProfile } from './demand-profile';
import { ForecastInputError } from './errors';
import { date, fraction, isRecord, isValidDate, list, nonNegative, positive, record, unitFraction, whole } from './validate';

/**
 * Depletion forecast of one installed anode group: when it is to be renewed (renewBy) and
 * when it is spent (endOfLife), each with a band (early / late).
 *
 * Demand. The group's current follows its design demand profile (demand-profile.ts): linear
 * from startA at installation to endA at overYears, because coating breakdown fc = a + b*t
 * makes the demand linear in time. Without a profile the current is the constant `currentA`
 * (the design's mean current share, or a measured output): the straight line of the handbook
 * rule Y = eps x W / (8760 x I) (design-basis.md "remaining life from a survey").
 * Consumed mass by t = Q(t) x 8760 / eps kg, Q the charge delivered (A x years, closed form).
 *
 * Dates. endOfLife: the remaining fraction reaches 1 - u (the consumed mass is u x installed
 * mass). renewBy: it reaches the higher of 1 - u and the renewal threshold, by default 0.25
 * remaining ("renew when less than 25 % of original mass remains", NAVFAC mooring practice,
 * published; design-basis.md "Inspection"), so renewBy is never after endOfLife and is earlier
 * whenever 0.25 > 1 - u (u < 0.75).
 *
 * Surveys scale the profile, they do not replace it:
 * 1. A survey reading "no loss" (remaining fraction 1) is set aside: it says the loss is below
 *    what the eye resolves, not that nothing was consumed, so it neither scales nor restarts the
 *    forecast (taken as a restart it would push the end of life back by the survey's age, and
 *    as a scale it would stop the forecast). With only such surveys the forecast is the profile.
 *    Several readings on one day count as one, the lowest (the conservative reading).
 * 2. A survey at least half a year after installation is "informative": its consumed fraction
 *    c = 1 - f against the profile's own by that date, P(t) = Q(t) x 8760 / (eps x mass),
 *    gives the factor k = c / P(t). Several informative surveys: k is the least-squares fit of
 *    the consumed fractions, minimising sum (c_i - k P_i)^2 with equal weights, so
 *    k = sum(c_i P_i) / sum(P_i^2). Equal weights because a visual reading errs by about the
 *    same absolute fraction whatever its date; a later survey still counts more, through its
 *    larger P_i (a longer baseline). Without an informative survey k = 1 (the design).
 * 3. The forecast starts from the latest survey kept (its date and reading; installation with
 *    none) and goes on at k x the profile's current:
 *      f(t) = f_s - k x (P(t) - P(t_s)).
 *    With one informative survey this is the curve 1 - k x P(t) through that survey. A survey
 *    under half a year old restarts the forecast at the design current (k = 1): too short a
 *    baseline for a factor (a 0.05 reading error over 3 months is most of what was consumed).
 * 4. A date whose remaining fraction the latest survey already found (reading at or below it)
 *    is in the record: the first time the recorded history (installation and the surveys kept,
 *    joined by straight lines) reached it, and its band collapses onto it (`spent` for 1 - u).
 * 5. Without a design current (zero current or a zero profile) an informative survey alone sets
 *    a constant rate (evidence outranks the missing input); with neither, or a forecast further
 *    than MAX_FORECAST_YEARS from its start (a reading a hair under 1), the date is null. A
 *    design current that does not fall to zero always gives a date: a survey of no loss cannot
 *    stop it (rule 1).
 *
 * Band (early / late), the method:
 * - Readings: a diver's estimate of the remaining fraction is good to about +/- 0.05 absolute
 *   (READING_UNCERTAINTY, common practice). The early end takes every survey kept 0.05 lower,
 *   the late end 0.05 higher (within 0..1): that moves the start point and, for the fit,
 *   k by +/- 0.05 x sum(P_i) / sum(P_i^2) (0.05 / P for one survey). Every reading is moved the
 *   same way (one diver's bias), the wider and safer assumption than independent errors.
 * - Spread: the band's k range is widened to the lowest and highest k implied by any one
 *   informative survey (c_i / P_i) and by any two consecutive surveys at least half a year
 *   apart ((c_j - c_i) / (P_j - P_i)); factors that are not positive are ignored. A recent
 *   interval consuming faster than the fit pulls the early date forward.
 * - Without an informative survey k is the design's, 1, and its range +/- 20 % (BAND_FRACTION,
 *   practice), still with the reading moved +/- 0.05 where an early survey is the start.
 * Then early = the date with the lower readings and the highest k, late = the higher readings
 * and the lowest k (null when that k is 0, readings consistent with no loss at all, or beyond
 * MAX_FORECAST_YEARS). endOfLife and renewBy always lie inside their bands.
 *
 * Time: a year is 8760 h, the year of the consumption rate (see dates.ts). Dates are rounded
 * to the millisecond. Cost: O(surveys) per group, closed forms, no stepping.
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
  /**
   * Constant current, A: the group's share of its design's mean current, or a measured output.
   * Required without `demandProfile`; with one it is checked when given but not used.
   */
  currentA?: number;
  /**
   * The group's share of its design's demand over time: linear from startA at installation to
   * endA at overYears (see demand-profile.ts). Absent or null: the constant `currentA`.
   */
  demandProfile?: DemandProfile | null;
  /**
   * The organisation's renewal threshold, remaining fraction 0..1: renew when less than this
   * remains. Default DEFAULT_RENEWAL_THRESHOLD_REMAINING (0.25).
   */
  renewalThresholdRemaining?: number;
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
  /** Remaining fraction at which the group is to be renewed: max(1 - u, renewal threshold). */
  renewFraction: number;
  /** The design's mean rate, kg/yr: mean current x 8760 / eps (the profile's mean over overYears). */
  designRatePerYearKg: number;
  /** The rate the forecast uses at its start point, kg/yr (it follows the profile after it). */
  ratePerYearKg: number;
  /** The average rate since installation shown by the latest survey kept, when informative. */
  observedRatePerYearKg?: number;
  /**
   * k: how many times the design profile's consumption the surveys show (1 without an
   * informative survey). Absent when the design has no current (surveys alone set the rate).
   */
  profileScale?: number;
  basis: ForecastBasis;
  /** Where the forecast starts: installation, or the latest survey kept. */
  startsFrom: RemainingPoint;
  /** True when the latest survey kept already found the group at or below 1 - u. */
  spent: boolean;
  /**
   * End of life: when the remaining fraction reaches 1 - u, the utilisation factor used up and
   * the group no longer relied on to protect. Null only when it never depletes (no current and
   * no survey showing loss, or a profile falling to 0 A first) or beyond MAX_FORECAST_YEARS.
   */
  endOfLife: Date | null;
  /** Early end of the endOfLife band; null only with endOfLife. */
  early: Date | null;
  /** Late end of the endOfLife band; null with endOfLife, or as the module comment says. */
  late: Date | null;
  /**
   * Renew by: when the remaining fraction reaches renewFraction, the higher of 1 - u and the
   * organisation's renewal threshold (default 0.25). The date renewals are scheduled on; never
   * after endOfLife. Null only with endOfLife; a date while endOfLife is null when a survey
   * already found the group below the renewal fraction, or a demand that dies away (a falling
   * profile to 0 A) reaches the renewal fraction but never 1 - u.
   */
  renewBy: Date | null;
  /** Early end of the renewBy band (for the scheduler's at-risk flag); null only with renewBy. */
  renewByEarly: Date | null;
  /** Late end of the renewBy band. */
  renewByLate: Date | null;
  /**
   * Remaining fraction on a date, clamped to 0..1: 1 before installation, the recorded
   * history (straight lines between installation and the surveys kept) up to the latest
   * survey kept, the forecast curve after it.
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

/** Half a year of 8760-h years: the shortest baseline that gives a survey factor (practice). */
export const MIN_SURVEY_BASELINE_YEARS = 0.5;
/** Half-width of the band without an informative survey, as a fraction of k (practice). */
export const BAND_FRACTION = 0.2;
/** Uncertainty of a diver's remaining-fraction estimate, absolute (common practice). */
export const READING_UNCERTAINTY = 0.05;
/** Renew when less than this fraction of the original mass remains (NAVFAC mooring practice, published). */
export const DEFAULT_RENEWAL_THRESHOLD_REMAINING = 0.25;
/**
 * Forecasts further out than this from their start (a near-zero rate) are treated as never
 * depleting: the date is null rather than one beyond any plan or JS Date's range.
 */
export const MAX_FORECAST_YEARS = 1000;
/** Cap on remainingSeries so a wrong step cannot allocate without bound. */
export const MAX_SERIES_POINTS = 5000;

interface Point {
  t: number; // ms
  f: number;
}

/** A survey kept, with its years since installation and the unit profile's consumed fraction then. */
interface SurveyPoint extends Point {
  years: number;
  p: number;
}

/** The scale factor K (A, on the unit profile) and the band's range of it. */
interface Fit {
  k: number;
  low: number;
  high: number;
}

/** What a date is solved on: the unit profile, the mass, and the recorded history. */
interface Model {
  /** Installation, ms. */
  t0: number;
  /** The design's shape with a mean of 1 A over overYears (a constant 1 A without a design current). */
  unit: DemandProfile;
  /** Consumed fraction per A x year, 8760 / (eps x installed mass). */
  fractionPerAYear: number;
  /** Installation (fraction 1), then the surveys kept. */
  history: Point[];
  /** Where the forecast starts: the last point of the history. */
  start: Point;
  /** The start's years since installation, and the unit profile's charge by then (A x years). */
  startYears: number;
  startCharge: number;
  /** The unit profile's consumed fraction at the start. */
  startConsumed: number;
  /** The fitted factor K (A, on the unit profile) the forecast goes on at. */
  k: number;
}

/** The unit profile of a constant current (and of a design without current): 1 A throughout. */
const CONSTANT_UNIT_PROFILE: DemandProfile = constantProfile(1);

interface DateBand {
  at: Date | null;
  early: Date | null;
  late: Date | null;
}

export function forecastGroup(input: GroupForecastInput): GroupForecast {
  const inp = record(input, 'input');
  const installedOn = date(inp.installedOn, 'installedOn');
  const quantity = whole(inp.quantity, 'quantity', 1);
  const netMass = positive(inp.netMassPerAnodeKg, 'netMassPerAnodeKg', 'kg');
  const u = unitFraction(inp.utilisationFactor, 'utilisationFactor');
  const eps = positive(inp.capacityAhPerKg, 'capacityAhPerKg', 'Ah/kg');
  const hasProfile = inp.demandProfile !== undefined && inp.demandProfile !== null;
  const currentA = hasProfile && inp.currentA === undefined ? 0 : nonNegative(inp.currentA, 'currentA', 'A');
  const design = hasProfile ? readDemandProfile(inp.demandProfile, 'demandProfile') : constantProfile(currentA);
  const threshold =
    inp.renewalThresholdRemaining === undefined ? DEFAULT_RENEWAL_THRESHOLD_REMAINING : fraction(inp.renewalThresholdRemaining, 'renewalThresholdRemaining');
  const readings = readSurveys(inp.surveys, installedOn);

  const installedMassKg = quantity * netMass;
  const endFraction = 1 - u;
  const renewFraction = Math.max(endFraction, threshold);
  const designScaleA = meanCurrentA(design);
  const designRatePerYearKg = (designScaleA * HOURS_PER_YEAR) / eps;
  if (!Number.isFinite(installedMassKg) || !Number.isFinite(designRatePerYearKg) || !Number.isFinite(design.endA - design.startA)) {
    throw new ForecastInputError(hasProfile ? 'demandProfile' : 'currentA', 'The inputs are too large to give a finite forecast; check the units.');
  }
  // The forecast's current is K x the unit profile (K in A); K = the design's mean current is
  // the design itself (k = 1).
  const t0 = installedOn.getTime();
  const m: Model = {
    t0,
    // A constant current c scales to c / c = 1 A exactly: the shared constant profile.
    unit:
      hasProfile && designScaleA > 0
        ? { startA: design.startA / designScaleA, endA: design.endA / designScaleA, overYears: design.overYears }
        : CONSTANT_UNIT_PROFILE,
    fractionPerAYear: HOURS_PER_YEAR / (eps * installedMassKg),
    history: [],
    start: { t: t0, f: 1 },
    startYears: 0,
    startCharge: 0,
    startConsumed: 0,
    k: 0,
  };

  // Rule 1: readings of no loss are set aside; the rest, with the unit profile's consumption.
  let keptCount = 0;
  for (let i = 0; i < readings.length; i++) if (readings[i].f < 1) keptCount++;
  const kept: SurveyPoint[] = new Array(keptCount);
  m.history = new Array(keptCount + 1);
  m.history[0] = m.start;
  for (let i = 0, j = 0; i < readings.length; i++) {
    const point = readings[i];
    if (point.f >= 1) continue;
    point.years = (point.t - t0) / MS_PER_YEAR;
    point.p = consumedAt(m, point.years);
    kept[j++] = point;
    m.history[j] = point;
  }
  const start = m.history[keptCount];
  const startYears = (start.t - t0) / MS_PER_YEAR;
  m.start = start;
  m.startYears = startYears;
  m.startCharge = chargeAYears(m.unit, startYears);
  m.startConsumed = m.fractionPerAYear * m.startCharge;
  const fit = fitScale(kept, designScaleA);
  m.k = fit.k;
  const end = dateBand(m, fit, endFraction);
  const renew = renewFraction === endFraction ? end : dateBand(m, fit, renewFraction);

  const latest = kept.length > 0 ? kept[kept.length - 1] : null;
  const observedRateFrac = latest !== null && latest.years >= MIN_SURVEY_BASELINE_YEARS ? (1 - latest.f) / latest.years : undefined;
  const forecast: GroupForecast = {
    installedMassKg,
    endFraction,
    renewFraction,
    designRatePerYearKg,
    ratePerYearKg: fit.k * m.fractionPerAYear * currentAtA(m.unit, startYears) * installedMassKg,
    basis: kept.length > 0 ? 'survey-corrected' : 'design-rate',
    startsFrom: { date: new Date(start.t), remainingFraction: start.f },
    spent: start.f <= endFraction,
    endOfLife: end.at,
    early: end.early,
    late: end.late,
    renewBy: renew.at,
    renewByEarly: renew.early,
    renewByLate: renew.late,
    // Methods rather than arrow functions: they share forecastGroup's one closure context, and
    // transpilers that keep function names do not rename each of them on every call.
    remainingFractionAt(at: Date): number {
      return remainingFractionOn(m, at);
    },
    remainingMassKgAt(at: Date): number {
      return remainingFractionOn(m, at) * installedMassKg;
    },
    remainingSeries(from: Date, to: Date, stepMonths: number): RemainingPoint[] {
      return remainingSeriesOf(m, from, to, stepMonths);
    },
  };
  if (observedRateFrac !== undefined) forecast.observedRatePerYearKg = observedRateFrac * installedMassKg;
  if (designScaleA > 0) forecast.profileScale = fit.k / designScaleA;
  return forecast;
}

/** GroupForecast.remainingFractionAt. */
function remainingFractionOn(m: Model, at: Date): number {
  const t = date(at, 'date').getTime();
  if (t >= m.start.t) return clamp01(m.start.f - m.k * (consumedAt(m, (t - m.t0) / MS_PER_YEAR) - m.startConsumed));
  return clamp01(historyAt(m.history, t));
}

/** GroupForecast.remainingSeries. */
function remainingSeriesOf(m: Model, from: Date, to: Date, stepMonths: number): RemainingPoint[] {
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
    out.push({ date: d, remainingFraction: remainingFractionOn(m, d) });
  }
  if (out[out.length - 1].date.getTime() < b.getTime()) out.push({ date: new Date(b.getTime()), remainingFraction: remainingFractionOn(m, b) });
  return out;
}

/** The unit profile's consumed fraction `years` after installation. */
function consumedAt(m: Model, years: number): number {
  return m.fractionPerAYear * chargeAYears(m.unit, years);
}

/**
 * Rules 3-5: the first time, ms, at which the forecast reaches the remaining fraction `target`,
 * with every survey reading moved by `delta` (0 for the forecast itself, -/+ the reading
 * uncertainty for the band) and the factor K `k`; null when never within reach.
 */
function reach(m: Model, delta: number, k: number, target: number): number | null {
  if (target >= 1) return m.t0;
  const anchor = m.history[m.history.length - 1];
  const anchorF = m.history.length > 1 ? clamp01(anchor.f + delta) : anchor.f;
  if (anchorF <= target) return Math.round(firstCrossing(m.history, target, delta));
  if (!(k > 0)) return null;
  const years = yearsToCharge(m.unit, m.startCharge + (anchorF - target) / (k * m.fractionPerAYear));
  if (!(years - m.startYears <= MAX_FORECAST_YEARS)) return null; // also Infinity and NaN
  return Math.max(anchor.t, Math.round(m.t0 + years * MS_PER_YEAR));
}

/** A date and its band (see the module comment): collapsed when the record already reached it. */
function dateBand(m: Model, fit: Fit, target: number): DateBand {
  const at = reach(m, 0, fit.k, target);
  if (at === null) return { at: null, early: null, late: null };
  if (m.history[m.history.length - 1].f <= target) return { at: new Date(at), early: new Date(at), late: new Date(at) };
  const early = reach(m, -READING_UNCERTAINTY, fit.high, target);
  const late = reach(m, READING_UNCERTAINTY, fit.low, target);
  return { at: new Date(at), early: new Date(Math.min(early ?? at, at)), late: late === null ? null : new Date(Math.max(late, at)) };
}

/**
 * Validated surveys as history points, sorted by time, one per instant (lowest reading); `years`
 * and `p` are filled in for the surveys kept.
 */
function readSurveys(value: unknown, installedOn: Date): SurveyPoint[] {
  if (value === undefined || value === null) return [];
  const raw = list(value, 'surveys');
  const installed = installedOn.getTime();
  const points: SurveyPoint[] = new Array(raw.length);
  for (let i = 0; i < raw.length; i++) {
    const r = isRecord(raw[i]) ? (raw[i] as Record<string, unknown>) : record(raw[i], `surveys[${i}]`);
    const d = isValidDate(r.date) ? r.date : date(r.date, `surveys[${i}].date`);
    if (d.getTime() < installed) {
      throw new ForecastInputError(`surveys[${i}].date`, `surveys[${i}].date must not be before installedOn.`);
    }
    const f = r.remainingFraction;
    points[i] = { t: d.getTime(), f: typeof f === 'number' && f >= 0 && f <= 1 ? f : fraction(f, `surveys[${i}].remainingFraction`), years: 0, p: 0 };
  }
  if (points.length < 2) return points;
  sortByTimeThenFraction(points);
  // Same instant: keep the first after sorting, the lowest fraction.
  let n = 1;
  for (let i = 1; i < points.length; i++) if (points[i].t !== points[n - 1].t) points[n++] = points[i];
  points.length = n;
  return points;
}

const byTimeThenFraction = (a: Point, b: Point) => a.t - b.t || a.f - b.f;

/**
 * Sorts in place by time, then fraction; stable. A few surveys (the usual case) by insertion,
 * which gives the same order as Array.prototype.sort without its work array.
 */
function sortByTimeThenFraction(points: SurveyPoint[]): void {
  if (points.length > 16) {
    points.sort(byTimeThenFraction);
    return;
  }
  for (let i = 1; i < points.length; i++) {
    const p = points[i];
    let j = i - 1;
    while (j >= 0 && byTimeThenFraction(points[j], p) > 0) {
      points[j + 1] = points[j];
      j--;
    }
    points[j + 1] = p;
  }
}

/**
 * Rule 2 and the band's k range: K (A, on the unit profile) fitted to the informative surveys
 * by least squares on the consumed fraction, widened by the reading uncertainty and the spread
 * of the single-survey and interval factors; the design's K +/- 20 % without one.
 */
function fitScale(kept: readonly SurveyPoint[], designScaleA: number): Fit {
  let sumPP = 0;
  let sumCP = 0;
  let sumP = 0;
  // The spread of the single-survey and interval factors; positive, finite factors only.
  let spreadLow = Infinity;
  let spreadHigh = 0;
  for (let i = 0; i < kept.length; i++) {
    const s = kept[i];
    if (s.years >= MIN_SURVEY_BASELINE_YEARS && s.p > 0) {
      const consumed = 1 - s.f;
      sumPP += s.p * s.p;
      sumCP += consumed * s.p;
      sumP += s.p;
      const factor = consumed / s.p; // this survey's own factor
      if (factor > 0 && Number.isFinite(factor)) {
        spreadLow = Math.min(spreadLow, factor);
        spreadHigh = Math.max(spreadHigh, factor);
      }
    }
    const before = i > 0 ? kept[i - 1] : null;
    if (before !== null && s.years - before.years >= MIN_SURVEY_BASELINE_YEARS && s.p > before.p) {
      const factor = (before.f - s.f) / (s.p - before.p); // the interval since the survey before
      if (factor > 0 && Number.isFinite(factor)) {
        spreadLow = Math.min(spreadLow, factor);
        spreadHigh = Math.max(spreadHigh, factor);
      }
    }
  }
  if (!(sumPP > 0)) return { k: designScaleA, low: (1 - BAND_FRACTION) * designScaleA, high: (1 + BAND_FRACTION) * designScaleA };
  const k = sumCP / sumPP;
  const reading = (READING_UNCERTAINTY * sumP) / sumPP;
  return { k, low: Math.min(Math.max(0, k - reading), spreadLow), high: Math.max(k + reading, spreadHigh) };
}

/**
 * The first time the piecewise-linear history, with every survey's reading moved by `delta`
 * (within 0..1; installation stays at 1), reaches fraction `target` < 1; it ends at or below it.
 */
function firstCrossing(history: readonly Point[], target: number, delta: number): number {
  let aT = history[0].t;
  let aF = history[0].f;
  for (let i = 1; i < history.length; i++) {
    const bT = history[i].t;
    const bF = clamp01(history[i].f + delta);
    if (aF > target && bF <= target) return aT + ((aF - target) / (aF - bF)) * (bT - aT);
    aT = bT;
    aF = bF;
  }
  // Unreachable: history starts at 1 > target and ends at or below it.
  return history[history.length - 1].t;
}

/** The recorded history at t (before the latest point; straight lines between the points). */
function historyAt(history: readonly Point[], t: number): number {
  if (t < history[0].t) return 1;
  // Binary search for the last point at or before t (history is sorted, t before its last point).
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
