import { validateShape } from './anode-shape';
import { isLongFlushValid } from './lookups';
import type { AnodeShape, LongFlushShape, McCoyShape, ResistanceFormula, SlenderStandoffShape } from './types';
import { assertFiniteResult, positive, record } from './validate';

/** Stand-off at and above which the slender formulas hold, m (El-Reedy (2012) ch. 6). */
export const FULL_STANDOFF_M = 0.3;
/** Lower end of the corrected stand-off range, m (El-Reedy (2012) ch. 6). */
export const MIN_CORRECTED_STANDOFF_M = 0.15;
/** Resistance multiplier for stand-off 0.15 to 0.30 m (El-Reedy (2012) ch. 6). */
export const STANDOFF_FACTOR = 1.3;

/**
 * How the shape was treated: as given, a slender anode closer than 0.15 m taken as
 * flush-mounted, or a "long flush" plate too short for its formula taken as short flush.
 */
export type ResistanceTreatment = 'as-given' | 'near-flush-slender' | 'short-flush-fallback';

export interface ResistanceDetail {
  ohm: number;
  formula: ResistanceFormula;
  standoffFactor: number;
  treatment: ResistanceTreatment;
}

export interface AnodeResistanceInput {
  shape: AnodeShape;
  resistivityOhmM: number;
}

/** Anode-to-electrolyte resistance, ohm, from the formula that fits the shape. */
export function anodeResistanceOhm(input: AnodeResistanceInput): number {
  return anodeResistanceDetail(input).ohm;
}

/** As anodeResistanceOhm, also saying which formula and correction were used. */
export function anodeResistanceDetail(input: AnodeResistanceInput): ResistanceDetail {
  const r = record(input, 'input');
  const rho = positive(r.resistivityOhmM, 'resistivityOhmM', 'ohm m');
  const detail = resistanceOf(validateShape(r.shape, 'shape'), rho);
  if (!(detail.ohm > 0) || !Number.isFinite(detail.ohm)) assertFiniteResult(Number.NaN, 'shape');
  return detail;
}

/** Unchecked core for a validated shape. */
export function resistanceOf(shape: AnodeShape, rho: number): ResistanceDetail {
  switch (shape.kind) {
    case 'slender-standoff':
      return slenderDetail(shape, rho);
    case 'long-flush':
      return longFlushDetail(shape, rho);
    default:
      return mcCoyDetail(shape, rho);
  }
}

export function modifiedDwightOhm(rho: number, lengthM: number, radiusM: number): number {
  return (rho / (2 * Math.PI * lengthM)) * (Math.log((4 * lengthM) / radiusM) - 1); // DNV-RP-B401 (2010) Table 10-7, modified Dwight
}

export function shortSlenderOhm(rho: number, lengthM: number, radiusM: number): number {
  const x = radiusM / (2 * lengthM);
  const root = Math.sqrt(1 + x * x);
  // DNV-RP-B401 (2010) Table 10-7, short slender stand-off (L < 4r), from memory:
  // rho/(2 pi L) [ln((2L/r)(1 + root)) + r/2L - root], written as asinh(1/x) - 1/(x + root)
  // (the same value) so that very short, fat anodes do not lose it to cancellation.
  return (rho / (2 * Math.PI * lengthM)) * (Math.asinh(1 / x) - 1 / (x + root));
}

export function longFlushOhm(rho: number, lengthM: number, widthM: number): number {
  const s = (lengthM + widthM) / 2;
  return rho / (2 * s); // DNV-RP-B401 (2010) Table 10-7, long flush Ra = rho/(2S), S = (L+W)/2
}

export function mcCoyOhm(rho: number, exposedAreaM2: number): number {
  return (0.315 * rho) / Math.sqrt(exposedAreaM2); // DNV-RP-B401 (2010) Table 10-7, McCoy
}

/** Equivalent radius of a non-round slender anode from its cross-section perimeter (r = c/(2*pi)). */
export function equivalentRadiusM(perimeterM: number): number {
  return positive(perimeterM, 'perimeterM', 'm') / (2 * Math.PI); // DNV-RP-B401 (2010) Table 10-7 note, from memory
}

function slenderFormula(rho: number, lengthM: number, radiusM: number): { ohm: number; formula: ResistanceFormula } {
  return lengthM >= 4 * radiusM
    ? { ohm: modifiedDwightOhm(rho, lengthM, radiusM), formula: 'modified-dwight' }
    : { ohm: shortSlenderOhm(rho, lengthM, radiusM), formula: 'short-slender' };
}

function flushFormula(rho: number, lengthM: number, widthM: number, thicknessM?: number) {
  return isLongFlushValid(lengthM, widthM, thicknessM)
    ? { ohm: longFlushOhm(rho, lengthM, widthM), formula: 'long-flush' as const }
    : { ohm: mcCoyOhm(rho, lengthM * widthM), formula: 'mccoy' as const };
}

/**
 * Slender stand-off. At or above 0.30 m (or not stated) the formula as is; 0.15-0.30 m
 * times 1.3. Below 0.15 m the formulas do not hold and the anode lies almost on the
 * steel: it is treated as a flush plate as wide as its diameter (long flush, or McCoy on
 * the projected area L x 2r), and never less than the 1.3-corrected slender value, so a
 * smaller gap can only raise the resistance (conservative).
 */
function slenderDetail(shape: SlenderStandoffShape, rho: number): ResistanceDetail {
  const base = slenderFormula(rho, shape.lengthM, shape.radiusM);
  const standoff = shape.standoffM ?? FULL_STANDOFF_M;
  if (standoff >= FULL_STANDOFF_M) return { ...base, standoffFactor: 1, treatment: 'as-given' };
  const corrected = base.ohm * STANDOFF_FACTOR; // El-Reedy (2012) ch. 6, stand-off 0.15-0.30 m
  if (standoff >= MIN_CORRECTED_STANDOFF_M) {
    return { ohm: corrected, formula: base.formula, standoffFactor: STANDOFF_FACTOR, treatment: 'as-given' };
  }
  const flush = flushFormula(rho, shape.lengthM, 2 * shape.radiusM);
  return flush.ohm > corrected
    ? { ...flush, standoffFactor: 1, treatment: 'near-flush-slender' }
    : { ohm: corrected, formula: base.formula, standoffFactor: STANDOFF_FACTOR, treatment: 'near-flush-slender' };
}

/** Long flush; a plate shorter than 4 x width (or thickness) is a short flush plate: McCoy on L x W. */
function longFlushDetail(shape: LongFlushShape, rho: number): ResistanceDetail {
  const f = flushFormula(rho, shape.lengthM, shape.widthM, shape.thicknessM);
  return { ...f, standoffFactor: 1, treatment: f.formula === 'long-flush' ? 'as-given' : 'short-flush-fallback' };
}

function mcCoyDetail(shape: McCoyShape, rho: number): ResistanceDetail {
  return { ohm: mcCoyOhm(rho, shape.exposedAreaM2), formula: 'mccoy', standoffFactor: 1, treatment: 'as-given' };
}
