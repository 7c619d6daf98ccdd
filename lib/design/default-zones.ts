import { wettedSurfaceDennyMumford } from '@/lib/cp';
import type { DeskSurface } from '@/lib/schemas/design';

export interface VesselParticulars {
  lengthBppM?: number | null;
  beamM?: number | null;
  draughtM?: number | null;
  blockCoefficient?: number | null;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

/**
 * Starting zones for a hull from its particulars. The wetted area is Denny-Mumford's
 * S = L(1.7T + CB*B); the split into bottom and sides and the appendage areas are rules of thumb
 * (common practice) marked as estimates for the engineer to replace with drawing values.
 */
export function defaultVesselZones(v: VesselParticulars): DeskSurface[] {
  const { lengthBppM: L, beamM: B, draughtM: T, blockCoefficient: CB } = v;
  if (!L || !B || !T || !CB) {
    return [zone('Hull bottom', 'hull-bottom', 1000, 'entered', 'II'), zone('Boot-top and sides', 'boot-top-sides', 500, 'entered', 'II')];
  }
  const wetted = wettedSurfaceDennyMumford({ lengthM: L, beamM: B, draughtM: T, blockCoefficient: CB });
  const bottom = Math.min(wetted * 0.8, L * B * CB); // flat of bottom about L x B x CB (practice)
  const rudder = 2 * 0.018 * L * T; // rudder area about 1.8 % of L x T, both faces (practice)
  const propellerDiameter = 0.7 * T; // practice
  const propeller = 2 * 0.55 * ((Math.PI * propellerDiameter ** 2) / 4); // both faces, expanded-area ratio about 0.55 (practice)
  return [
    zone('Hull bottom', 'hull-bottom', round1(bottom), 'denny-mumford', 'II'),
    zone('Boot-top and sides', 'boot-top-sides', round1(wetted - bottom), 'denny-mumford', 'II'),
    zone('Rudder', 'rudder', round1(rudder), 'estimate', 'II'),
    { ...zone('Propeller and shaft', 'propeller-shaft', round1(propeller), 'estimate', 'bare'), currentDensityOverride: { initial: 500, mean: 500, final: 500 }, drainsCurrent: 'copper-alloy' },
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
  return { name, kind, areaM2, areaSource, depthBand: '0-30', coatingCategory, coatingAgeYears: 0, currentDensityOverride: null, drainsCurrent: null };
}
