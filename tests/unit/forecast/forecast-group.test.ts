import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ForecastInputError, forecastGroup, type GroupForecastInput } from '@/lib/forecast';
import { DAY_MS, HOUR_MS, expectInstant, fieldOf, utc } from './helpers';
import { forecastFigures } from '@/tests/fixtures/forecast-fields';

// The hand-checked group used throughout: 10 zinc hull anodes of 10 kg net = 100 kg.
// eps 780 Ah/kg for zinc in seawater (design-basis.md: DNV-RP-B401 (2010) Table 10-6, from
// memory; 780 Ah/kg also in MIL-A-18001 data, published).
// u 0.80 for a short flush-mounted anode (DNV-RP-B401 (2010), from memory).
// 1 A is an invented share of the design's mean current.
const zincGroup = (over: Partial<GroupForecastInput> = {}): GroupForecastInput => ({
  installedOn: utc('2020-01-01'),
  quantity: 10,
  netMassPerAnodeKg: 10,
  utilisationFactor: 0.8,
  capacityAhPerKg: 780,
  currentA: 1,
  ...over,
});

describe('forecastGroup without surveys (design rate)', () => {
  it('remaining-life formula Y = eps*W/(8760*I), zinc 780 Ah/kg, hand computed', () => {
    // Hand calculation:
    //   rate = I x 8760 / eps = 1 x 8760 / 780 = 11.2308 kg/yr
    //   (the trade's "zinc about 11.2 kg/A-yr" — common practice, design-basis.md)
    //   usable mass W = u x 100 kg = 80 kg
    //   Y = eps x W / (8760 x I) = 780 x 80 / 8760 = 7.1233 years = 62,400 h = 2,600 days
    //   2020-01-01 + 2,600 days = 2027-02-13
    const f = forecastGroup(zincGroup());
    expect(f.basis).toBe('design-rate');
    expect(f.installedMassKg).toBe(100);
    expect(f.endFraction).toBeCloseTo(0.2, 12);
    expect(f.designRatePerYearKg).toBeCloseTo(11.2308, 4);
    expect(f.ratePerYearKg).toBeCloseTo(11.2308, 4);
    expect(f.observedRatePerYearKg).toBeUndefined();
    expect(f.spent).toBe(false);
    expectInstant(f.endOfLife, '2027-02-13');
    expect((f.endOfLife!.getTime() - utc('2020-01-01').getTime()) / HOUR_MS / 8760).toBeCloseTo(7.1233, 4);
  });

  it('the band without surveys is the rate +/- 20 % (practice), hand computed', () => {
    // early: 62,400 h / 1.2 = 52,000 h -> 2025-12-06T16:00Z; late: 62,400 h / 0.8 = 78,000 h -> 2028-11-24
    const f = forecastGroup(zincGroup());
    expectInstant(f.early, '2025-12-06T16:00:00Z');
    expectInstant(f.late, '2028-11-24');
  });

  it('halving the current doubles the life from installation', () => {
    // 0.5 A: 780 x 80 / (8760 x 0.5) = 14.2466 yr = 124,800 h = 5,200 days
    const f = forecastGroup(zincGroup({ currentA: 0.5 }));
    expectInstant(f.endOfLife, new Date(utc('2020-01-01').getTime() + 5200 * DAY_MS));
  });

  it('remainingFractionAt follows the straight line, is 1 before installation and clamps at 0', () => {
    const f = forecastGroup(zincGroup());
    // one 8760-h year after installation (2020 is a leap year: 2020-12-31): 1 - 11.2308/100 = 0.887692
    expect(f.remainingFractionAt(utc('2020-12-31'))).toBeCloseTo(0.887692, 6);
    expect(f.remainingMassKgAt(utc('2020-12-31'))).toBeCloseTo(88.7692, 4);
    expect(f.remainingFractionAt(f.endOfLife!)).toBeCloseTo(0.2, 9);
    expect(f.remainingFractionAt(utc('2019-06-01'))).toBe(1);
    // 100 kg / 11.2308 kg/yr = 8.9 yr to empty: 2035 is past it
    expect(f.remainingFractionAt(utc('2035-01-01'))).toBe(0);
  });

  it('zero current never depletes: endOfLife, early and late are null', () => {
    const f = forecastGroup(zincGroup({ currentA: 0 }));
    expect(f.endOfLife).toBeNull();
    expect(f.early).toBeNull();
    expect(f.late).toBeNull();
    expect(f.remainingFractionAt(utc('2060-01-01'))).toBe(1);
  });
});

