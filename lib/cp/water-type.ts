import type { WaterType } from './types';
import { nonNegative, positive } from './validate';

/**
 * Salinity limits between fresh, brackish and seawater, PSU: common practice (Venice system
 * classification, 1958): fresh (limnetic) below 0.5; brackish from 0.5 (oligo-, meso- and
 * polyhaline) to below 30; seawater (euhaline and above) from 30.
 */
export const WATER_TYPE_SALINITY_LIMITS_PSU = { freshBelow: 0.5, seawaterFrom: 30 } as const;

/** Water type from salinity, PSU: fresh < 0.5 <= brackish < 30 <= seawater (Venice system, common practice). */
export function waterTypeFromSalinity(psu: number): Exclude<WaterType, 'sediment'> {
  const s = nonNegative(psu, 'salinityPsu', 'PSU');
  if (s < WATER_TYPE_SALINITY_LIMITS_PSU.freshBelow) return 'fresh';
  return s < WATER_TYPE_SALINITY_LIMITS_PSU.seawaterFrom ? 'brackish' : 'seawater';
}

/**
 * S = 1.80655 Cl: salinity per unit chlorinity (the 1969 UNESCO relation that replaced
 * Knudsen's S = 0.030 + 1.805 Cl, kept by PSS-78 for standard seawater; from memory).
 */
export const SALINITY_PER_CHLORINITY = 1.80655;

/** Chlorinity of seawater or seawater diluted with fresh water, g/kg, from its salinity, PSU (S = 1.80655 Cl). */
export function chlorinityGPerKg(salinityPsu: number): number {
  return positive(salinityPsu, 'salinityPsu', 'PSU') / SALINITY_PER_CHLORINITY;
}
