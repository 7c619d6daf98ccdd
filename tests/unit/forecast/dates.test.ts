import { afterEach, describe, expect, it } from 'vitest';
import { MS_PER_YEAR, addMonthsUTC, addYears8760 } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import { utc } from './helpers';

describe('addMonthsUTC', () => {
  it('clamps to the end of a shorter month', () => {
    expect(addMonthsUTC(utc('2024-01-31'), 1)).toEqual(utc('2024-02-29')); // leap year
    expect(addMonthsUTC(utc('2025-01-31'), 1)).toEqual(utc('2025-02-28'));
    expect(addMonthsUTC(utc('2025-08-31'), -6)).toEqual(utc('2025-02-28'));
  });

  it('crosses years both ways and keeps the time of day', () => {
    expect(addMonthsUTC(utc('2025-11-15T13:45:00Z'), 3)).toEqual(utc('2026-02-15T13:45:00Z'));
    expect(addMonthsUTC(utc('2025-02-15'), -14)).toEqual(utc('2023-12-15'));
    expect(addMonthsUTC(utc('2025-02-15'), 60)).toEqual(utc('2030-02-15'));
  });

  describe('in a far-off host time zone', () => {
    const saved = process.env.TZ;
    afterEach(() => {
      if (saved === undefined) delete process.env.TZ;
      else process.env.TZ = saved;
    });

    it('gives the same UTC result', () => {
      // 2025-03-31T23:30Z is already 1 April in Auckland: local arithmetic would land on 1 May
      process.env.TZ = 'Pacific/Auckland';
      expect(addMonthsUTC(utc('2025-03-31T23:30:00Z'), 1)).toEqual(utc('2025-04-30T23:30:00Z'));
    });
  });
});

describe('8760-hour years', () => {
  it('one consumption year is 365 days', () => {
    expect(MS_PER_YEAR).toBe(365 * 86_400_000);
    expect(toDateOnly(addYears8760(utc('2023-03-01'), 1))).toBe('2024-02-29');
  });
});

describe('addMonthsUTC in integer arithmetic', () => {
  /** The month addition through the Date's UTC fields, as addMonthsUTC was first written. */
  function throughDateFields(d: Date, months: number): number {
    const m = d.getUTCMonth() + months;
    const year = d.getUTCFullYear() + Math.floor(m / 12);
    const month = ((m % 12) + 12) % 12;
    const day = Math.min(d.getUTCDate(), new Date(Date.UTC(year, month + 1, 0)).getUTCDate());
    return Date.UTC(year, month, day, d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds(), d.getUTCMilliseconds());
  }

  it('agrees with the Date fields on every day from 1890 to 2110, leap days and month ends included', () => {
    const from = Date.UTC(1890, 0, 1) / 86_400_000;
    const to = Date.UTC(2110, 0, 1) / 86_400_000;
    let differences = 0;
    for (let day = from; day < to; day++) {
      const t = day * 86_400_000 + ((day * 7919) % 86_400_000); // a different time of day each day
      for (const months of [-121, -13, -6, -1, 1, 6, 13, 30, 121]) {
        if (!Object.is(addMonthsUTC(new Date(t), months).getTime(), throughDateFields(new Date(t), months))) differences++;
      }
    }
    expect(differences).toBe(0);
  });

  it('agrees where it hands over to the Date fields: years 0-99, the ends of the Date range, fractional months', () => {
    const cases: [string, number][] = [
      ['0100-03-31T12:00:00Z', -1],
      ['0101-01-31T00:00:00Z', -13],
      ['0099-12-31T00:00:00Z', 2],
      ['-000400-02-29T00:00:00Z', 12],
      ['+275000-06-30T00:00:00Z', 6],
      ['+275760-08-13T00:00:00Z', 1],
      ['-271821-04-20T00:00:00Z', -1],
      ['2025-01-31T00:00:00Z', 1.5],
    ];
    for (const [iso, months] of cases) {
      const d = new Date(iso);
      expect(addMonthsUTC(d, months).getTime(), `${iso} + ${months}`).toEqual(throughDateFields(d, months));
    }
  });
});
