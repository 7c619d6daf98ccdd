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

export type HullCoatingCondition = 'new' | 'good' | 'fair' | 'poor';

/**
 * Design current density of a coated hull by the condition of its paint, mA/m2, for the coated area
 * (fc = 1): new and intact about 10, good 15, fair 20, poor or old hull about 30 (common practice, from
 * memory; the design basis's 15-20 good paint and about 30 old hull are published as practice).
 */
export const HULL_COATING_CONDITION_MA_PER_M2: Readonly<Record<HullCoatingCondition, number>> = { new: 10, good: 15, fair: 20, poor: 30 };

/** The next worse condition: rudders, sea chests and thruster tunnels see the highest flow (common practice). */
export const HIGH_FLOW_CONDITION: Readonly<Record<HullCoatingCondition, HullCoatingCondition>> = { new: 'good', good: 'fair', fair: 'poor', poor: 'poor' };

/** Above this service speed the hull needs more current (knots, from memory). */
export const HIGH_SPEED_KNOTS = 20;
/** Factor on coated-hull demand above that speed (about +25 %, from memory). */
export const HIGH_SPEED_FACTOR = 1.25;

/** Bare steel moving in seawater, A/m2: 150-250 mA/m2 and more with speed (from memory); initial at the top of the band. */
export const MOVING_BARE_STEEL_A_PER_M2 = { initial: 0.25, mean: 0.15, final: 0.15 } as const;
