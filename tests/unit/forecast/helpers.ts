import { expect } from 'vitest';
import { ForecastInputError } from '@/lib/forecast';

export const DAY_MS = 86_400_000;
export const HOUR_MS = 3_600_000;

/** A UTC date from an ISO string (a bare day means midnight UTC). */
export const utc = (iso: string): Date => new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);

/** Asserts two instants agree within tolMs (default one second: float rounding of hours). */
export function expectInstant(actual: Date | null | undefined, expected: Date | string, tolMs = 1000): void {
  expect(actual, 'a date was expected').toBeInstanceOf(Date);
  const want = typeof expected === 'string' ? utc(expected) : expected;
  const diff = Math.abs((actual as Date).getTime() - want.getTime());
  expect(diff, `${(actual as Date).toISOString()} vs ${want.toISOString()}`).toBeLessThanOrEqual(tolMs);
}

/** Runs fn and returns the ForecastInputError's field, or fails the test. */
export function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ForecastInputError);
    return (e as ForecastInputError).field;
  }
  throw new Error('expected a ForecastInputError, nothing was thrown');
}
