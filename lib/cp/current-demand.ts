import { BARE_FACTORS, breakdownFactors } from './coating-breakdown';
import type { BreakdownFactors, Coating, CurrentDensity, CurrentsA } from './types';
import { CpInputError } from './errors';
import { assertFiniteResult, nonNegative, positive, record, show } from './validate';

export interface SurfaceDemandInput {
  areaM2: number;
  /** Bare-metal design current densities, A/m2. */
  currentDensity: CurrentDensity;
  coating: Coating;
  designLifeYears: number;
}

/** Ic = Ac * fc * ic for the initial, mean and final condition. */
export function surfaceCurrentDemand(input: SurfaceDemandInput): CurrentsA {
  const r = record(input, 'input');
  const tf = positive(r.designLifeYears, 'designLifeYears', 'years');
  const { initialA, meanA, finalA } = surfaceDemandDetail(validateSurfaceDemand(r, ''), tf);
  return assertFiniteResult({ initialA, meanA, finalA }, 'areaM2');
}

export interface CheckedSurfaceDemand {
  areaM2: number;
  currentDensity: CurrentDensity;
  coating: Coating;
}

/** Validates area, densities and coating of one surface; `prefix` gives the field path. */
export function validateSurfaceDemand(r: Record<string, unknown>, prefix: string): CheckedSurfaceDemand {
  const f = (name: string) => `${prefix}${name}`;
  const areaM2 = nonNegative(r.areaM2, f('areaM2'), 'm2');
  const cd = record(r.currentDensity, f('currentDensity'));
  const currentDensity = {
    initial: nonNegative(cd.initial, f('currentDensity.initial'), 'A/m2'),
    mean: nonNegative(cd.mean, f('currentDensity.mean'), 'A/m2'),
    final: nonNegative(cd.final, f('currentDensity.final'), 'A/m2'),
  };
  return { areaM2, currentDensity, coating: validateCoating(r.coating, f('coating')) };
}

function validateCoating(value: unknown, field: string): Coating {
  if (value === 'bare') return 'bare';
  if (typeof value !== 'object' || value === null) {
    throw new CpInputError(field, `${field} must be 'bare' or coating constants { a, b } (got ${show(value)}).`);
  }
  const c = value as Record<string, unknown>;
  return { a: nonNegative(c.a, `${field}.a`), b: nonNegative(c.b, `${field}.b`) };
}

export interface SurfaceDemandDetail extends CurrentsA {
  breakdown: BreakdownFactors;
}

/** Unchecked demand of a validated surface. */
export function surfaceDemandDetail(s: CheckedSurfaceDemand, tf: number): SurfaceDemandDetail {
  const fc = s.coating === 'bare' ? BARE_FACTORS : breakdownFactors(s.coating.a, s.coating.b, tf);
  return {
    breakdown: { ...fc },
    initialA: s.areaM2 * fc.initial * s.currentDensity.initial, // DNV-RP-B401 (2010) sec. 7, Ic = Ac*fc*ic
    meanA: s.areaM2 * fc.mean * s.currentDensity.mean, // DNV-RP-B401 (2010) sec. 7, Ic = Ac*fc*ic
    finalA: s.areaM2 * fc.final * s.currentDensity.final, // DNV-RP-B401 (2010) sec. 7, Ic = Ac*fc*ic
  };
}
