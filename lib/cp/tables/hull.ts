import { basis } from '../basis';
import { milliampsPerM2 } from '../units';
import type { Flag } from '../types';

export interface HullDensity {
  minAPerM2: number;
  maxAPerM2: number;
  source: string;
  flag: Flag;
}

const range = (minMA: number, maxMA: number, source: string, flag: Flag): HullDensity => ({
  minAPerM2: milliampsPerM2(minMA),
  maxAPerM2: milliampsPerM2(maxMA),
  source,
  flag,
});

/** Current densities of ship hulls and their fittings, A/m2 (already for the coated state: use fc = 1). */
export const HULL_CURRENT_DENSITY = {
  'coated-hull-good-paint': range(15, 20, 'common practice', 'practice'),
  'coated-hull-old': range(30, 30, 'common practice', 'practice'),
  'coated-hull-excellent-yearly-docking': range(4.5, 4.5, basis.shipHullGuide, 'published'),
  'copper-alloy-propeller': range(450, 500, basis.shipHullGuide, 'published'),
  'copper-alloy-propeller-redesign': range(350, 350, 'published redesign (design basis)', 'published'),
  'stainless-shaft': range(100, 120, basis.shipHullGuide, 'published'),
} as const satisfies Record<string, HullDensity>;

/** Allowance added to the coated-hull demand, as a fraction (common practice: about 10 %). */
export const HULL_DEMAND_ALLOWANCE = 0.1;
