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

/**
 * The forecast of one group, an object of forecastGroup's own: read its fields by name and call its
 * methods on it. Its seven dates are getters, made when first read (the same Date on every read) and
 * not assignable. A spread copy, Object.keys or structuredClone sees the model's internal fields and
 * none of the dates; a method taken off the object loses it (`const { remainingFractionAt } = f`
 * fails). JSON.stringify gives every figure and date (toJSON).
 */
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

/** What the forecast's methods read: the unit profile, the mass, the recorded history and the fitted factor. */
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
  /** The unit profile's consumed fraction at the start. */
  startConsumed: number;
  /** The fitted factor K (A, on the unit profile) the forecast goes on at. */
  k: number;
}

/** The unit profile of a constant current (and of a design without current): 1 A throughout. */
const CONSTANT_UNIT_PROFILE: DemandProfile = constantProfile(1);

/** Epoch ms as a Date, NaN as null. */
const dateOrNull = (ms: number): Date | null => (ms === ms ? new Date(ms) : null);

/**
 * The results of fitScale (after K itself) and dateBand, read straight after the call: the band's
 * range of K (low, high) and a date with its band (at, early, late; ms, NaN for null). In typed
 * arrays so that the numbers are not boxed, as an object's, a closure's or a returned number would be.
 */
const fitRange = new Float64Array(2);
const band = new Float64Array(3);

/**
 * forecastGroup's result: the model its methods read, its figures, and its seven dates, kept as
 * epoch ms (NaN for null) and made Date objects when first read, each once (the same object on
 * every read). A fleet's scheduler reads two of them; making all seven, with the objects the
 * solving used to allocate, was about a third of the bench fleet's memory traffic.
 */
class Forecast implements GroupForecast, Model {
  t0: number;
  unit: DemandProfile;
  fractionPerAYear: number;
  history: Point[];
  start: Point;
  startConsumed: number;
  k: number;
  installedMassKg: number;
  endFraction: number;
  renewFraction: number;
  designRatePerYearKg: number;
  ratePerYearKg: number;
  basis: ForecastBasis;
  spent: boolean;
  declare observedRatePerYearKg?: number;
  declare profileScale?: number;
  private endMs: number;
  private earlyMs: number;
  private lateMs: number;
  private renewMs: number;
  private renewEarlyMs: number;
  private renewLateMs: number;
  /** The dates as Date objects, each made when first read (undefined until then). */
  private endDate: Date | null | undefined;
  private earlyDate: Date | null | undefined;
  private lateDate: Date | null | undefined;
  private renewDate: Date | null | undefined;
  private renewEarlyDate: Date | null | undefined;
  private renewLateDate: Date | null | undefined;
  private startPoint: RemainingPoint | undefined;