describe('forecastGroup with surveys', () => {
  it('a survey that shortens the forecast (more wastage than design) moves endOfLife earlier, hand computed', () => {
    // Invented survey two 8760-h years after installation (2021-12-31) estimating 60 % left.
    // Design alone predicted 1 - 2 x 0.112308 = 0.7754 left then, and end of life 2027-02-13.
    // Observed rate = (1 - 0.6) / 2 = 0.20 per year = 20 kg/yr.
    // From the survey: (0.6 - 0.2) / 0.2 = 2 years more -> 4 years after installation
    //   = 1,460 days -> 2023-12-31.
    // Band (reading +/- 0.05, common practice): the early end reads 0.55, consumed 0.45 over
    //   2 yr = 0.225 per year, 0.8 / 0.225 = 3.5556 yr = 31,146.67 h -> 2023-07-21T18:40Z;
    //   the late end reads 0.65, 0.175 per year, 0.8 / 0.175 = 4.5714 yr = 40,045.71 h
    //   -> 2024-07-26T13:42:51Z. (Was +/- 20 % of the rate; the band now comes from the reading.)
    const design = forecastGroup(zincGroup());
    const f = forecastGroup(zincGroup({ surveys: [{ date: utc('2021-12-31'), remainingFraction: 0.6 }] }));
    expect(f.basis).toBe('survey-corrected');
    expect(f.observedRatePerYearKg).toBeCloseTo(20, 9);
    expect(f.ratePerYearKg).toBeCloseTo(20, 9);
    expect(f.designRatePerYearKg).toBeCloseTo(11.2308, 4);
    expectInstant(f.endOfLife, '2023-12-31');
    expect(f.endOfLife!.getTime()).toBeLessThan(design.endOfLife!.getTime());
    expectInstant(f.early, '2023-07-21T18:40:00Z');
    expectInstant(f.late, '2024-07-26T13:42:51.428Z');
    expect(f.startsFrom).toEqual({ date: utc('2021-12-31'), remainingFraction: 0.6 });
  });

  it('a survey showing less wastage than design lengthens the forecast, hand computed', () => {
    // 90 % left after 2 years: 0.05 per year = 5 kg/yr; (0.9 - 0.2) / 0.05 = 14 more years
    // -> 16 years of 365 days after installation = 5,840 days -> 2035-12-28
    const f = forecastGroup(zincGroup({ surveys: [{ date: utc('2021-12-31'), remainingFraction: 0.9 }] }));
    expect(f.observedRatePerYearKg).toBeCloseTo(5, 9);
    expectInstant(f.endOfLife, '2035-12-28');
  });

  it('the latest survey sets the start even when listed first, the surveys fit the rate and spread the band', () => {
    // Invented surveys: 95 % left at 1 yr (2020-12-31), 55 % left at 3 yr (2022-12-31).
    // Design consumption P(t) = r t with r = 0.112308 per year (1 A); consumed c = 0.05 and 0.45.
    // Least-squares factor k = (0.05 x r + 0.45 x 3r) / (r^2 + 9 r^2) = 0.14 / r: the forecast
    //   consumes k r = 0.14 per year (14 kg/yr) from the latest survey (0.55 at 3 yr).
    //   (Was the latest survey's average since installation, 0.15 per year.)
    // End of life: 3 + (0.55 - 0.2) / 0.14 = 5.5 yr = 2,007.5 days -> 2025-06-30T12:00Z.
    // Band: the fit +/- 0.05 x (r + 3r) / (10 r^2) x r = +/- 0.02 -> 0.12..0.16 per year; one
    //   survey each: 0.05 (1 yr) and 0.15 (3 yr); between the surveys (0.95 - 0.55) / 2 = 0.20
    //   -> low 0.05, high 0.20.
    //   early: readings 0.05 lower, 3 + (0.50 - 0.2) / 0.20 = 4.5 yr -> 2024-06-30T12:00Z;
    //   late: readings 0.05 higher, 3 + (0.60 - 0.2) / 0.05 = 11 yr -> 2030-12-29.
    const f = forecastGroup(
      zincGroup({
        surveys: [
          { date: utc('2022-12-31'), remainingFraction: 0.55 },
          { date: utc('2020-12-31'), remainingFraction: 0.95 },
        ],
      }),
    );
    expect(f.observedRatePerYearKg).toBeCloseTo(15, 9);
    expect(f.ratePerYearKg).toBeCloseTo(14, 9);
    expect(f.profileScale).toBeCloseTo(0.14 / (8760 / 780 / 100), 9);
    expect(f.startsFrom).toEqual({ date: utc('2022-12-31'), remainingFraction: 0.55 });
    expectInstant(f.endOfLife, '2025-06-30T12:00:00Z');
    expectInstant(f.early, '2024-06-30T12:00:00Z');
    expectInstant(f.late, '2030-12-29');
    // history between the surveys is a straight line: halfway (2021-12-31) = (0.95 + 0.55) / 2
    expect(f.remainingFractionAt(utc('2021-12-31'))).toBeCloseTo(0.75, 9);
    // and the surveys themselves are on the curve
    expect(f.remainingFractionAt(utc('2020-12-31'))).toBeCloseTo(0.95, 9);
  });

  it('a survey under half a year after installation restarts the line at the design rate', () => {
    // Invented survey at 0.25 yr (2,190 h -> 2020-04-01T06:00Z) estimating 95 % left.
    // Too short a baseline for a rate: the design rate continues from the survey point.
    // Usable from the survey: (0.95 - 0.2) x 100 kg = 75 kg; 75 x 780 / 1 A = 58,500 h
    // -> 2,190 + 58,500 = 60,690 h after installation -> 2026-12-03T18:00Z.
    const f = forecastGroup(zincGroup({ surveys: [{ date: utc('2020-04-01T06:00:00Z'), remainingFraction: 0.95 }] }));
    expect(f.basis).toBe('survey-corrected');
    expect(f.observedRatePerYearKg).toBeUndefined();
    expect(f.ratePerYearKg).toBeCloseTo(f.designRatePerYearKg, 12);
    expectInstant(f.endOfLife, '2026-12-03T18:00:00Z');
  });

  it('an informative survey gives a rate even when the entered current is zero', () => {
    // 80 % left after 2 years: 0.1 per year; (0.8 - 0.2) / 0.1 = 6 more years -> 8 x 365 days = 2,920 days
    const f = forecastGroup(zincGroup({ currentA: 0, surveys: [{ date: utc('2021-12-31'), remainingFraction: 0.8 }] }));
    expect(f.observedRatePerYearKg).toBeCloseTo(10, 9);
    expectInstant(f.endOfLife, new Date(utc('2020-01-01').getTime() + 2920 * DAY_MS));
  });

  it('a survey that shows no loss after two years falls back to the design current, never "never depletes"', () => {
    // The issue: a survey showing no loss marked the group as never depleting. The reading is
    // set aside (loss below what the eye resolves): the forecast is the design's, end of life
    // 2027-02-13 as in "remaining-life formula", band +/- 20 %.
    const design = forecastGroup(zincGroup());
    const f = forecastGroup(zincGroup({ surveys: [{ date: utc('2021-12-31'), remainingFraction: 1 }] }));
    expect(f.observedRatePerYearKg).toBeUndefined();
    expect(f.profileScale).toBe(1);
    expect(f.basis).toBe('design-rate');
    expectInstant(f.endOfLife, '2027-02-13');
    expect(f.endOfLife).toEqual(design.endOfLife);
    expect(f.early).toEqual(design.early);
    expect(f.late).toEqual(design.late);
  });

  it('a near-zero observed rate is treated as never depleting, not an invalid date', () => {
    // 99.9999 % left after 0.5 yr: 2e-6 per year; 0.8 / 2e-6 = 400,000 years > MAX_FORECAST_YEARS
    const f = forecastGroup(zincGroup({ currentA: 0, surveys: [{ date: utc('2020-07-01T12:00:00Z'), remainingFraction: 0.999999 }] }));
    expect(f.observedRatePerYearKg).toBeGreaterThan(0);
    expect(f.endOfLife).toBeNull();
    expect(f.late).toBeNull();
  });

  it('a latest survey below 1 - u is spent: end of life where the history crossed 1 - u', () => {
    // Invented: 50 % left at 1 yr (8,760 h), 10 % at 2 yr (17,520 h); 1 - u = 0.2.
    // Crossing between them: (0.5 - 0.2) / (0.5 - 0.1) = 0.75 of the way -> 1.75 yr = 15,330 h
    // -> 2021-09-30T18:00Z. The band collapses onto it.
    const f = forecastGroup(
      zincGroup({
        surveys: [
          { date: utc('2020-12-31'), remainingFraction: 0.5 },
          { date: utc('2021-12-31'), remainingFraction: 0.1 },
        ],
      }),
    );
    expect(f.spent).toBe(true);
    expectInstant(f.endOfLife, '2021-09-30T18:00:00Z');
    expect(f.early).toEqual(f.endOfLife);
    expect(f.late).toEqual(f.endOfLife);
  });

  it('two readings on the same day count as one, the lower', () => {
    // 0.6 and 0.7 on 2021-12-31: 0.6 is used, as in "a survey that shortens the forecast"
    const f = forecastGroup(
      zincGroup({
        surveys: [
          { date: utc('2021-12-31'), remainingFraction: 0.7 },
          { date: utc('2021-12-31'), remainingFraction: 0.6 },
        ],
      }),
    );
    expect(f.startsFrom.remainingFraction).toBe(0.6);
    expectInstant(f.endOfLife, '2023-12-31');
  });
});

