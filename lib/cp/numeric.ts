/** Hours in a design year as used by the DNV-RP-B401 (2010) mass equation. */
export const HOURS_PER_YEAR = 8760;

/** Relative tolerance below which a ratio counts as a whole number (float noise). */
const WHOLE_TOLERANCE = 1e-9;

/**
 * Smallest whole count >= x, ignoring float noise: 13.0000000001 gives 13, not 14,
 * because 35.25/0.47 and the like land a hair above the integer in binary.
 */
export function ceilCount(x: number): number {
  const nearest = Math.round(x);
  if (Math.abs(x - nearest) <= WHOLE_TOLERANCE * Math.max(1, Math.abs(x))) return nearest;
  return Math.ceil(x);
}
