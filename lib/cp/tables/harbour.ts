import { basis } from '../basis';
import { milliampsPerFt2ToAPerM2, milliampsPerM2 } from '../units';
import type { Flag } from '../types';

export interface DensityRange {
  minAPerM2: number;
  maxAPerM2: number;
}

// MIL-HDBK-1004/10 Table 1 (published): bare steel, mA/m2 converted to A/m2
export const HARBOUR_BARE_STEEL_RANGES: Readonly<Record<string, DensityRange>> = {
  'still-seawater': { minAPerM2: milliampsPerM2(11), maxAPerM2: milliampsPerM2(32) },
  'moving-seawater': { minAPerM2: milliampsPerM2(32), maxAPerM2: milliampsPerM2(270) },
  'still-fresh-water': { minAPerM2: milliampsPerM2(22), maxAPerM2: milliampsPerM2(43) },
  'moving-fresh-water': { minAPerM2: milliampsPerM2(43), maxAPerM2: milliampsPerM2(65) },
};

export interface HarbourDesignValue {
  aPerM2: number;
  source: string;
  flag: Flag;
}

const mil = (mAPerFt2: number): HarbourDesignValue => ({
  aPerM2: milliampsPerFt2ToAPerM2(mAPerFt2),
  source: `${basis.harbourStructures}, worked examples`,
  flag: 'published',
});
const sheet = (mAPerM2: number): HarbourDesignValue => ({ aPerM2: milliampsPerM2(mAPerM2), source: 'project sheets', flag: 'practice' });

/** Design values used for harbour structures, A/m2. */
export const HARBOUR_DESIGN_VALUES = {
  'sheet-pile-water': mil(0.5),
  'sheet-pile-mud': mil(0.2),
  'sheet-pile-backfill': mil(0.05),
  'h-pile-water': mil(2),
  'h-pile-mud': mil(1),
  'project-a-water': sheet(35),
  'project-a-mud': sheet(15),
  'project-b-water': sheet(54),
  'project-b-mud': sheet(20),
} as const satisfies Record<string, HarbourDesignValue>;

/**
 * The harbour method's defaults for bare steel piles and sheet piling, A/m2. Immersed: 54 mA/m2 initial
 * (the higher project sheet), 35 mA/m2 mean and final; mud: 20 and 15 (project sheets, common practice).
 * Both lie inside MIL-HDBK-1004/10 Table 1's 11-270 mA/m2 for still to moving seawater (published).
 * Fresh water: 43 initial, 32 mean and final, inside the same table's 22-65 mA/m2 (practice).
 */
export const HARBOUR_PRACTICE_DENSITY = {
  'water-seawater': { initial: milliampsPerM2(54), mean: milliampsPerM2(35), final: milliampsPerM2(35) },
  'water-fresh': { initial: milliampsPerM2(43), mean: milliampsPerM2(32), final: milliampsPerM2(32) },
  mud: { initial: milliampsPerM2(20), mean: milliampsPerM2(15), final: milliampsPerM2(15) },
} as const;