describe('the forecast as an object', () => {
  it('its dates are the same objects on every read, and JSON gives every figure and date', () => {
    const f = forecastGroup(zincGroup({ surveys: [{ date: utc('2022-01-01'), remainingFraction: 0.7 }] }));
    expect(f.renewBy).toBeInstanceOf(Date);
    expect(f.renewBy).toBe(f.renewBy);
    expect(f.endOfLife).toBe(f.endOfLife);
    expect(f.startsFrom).toBe(f.startsFrom);
    const json = JSON.parse(JSON.stringify(f));
    expect(Object.keys(json).sort()).toEqual(
      ['basis', 'designRatePerYearKg', 'early', 'endFraction', 'endOfLife', 'installedMassKg', 'late', 'observedRatePerYearKg', 'profileScale', 'ratePerYearKg', 'renewBy', 'renewByEarly', 'renewByLate', 'renewFraction', 'spent', 'startsFrom'].sort(),
    );
    expect(json.renewBy).toBe(f.renewBy!.toISOString());
    expect(json.late).toBe(f.late!.toISOString());
    expect(json.startsFrom).toEqual({ date: '2022-01-01T00:00:00.000Z', remainingFraction: 0.7 });
    expect(json.ratePerYearKg).toBe(f.ratePerYearKg);
  });

  it('JSON gives each figure and date exactly as the forecast reads it: with and without surveys, a profile, a date that never comes', () => {
    const cases = [
      forecastGroup(zincGroup()),
      forecastGroup(zincGroup({ currentA: 0 })),
      forecastGroup(zincGroup({ renewalThresholdRemaining: 0.4, surveys: [{ date: utc('2021-01-01'), remainingFraction: 0.8 }, { date: utc('2022-06-01'), remainingFraction: 0.55 }] })),
      forecastGroup(zincGroup({ demandProfile: { startA: 0.6, endA: 1.4, overYears: 5 }, surveys: [{ date: utc('2020-04-01'), remainingFraction: 0.97 }] })),
    ];
    for (const f of cases) {
      // The figures read one by one through their getters (not through toJSON), as JSON would write them.
      const expected = JSON.parse(JSON.stringify(forecastFigures(f)));
      expect(JSON.parse(JSON.stringify(f))).toStrictEqual(expected);
    }
    // The cases differ where it matters: a date that never comes, a band, a renewal threshold above 1 - u.
    expect(cases[1].endOfLife).toBeNull();
    expect(cases[2].renewBy!.getTime()).toBeLessThan(cases[2].endOfLife!.getTime());
    expect(cases[2].renewByEarly!.getTime()).toBeLessThan(cases[2].renewBy!.getTime());
  });
});

