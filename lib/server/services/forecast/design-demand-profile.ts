import type { DemandProfile } from '@/lib/forecast';
import type { DesignRecord } from '@/lib/schemas/design-record';

type Breakdown = { initial: number; final: number };

/**
 * A group's demand profile (lib/forecast/demand-profile.ts) from its design's stored record: linear
 * from startA at installation to endA at the design life, its mean the group's share of the design's
 * mean current (the current its mass was sized on). Pure.
 *
 * Shape: the coating breakdown factors of the group's zone in the record (fc = a + b*t, DNV-RP-B401,
 * published). With fcm = (fci + fcf) / 2, the mean of the straight line,
 *   startA = meanShareA x fci / fcm,   endA = meanShareA x fcf / fcm,   overYears = design life.
 * For an uncapped breakdown fcm is the record's own mean factor (a + b*tf/2), so this is
 * meanShareA x fci / fcm and meanShareA x fcf / fcm of the record. Where the record capped the final
 * factor at 1 its mean factor is above the line's mean; dividing by the line's mean keeps the
 * profile's mean at meanShareA, so the forecast never consumes less than the mass was sized for.
 * The design's initial and final currents are NOT used: they take the initial and final current
 * densities, above the mean one, and a profile between them would average more than the sizing current.
 *
 * Bare steel (fc = 1 throughout, also ship-hull practice) gives a flat profile. A group whose zone is
 * not in the record takes the design's overall shape: each surface's shape weighted by its mean demand.
 * Null when the record has no results, or no positive design life or mean share.
 */
export function designDemandProfile(record: Pick<DesignRecord, 'inputs' | 'results'>, zoneName: string | null, meanShareA: number): DemandProfile | null {
  const { results } = record;
  const overYears = record.inputs.designLifeYears;
  if (!results || !(overYears > 0) || !(meanShareA > 0) || !Number.isFinite(meanShareA)) return null;
  const zone = zoneName === null ? undefined : results.surfaces.find((s) => s.name === zoneName);
  const shape = zone ? shapeOf(zone.breakdown) : overallShape(results.surfaces);
  return { startA: meanShareA * shape.start, endA: meanShareA * shape.end, overYears };
}

/** Start and end as multiples of the line's mean (their mean is 1); flat without a breakdown to follow. */
function shapeOf(b: Breakdown): { start: number; end: number } {
  const mean = (b.initial + b.final) / 2;
  if (!(mean > 0) || !Number.isFinite(mean)) return { start: 1, end: 1 };
  return { start: b.initial / mean, end: b.final / mean };
}

/** The design's shape as a whole: the surfaces' shapes weighted by their mean demand (mean still 1). */
function overallShape(surfaces: readonly { meanA: number; breakdown: Breakdown }[]): { start: number; end: number } {
  let weight = 0;
  let start = 0;
  let end = 0;
  for (const s of surfaces) {
    if (!(s.meanA > 0)) continue;
    const shape = shapeOf(s.breakdown);
    weight += s.meanA;
    start += s.meanA * shape.start;
    end += s.meanA * shape.end;
  }
  return weight > 0 ? { start: start / weight, end: end / weight } : { start: 1, end: 1 };
}