  /** `history`: installation, then the surveys with a reading below 1 (rule 1), one per instant, by time. */
  constructor(history: Point[], installedMassKg: number, eps: number, u: number, threshold: number, profile: DemandProfile | null, designScaleA: number) {
    const t0 = history[0].t;
    const endFraction = 1 - u;
    const renewFraction = Math.max(endFraction, threshold);
    this.t0 = t0;
    // The forecast's current is K x the unit profile (K in A); K = the design's mean current is
    // the design itself (k = 1). A constant current c scales to c / c = 1 A exactly: the shared
    // constant profile.
    this.unit =
      profile !== null && designScaleA > 0
        ? { startA: profile.startA / designScaleA, endA: profile.endA / designScaleA, overYears: profile.overYears }
        : CONSTANT_UNIT_PROFILE;
    this.fractionPerAYear = HOURS_PER_YEAR / (eps * installedMassKg);
    const keptCount = history.length - 1;
    const start = history[keptCount];
    const startYears = (start.t - t0) / MS_PER_YEAR;
    const startCharge = chargeAYears(this.unit, startYears);
    this.history = history;
    this.start = start;
    this.startConsumed = this.fractionPerAYear * startCharge;
    const k = fitScale(this, designScaleA);
    const kLow = fitRange[0];
    const kHigh = fitRange[1];
    this.k = k;

    this.installedMassKg = installedMassKg;
    this.endFraction = endFraction;
    this.renewFraction = renewFraction;
    this.designRatePerYearKg = (designScaleA * HOURS_PER_YEAR) / eps;
    this.ratePerYearKg = k * this.fractionPerAYear * currentAtA(this.unit, startYears) * installedMassKg;
    this.basis = keptCount > 0 ? 'survey-corrected' : 'design-rate';
    this.spent = start.f <= endFraction;
    dateBand(this, startYears, startCharge, kLow, kHigh, endFraction);
    this.endMs = band[0];
    this.earlyMs = band[1];
    this.lateMs = band[2];
    if (renewFraction !== endFraction) {
      dateBand(this, startYears, startCharge, kLow, kHigh, renewFraction);
      this.renewMs = band[0];
      this.renewEarlyMs = band[1];
      this.renewLateMs = band[2];
    } else {
      this.renewMs = this.endMs;
      this.renewEarlyMs = this.earlyMs;
      this.renewLateMs = this.lateMs;
    }
    this.endDate = undefined;
    this.earlyDate = undefined;
    this.lateDate = undefined;
    this.renewDate = undefined;
    this.renewEarlyDate = undefined;
    this.renewLateDate = undefined;
    this.startPoint = undefined;

    // The latest survey kept is the start.
    if (keptCount > 0 && startYears >= MIN_SURVEY_BASELINE_YEARS) this.observedRatePerYearKg = ((1 - start.f) / startYears) * installedMassKg;
    if (designScaleA > 0) this.profileScale = k / designScaleA;
  }

  get endOfLife(): Date | null {
    return this.endDate === undefined ? (this.endDate = dateOrNull(this.endMs)) : this.endDate;
  }

  get early(): Date | null {
    return this.earlyDate === undefined ? (this.earlyDate = dateOrNull(this.earlyMs)) : this.earlyDate;
  }

  get late(): Date | null {
    return this.lateDate === undefined ? (this.lateDate = dateOrNull(this.lateMs)) : this.lateDate;
  }

  get renewBy(): Date | null {
    return this.renewDate === undefined ? (this.renewDate = dateOrNull(this.renewMs)) : this.renewDate;
  }

  get renewByEarly(): Date | null {
    return this.renewEarlyDate === undefined ? (this.renewEarlyDate = dateOrNull(this.renewEarlyMs)) : this.renewEarlyDate;
  }

  get renewByLate(): Date | null {
    return this.renewLateDate === undefined ? (this.renewLateDate = dateOrNull(this.renewLateMs)) : this.renewLateDate;
  }

  get startsFrom(): RemainingPoint {
    return this.startPoint ?? (this.startPoint = { date: new Date(this.start.t), remainingFraction: this.start.f });
  }

  remainingFractionAt(at: Date): number {
    return remainingFractionOn(this, at);
  }

  remainingMassKgAt(at: Date): number {
    return remainingFractionOn(this, at) * this.installedMassKg;
  }

  remainingSeries(from: Date, to: Date, stepMonths: number): RemainingPoint[] {
    return remainingSeriesOf(this, from, to, stepMonths);
  }

  /** The forecast's figures and dates as a plain object, without the model (JSON.stringify calls it). */
  toJSON(): Record<string, unknown> {
    const out: Record<string, unknown> = {
      installedMassKg: this.installedMassKg,
      endFraction: this.endFraction,
      renewFraction: this.renewFraction,
      designRatePerYearKg: this.designRatePerYearKg,
      ratePerYearKg: this.ratePerYearKg,
      basis: this.basis,
      startsFrom: this.startsFrom,
      spent: this.spent,
      endOfLife: this.endOfLife,
      early: this.early,
      late: this.late,
      renewBy: this.renewBy,
      renewByEarly: this.renewByEarly,
      renewByLate: this.renewByLate,
    };
    if (this.observedRatePerYearKg !== undefined) out.observedRatePerYearKg = this.observedRatePerYearKg;
    if (this.profileScale !== undefined) out.profileScale = this.profileScale;
    return out;
  }
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
  // Without a profile the design is the constant current: its mean is that current.
  const profile = hasProfile ? readDemandProfile(inp.demandProfile, 'demandProfile') : null;
  const threshold =
    inp.renewalThresholdRemaining === undefined ? DEFAULT_RENEWAL_THRESHOLD_REMAINING : fraction(inp.renewalThresholdRemaining, 'renewalThresholdRemaining');
  const history = readHistory(inp.surveys, installedOn);

