import type { CoatingConstants } from '../types';

export type MetallicCoating = 'tsa' | 'tsz' | 'hdg';

/**
 * Breakdown constants assumed for sacrificial metallic coatings (fc = a + b*t). A thermally sprayed
 * aluminium or zinc layer, or hot-dip galvanising, protects a scratch itself and is slowly consumed,
 * so the steel's own demand starts low and rises as the layer is used up. No table in the design basis
 * gives these: they are Tidewarden's assumptions (common practice, to be set by the engineer).
 */
export const METALLIC_COATING_CONSTANTS: Readonly<Record<MetallicCoating, CoatingConstants>> = {
  tsa: { a: 0.02, b: 0.01 },
  tsz: { a: 0.05, b: 0.02 },
  hdg: { a: 0.05, b: 0.025 },
};
