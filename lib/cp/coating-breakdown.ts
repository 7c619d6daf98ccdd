import type { BreakdownFactors, CoatingConstants } from './types';
import { nonNegative, positive } from './validate';

export interface CoatingBreakdownInput extends CoatingConstants {
  designLifeYears: number;
}

/** fc = a + b*t at the start, mean and end of the design life, each capped at 1. */
export function coatingBreakdown(input: CoatingBreakdownInput): BreakdownFactors {
  const a = nonNegative(input?.a, 'a');
  const b = nonNegative(input?.b, 'b');
  const tf = positive(input?.designLifeYears, 'designLifeYears', 'years');
  return breakdownFactors(a, b, tf);
}

/** Unchecked core of coatingBreakdown, for callers that validated already. */
export function breakdownFactors(a: number, b: number, tf: number): BreakdownFactors {
  return {
    initial: Math.min(1, a), // DNV-RP-B401 (2010) coating breakdown, fci = a
    mean: Math.min(1, a + (b * tf) / 2), // DNV-RP-B401 (2010) coating breakdown, fcm = a + b*tf/2
    final: Math.min(1, a + b * tf), // DNV-RP-B401 (2010) coating breakdown, fcf = a + b*tf
  };
}

export const BARE_FACTORS: BreakdownFactors = Object.freeze({ initial: 1, mean: 1, final: 1 });
