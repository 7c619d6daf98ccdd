import { wettedSurfaceDennyMumford } from '@/lib/cp';
import type { DeskSurface } from '@/lib/schemas/design';

export interface VesselParticulars {
  lengthBppM?: number | null;
  beamM?: number | null;
  draughtM?: number | null;
  blockCoefficient?: number | null;
  vesselType?: string | null;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

/**
 * Block coefficient by vessel type where none is given (typical values, common practice, from memory):
 * fine fast craft about 0.45, tugs and ferries about 0.55-0.6, general cargo 0.7, bulk and tankers 0.8.
 */
export const DEFAULT_BLOCK_COEFFICIENT: ReadonlyArray<[RegExp, number]> = [
  [/\b(crew|pilot|patrol|fast|launch|catamaran)\b/i, 0.45],
  [/\b(tug|workboat|work boat)\b/i, 0.55],
  [/\b(ferry|ro-?ro|passenger)\b/i, 0.6],
  [/\b(offshore|supply|psv|ahts)\b/i, 0.65],
  [/\b(cargo|container|reefer)\b/i, 0.7],
  [/\b(bulk|bulker|tanker|ore)\b/i, 0.8],
];
/** For a type not in the list (common practice): a middling hull. */
export const FALLBACK_BLOCK_COEFFICIENT = 0.6;

export function defaultBlockCoefficient(vesselType: string | null | undefined): number {
  return DEFAULT_BLOCK_COEFFICIENT.find(([pattern]) => pattern.test(vesselType ?? ''))?.[1] ?? FALLBACK_BLOCK_COEFFICIENT;
}

/**
 * Starting zones for a hull from its particulars: bottom and sides from Denny-Mumford's wetted area
 * S = L(1.7T + CB*B), then the rudder, propeller and shaft and sea chests, which every hull has. The
 * split and the appendage areas are rules of thumb (common practice), each zone saying where its area
 * comes from. Without a block coefficient a default for the vessel type is used and said so; without
 * length, beam or draught the areas are placeholders, never presented as entered.
 */
export function defaultVesselZones(v: VesselParticulars): DeskSurface[] {
  const { lengthBppM: L, beamM: B, draughtM: T } = v;
  const cbGiven = Boolean(v.blockCoefficient);
  const CB = v.blockCoefficient || defaultBlockCoefficient(v.vesselType);
  if (!L || !B || !T) {
    return [
      zone('Hull bottom', 'hull-bottom', 1, 'placeholder', 'II'),
      zone('Boot-top and sides', 'boot-top-sides', 1, 'placeholder', 'II'),
      zone('Rudder', 'rudder', 1, 'placeholder', 'II'),
      { ...zone('Propeller and shaft', 'propeller-shaft', 1, 'placeholder', 'bare'), drainsCurrent: 'copper-alloy' },
      zone('Sea chests', 'sea-chest', 1, 'placeholder', 'II'),
    ];
  }
  const source = cbGiven ? 'denny-mumford' : 'denny-mumford-default-cb';
  const wetted = wettedSurfaceDennyMumford({ lengthM: L, beamM: B, draughtM: T, blockCoefficient: CB });
  const bottom = Math.min(wetted * 0.8, L * B * CB); // flat of bottom about L x B x CB (practice)
  const rudder = 2 * 0.018 * L * T; // rudder area about 1.8 % of L x T, both faces (practice)
  const propellerDiameter = 0.7 * T; // practice
  const propeller = 2 * 0.55 * ((Math.PI * propellerDiameter ** 2) / 4); // both faces, expanded-area ratio about 0.55 (practice)
  return [
    zone('Hull bottom', 'hull-bottom', round1(bottom), source, 'II'),
    zone('Boot-top and sides', 'boot-top-sides', round1(wetted - bottom), source, 'II'),
    zone('Rudder', 'rudder', round1(rudder), 'estimate', 'II'),
    { ...zone('Propeller and shaft', 'propeller-shaft', round1(propeller), 'estimate', 'bare'), drainsCurrent: 'copper-alloy' },
    zone('Sea chests', 'sea-chest', round1(Math.max(2, 0.02 * L)), 'estimate', 'II'),
  ];
}

export interface StructureParticulars {
  pileCount?: number | null;
  pileDiameterM?: number | null;
}

/** Starting zones for a piled structure: immersed and mud zones of the piles, 10 m of each assumed (to be replaced). */
export function defaultStructureZones(s: StructureParticulars): DeskSurface[] {
  const n = s.pileCount ?? 20;
  const d = s.pileDiameterM ?? 0.6;
  const perPile = Math.PI * d * 10;
  return [zone('Pile immersion zone', 'pile-immersed', round1(n * perPile), 'estimate', 'bare'), { ...zone('Pile mud zone', 'pile-mud', round1(n * perPile), 'estimate', 'bare'), depthBand: 'sediment' }];
}

function zone(name: string, kind: DeskSurface['kind'], areaM2: number, areaSource: string, coatingCategory: DeskSurface['coatingCategory']): DeskSurface {
  return { name, kind, areaM2, areaSource, depthBand: '0-30', coatingCategory, coatingAgeYears: 0, currentDensityOverride: null, drainsCurrent: null, temperatureC: null };
}
