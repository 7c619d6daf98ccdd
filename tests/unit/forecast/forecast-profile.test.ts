import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_RENEWAL_THRESHOLD_REMAINING,
  FORECAST_DATE_LABELS,
  MS_PER_YEAR,
  READING_UNCERTAINTY,
  chargeAYears,
  forecastGroup,
  proposeRenewals,
  yearsToCharge,
  type GroupForecastInput,
} from '@/lib/forecast';
import { expectInstant, fieldOf, utc } from './helpers';

// The hand-worked hull group (all numbers invented, chosen so the arithmetic is exact):
//   10 Al-Zn-In flush anodes of 8.76 kg net = 87.6 kg installed;
//   eps 2000 Ah/kg (DNV-RP-B401 (2010) Table 10-6, from memory, design-basis.md);
//   u 0.80 (short flush, DNV-RP-B401 (2010), from memory);
//   demand profile: 1.6 A at installation rising linearly to 4.8 A at 5.0 years (coating
//   breakdown fc = a + b t makes the demand linear; 1 : 3 is fci : fcf of an invented coating).
// Closed form (hand-worked):
//   slope = (4.8 - 1.6) / 5 = 0.64 A/yr
//   Q(t) = 1.6 t + 0.64 t^2 / 2 = 1.6 t + 0.32 t^2       A x yr delivered by t years
//   the whole mass is 87.6 kg x 2000 Ah/kg / 8760 h = 20 A x yr, so the consumed fraction is
//   P(t) = Q(t) / 20 = 0.08 t + 0.016 t^2
//   P(5) = 0.4 + 0.4 = 0.8 = u: sized to be spent at exactly 5.0 years (mean 3.2 A x 5 yr = 16 A x yr).
//   Reaching a consumed fraction c: t^2 + 5 t - c / 0.016 = 0, t = (-5 + sqrt(25 + 250 c)) / 2.
const installedOn = utc('2024-01-01');
const hull = (over: Partial<GroupForecastInput> = {}): GroupForecastInput => ({
  installedOn,
  quantity: 10,
  netMassPerAnodeKg: 8.76,
  utilisationFactor: 0.8,
  capacityAhPerKg: 2000,
  demandProfile: { startA: 1.6, endA: 4.8, overYears: 5 },
  ...over,
});
/** The instant `y` 8760-h years after installation. */
const after = (y: number) => new Date(installedOn.getTime() + y * MS_PER_YEAR);
/** Years of 8760 h from installation to `d`. */
const yearsOf = (d: Date | null) => ((d as Date).getTime() - installedOn.getTime()) / MS_PER_YEAR;
/** Hand formula above: years at which the consumed fraction on the design curve is c. */
const yearsAtConsumed = (c: number) => (-5 + Math.sqrt(25 + 250 * c)) / 2;

