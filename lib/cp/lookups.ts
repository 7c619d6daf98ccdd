import { CpInputError } from './errors';
import { COATING_CONSTANTS, type CoatingCategory, type CoatingDepthBand } from './tables/coating-constants';
import { BARE_STEEL_CURRENT_DENSITY, SEDIMENT_CURRENT_DENSITY } from './tables/current-density';
import { SEAWATER_RESISTIVITY_OHM_M, SEDIMENT_RESISTIVITY_OHM_M } from './tables/resistivity';
import { UTILISATION_FACTORS, type UtilisationCase } from './tables/utilisation';
import type { AnodeShape, Climate, CoatingConstants, CurrentDensity, DepthBand } from './types';
import { finite, nonNegative, oneOf } from './validate';

export const CLIMATES: readonly Climate[] = ['tropical', 'sub-tropical', 'temperate', 'arctic'];
export const DEPTH_BANDS: readonly DepthBand[] = ['0-30', '30-100', '100-300', '300+'];
const COATING_CATEGORIES: readonly CoatingCategory[] = ['I', 'II', 'III'];

/**
 * Design current density of bare steel for a climate and depth band, or of steel in
 * sediment (`depthBand: 'sediment'`, climate then irrelevant).
 */
export function currentDensityFor({ climate, depthBand }: { climate: Climate; depthBand: DepthBand | 'sediment' }): CurrentDensity {
  const band = oneOf(depthBand, [...DEPTH_BANDS, 'sediment'] as const, 'depthBand');
  if (band === 'sediment') return { ...SEDIMENT_CURRENT_DENSITY };
  return { ...BARE_STEEL_CURRENT_DENSITY[band][oneOf(climate, CLIMATES, 'climate')] };
}

/** Coating constants a, b; the coating table splits only at 30 m. */
export function coatingConstantsFor({ category, depthBand }: { category: CoatingCategory; depthBand: DepthBand }): CoatingConstants {
  const band = oneOf(depthBand, DEPTH_BANDS, 'depthBand');
  const coatingBand: CoatingDepthBand = band === '0-30' ? '0-30' : '>30';
  return { ...COATING_CONSTANTS[coatingBand][oneOf(category, COATING_CATEGORIES, 'category')] };
}

/** Default resistivity, ohm m, of seawater in a climate, or of seabed sediment. */
export function resistivityFor(climate: Climate | 'sediment'): number {
  const c = oneOf(climate, [...CLIMATES, 'sediment'] as const, 'climate');
  return c === 'sediment' ? SEDIMENT_RESISTIVITY_OHM_M : SEAWATER_RESISTIVITY_OHM_M[c];
}

/**
 * Climate band from surface water temperature: tropical > 20 C, sub-tropical 12-20 C,
 * temperate 7-11 C, arctic < 7 C. The table leaves 11-12 C open: it is taken as
 * temperate, and boundary values go to the colder band (higher current density).
 */
export function climateFromTemperature(temperatureC: number): Climate {
  const t = finite(temperatureC, 'temperatureC', 'degrees C');
  if (t > 20) return 'tropical';
  if (t >= 12) return 'sub-tropical';
  if (t >= 7) return 'temperate';
  return 'arctic';
}

/** Depth band of the current-density table for a water depth in metres. */
export function depthBandFromDepth(depthM: number): DepthBand {
  const d = nonNegative(depthM, 'depthM', 'm');
  if (d <= 30) return '0-30';
  if (d <= 100) return '30-100';
  if (d <= 300) return '100-300';
  return '300+';
}

/** Which row of the utilisation table an anode shape falls in. */
export function utilisationCaseOf(shape: AnodeShape): UtilisationCase {
  switch (shape.kind) {
    case 'slender-standoff':
      return shape.lengthM >= 4 * shape.radiusM ? 'long-slender-standoff' : 'short-slender-standoff';
    case 'long-flush':
      return isLongFlushValid(shape.lengthM, shape.widthM, shape.thicknessM) ? 'long-flush' : 'short-flush';
    case 'short-flush':
      return 'short-flush';
    case 'bracelet':
      return shape.segmented ? 'bracelet-segmented' : 'bracelet-half-shell';
    default:
      throw new CpInputError('shape.kind', 'shape.kind is not a known anode shape.');
  }
}

/** Table utilisation factor for an anode shape. */
export function utilisationFactorFor(shape: AnodeShape): number {
  return UTILISATION_FACTORS[utilisationCaseOf(shape)].factor;
}

/** Long-flush formula validity: length at least 4 x width and 4 x thickness. */
export function isLongFlushValid(lengthM: number, widthM: number, thicknessM?: number): boolean {
  return lengthM >= 4 * widthM && (thicknessM === undefined || lengthM >= 4 * thicknessM);
}
