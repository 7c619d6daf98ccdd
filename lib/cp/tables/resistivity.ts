import { DNV_RP_B401 } from '../basis';
import type { Climate, SourceNote } from '../types';

// DNV-RP-B401 (2010) default seawater resistivity by climate, ohm m, from memory
export const SEAWATER_RESISTIVITY_OHM_M: Readonly<Record<Climate, number>> = {
  tropical: 0.15,
  'sub-tropical': 0.2,
  temperate: 0.25,
  arctic: 0.3,
};

/**
 * Seabed sediment, ohm m. The basis gives about 1.0-1.5 (memory); the upper end is
 * taken because a higher resistivity lowers anode output (conservative).
 */
export const SEDIMENT_RESISTIVITY_OHM_M = 1.5;

export const RESISTIVITY_SOURCE: SourceNote = {
  source: DNV_RP_B401,
  flag: 'memory',
  note: 'Brackish and fresh water are far more resistive: use a measured value.',
};
