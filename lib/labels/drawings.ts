import type { HullEnd, HullSide, TidalDatum } from '@/lib/schemas/anode-position';

/** The side of a hull a group is on. */
export const HULL_SIDE_LABELS: Record<HullSide, string> = {
  port: 'port',
  starboard: 'starboard',
  both: 'port and starboard',
  centre: 'centre line',
};
/** Which end of a hull. */
export const HULL_END_LABELS: Record<HullEnd, string> = { fore: 'forward', aft: 'aft' };
/** Tidal datums, with the abbreviation a diver's sheet uses. */
export const TIDAL_DATUM_LABELS: Record<TidalDatum, string> = {
  LAT: 'lowest astronomical tide (LAT)',
  CD: 'chart datum (CD)',
  MLWS: 'mean low water springs (MLWS)',
  MLLW: 'mean lower low water (MLLW)',
  MLW: 'mean low water (MLW)',
  MSL: 'mean sea level (MSL)',
  LW: 'low water',
};
/** The two views of a hull drawing. */
export const HULL_VIEW_LABELS: Record<'port' | 'starboard', string> = { port: 'Port side', starboard: 'Starboard side' };
/** Where a particular used by a drawing comes from (the product's convention for values the user did not give). */
export const PARTICULAR_SOURCE_LABELS: Record<'entered' | 'estimate', string> = { entered: 'entered', estimate: 'estimated' };
