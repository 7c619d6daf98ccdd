import { describe, expect, it } from 'vitest';
import { METALLIC_COATING_CONSTANTS, coatingConstantsFor } from '@/lib/cp';
import { deskNotices, zoneCoating, zoneDemand } from '@/lib/design/build-design-input';
import { JETTY, WORKBOAT, structureInputs, vesselInputs, zone } from './desk-inputs';

const harbour = { demandMethod: 'harbour', climate: 'temperate', water: 'seawater', hullCoatingCondition: 'good', serviceSpeedKnots: null } as const;

describe('metallic coatings', () => {
  it.each(['tsa', 'tsz', 'hdg'] as const)('%s uses its METALLIC_COATING_CONSTANTS, continued by its age', (category) => {
    const { a, b } = METALLIC_COATING_CONSTANTS[category]; // Tidewarden assumptions (common practice, to be confirmed)
    expect(zoneCoating(zone('Piles', 'pile-immersed', 100, category))).toEqual({ a, b });
    // fc(t) = a + b(age + t) (DNV-RP-B401 (2010) 10.4, published equation)
    expect(zoneCoating(zone('Piles', 'pile-immersed', 100, category, { coatingAgeYears: 4 }))).toEqual({ a: expect.closeTo(a + 4 * b, 12), b });
    expect(zoneDemand(zone('Piles', 'pile-immersed', 100, category), harbour).coating).toEqual({ a, b });
    // the same constants at every depth: the paint table does not apply
    expect(zoneCoating(zone('Deep', 'pile-immersed', 100, category, { depthBand: '300+' }))).toEqual({ a, b });
  });

  it('the breakdown factor never exceeds 1, however old the layer', () => {
    expect(zoneCoating(zone('Old', 'pile-immersed', 100, 'hdg', { coatingAgeYears: 60 }))).toMatchObject({ a: 1 });
  });

  it('a sacrificial metal layer starts below a thick paint system and stays below bare steel', () => {
    const paintIII = coatingConstantsFor({ category: 'III', depthBand: '0-30' }); // DNV-RP-B401 (2010), from memory
    for (const c of Object.values(METALLIC_COATING_CONSTANTS)) {
      expect(c.a).toBeGreaterThan(0);
      expect(c.a).toBeLessThanOrEqual(0.05);
      expect(c.a + c.b * 20).toBeLessThan(1);
    }
    expect(METALLIC_COATING_CONSTANTS.tsa.a).toBeLessThanOrEqual(paintIII.a);
  });

  it('the notice names the zones and says the constants are assumptions to confirm', () => {
    const inputs = structureInputs(JETTY, { surfaces: [zone('TSA piles', 'pile-immersed', 700, 'tsa'), zone('Galvanised bracing', 'other', 50, 'hdg')] });
    const notice = deskNotices(inputs).find((n) => n.code === 'sacrificial-metal-coating');
    expect(notice?.message).toContain('TSA piles, Galvanised bracing');
    expect(notice?.message).toContain('common practice');
  });

  it('a noble plating (tin, nickel, chromium) is sized as bare metal and its notice says barrier only', () => {
    // noble platings protect only as a barrier (design basis, common practice)
    const plated = zone('Chromed ram', 'other', 5, 'noble-plating');
    expect(zoneCoating(plated)).toBe('bare');
    expect(zoneDemand(plated, harbour)).toEqual(zoneDemand(zone('Chromed ram', 'other', 5, 'bare'), harbour));
    // under ship-hull practice as bare steel moving in seawater, 250/150 mA/m2 (from memory)
    expect(zoneDemand(plated, { ...harbour, demandMethod: 'ship-hull' }).currentDensity).toEqual({ initial: 0.25, mean: 0.15, final: 0.15 });
    const notice = deskNotices(vesselInputs(WORKBOAT, { surfaces: [...vesselInputs(WORKBOAT).surfaces, plated] })).find((n) => n.code === 'noble-plating-barrier-only');
    expect(notice?.message).toMatch(/Chromed ram.*barrier only.*sized as bare metal/);
  });
});
