import { DNV_RP_B401, basis } from '../basis';
import type { Climate, CurrentDensity, DepthBand, SourceNote } from '../types';

const row = (initial: number, final: number, mean: number): CurrentDensity => ({ initial, mean, final });

/**
 * Design current densities for bare steel in seawater, A/m2, by depth band and climate.
 * Climate by surface water temperature: tropical > 20 C, sub-tropical 12-20 C,
 * temperate 7-11 C, arctic < 7 C.
 */
export const BARE_STEEL_CURRENT_DENSITY: Readonly<Record<DepthBand, Readonly<Record<Climate, CurrentDensity>>>> = {
  // DNV-RP-B401 (2010) Tables 10-1 (initial/final) and 10-2 (mean), from memory
  '0-30': { tropical: row(0.15, 0.09, 0.07), 'sub-tropical': row(0.17, 0.11, 0.08), temperate: row(0.2, 0.13, 0.1), arctic: row(0.25, 0.17, 0.12) },
  '30-100': { tropical: row(0.12, 0.08, 0.06), 'sub-tropical': row(0.14, 0.09, 0.07), temperate: row(0.17, 0.11, 0.08), arctic: row(0.2, 0.13, 0.1) },
  '100-300': { tropical: row(0.14, 0.09, 0.07), 'sub-tropical': row(0.16, 0.11, 0.08), temperate: row(0.19, 0.14, 0.09), arctic: row(0.22, 0.17, 0.11) },
  '300+': { tropical: row(0.18, 0.13, 0.09), 'sub-tropical': row(0.2, 0.15, 0.1), temperate: row(0.22, 0.17, 0.11), arctic: row(0.22, 0.17, 0.11) },
};

export const BARE_STEEL_CURRENT_DENSITY_SOURCE: SourceNote = {
  source: `${DNV_RP_B401} Tables 10-1 and 10-2`,
  flag: 'memory',
};

/** Steel buried in seabed sediment, A/m2 (DNV-RP-B401 (2010), from memory). */
export const SEDIMENT_CURRENT_DENSITY: CurrentDensity = { initial: 0.02, mean: 0.02, final: 0.02 };

export const SEDIMENT_CURRENT_DENSITY_SOURCE: SourceNote = { source: DNV_RP_B401, flag: 'memory' };

/**
 * Regional cross-check, A/m2 (Lloyd's Register offshore-unit rules Table 4.1.1, published).
 * Not used by the design; shown beside the DNV value so an engineer can compare.
 */
export const REGIONAL_CURRENT_DENSITY_CHECK = {
  'north-sea-north-of-62n': row(0.22, 0.13, 0.1),
  'north-sea-55-62n': row(0.18, 0.12, 0.09),
  'north-sea-south-of-55n': row(0.15, 0.1, 0.08),
  'arabian-gulf-india-brazil-west-africa': row(0.13, 0.09, 0.07),
  'mediterranean-gulf-of-mexico': row(0.11, 0.08, 0.06),
  mud: row(0.025, 0.02, 0.02),
} as const satisfies Record<string, CurrentDensity>;

export const REGIONAL_CURRENT_DENSITY_CHECK_SOURCE: SourceNote = { source: basis.regionalCrossCheck, flag: 'published' };