  const installedMassKg = quantity * netMass;
  const designScaleA = profile !== null ? meanCurrentA(profile) : currentA;
  const designRatePerYearKg = (designScaleA * HOURS_PER_YEAR) / eps;
  if (!Number.isFinite(installedMassKg) || !Number.isFinite(designRatePerYearKg) || (profile !== null && !Number.isFinite(profile.endA - profile.startA))) {
    throw new ForecastInputError(hasProfile ? 'demandProfile' : 'currentA', 'The inputs are too large to give a finite forecast; check the units.');
  }
  return new Forecast(history, installedMassKg, eps, u, threshold, profile, designScaleA);
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
 * uncertainty for the band) and the factor K `k`; NaN when never within reach. `startYears` and
 * `startCharge`: the start's years since installation and the unit profile's charge by then.
 */
function reach(m: Model, startYears: number, startCharge: number, delta: number, k: number, target: number): number {
  if (target >= 1) return m.t0;
  const anchor = m.start;
  const anchorF = m.history.length > 1 ? clamp01(anchor.f + delta) : anchor.f;
  if (anchorF <= target) return Math.round(firstCrossing(m.history, target, delta));
  if (!(k > 0)) return NaN;
  const years = yearsToCharge(m.unit, startCharge + (anchorF - target) / (k * m.fractionPerAYear));
  if (!(years - startYears <= MAX_FORECAST_YEARS)) return NaN; // also Infinity and NaN
  return Math.max(anchor.t, Math.round(m.t0 + years * MS_PER_YEAR));
}

/**
 * A date and its band (see the module comment), ms, NaN for null, left in `band` as at, early,
 * late (read them before the next call); collapsed when the record already reached it.
 */
function dateBand(m: Model, startYears: number, startCharge: number, kLow: number, kHigh: number, target: number): void {
  const at = reach(m, startYears, startCharge, 0, m.k, target);
  band[0] = at;
  if (at !== at) {
    band[1] = NaN;
    band[2] = NaN;
  } else if (m.start.f <= target) {
    band[1] = at;
    band[2] = at;
  } else {
    const early = reach(m, startYears, startCharge, -READING_UNCERTAINTY, kHigh, target);
    const late = reach(m, startYears, startCharge, READING_UNCERTAINTY, kLow, target);
    band[1] = early === early ? Math.min(early, at) : at;
    band[2] = late === late ? Math.max(late, at) : NaN;
  }
}

/**
 * The history: installation (fraction 1) first, then the validated surveys sorted by time, one per
 * instant (the lowest reading), without the readings of no loss (rule 1).
 */