describe('the demand profile in closed form', () => {
  it('Q(t) = startA t + slope t^2 / 2 and its inverse, hand-worked', () => {
    const p = { startA: 1.6, endA: 4.8, overYears: 5 };
    expect(chargeAYears(p, 2.5)).toBeCloseTo(6, 12); // 1.6 x 2.5 + 0.32 x 6.25 = 4 + 2
    expect(chargeAYears(p, 5)).toBeCloseTo(16, 12); // 8 + 8
    expect(yearsToCharge(p, 16)).toBeCloseTo(5, 12);
    expect(yearsToCharge(p, 6)).toBeCloseTo(2.5, 12);
    // after overYears a rising profile keeps its slope: Q(6) = 9.6 + 11.52 = 21.12
    expect(chargeAYears(p, 6)).toBeCloseTo(21.12, 12);
    // a falling profile (bare steel) holds at endA: 4.8 -> 1.6 over 5 yr delivers the same 16 A x yr
    // by 5 yr (4.8 x 5 - 0.32 x 25 = 16), then 1.6 A: Q(6) = 17.6
    const falling = { startA: 4.8, endA: 1.6, overYears: 5 };
    expect(chargeAYears(falling, 5)).toBeCloseTo(16, 12);
    expect(chargeAYears(falling, 6)).toBeCloseTo(17.6, 12);
    expect(yearsToCharge(falling, 17.6)).toBeCloseTo(6, 12);
    expect(yearsToCharge({ startA: 0, endA: 0, overYears: 5 }, 1)).toBe(Infinity);
  });

  it('Q(t) agrees with Simpson\'s rule (exact for a quadratic) and yearsToCharge inverts it', () => {
    const current = (p: { startA: number; endA: number; overYears: number }, t: number) =>
      p.endA < p.startA && t > p.overYears ? p.endA : p.startA + ((p.endA - p.startA) / p.overYears) * t;
    const simpson = (p: { startA: number; endA: number; overYears: number }, a: number, b: number) =>
      ((b - a) / 6) * (current(p, a) + 4 * current(p, (a + b) / 2) + current(p, b));
    const amps = fc.oneof(fc.constant(0), fc.double({ min: 0.001, max: 100, noNaN: true }));
    fc.assert(
      fc.property(
        fc.record({ startA: amps, endA: amps, overYears: fc.double({ min: 0.1, max: 40, noNaN: true }) }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        (p, t) => {
          // piecewise on each side of overYears, where a falling profile changes formula
          const cut = Math.min(t, p.overYears);
          const want = simpson(p, 0, cut) + (t > cut ? simpson(p, cut, t) : 0);
          const got = chargeAYears(p, t);
          expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-9 * Math.max(1, want));
          // the inverse is unique where current flows at t
          if (current(p, t) > 0) expect(Math.abs(yearsToCharge(p, got) - t)).toBeLessThanOrEqual(1e-7 * Math.max(1, t));
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('forecastGroup on a linear demand profile', () => {
  it('without a survey the hull group is spent at exactly 5.0 years, hand-worked', () => {
    // P(t) = 0.8 at t = (-5 + sqrt(225)) / 2 = 5 -> 2024-01-01 + 1,825 days = 2028-12-30.
    // Band (no survey: k = 1 +/- 20 %, practice):
    //   early k = 1.2: P = 0.8 / 1.2 = 0.6667, t = (-5 + sqrt(191.667)) / 2 = 4.42219 yr
    //   late  k = 0.8: P = 1.0,               t = (-5 + sqrt(275)) / 2     = 5.79156 yr
    const f = forecastGroup(hull());
    expect(f.basis).toBe('design-rate');
    expect(f.profileScale).toBe(1);
    expect(f.installedMassKg).toBeCloseTo(87.6, 12);
    // design mean rate: (1.6 + 4.8) / 2 = 3.2 A x 8760 / 2000 = 14.016 kg/yr; at installation 1.6 A: 7.008 kg/yr
    expect(f.designRatePerYearKg).toBeCloseTo(14.016, 9);
    expect(f.ratePerYearKg).toBeCloseTo(7.008, 9);
    expectInstant(f.endOfLife, '2028-12-30');
    expect(yearsOf(f.endOfLife)).toBeCloseTo(5, 6);
    expect(yearsOf(f.early)).toBeCloseTo(4.42219, 5);
    expect(yearsOf(f.late)).toBeCloseTo(5.79156, 5);
    // the curve itself: at 2.5 yr P = 0.3, 0.70 remains
    expect(f.remainingFractionAt(after(2.5))).toBeCloseTo(0.7, 9);
    expect(f.remainingMassKgAt(after(2.5))).toBeCloseTo(61.32, 9);
  });

  it('surveyed at 2.5 years exactly on its design curve, it is still spent at 5.0 years, inside its band (the issue)', () => {
    // Survey at 2.5 yr: P(2.5) = 0.2 + 0.1 = 0.3 consumed, 0.70 remaining, on the design curve.
    // k = 0.3 / 0.3 = 1, so end of life stays at 5.0 yr. (The average since installation,
    // 0.3 / 2.5 = 0.12 per year, as a straight line gave 0.8 / 0.12 = 6.67 yr: the bug.)
    // Band, readings +/- 0.05 (common practice), hand-worked:
    //   early: 0.65 read, consumed 0.35, k = 0.35 / 0.3 = 7/6: P = 0.8 x 6/7 = 0.685714,
    //          t = (-5 + sqrt(25 + 171.4286)) / 2 = 4.50765 yr
    //   late:  0.75 read, consumed 0.25, k = 5/6: P = 0.96, t = (-5 + sqrt(265)) / 2 = 5.63941 yr
    const f = forecastGroup(hull({ surveys: [{ date: after(2.5), remainingFraction: 0.7 }] }));
    expect(f.basis).toBe('survey-corrected');
    expect(f.profileScale).toBeCloseTo(1, 9);
    expect(f.observedRatePerYearKg).toBeCloseTo(0.12 * 87.6, 9);
    expect(Math.abs(yearsOf(f.endOfLife) - 5)).toBeLessThan(0.1); // acceptance criterion of the issue
    expect(yearsOf(f.endOfLife)).toBeCloseTo(5, 6);
    expect(f.early!.getTime()).toBeLessThan(f.endOfLife!.getTime());
    expect(f.late!.getTime()).toBeGreaterThan(f.endOfLife!.getTime());
    expect(yearsOf(f.early)).toBeCloseTo(4.50765, 5);
    expect(yearsOf(f.late)).toBeCloseTo(5.63941, 5);
    expect(READING_UNCERTAINTY).toBe(0.05);
  });

  it('a survey showing no loss gives a finite end of life, the profile\'s own', () => {
    // Remaining 1.0 at 2.5 yr: set aside (loss below what the eye resolves), k = 1: the
    // forecast is the profile's, 5.0 yr, with the profile's band; never "never depletes".
    const design = forecastGroup(hull());
    const f = forecastGroup(hull({ surveys: [{ date: after(2.5), remainingFraction: 1 }] }));
    expect(f.endOfLife).not.toBeNull();
    expect(f.endOfLife).toEqual(design.endOfLife);
    expect(f.renewBy).toEqual(design.renewBy);
    expect(f.early).toEqual(design.early);
    expect(f.late).toEqual(design.late);
    expect(f.profileScale).toBe(1);
    expect(f.startsFrom).toEqual({ date: installedOn, remainingFraction: 1 });
  });

  it('a survey showing twice the profile\'s consumption halves what the group may still deliver, hand-worked', () => {
    // Rising profile: at 2.5 yr 0.40 remains, consumed 0.60 = 2 x 0.30, so k = 2.
    // Spent when 2 P(t) = 0.8: P = 0.4 -> Q = 8 A x yr, half the design's 16 (the charge budget
    // halves); t = (-5 + sqrt(125)) / 2 = 3.09017 yr, 0.59 yr after the survey instead of 2.5.
    // (On a rising profile the life does not simply halve: demand still rises after the survey.)
    const f = forecastGroup(hull({ surveys: [{ date: after(2.5), remainingFraction: 0.4 }] }));
    expect(f.profileScale).toBeCloseTo(2, 9);
    expect(yearsOf(f.endOfLife)).toBeCloseTo(3.09017, 5);
    expect(chargeAYears({ startA: 1.6, endA: 4.8, overYears: 5 }, yearsOf(f.endOfLife))).toBeCloseTo(8, 6);
    // the rate at the survey is twice the design's then: 2 x (1.6 + 0.64 x 2.5) A = 6.4 A x 8760 / 2000 = 28.032 kg/yr
    expect(f.ratePerYearKg).toBeCloseTo(28.032, 9);

    // Constant current, the same group's mean 3.2 A: P(t) = 0.16 t, spent at 0.8 / 0.16 = 5.0 yr.
    // Surveyed at 1.25 yr with 0.60 left (0.40 consumed = 2 x 0.20): k = 2, and the whole life
    // halves exactly: 0.8 / 0.32 = 2.5 yr.
    const flat = forecastGroup(hull({ demandProfile: null, currentA: 3.2 }));
    const twice = forecastGroup(hull({ demandProfile: null, currentA: 3.2, surveys: [{ date: after(1.25), remainingFraction: 0.6 }] }));
    expect(yearsOf(flat.endOfLife)).toBeCloseTo(5, 9);
    expect(twice.profileScale).toBeCloseTo(2, 9);
    expect(yearsOf(twice.endOfLife)).toBeCloseTo(2.5, 9);
  });

  it('after overYears a rising profile keeps its slope and a falling one holds at endA, hand-worked', () => {
    // u = 0.9: spent at Q = 0.9 x 20 = 18 A x yr, after the 5-year profile.
    // Rising (1.6 -> 4.8 A): 0.32 t^2 + 1.6 t = 18, t = (-5 + sqrt(250)) / 2 = 5.40569 yr
    //   (held at 4.8 A it would be 5 + 2 / 4.8 = 5.41667 yr).
    // Falling (4.8 -> 1.6 A, bare steel): 16 by 5 yr, then 1.6 A: 5 + 2 / 1.6 = 6.25 yr.
    const rising = forecastGroup(hull({ utilisationFactor: 0.9 }));
    const falling = forecastGroup(hull({ utilisationFactor: 0.9, demandProfile: { startA: 4.8, endA: 1.6, overYears: 5 } }));
    expect(yearsOf(rising.endOfLife)).toBeCloseTo(5.40569, 5);
    expect(yearsOf(falling.endOfLife)).toBeCloseTo(6.25, 9);
  });

  it('a constant profile is the constant current, and a survey under half a year restarts the profile at the design current', () => {
    // startA = endA = 3.2 A is the same as currentA 3.2 A: spent at 0.8 / 0.16 = 5.0 yr.
    const flat = forecastGroup(hull({ demandProfile: { startA: 3.2, endA: 3.2, overYears: 5 } }));
    const constant = forecastGroup(hull({ demandProfile: null, currentA: 3.2 }));
    expect(flat.endOfLife).toEqual(constant.endOfLife);
    expect(flat.renewBy).toEqual(constant.renewBy);
    expect(flat.early).toEqual(constant.early);
    expect(yearsOf(flat.endOfLife)).toBeCloseTo(5, 9);
    // Survey at 0.25 yr reading 0.95 (P(0.25) = 0.02 + 0.001 = 0.021 on the design curve): too
    // short a baseline for a factor; the design current goes on from the survey:
    // 0.95 - (P(t) - 0.021) = 0.2 -> P = 0.771, t = (-5 + sqrt(25 + 192.75)) / 2 = 4.87818 yr.
    const early = forecastGroup(hull({ surveys: [{ date: after(0.25), remainingFraction: 0.95 }] }));
    expect(early.basis).toBe('survey-corrected');
    expect(early.profileScale).toBe(1);
    expect(early.observedRatePerYearKg).toBeUndefined();
    expect(yearsOf(early.endOfLife)).toBeCloseTo(4.87818, 5);
  });

  it('with several surveys k is the least-squares fit of the consumed fractions, hand-worked', () => {
    // Surveys at 2.5 yr (P = 0.3) reading 0.64 (consumed 0.36) and at 4 yr
    // (P = 0.32 + 0.256 = 0.576) reading 0.28 (consumed 0.72).
    // k = (0.36 x 0.3 + 0.72 x 0.576) / (0.09 + 0.331776) = 0.522720 / 0.421776 = 1.239331.
    // From the latest survey (0.28 at 4 yr): 0.28 - k (P(t) - 0.576) = 0.2
    //   -> P = 0.576 + 0.08 / 1.239331 = 0.640551, t = (-5 + sqrt(25 + 160.1377)) / 2 = 4.30327 yr.
    const f = forecastGroup(
      hull({
        surveys: [
          { date: after(4), remainingFraction: 0.28 },
          { date: after(2.5), remainingFraction: 0.64 },
        ],
      }),
    );
    expect(f.profileScale).toBeCloseTo(0.52272 / 0.421776, 9);
    expect(f.startsFrom.remainingFraction).toBe(0.28);
    expect(yearsOf(f.endOfLife)).toBeCloseTo(4.30327, 5);
    expect(f.early!.getTime()).toBeLessThanOrEqual(f.endOfLife!.getTime());
    expect(f.late!.getTime()).toBeGreaterThanOrEqual(f.endOfLife!.getTime());
  });
});

describe('renewBy', () => {
  it('is earlier than endOfLife when 0.25 > 1 - u: u = 0.8 renews at 25 % remaining, hand-worked', () => {
    // 1 - u = 0.20 < 0.25 (NAVFAC mooring practice, published): renew at consumed 0.75,
    // t = (-5 + sqrt(25 + 187.5)) / 2 = 4.78869 yr -> 2028-10-13T20:55:23.694Z; end of life 5.0 yr.
    // Band (k 1.2 / 0.8): early P = 0.625, t = (-5 + sqrt(181.25)) / 2 = 4.23146 yr;
    //                     late  P = 0.9375, t = (-5 + sqrt(259.375)) / 2 = 5.55256 yr.
    expect(DEFAULT_RENEWAL_THRESHOLD_REMAINING).toBe(0.25);
    const f = forecastGroup(hull());
    expect(f.renewFraction).toBe(0.25);
    expect(f.endFraction).toBeCloseTo(0.2, 12);
    expect(yearsOf(f.renewBy)).toBeCloseTo(4.78869, 5);
    expectInstant(f.renewBy, '2028-10-13T20:55:23.694Z');
    expect(f.renewBy!.getTime()).toBeLessThan(f.endOfLife!.getTime());
    expect(f.remainingFractionAt(f.renewBy!)).toBeCloseTo(0.25, 9);
    expect(yearsOf(f.renewByEarly)).toBeCloseTo(4.23146, 5);
    expect(yearsOf(f.renewByLate)).toBeCloseTo(5.55256, 5);
  });

  it('equals endOfLife when 1 - u is at or above the threshold (u 0.75 and 0.7)', () => {
    for (const u of [0.75, 0.7]) {
      const f = forecastGroup(hull({ utilisationFactor: u }));
      expect(f.renewFraction).toBeCloseTo(1 - u, 12);
      expect(f.renewBy).toEqual(f.endOfLife);
      expect(yearsOf(f.endOfLife)).toBeCloseTo(yearsAtConsumed(u), 9);
    }
  });

  it('follows the organisation\'s threshold: 0.40 remaining, hand-worked; 0 means at end of life', () => {
    // consumed 0.60: t = (-5 + sqrt(175)) / 2 = 4.11438 yr
    expect(yearsOf(forecastGroup(hull({ renewalThresholdRemaining: 0.4 })).renewBy)).toBeCloseTo(4.11438, 5);
    const none = forecastGroup(hull({ renewalThresholdRemaining: 0 }));
    expect(none.renewBy).toEqual(none.endOfLife);
  });

  it('a survey already below the threshold dates renewBy from the record, the end of life from the forecast, hand-worked', () => {
    // Survey at 4.5 yr reading 0.22: below 0.25, above 1 - u = 0.20.
    // renewBy: the straight line (0, 1) -> (4.5, 0.22) reaches 0.25 at 4.5 x 0.75 / 0.78 = 4.32692 yr,
    //   band collapsed onto it.
    // End of life: P(4.5) = 0.36 + 0.324 = 0.684, k = 0.78 / 0.684 = 1.140351; 1 - k P = 0.2 at
    //   P = 0.701538, t = (-5 + sqrt(25 + 175.3846)) / 2 = 4.57786 yr.
    const f = forecastGroup(hull({ surveys: [{ date: after(4.5), remainingFraction: 0.22 }] }));
    expect(f.spent).toBe(false);
    expect(yearsOf(f.renewBy)).toBeCloseTo(4.32692, 5);
    expect(f.renewByEarly).toEqual(f.renewBy);
    expect(f.renewByLate).toEqual(f.renewBy);
    expect(yearsOf(f.endOfLife)).toBeCloseTo(4.57786, 5);
  });

  it('the UI words come from one place', () => {
    expect(FORECAST_DATE_LABELS.renewBy).toBe('Renew by');
    expect(FORECAST_DATE_LABELS.endOfLife).toBe('End of life');
  });
});

describe('the scheduler works from renewBy', () => {
  it('a renewBy before the end of life moves the renewal to an earlier docking, hand-worked', () => {
    // The hull group without survey: renewBy 2028-10-13T20:55Z, end of life 2028-12-30.
    // Deadlines less 6 months: 2028-04-13T20:55Z and 2028-06-30. A docking on 2028-05-15 meets
    // the end-of-life deadline but not the renew-by one, which takes the docking of 2027-12-01.
    const f = forecastGroup(hull());
    const dockings = [
      { id: 'D-2027', date: utc('2027-12-01') },
      { id: 'D-2028', date: utc('2028-05-15') },
    ];
    const today = utc('2025-01-15');
    const [byRenew, byEnd] = proposeRenewals({
      today,
      dockings,
      groups: [
        { id: 'renew', renewBy: f.renewBy, renewByEarly: f.renewByEarly, endOfLife: f.endOfLife, early: f.early },
        { id: 'end', endOfLife: f.endOfLife, early: f.early },
      ],
    });
    expect(byRenew).toMatchObject({ status: 'proposed', dockingId: 'D-2027' });
    expectInstant(byRenew.deadline, '2028-04-13T20:55:23.694Z');
    expect(byRenew.reason).toMatch(/renew by 13 Oct 2028 less 6 months/);
    expect(byEnd).toMatchObject({ status: 'proposed', dockingId: 'D-2028', deadline: utc('2028-06-30') });
    expect(byEnd.reason).toMatch(/end of life 30 Dec 2028 less 6 months/);
  });

  it('the at-risk flag follows the renewBy band, and a null renewBy is sound', () => {
    // renewBy 2030-03-01 -> deadline 2029-09-01 -> 2027-12-01. renewByEarly 2028-01-01 -> 2027-07-01,
    // before that docking: at risk, although `early` (end-of-life band) is late enough.
    const dockings = [{ id: 'D2', date: utc('2027-12-01') }];
    const today = utc('2025-01-15');
    const [risky, sound] = proposeRenewals({
      today,
      dockings,
      groups: [
        { id: 'g', renewBy: utc('2030-03-01'), renewByEarly: utc('2028-01-01'), endOfLife: utc('2030-09-01'), early: utc('2029-09-01') },
        { id: 'h', renewBy: null, endOfLife: utc('2026-01-01') },
      ],
    });
    expect(risky).toMatchObject({ status: 'proposed', dockingId: 'D2', atRisk: true, deadline: utc('2029-09-01') });
    expect(sound).toMatchObject({ status: 'sound' });
    expect(sound.deadline).toBeUndefined();
    expect(sound.reason).toMatch(/renewal threshold/);
    expect(fieldOf(() => proposeRenewals({ today, dockings, groups: [{ id: 'g', renewBy: 'soon' as unknown as Date }] }))).toBe('groups[0].renewBy');
  });
});

describe('forecastGroup profile input checks', () => {
  it.each([
    ['demandProfile.startA', { demandProfile: { startA: -0.1, endA: 4.8, overYears: 5 } }],
    ['demandProfile.endA', { demandProfile: { startA: 1.6, endA: -1, overYears: 5 } }],
    ['demandProfile.overYears', { demandProfile: { startA: 1.6, endA: 4.8, overYears: 0 } }],
    ['demandProfile.overYears', { demandProfile: { startA: 1.6, endA: 4.8, overYears: -5 } }],
    ['demandProfile.startA', { demandProfile: { startA: Number.NaN, endA: 4.8, overYears: 5 } }],
    ['demandProfile', { demandProfile: 3.2 as unknown as GroupForecastInput['demandProfile'] }],
    ['renewalThresholdRemaining', { renewalThresholdRemaining: 1.5 }],
    ['renewalThresholdRemaining', { renewalThresholdRemaining: -0.1 }],
    ['currentA', { demandProfile: null }],
  ] as const)('names %s', (field, over) => {
    expect(fieldOf(() => forecastGroup(hull(over as Partial<GroupForecastInput>)))).toBe(field);
  });
});
