import { describe, expect, it } from 'vitest';
import { buildDesignJob, deskNotices } from '@/lib/design/build-design-input';
import { fieldOf } from '../cp/helpers';
import { ferryInputs } from './record-fixture';
import { JETTY, WORKBOAT, size, structureInputs, vesselInputs, zone } from './desk-inputs';

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

describe('no anodes in the mud', () => {
  const mudSheet = structureInputs(JETTY, {
    surfaces: [
      zone('Sheet piling, water side', 'sheet-pile-water', 2000, 'bare'),
      zone('Sheet piling, embedded', 'sheet-pile-mud', 1500, 'bare'),
      zone('Tie rods below mudline', 'other', 200, 'bare', { depthBand: 'sediment' }),
    ],
  });

  it('mud zones are marked as taking no anodes, by kind or by the sediment band', () => {
    expect(buildDesignJob(mudSheet).surfaces.map((s) => s.anodesAllowed)).toEqual([undefined, false, false]);
  });

  it.each([
    ['jetty piles', structureInputs(JETTY)],
    ['sheet piling', mudSheet],
    ['sheet piling, current governs', { ...mudSheet, designLifeYears: 2 }],
  ])('%s: every anode goes to the water, the mud’s demand is carried, and the zone counts add up to the count to fit', (_, inputs) => {
    const r = size(inputs);
    const mud = r.distribution.surfaces.filter((s) => s.anodesAllowed === false);
    expect(mud.length).toBeGreaterThan(0);
    for (const m of mud) expect(m.count).toBe(0);
    expect(sum(r.distribution.surfaces.map((s) => s.count))).toBe(r.anodesToFit);
    // the mud's demand is in the total the count is sized on
    expect(r.current.meanA).toBeCloseTo(sum(r.surfaces.map((s) => s.meanA)), 9);
    expect(mud.every((m) => m.demandA > 0)).toBe(true);
  });

  it('the notice names the mud zones', () => {
    expect(deskNotices(mudSheet).find((n) => n.code === 'mud-served-from-water')?.message).toContain('Sheet piling, embedded, Tie rods below mudline');
  });

  it('an all-mud design is refused, naming surfaces', () => {
    const allMud = structureInputs(JETTY, { surfaces: [zone('Piles, mud', 'pile-mud', 700, 'bare', { depthBand: 'sediment' })] });
    expect(fieldOf(() => size(allMud))).toBe('surfaces');
  });
});

describe('one number to fit', () => {
  it.each([
    ['the workboat', vesselInputs(WORKBOAT)],
    ['the ferry', ferryInputs()],
    ['the jetty', structureInputs(JETTY)],
    ['a fast hull in poor paint', vesselInputs(WORKBOAT, { hullCoatingCondition: 'poor', serviceSpeedKnots: 24 })],
    ['an anaerobic hull (current governs)', vesselInputs(WORKBOAT, { anaerobic: true })],
  ])('%s: headline = sum of zone counts = installed count, never below the criteria count', (_, inputs) => {
    const r = size(inputs);
    expect(sum(r.distribution.surfaces.map((s) => s.count))).toBe(r.anodesToFit);
    expect(r.distribution.distributedCount).toBe(r.anodesToFit);
    expect(r.anodesToFit).toBeGreaterThanOrEqual(r.anodeCount);
    expect(r.anodeCount).toBe(Math.max(r.countBy.mass, r.countBy.initialCurrent, r.countBy.finalCurrent));
    expect(r.installedCount).toBe(r.anodesToFit);
    // each zone rounds up its share once: the excess is under one anode per zone that takes anodes
    expect(r.anodesToFit - r.anodeCount).toBeLessThan(r.distribution.surfaces.filter((s) => s.anodesAllowed !== false).length);
  });

  it('the installed figures refer to the count to fit', () => {
    const r = size(vesselInputs(WORKBOAT));
    expect(r.installedNetMassKg).toBeCloseTo(r.anodesToFit * 7.7, 9); // TW-AW-4020 net mass (built-in catalogue)
  });
});