describe('remainingSeries', () => {
  it('steps calendar months from `from` and ends exactly at `to`', () => {
    const f = forecastGroup(zincGroup());
    const s = f.remainingSeries(utc('2020-01-01'), utc('2020-12-31'), 6);
    expect(s.map((p) => p.date.toISOString().slice(0, 10))).toEqual(['2020-01-01', '2020-07-01', '2020-12-31']);
    expect(s[0].remainingFraction).toBe(1);
    // 2020-07-01 is 182 days in: 1 - (182 / 365) x 0.112308
    expect(s[1].remainingFraction).toBeCloseTo(1 - (182 / 365) * (8760 / 780 / 100), 9);
    expect(s[2].remainingFraction).toBeCloseTo(0.887692, 6);
  });

  it('rejects a zero step and a reversed range', () => {
    const f = forecastGroup(zincGroup());
    expect(fieldOf(() => f.remainingSeries(utc('2020-01-01'), utc('2021-01-01'), 0))).toBe('stepMonths');
    expect(fieldOf(() => f.remainingSeries(utc('2021-01-01'), utc('2020-01-01'), 1))).toBe('to');
  });
});

describe('forecastGroup input checks', () => {
  it.each([
    ['quantity', { quantity: 0 }],
    ['quantity', { quantity: 2.5 }],
    ['netMassPerAnodeKg', { netMassPerAnodeKg: -1 }],
    ['utilisationFactor', { utilisationFactor: 0 }],
    ['utilisationFactor', { utilisationFactor: 1.1 }],
    ['capacityAhPerKg', { capacityAhPerKg: 0 }],
    ['currentA', { currentA: -0.1 }],
    ['currentA', { currentA: Number.NaN }],
    ['installedOn', { installedOn: new Date('not a date') }],
    ['surveys[0].date', { surveys: [{ date: utc('2019-12-31'), remainingFraction: 0.9 }] }],
    ['surveys[1].remainingFraction', { surveys: [{ date: utc('2021-01-01'), remainingFraction: 0.9 }, { date: utc('2022-01-01'), remainingFraction: 1.5 }] }],
  ] as const)('names %s', (field, over) => {
    expect(fieldOf(() => forecastGroup(zincGroup(over as Partial<GroupForecastInput>)))).toBe(field);
  });

  it('throws ForecastInputError, not a TypeError, for a missing input', () => {
    expect(() => forecastGroup(undefined as unknown as GroupForecastInput)).toThrow(ForecastInputError);
  });
});

