import { describe, expect, it } from 'vitest';
import { HARBOUR_BARE_STEEL_RANGES, HARBOUR_DESIGN_VALUES, currentDensityFor, milliampsPerFt2ToAPerM2 } from '@/lib/cp';
import { deskNotices, zoneDemand } from '@/lib/design/build-design-input';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { WORKBOAT, JETTY, structureInputs, vesselInputs, zone } from './desk-inputs';

type Method = Pick<DeskInputs, 'demandMethod' | 'climate' | 'water' | 'hullCoatingCondition' | 'serviceSpeedKnots'>;
const harbour = (change: Partial<Method> = {}): Method => ({ demandMethod: 'harbour', climate: 'temperate', water: 'seawater', hullCoatingCondition: 'good', serviceSpeedKnots: null, ...change });
const mA = (surface: DeskSurface, method: Method) => {
  const { currentDensity: d } = zoneDemand(surface, method);
  return [d.initial * 1000, d.mean * 1000, d.final * 1000].map((x) => Math.round(x * 1e9) / 1e9);
};

const immersed = zone('Piles, immersed', 'pile-immersed', 700, 'bare');
const mud = zone('Piles, mud', 'pile-mud', 700, 'bare', { depthBand: 'sediment' });
const codes = (inputs: DeskInputs) => deskNotices(inputs).map((n) => n.code);

describe('harbour practice', () => {
  it('bare steel immersed in seawater: 54 mA/m² initial, 35 mean and final', () => {
    // project sheets 54/20 and 35/15 mA/m² water/mud (design basis, common practice)
    expect(mA(immersed, harbour())).toEqual([54, 35, 35]);
    expect(mA(zone('Sheet piling', 'sheet-pile-water', 500, 'bare'), harbour())).toEqual([54, 35, 35]);
    expect(zoneDemand(immersed, harbour()).coating).toBe('bare');
  });

  it('in the mud: 20 mA/m² initial, 15 mean and final, by zone kind or by the sediment band', () => {
    // project sheets, mud 20 and 15 mA/m² (design basis, common practice)
    expect(mA(mud, harbour())).toEqual([20, 15, 15]);
    expect(mA(zone('Sheet piling, embedded', 'sheet-pile-mud', 300, 'bare'), harbour())).toEqual([20, 15, 15]);
    expect(mA(zone('Piles below the mudline', 'other', 300, 'bare', { depthBand: 'sediment' }), harbour())).toEqual([20, 15, 15]);
    // at or above the MIL-HDBK-1004/10 worked example's H-pile mud value, 1 mA/ft² = 10.76 mA/m² (published)
    expect(HARBOUR_DESIGN_VALUES['h-pile-mud'].aPerM2 * 1000).toBeCloseTo(10.764, 3);
    expect(mA(mud, harbour())[1]).toBeGreaterThan(milliampsPerFt2ToAPerM2(1) * 1000);
  });

  it('the immersed values lie within MIL-HDBK-1004/10 Table 1, 11-270 mA/m² for still to moving seawater', () => {
    // MIL-HDBK-1004/10 Table 1 (published)
    const lo = HARBOUR_BARE_STEEL_RANGES['still-seawater'].minAPerM2 * 1000;
    const hi = HARBOUR_BARE_STEEL_RANGES['moving-seawater'].maxAPerM2 * 1000;
    expect([lo, hi]).toEqual([11, expect.closeTo(270, 9)]);
    for (const x of [...mA(immersed, harbour()), ...mA(mud, harbour())]) {
      expect(x).toBeGreaterThanOrEqual(lo);
      expect(x).toBeLessThanOrEqual(hi);
    }
  });

  it('in fresh water: 43 mA/m² initial, 32 mean and final, within Table 1’s 22-65 mA/m² for still to moving fresh water', () => {
    // common practice; MIL-HDBK-1004/10 Table 1 still fresh 22-43, moving fresh 43-65 mA/m² (published)
    const fresh = mA(immersed, harbour({ water: 'fresh' }));
    expect(fresh).toEqual([43, 32, 32]);
    for (const x of fresh) {
      expect(x).toBeGreaterThanOrEqual(HARBOUR_BARE_STEEL_RANGES['still-fresh-water'].minAPerM2 * 1000);
      expect(x).toBeLessThanOrEqual(HARBOUR_BARE_STEEL_RANGES['moving-fresh-water'].maxAPerM2 * 1000);
    }
    // the mud is the mud, whatever the water above it
    expect(mA(mud, harbour({ water: 'fresh' }))).toEqual([20, 15, 15]);
  });

  it('does not depend on the climate band (the offshore table does)', () => {
    expect(mA(immersed, harbour({ climate: 'arctic' }))).toEqual(mA(immersed, harbour({ climate: 'tropical' })));
  });

  it('a coated pile keeps its paint breakdown on the harbour density', () => {
    const coated = zoneDemand(zone('Coated piles', 'pile-immersed', 700, 'III'), harbour());
    expect(coated.coating).toEqual({ a: 0.02, b: 0.012 }); // DNV-RP-B401 (2010) category III, 0-30 m (from memory)
    expect(coated.currentDensity.mean * 1000).toBeCloseTo(35, 9);
  });
});

