import { describe, expect, it } from 'vitest';
import { wettedSurfaceDennyMumford } from '@/lib/cp';
import { deskNotices } from '@/lib/design/build-design-input';
import { DEFAULT_BLOCK_COEFFICIENT, FALLBACK_BLOCK_COEFFICIENT, defaultBlockCoefficient, defaultStructureZones, defaultVesselZones } from '@/lib/design/default-zones';
import { WORKBOAT, vesselInputs } from './desk-inputs';

const areaOf = (zones: ReturnType<typeof defaultVesselZones>, kind: string) => zones.find((z) => z.kind === kind)!.areaM2;
const notices = (zones: ReturnType<typeof defaultVesselZones>) => deskNotices(vesselInputs(WORKBOAT, { surfaces: zones }));

describe('vessel zones from the particulars: areas are never invented', () => {
  it('with L, B, T and CB the hull bottom and sides add up to Denny-Mumford’s S = L(1.7T + CB·B)', () => {
    // Denny-Mumford (published, design basis): 60 x (1.7 x 4 + 0.6 x 13) = 876 m2
    const zones = defaultVesselZones(WORKBOAT);
    expect(wettedSurfaceDennyMumford({ lengthM: 60, beamM: 13, draughtM: 4, blockCoefficient: 0.6 })).toBeCloseTo(876, 9);
    expect(areaOf(zones, 'hull-bottom') + areaOf(zones, 'boot-top-sides')).toBeCloseTo(876, 1);
    expect(areaOf(zones, 'hull-bottom')).toBeCloseTo(468, 1); // flat of bottom about L x B x CB (common practice)
    expect(zones.filter((z) => z.kind === 'hull-bottom' || z.kind === 'boot-top-sides').map((z) => z.areaSource)).toEqual(['denny-mumford', 'denny-mumford']);
    expect(notices(zones).find((n) => n.code === 'areas-estimated')?.message).toContain('Denny-Mumford');
  });

  it('without CB takes the vessel type’s default and marks the areas so', () => {
    const zones = defaultVesselZones({ ...WORKBOAT, blockCoefficient: null });
    const cb = defaultBlockCoefficient('Workboat');
    expect(cb).toBe(0.55); // tugs and workboats about 0.55 (common practice, from memory)
    expect(areaOf(zones, 'hull-bottom') + areaOf(zones, 'boot-top-sides')).toBeCloseTo(wettedSurfaceDennyMumford({ lengthM: 60, beamM: 13, draughtM: 4, blockCoefficient: cb }), 1);
    for (const kind of ['hull-bottom', 'boot-top-sides']) expect(zones.find((z) => z.kind === kind)!.areaSource).toBe('denny-mumford-default-cb');
    expect(notices(zones).find((n) => n.code === 'areas-estimated')?.message).toContain('default block coefficient');
  });

  it('default block coefficients: fine craft 0.45 to bulk and tankers 0.8, a middling 0.6 for an unknown type', () => {
    // common practice, from memory
    expect(defaultBlockCoefficient('Crew boat')).toBe(0.45);
    expect(defaultBlockCoefficient('Harbour tug')).toBe(0.55);
    expect(defaultBlockCoefficient('Ro-ro ferry')).toBe(0.6);
    expect(defaultBlockCoefficient('Platform supply vessel')).toBe(0.65);
    expect(defaultBlockCoefficient('General cargo')).toBe(0.7);
    expect(defaultBlockCoefficient('Product tanker')).toBe(0.8);
    expect(defaultBlockCoefficient('Dredger')).toBe(FALLBACK_BLOCK_COEFFICIENT);
    expect(defaultBlockCoefficient(null)).toBe(0.6);
    for (const [, cb] of DEFAULT_BLOCK_COEFFICIENT) {
      expect(cb).toBeGreaterThanOrEqual(0.35);
      expect(cb).toBeLessThanOrEqual(0.85);
    }
  });

  it('without length, beam or draught every area is a placeholder, and the notice lists each as estimated', () => {
    for (const missing of [{ lengthBppM: null }, { beamM: null }, { draughtM: undefined }]) {
      const zones = defaultVesselZones({ ...WORKBOAT, ...missing });
      expect(zones.map((z) => z.areaSource)).toEqual(zones.map(() => 'placeholder'));
      const message = notices(zones).find((n) => n.code === 'areas-estimated')?.message ?? '';
      for (const z of zones) expect(message).toContain(`${z.name} (placeholder`);
    }
  });

  it('every vessel default has a rudder and a bare copper-alloy propeller-and-shaft zone, so neither notice is raised', () => {
    for (const v of [WORKBOAT, { ...WORKBOAT, blockCoefficient: null }, {}]) {
      const zones = defaultVesselZones(v);
      expect(zones.some((z) => z.kind === 'rudder')).toBe(true);
      expect(zones.find((z) => z.kind === 'propeller-shaft')).toMatchObject({ coatingCategory: 'bare', drainsCurrent: 'copper-alloy' });
      const codes = notices(zones).map((n) => n.code);
      expect(codes).not.toContain('no-propeller-zone');
      expect(codes).not.toContain('no-rudder-zone');
    }
  });

  it('a vessel without a propeller zone is told so; a structure never is', () => {
    const zones = defaultVesselZones(WORKBOAT).filter((z) => z.kind !== 'propeller-shaft');
    expect(notices(zones).find((n) => n.code === 'no-propeller-zone')?.message).toContain('450-500 mA/m²'); // Japanese ship-equipment guide, published
    const structure = { ...vesselInputs(WORKBOAT), hullMaterial: null, surfaces: defaultStructureZones({ pileCount: 4, pileDiameterM: 0.5 }) };
    expect(deskNotices(structure).map((n) => n.code)).not.toContain('no-propeller-zone');
  });

  it('entered areas raise no estimated-area notice', () => {
    const zones = defaultVesselZones(WORKBOAT).map((z) => ({ ...z, areaSource: 'entered' }));
    expect(notices(zones).map((n) => n.code)).not.toContain('areas-estimated');
  });

  it('pile zones are 10 m immersed and 10 m in the mud per pile, said to be estimates', () => {
    const [water, mud] = defaultStructureZones({ pileCount: 40, pileDiameterM: 0.61 });
    expect(water.areaM2).toBeCloseTo(40 * Math.PI * 0.61 * 10, 1); // pi x d x length per pile
    expect(mud).toMatchObject({ kind: 'pile-mud', depthBand: 'sediment', areaSource: 'estimate' });
    expect(water.areaSource).toBe('estimate');
  });
});
