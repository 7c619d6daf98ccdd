// Tests as the engineering SHOULD behave; each fails on main (reported, not committed).
import { describe, expect, it } from 'vitest';
import { builtinAnodeModel } from '@/lib/cp';
import { defaultBlockCoefficient } from '@/lib/design/default-zones';
import { WORKBOAT, size, structureInputs, vesselInputs, zone, JETTY } from './desk-inputs';

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

describe('problems', () => {
  it('P1: magnesium on a painted steel hull warns under ship-hull practice as it does under harbour practice', () => {
    // a painted steel hull in fresh water with magnesium plates: the interlock must see the paint
    const inputs = vesselInputs(WORKBOAT, { water: 'fresh', resistivitySource: 'measured', resistivityOhmM: 30, temperatureC: 15, anodeModelKey: 'builtin:TW-MB-3015' });
    expect(size(inputs).warnings.map((w) => w.code)).toContain('magnesium-on-coated-steel');
  });

  it('P2: a data-sheet output is stated at -0.80 V: at the anaerobic -0.90 V criterion the count by current rises', () => {
    const base = structureInputs(JETTY, { designLifeYears: 2 });
    const model = { ...builtinAnodeModel('TW-AS-2018')!, ratedOutputA: 3.5, ratedAtResistivityOhmM: 0.269 };
    const aerobic = size(base, model);
    const anaerobic = size({ ...base, anaerobic: true }, model);
    expect(aerobic.governingCriterion).not.toBe('mass');
    // driving voltage 0.25 V -> 0.15 V with Al-Zn-In at -1.05 V (DNV-RP-B401 (2010) Table 10-6, from memory)
    expect(anaerobic.perAnode.initialOutputA).toBeCloseTo(aerobic.perAnode.initialOutputA * 0.15 / 0.25, 9);
    expect(anaerobic.anodesToFit).toBeGreaterThan(aerobic.anodesToFit);
  });

  it('P3: two zones with the same name (twin rudders): the zone counts still add up to the count to fit', () => {
    const surfaces = [zone('Hull', 'hull-bottom', 800, 'II'), zone('Rudder', 'rudder', 12, 'II'), zone('Rudder', 'rudder', 12, 'II'), zone('Propellers', 'propeller-shaft', 10, 'bare', { drainsCurrent: 'copper-alloy' })];
    const r = size(vesselInputs(WORKBOAT, { surfaces }));
    expect(sum(r.distribution.surfaces.map((s) => s.count))).toBe(r.anodesToFit);
    // and with different areas, each rudder keeps its own share
    const unequal = size(vesselInputs(WORKBOAT, { surfaces: [zone('Hull', 'hull-bottom', 800, 'II'), zone('Rudder', 'rudder', 40, 'II'), zone('Rudder', 'rudder', 4, 'II')] }));
    expect(sum(unequal.distribution.surfaces.map((s) => s.count))).toBe(unequal.anodesToFit);
  });

  it('P4: the default block coefficient matches the vessel type as words, not letters inside other words', () => {
    expect(defaultBlockCoefficient('Twin-screw tug')).toBe(0.55); // tug, not "s-crew" boat (0.45)
    expect(defaultBlockCoefficient('Twin screw ferry')).toBe(0.6); // ferry, not crew boat
    expect(defaultBlockCoefficient('Research explorer')).toBe(0.6); // no match: the fallback, not "ore" carrier (0.8)
    expect(defaultBlockCoefficient('Stores vessel')).toBe(0.6); // not "ore" carrier
  });

  it('P5: a water zone with no demand of its own still takes the anodes that carry the mud', () => {
    const surfaces = [
      zone('Piles, water', 'pile-immersed', 700, 'bare', { currentDensityOverride: { initial: 0, mean: 0, final: 0 } }),
      zone('Piles, mud', 'pile-mud', 700, 'bare', { depthBand: 'sediment' }),
    ];
    const r = size(structureInputs(JETTY, { surfaces }));
    expect(sum(r.distribution.surfaces.map((s) => s.count))).toBe(r.anodesToFit);
  });
});
