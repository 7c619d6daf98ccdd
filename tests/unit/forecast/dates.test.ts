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
