// The acceptance case: a workboat and a jetty sized from their particulars alone, with the inputs a
// new design starts from, must land where ship-hull and harbour practice put them by hand.
import { describe, expect, it } from 'vitest';
import { deskNotices } from '@/lib/design/build-design-input';
import { JETTY, WORKBOAT, size, structureInputs, vesselInputs } from './desk-inputs';

const HOURS_PER_YEAR = 8760;
/** Net mass by hand, kg: M = I x t x 8760 / (u x eps) (DNV-RP-B401, published). */
const massKg = (meanA: number, years: number, u: number, eps: number) => (meanA * years * HOURS_PER_YEAR) / (u * eps);

describe('60 m workboat (L 60, B 13, T 4, CB 0.6), ship-hull practice, 2.5 years, TW-AW-4020 (7.7 kg Al-Zn-In plate)', () => {
  // By hand:
  //   wetted area, Denny-Mumford S = 60 x (1.7 x 4 + 0.6 x 13) = 876 m2 (published formula)
  //   coated hull 876 m2 x 15-20 mA/m2 x 1.10 = 14.45-19.27 A (common practice, design basis)
  //   bronze propeller, 0.7T = 2.8 m, both faces at blade-area ratio 0.55: 6.8 m2 x 450-500 mA/m2 = 3.05-3.39 A
  //     (Japanese ship-equipment guide, published)
  //   mean demand 17.5-22.7 A; mass over 2.5 years with u 0.80 (short flush, DNV-RP-B401, from memory) and
  //   2000 Ah/kg (DNV-RP-B401 (2010) Table 10-6, from memory): 240-311 kg, i.e. 32-41 plates of 7.7 kg;
  //   sharing over five zones, each rounded up, adds at most four.
  const lowA = 876 * 0.015 * 1.1 + 6.8 * 0.45;
  const highA = 876 * 0.02 * 1.1 + 6.8 * 0.5;
  const low = Math.ceil(massKg(lowA, 2.5, 0.8, 2000) / 7.7);
  const high = Math.ceil(massKg(highA, 2.5, 0.8, 2000) / 7.7);
  const r = size(vesselInputs(WORKBOAT));

  it('the hand range is 32-41 anodes by mass', () => {
    expect([low, high]).toEqual([32, 41]);
  });

  it('the mean demand lies in 17.5-22.7 A', () => {
    expect(r.current.meanA).toBeGreaterThanOrEqual(lowA);
    expect(r.current.meanA).toBeLessThanOrEqual(highA);
  });

  it('the criteria count lies in the hand range and the count to fit within four more', () => {
    expect(r.anodeCount).toBeGreaterThanOrEqual(low);
    expect(r.anodeCount).toBeLessThanOrEqual(high);
    expect(r.anodesToFit).toBeGreaterThanOrEqual(low);
    expect(r.anodesToFit).toBeLessThanOrEqual(high + 4);
    expect(r.governingCriterion).toBe('mass'); // a 2.5-year flush-plate hull design is mass-governed (common practice)
  });

  it('lasts the docking interval and warns only of the propeller drain', () => {
    expect(r.achievedLifeYears).toBeGreaterThanOrEqual(2.5);
    expect(r.warnings.map((w) => w.code)).toEqual(['bare-item-current-drain']);
  });

  it('says that its areas are estimated', () => {
    const notice = deskNotices(vesselInputs(WORKBOAT)).find((n) => n.code === 'areas-estimated')?.message ?? '';
    for (const name of ['Hull bottom', 'Boot-top and sides', 'Rudder', 'Propeller and shaft', 'Sea chests']) expect(notice).toContain(name);
  });
});

describe('40-pile jetty (610 mm piles), harbour practice, 20 years, TW-AS-2018 (178 kg stand-off)', () => {
  // By hand:
  //   pile area 40 x pi x 0.61 m x 10 m = 767 m2 immersed (and as much in the mud, both estimated)
  //   mean demand at about 35 mA/m2 (project sheets, common practice): immersed only 26.8 A, the whole
  //   pile area 53.7 A; mass over 20 years with u 0.90 (long slender stand-off, DNV-RP-B401, from memory)
  //   and 2000 Ah/kg: 2,610-5,220 kg, i.e. 15-30 anodes of 178 kg.
  const pileAreaM2 = 40 * Math.PI * 0.61 * 10;
  const low = Math.ceil(massKg(pileAreaM2 * 0.035, 20, 0.9, 2000) / 178);
  const high = Math.ceil(massKg(2 * pileAreaM2 * 0.035, 20, 0.9, 2000) / 178);
  const r = size(structureInputs(JETTY));

  it('the hand range is 15-30 anodes', () => {
    expect([low, high]).toEqual([15, 30]);
  });

  it('the count to fit lies in it, all on the immersed zone', () => {
    expect(r.anodesToFit).toBeGreaterThanOrEqual(low);
    expect(r.anodesToFit).toBeLessThanOrEqual(high);
    expect(r.distribution.surfaces.map((s) => s.count)).toEqual([r.anodesToFit, 0]);
  });

  it('sizes the mud at 15 mA/m2 and the water at 35 mA/m2 mean', () => {
    // harbour practice, project sheets (common practice)
    expect(r.current.meanA).toBeCloseTo(766.5 * 0.035 + 766.5 * 0.015, 6);
    expect(r.achievedLifeYears).toBeGreaterThanOrEqual(20);
    expect(r.warnings).toEqual([]);
  });
});