describe('the offshore-structure table is used only when chosen', () => {
  it('ship-hull and harbour practice never return the table’s values; the offshore method does', () => {
    const table = currentDensityFor({ climate: 'temperate', depthBand: '0-30' }); // DNV-RP-B401 (2010) Table 10-1, from memory
    expect(zoneDemand(immersed, harbour()).currentDensity).not.toEqual(table);
    expect(zoneDemand(zone('Hull bottom', 'hull-bottom', 400, 'bare'), { ...harbour(), demandMethod: 'ship-hull' }).currentDensity).not.toEqual(table);
    expect(zoneDemand(immersed, harbour({ demandMethod: 'offshore-table' })).currentDensity).toEqual(table);
    expect(zoneDemand(mud, harbour({ demandMethod: 'offshore-table' })).currentDensity).toEqual(currentDensityFor({ climate: 'temperate', depthBand: 'sediment' }));
  });

  it('a hull sized by the table says so, and so does a structure; neither notice appears under its own practice', () => {
    const vessel = vesselInputs(WORKBOAT);
    const structure = structureInputs(JETTY);
    expect(codes({ ...vessel, demandMethod: 'offshore-table' })).toContain('offshore-table-on-hull');
    expect(codes({ ...vessel, demandMethod: 'offshore-table' })).not.toContain('offshore-table-on-harbour');
    expect(codes({ ...structure, demandMethod: 'offshore-table' })).toContain('offshore-table-on-harbour');
    expect(codes({ ...structure, demandMethod: 'offshore-table' })).not.toContain('offshore-table-on-hull');
    for (const inputs of [vessel, structure]) {
      expect(codes(inputs).filter((c) => c.startsWith('offshore-table'))).toEqual([]);
    }
  });

  it('names the method and its source in the first notice', () => {
    expect(deskNotices(vesselInputs(WORKBOAT))[0]).toMatchObject({ code: 'demand-method', message: expect.stringContaining('ship-hull practice') });
    expect(deskNotices(structureInputs(JETTY))[0]).toMatchObject({ code: 'demand-method', message: expect.stringContaining('MIL-HDBK-1004/10') });
    expect(deskNotices({ ...structureInputs(JETTY), demandMethod: 'offshore-table' })[0].message).toContain('DNV-RP-B401');
  });

  it('a structure is told its splash zone is not protected; a hull is not', () => {
    expect(codes(structureInputs(JETTY))).toContain('splash-zone-not-protected');
    expect(codes(vesselInputs(WORKBOAT))).not.toContain('splash-zone-not-protected');
  });
});
