import { surfaceDemandDetail, validateSurfaceDemand } from './current-demand';
import { CpInputError } from './errors';
import type { CurrentsA } from './types';
import { assertFiniteResult, list, nonNegative, optional, positive, record, text } from './validate';

/**
 * Margin on the peak demand for the suggested rating (common practice, Tidewarden's
 * choice): coating damage between dockings, ageing anodes and reference drift.
 */
export const IMPRESSED_CURRENT_MARGIN = 0.25;

/** Ratings are rounded up to this step, A (presentation choice). */
export const IMPRESSED_CURRENT_RATING_STEP_A = 5;

export interface ImpressedCurrentInput {
  designLifeYears: number;
  surfaces: ReadonlyArray<{ name: string; areaM2: number; currentDensity: { initial: number; mean: number; final: number }; coating: { a: number; b: number } | 'bare' }>;
  /** Fraction added to the peak demand; default 0.25. */
  margin?: number;
}

export interface ImpressedCurrentSummary {
  current: CurrentsA;
  peakA: number;
  peakCondition: 'initial' | 'final';
  margin: number;
  suggestedRatingA: number;
  surfaces: Array<CurrentsA & { name: string }>;
  note: string;
}

/**
 * Output an impressed-current system must deliver over the design life, from the same
 * demand as an anode design, with a suggested rating. A summary, not a system design.
 */
export function impressedCurrentSummary(input: ImpressedCurrentInput): ImpressedCurrentSummary {
  const r = record(input, 'input');
  const tf = positive(r.designLifeYears, 'designLifeYears', 'years');
  const margin = optional(r.margin, (v) => nonNegative(v, 'margin')) ?? IMPRESSED_CURRENT_MARGIN;
  const surfaces = list(r.surfaces, 'surfaces').map((s, i) => {
    const row = record(s, `surfaces[${i}]`);
    const { initialA, meanA, finalA } = surfaceDemandDetail(validateSurfaceDemand(row, `surfaces[${i}].`), tf);
    return { name: text(row.name, `surfaces[${i}].name`), initialA, meanA, finalA };
  });
  const current = surfaces.reduce((t, s) => ({ initialA: t.initialA + s.initialA, meanA: t.meanA + s.meanA, finalA: t.finalA + s.finalA }), { initialA: 0, meanA: 0, finalA: 0 });
  const peakCondition = current.finalA > current.initialA ? 'final' : 'initial';
  const peakA = Math.max(current.initialA, current.finalA);
  if (!(peakA > 0)) throw new CpInputError('surfaces', 'The surfaces have no current demand.');
  const step = IMPRESSED_CURRENT_RATING_STEP_A;
  const suggestedRatingA = Math.ceil((peakA * (1 + margin)) / step - 1e-9) * step;
  return assertFiniteResult({
    current,
    peakA,
    peakCondition,
    margin,
    suggestedRatingA,
    surfaces,
    note: `Rating = peak demand x (1 + ${margin}) rounded up to ${step} A (common practice). The system's anodes, reference electrodes and dielectric shields are designed separately.`,
  }, 'surfaces');
}
