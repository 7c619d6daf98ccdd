import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_DOCKING_GAP_DAYS, addMonthsUTC, proposeNextDockings, type ProposedDocking } from '@/lib/forecast';
import { DAY_MS, fieldOf, utc } from './helpers';

const days = (list: ProposedDocking[]) => list.map((d) => `${d.date.toISOString().slice(0, 10)} ${d.kind}`);

describe('proposeNextDockings', () => {
  it('without a renewal survey, steps the practice interval of 30 months (common practice)', () => {
    // 2024-03-15 + 30, 60, 90, 120 months; the horizon ends 2034-03-15 (inclusive)
    const out = proposeNextDockings({ lastDocking: utc('2024-03-15'), horizonYears: 10 });
    expect(days(out)).toEqual(['2026-09-15 intermediate', '2029-03-15 intermediate', '2031-09-15 intermediate', '2034-03-15 intermediate']);
    expect(out[0].reason).toMatch(/36 months/);
  });

  it('a renewal survey every five years, one intermediate docking between (class: two bottom inspections per five years, published)', () => {
    // Renewal survey at the last docking, 2022-06-01. Anniversaries 2027-06-01 and 2032-06-01.
    // 2022-06-01 -> 2027-06-01 is 1,826 days: round(1826 / (30 x 30.4375)) = 2 parts, so one
    // intermediate 913 days in = 2024-11-30. 2027-06-01 -> 2032-06-01 is 1,827 days: 913 days in = 2029-11-30.
    const out = proposeNextDockings({ lastDocking: utc('2022-06-01'), lastRenewalSurvey: utc('2022-06-01'), horizonYears: 10 });
    expect(days(out)).toEqual(['2024-11-30 intermediate', '2027-06-01 renewal-survey', '2029-11-30 intermediate', '2032-06-01 renewal-survey']);
    expect(out[1].reason).toMatch(/5 years after the renewal survey of 1 Jun 2022\b/);
    expect(out[3].reason).toMatch(/10 years/);
  });

  it('a gap within the 36-month limit needs no extra docking', () => {
    // Intermediate docking done 2024-09-10; renewal survey due 2027-06-01, 994 days (about 32.7
    // months) later: round(994 / 913.1) = 1 and ceil(994 / 1095) = 1, so the renewal survey is next.
    // Tail: 2027-06-01 + 30 months = 2029-12-01, after the horizon end 2029-09-10.
    const out = proposeNextDockings({ lastDocking: utc('2024-09-10'), lastRenewalSurvey: utc('2022-06-01'), horizonYears: 5 });
    expect(days(out)).toEqual(['2027-06-01 renewal-survey']);
  });

  it('a gap over 36 months before a renewal survey is split', () => {
    // 2023-01-01 -> 2026-06-01 is 1,247 days (about 41 months): ceil(1247 / 1095) = 2 parts,
    // the intermediate 623 days in = 2024-09-15.
    const out = proposeNextDockings({ lastDocking: utc('2023-01-01'), lastRenewalSurvey: utc('2021-06-01'), horizonYears: 4 });
    expect(days(out)).toEqual(['2024-09-15 intermediate', '2026-06-01 renewal-survey']);
  });

  it('rejects an interval above the 36-month class limit and an empty horizon', () => {
    expect(fieldOf(() => proposeNextDockings({ lastDocking: utc('2024-01-01'), horizonYears: 5, intervalMonths: 37 }))).toBe('intervalMonths');
    expect(fieldOf(() => proposeNextDockings({ lastDocking: utc('2024-01-01'), horizonYears: 0 }))).toBe('horizonYears');
    expect(fieldOf(() => proposeNextDockings({ lastDocking: new Date(Number.NaN), horizonYears: 5 }))).toBe('lastDocking');
  });
});

describe('proposeNextDockings properties', () => {
  const arb = fc.record({
    lastDay: fc.integer({ min: 0, max: 20_000 }), // from 2000-01-01
    lastHourMs: fc.integer({ min: 0, max: DAY_MS - 1 }),
    renewalBeforeDays: fc.option(fc.integer({ min: 0, max: 2500 }), { nil: undefined }),
    horizonYears: fc.integer({ min: 1, max: 30 }),
    intervalMonths: fc.option(fc.integer({ min: 6, max: 36 }), { nil: undefined }),
  });

  it('never leaves more than 36 months between dockings and hits each 5-year renewal anniversary', () => {
    fc.assert(
      fc.property(arb, (a) => {
        const lastDocking = new Date(Date.UTC(2000, 0, 1) + a.lastDay * DAY_MS + a.lastHourMs);
        const lastRenewalSurvey =
          a.renewalBeforeDays === undefined ? undefined : new Date(Date.UTC(2000, 0, 1) + (a.lastDay - a.renewalBeforeDays) * DAY_MS);
        const out = proposeNextDockings({ lastDocking, lastRenewalSurvey, horizonYears: a.horizonYears, intervalMonths: a.intervalMonths });
        const end = addMonthsUTC(lastDocking, a.horizonYears * 12);

        // 36 months apart at most, counted from the last docking; in order; within the horizon
        let prev = lastDocking;
        for (const d of out) {
          expect(Math.floor(d.date.getTime() / DAY_MS)).toBeGreaterThan(Math.floor(prev.getTime() / DAY_MS)); // strictly later day
          expect(d.date.getTime()).toBeLessThanOrEqual(addMonthsUTC(prev, 36).getTime());
          expect(d.date.getTime()).toBeLessThanOrEqual(end.getTime());
          prev = d.date;
        }
        // the horizon is covered: the last proposal is within one interval of its end
        const interval = a.intervalMonths ?? 30;
        expect(addMonthsUTC(prev, interval).getTime()).toBeGreaterThan(end.getTime() - DAY_MS);

        // each anniversary after the last docking and within the horizon is a renewal survey that day
        const renewals = out.filter((d) => d.kind === 'renewal-survey').map((d) => d.date.getTime());
        const expected: number[] = [];
        if (lastRenewalSurvey) {
          for (let k = 1; k < 40; k++) {
            const ann = addMonthsUTC(lastRenewalSurvey, 60 * k);
            const annDay = Math.floor(ann.getTime() / DAY_MS);
            if (annDay > Math.floor(lastDocking.getTime() / DAY_MS) && ann.getTime() <= end.getTime()) expected.push(annDay * DAY_MS);
          }
        }
        expect(renewals).toEqual(expected);

        // two bottom inspections in each five-year period: an intermediate between consecutive renewal surveys
        for (let i = 1; i < renewals.length; i++) {
          expect(out.some((d) => d.kind === 'intermediate' && d.date.getTime() > renewals[i - 1] && d.date.getTime() < renewals[i])).toBe(true);
        }
      }),
      { numRuns: 500 },
    );
  });

  it(`${MAX_DOCKING_GAP_DAYS} days never exceed 36 calendar months from any start`, () => {
    // The constant the gap split relies on: three calendar years hold 1,095 or 1,096 days.
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 40_000 }), (day) => {
        const d = new Date(Date.UTC(1990, 0, 1) + day * DAY_MS);
        expect(addMonthsUTC(d, 36).getTime() - d.getTime()).toBeGreaterThanOrEqual(MAX_DOCKING_GAP_DAYS * DAY_MS);
      }),
      { numRuns: 500 },
    );
  });
});
