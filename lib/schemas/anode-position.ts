import { z } from 'zod';
import { multilineText, text } from './text';

/*
 * Where an anode group sits, as data: on a hull by frames, side, height above the keel and the part of the hull;
 * on a structure by pile (bent number and row letter) and depth below a tidal datum. Every field may be unknown
 * (null); what the parser could not read stays in `note`. Stored as jsonb on anode_group.position, parsed here on
 * the way in and on the way out. SI units: metres.
 */

export const HULL_SIDES = ['port', 'starboard', 'both', 'centre'] as const;
export type HullSide = (typeof HULL_SIDES)[number];

/** The parts of a hull a group can be on (the zone kinds of a hull). */
export const HULL_PLACES = ['hull-bottom', 'boot-top-sides', 'rudder', 'propeller-shaft', 'sea-chest', 'thruster-tunnel'] as const;
export type HullPlace = (typeof HULL_PLACES)[number];

export const HULL_ENDS = ['fore', 'aft'] as const;
export type HullEnd = (typeof HULL_ENDS)[number];

/** Tidal datums a depth is given against. */
export const TIDAL_DATUMS = ['LAT', 'CD', 'MLWS', 'MLLW', 'MLW', 'MSL', 'LW'] as const;
export type TidalDatum = (typeof TIDAL_DATUMS)[number];

const metres = (min: number, max: number) => z.number().finite().min(min).max(max);

export const pileRefSchema = z.object({
  /** Bent (the line of piles across the structure), numbered from 1. */
  bent: z.number().int().min(1).max(999).nullable(),
  /** Row (the line of piles along the structure), a letter. */
  row: text().regex(/^[A-Z]{1,2}$/).nullable(),
});
export type PileRef = z.infer<typeof pileRefSchema>;

export const anodePositionSchema = z.object({
  frameFrom: z.number().int().min(-50).max(2000).nullable(),
  frameTo: z.number().int().min(-50).max(2000).nullable(),
  side: z.enum(HULL_SIDES).nullable(),
  heightAboveKeelM: metres(0, 60).nullable(),
  place: z.enum(HULL_PLACES).nullable(),
  end: z.enum(HULL_ENDS).nullable(),
  pileFrom: pileRefSchema.nullable(),
  pileTo: pileRefSchema.nullable(),
  /** Depth below the datum, m (negative: above it). */
  depthBelowDatumM: metres(-30, 300).nullable(),
  datum: z.enum(TIDAL_DATUMS).nullable(),
  /** What the position text says that is not in the fields above. */
  note: multilineText().max(2000).nullable(),
});
export type AnodePosition = z.infer<typeof anodePositionSchema>;

export const EMPTY_POSITION: AnodePosition = {
  frameFrom: null,
  frameTo: null,
  side: null,
  heightAboveKeelM: null,
  place: null,
  end: null,
  pileFrom: null,
  pileTo: null,
  depthBelowDatumM: null,
  datum: null,
  note: null,
};

/** True when the position places the group on a hull drawing (frames or a part of the hull). */
export const isHullPosition = (p: AnodePosition) => p.frameFrom !== null || p.place !== null;
/** True when the position names at least one pile (bent or row). */
export const isPilePosition = (p: AnodePosition) => p.pileFrom !== null;