describe('forecastGroup properties', () => {
  const arb = fc.record({
    days: fc.integer({ min: 0, max: 20_000 }),
    quantity: fc.integer({ min: 1, max: 200 }),
    mass: fc.double({ min: 0.5, max: 500, noNaN: true }),
    u: fc.double({ min: 0.5, max: 1, noNaN: true }),
    eps: fc.double({ min: 500, max: 2600, noNaN: true }),
    current: fc.double({ min: 0, max: 50, noNaN: true }),
    profile: fc.option(
      fc.record({ startA: fc.double({ min: 0, max: 50, noNaN: true }), endA: fc.double({ min: 0, max: 50, noNaN: true }), overYears: fc.double({ min: 0.5, max: 30, noNaN: true }) }),
    ),
    threshold: fc.option(fc.double({ min: 0, max: 0.9, noNaN: true })),
    surveys: fc.array(
      fc.record({ afterDays: fc.integer({ min: 0, max: 5000 }), f: fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.constant(1)) }),
      { maxLength: 4 },
    ),
  });

  it('the forecast reaches exactly 1 - u at endOfLife and the renewal fraction at renewBy, inside their bands, and only falls after its start', () => {
    fc.assert(
      fc.property(arb, (a) => {
        const installedOn = new Date(Date.UTC(1990, 0, 1) + a.days * DAY_MS);
        const f = forecastGroup({
          installedOn,
          quantity: a.quantity,
          netMassPerAnodeKg: a.mass,
          utilisationFactor: a.u,
          capacityAhPerKg: a.eps,
          currentA: a.current,
          demandProfile: a.profile,
          ...(a.threshold === null ? {} : { renewalThresholdRemaining: a.threshold }),
          surveys: a.surveys.map((s) => ({ date: new Date(installedOn.getTime() + s.afterDays * DAY_MS), remainingFraction: s.f })),
        });
        expect(f.renewFraction).toBeCloseTo(Math.max(1 - a.u, a.threshold ?? 0.25), 12);
        // renewBy: inside its own band, on the curve at the renewal fraction, never after endOfLife
        // (endOfLife may be null while renewBy is a date: the record or a dying demand reached
        // the renewal fraction but nothing reaches 1 - u)
        if (f.renewBy === null) {
          expect(f.endOfLife).toBeNull();
          expect(f.renewByEarly).toBeNull();
          expect(f.renewByLate).toBeNull();
        } else {
          expect(f.renewByEarly!.getTime()).toBeLessThanOrEqual(f.renewBy.getTime());
          if (f.renewByLate !== null) expect(f.renewByLate.getTime()).toBeGreaterThanOrEqual(f.renewBy.getTime());
          if (f.endOfLife !== null) expect(f.renewBy.getTime()).toBeLessThanOrEqual(f.endOfLife.getTime());
          if (f.startsFrom.remainingFraction > f.renewFraction && f.renewFraction < 1) {
            expect(f.remainingFractionAt(f.renewBy)).toBeCloseTo(f.renewFraction, 6);
          }
        }
        if (f.endOfLife === null) {
          expect(f.early).toBeNull();
          expect(f.late).toBeNull();
          return;
        }
        expect(f.early!.getTime()).toBeLessThanOrEqual(f.endOfLife.getTime());
        // late is null only when beyond MAX_FORECAST_YEARS
        if (f.late !== null) expect(f.late.getTime()).toBeGreaterThanOrEqual(f.endOfLife.getTime());
        expect(Number.isFinite(f.endOfLife.getTime())).toBe(true);
        if (!f.spent) {
          expect(f.endOfLife.getTime()).toBeGreaterThanOrEqual(f.startsFrom.date.getTime());
          expect(f.remainingFractionAt(f.endOfLife)).toBeCloseTo(1 - a.u, 6);
          const t0 = f.startsFrom.date.getTime();
          const mid = f.remainingFractionAt(new Date((t0 + f.endOfLife.getTime()) / 2));
          expect(mid).toBeLessThanOrEqual(f.startsFrom.remainingFraction + 1e-12);
          expect(mid).toBeGreaterThanOrEqual(1 - a.u - 1e-12);
        } else {
          expect(f.startsFrom.remainingFraction).toBeLessThanOrEqual(1 - a.u);
          expect(f.endOfLife.getTime()).toBeLessThanOrEqual(f.startsFrom.date.getTime());
        }
      }),
      { numRuns: 300 },
    );
  });

  it('with a design current, surveys that show no loss never stop the forecast: it is the design\'s', () => {
    const noLoss = fc.record({
      days: fc.integer({ min: 0, max: 20_000 }),
      current: fc.double({ min: 0.01, max: 50, noNaN: true }),
      profile: fc.option(
        fc.record({
          startA: fc.double({ min: 0.01, max: 50, noNaN: true }),
          endA: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 50, noNaN: true })),
          overYears: fc.double({ min: 0.5, max: 30, noNaN: true }),
        }),
      ),
      afterDays: fc.array(fc.integer({ min: 0, max: 5000 }), { minLength: 1, maxLength: 4 }),
    });
    fc.assert(
      fc.property(noLoss, (a) => {
        const installedOn = new Date(Date.UTC(1990, 0, 1) + a.days * DAY_MS);
        const base = { installedOn, quantity: 10, netMassPerAnodeKg: 10, utilisationFactor: 0.8, capacityAhPerKg: 780, currentA: a.current, demandProfile: a.profile };
        const design = forecastGroup(base);
        const f = forecastGroup({ ...base, surveys: a.afterDays.map((d) => ({ date: new Date(installedOn.getTime() + d * DAY_MS), remainingFraction: 1 })) });
        // A profile falling to 0 A has no demand left after overYears and may never deplete; any
        // other current (at least 0.01 A on 100 kg of zinc: under 720 years) always depletes.
        if (a.profile === null || a.profile.endA > 0) expect(f.endOfLife).not.toBeNull();
        expect(f.endOfLife).toEqual(design.endOfLife);
        expect(f.renewBy).toEqual(design.renewBy);
      }),
      { numRuns: 200 },
    );
  });
});
