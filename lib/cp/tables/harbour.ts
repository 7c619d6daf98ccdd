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
