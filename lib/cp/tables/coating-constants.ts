import { DNV_RP_B401 } from '../basis';
import type { CoatingConstants, SourceNote } from '../types';

/** Coating categories: I about 50 um, II 150-250 um, III at least 300 um dry film. */
export type CoatingCategory = 'I' | 'II' | 'III';

/** The coating table has only two depth bands. */
export type CoatingDepthBand = '0-30' | '>30';

// DNV-RP-B401 (2010) Table 10-4 (number from memory), constants a / b, from memory
export const COATING_CONSTANTS: Readonly<Record<CoatingDepthBand, Readonly<Record<CoatingCategory, CoatingConstants>>>> = {
  '0-30': { I: { a: 0.1, b: 0.1 }, II: { a: 0.05, b: 0.025 }, III: { a: 0.02, b: 0.012 } },
  '>30': { I: { a: 0.1, b: 0.05 }, II: { a: 0.05, b: 0.015 }, III: { a: 0.02, b: 0.008 } },
};

export const COATING_CONSTANTS_SOURCE: SourceNote = { source: `${DNV_RP_B401} Table 10-4`, flag: 'memory' };