function readHistory(value: unknown, installedOn: Date): Point[] {
  const installed = installedOn.getTime();
  if (value === undefined || value === null) return [{ t: installed, f: 1 }];
  const raw = list(value, 'surveys');
  const points: Point[] = new Array(raw.length + 1);
  points[0] = { t: installed, f: 1 };
  for (let i = 0; i < raw.length; i++) {
    const r = isRecord(raw[i]) ? (raw[i] as Record<string, unknown>) : record(raw[i], `surveys[${i}]`);
    const d = isValidDate(r.date) ? r.date : date(r.date, `surveys[${i}].date`);
    if (d.getTime() < installed) {
      throw new ForecastInputError(`surveys[${i}].date`, `surveys[${i}].date must not be before installedOn.`);
    }
    const f = r.remainingFraction;
    points[i + 1] = { t: d.getTime(), f: typeof f === 'number' && f >= 0 && f <= 1 ? f : fraction(f, `surveys[${i}].remainingFraction`) };
  }
  if (raw.length > 1) sortSurveys(points);
  // Same instant: the first after sorting, the lowest reading; then a reading of no loss is set aside.
  let n = 1;
  let previousT = NaN;
  for (let i = 1; i < points.length; i++) {
    const p = points[i];
    const sameInstant = p.t === previousT;
    previousT = p.t;
    if (!sameInstant && p.f < 1) points[n++] = p;
  }
  points.length = n;
  return points;
}

const byTimeThenFraction = (a: Point, b: Point) => a.t - b.t || a.f - b.f;

/**
 * Sorts the surveys (from index 1; installation stays first) in place by time, then fraction;
 * stable. A few surveys (the usual case) by insertion, which gives the same order as
 * Array.prototype.sort without its work array.
 */
function sortSurveys(points: Point[]): void {
  if (points.length > 17) {
    const surveys = points.slice(1).sort(byTimeThenFraction);
    for (let i = 0; i < surveys.length; i++) points[i + 1] = surveys[i];
    return;
  }
  for (let i = 2; i < points.length; i++) {
    const p = points[i];
    let j = i - 1;
    while (j >= 1 && byTimeThenFraction(points[j], p) > 0) {
      points[j + 1] = points[j];
      j--;
    }
    points[j + 1] = p;
  }
}

/**
 * Rule 2 and the band's k range: K (A, on the unit profile) fitted to the informative surveys
 * by least squares on the consumed fraction, widened by the reading uncertainty and the spread
 * of the single-survey and interval factors; the design's K +/- 20 % without one. Returns K and
 * leaves its range (low, high) in `fitRange`.
 */
function fitScale(m: Model, designScaleA: number): number {
  const h = m.history;
  let sumPP = 0;
  let sumCP = 0;
  let sumP = 0;
  // The spread of the single-survey and interval factors; positive, finite factors only.
  let spreadLow = Infinity;
  let spreadHigh = 0;
  // The survey before (its years since installation, its unit consumed fraction p, its reading).
  let beforeYears = 0;
  let beforeP = 0;
  let beforeF = 1;
  for (let i = 1; i < h.length; i++) {
    const f = h[i].f;
    const years = (h[i].t - m.t0) / MS_PER_YEAR;
    const p = consumedAt(m, years);
    if (years >= MIN_SURVEY_BASELINE_YEARS && p > 0) {
      const consumed = 1 - f;
      sumPP += p * p;
      sumCP += consumed * p;
      sumP += p;
      const factor = consumed / p; // this survey's own factor
      if (factor > 0 && Number.isFinite(factor)) {
        spreadLow = Math.min(spreadLow, factor);
        spreadHigh = Math.max(spreadHigh, factor);
      }
    }
    if (i > 1 && years - beforeYears >= MIN_SURVEY_BASELINE_YEARS && p > beforeP) {
      const factor = (beforeF - f) / (p - beforeP); // the interval since the survey before
      if (factor > 0 && Number.isFinite(factor)) {
        spreadLow = Math.min(spreadLow, factor);
        spreadHigh = Math.max(spreadHigh, factor);
      }
    }
    beforeYears = years;
    beforeP = p;
    beforeF = f;
  }
  if (!(sumPP > 0)) {
    fitRange[0] = (1 - BAND_FRACTION) * designScaleA;
    fitRange[1] = (1 + BAND_FRACTION) * designScaleA;
    return designScaleA;
  }
  const k = sumCP / sumPP;
  const reading = (READING_UNCERTAINTY * sumP) / sumPP;
  fitRange[0] = Math.min(Math.max(0, k - reading), spreadLow);
  fitRange[1] = Math.max(k + reading, spreadHigh);
  return k;
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
