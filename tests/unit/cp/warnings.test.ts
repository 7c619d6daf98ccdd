import { describe, expect, it } from 'vitest';
import { designAnodeSystem, type WarningCode } from '@/lib/cp';
import { cleanDesign, fieldOf, magnesium, variant, warningCodes as codes, zinc } from './helpers';

describe('warnings', () => {
  it('a clean design raises none, and every warning has a sentence', () => {
    expect(codes(cleanDesign())).toEqual([]);
    const w = designAnodeSystem(variant((d) => (d.environment.water = 'fresh'))).warnings;
    expect(w.length).toBeGreaterThan(0);
    for (const x of w) expect(x.message.length).toBeGreaterThan(20);
  });

  // Each row: code, a change that must raise it, a change that must not (the nearest clean case).
  const rows: Array<[WarningCode, (d: any) => void, (d: any) => void]> = [
    [
      'magnesium-on-aluminium',
      (d) => { magnesium(d); d.hullMaterial = 'aluminium'; d.allowMagnesiumOnAluminium = true; d.environment.water = 'fresh'; d.resistivityOhmM = 20; },
      (d) => { magnesium(d); d.hullMaterial = 'steel'; d.environment.water = 'fresh'; d.resistivityOhmM = 20; },
    ],
    ['magnesium-in-seawater', (d) => magnesium(d), (d) => { magnesium(d); d.environment.water = 'fresh'; d.resistivityOhmM = 20; }],
    [
      'magnesium-in-seawater', // water type not stated: seawater-range resistivity (design basis: 0.15-0.30 ohm m) counts as seawater
      (d) => { magnesium(d); delete d.environment; },
      (d) => { magnesium(d); delete d.environment; d.resistivityOhmM = 20; },
    ],
    ['zinc-above-temperature-limit', (d) => { zinc(d); d.environment.temperatureC = 60; }, (d) => { zinc(d); d.environment.temperatureC = 45; }], // zinc limit about 50 C, design basis (memory)
    ['zinc-in-fresh-water', (d) => { zinc(d); d.environment.water = 'fresh'; }, (d) => zinc(d)],
    ['aluminium-in-fresh-water', (d) => (d.environment.water = 'fresh'), (d) => (d.environment.water = 'seawater')],
    [
      'aluminium-in-fresh-water', // passivation below about 1,450 ppm chloride, published
      (d) => (d.environment = { water: 'brackish', chloridePpm: 900 }),
      (d) => (d.environment = { water: 'brackish', chloridePpm: 5000 }),
    ],
    ['life-below-design', (d) => (d.installedCount = 20), (d) => (d.installedCount = 500)],
    ['installed-count-below-required', (d) => (d.installedCount = 20), (d) => (d.installedCount = 500)],
    ['life-below-docking-interval', (d) => (d.nextDockingYears = 30), (d) => (d.nextDockingYears = 5)],
    ['over-protection-high-strength-steel', (d) => (d.protectedMetal = 'high-strength-steel'), (d) => { d.protectedMetal = 'high-strength-steel'; d.anode.potentialV = -0.82; }], // -0.83 V limit, DNV-RP-B401 (2010), from memory
    [
      'over-protection-aluminium', // -1.10 V limit, ABYC E-2, published
      (d) => { magnesium(d); d.protectedMetal = 'aluminium'; d.protectivePotentialV = -0.9; d.allowMagnesiumOnAluminium = true; },
      (d) => { d.protectedMetal = 'aluminium'; d.protectivePotentialV = -0.9; },
    ],
    ['bare-item-current-drain', (d) => (d.surfaces[0].drainsCurrent = 'copper-alloy'), () => {}],
    ['bare-item-current-drain', (d) => (d.surfaces[1].drainsCurrent = 'stainless'), () => {}],
    ['protective-potential-less-negative-than-criterion', (d) => { d.protectedMetal = 'aluminium'; d.protectivePotentialV = -0.8; }, (d) => { d.protectedMetal = 'aluminium'; d.protectivePotentialV = -0.9; }], // aluminium -0.90 V, ABYC E-2, published
    ['protective-potential-less-negative-than-criterion', (d) => { d.environment.anaerobic = true; d.protectivePotentialV = -0.8; }, (d) => { d.environment.anaerobic = true; d.protectivePotentialV = -0.9; }], // -0.90 V anaerobic, published
    ['utilisation-above-table', (d) => (d.anode.utilisationFactor = 0.95), (d) => (d.anode.utilisationFactor = 0.9)], // 0.90 long slender, DNV-RP-B401 (2010) Table 10-8
    ['standoff-treated-as-flush', (d) => (d.anode.shape.standoffM = 0.1), (d) => (d.anode.shape.standoffM = 0.2)],
    // seawater 0.13-0.42 ohm m over 30-42 PSU and -2 to 35 C, computed from the scale (PSS-78); 25 ohm cm = 0.25 ohm m
    ['resistivity-high-for-seawater', (d) => (d.resistivityOhmM = 25), (d) => (d.resistivityOhmM = 0.35)],
    ['resistivity-high-for-seawater', (d) => (d.resistivityOhmM = 1.2), (d) => { d.resistivityOhmM = 1.2; d.environment.water = 'brackish'; }],
    ['resistivity-low-for-seawater', (d) => (d.resistivityOhmM = 0.05), (d) => (d.resistivityOhmM = 0.15)],
    // fresh water 10-100+ ohm m, common practice; no check without a stated water type
    ['resistivity-low-for-fresh-water', (d) => { magnesium(d); d.environment.water = 'fresh'; d.resistivityOhmM = 2; }, (d) => { magnesium(d); d.environment.water = 'fresh'; d.resistivityOhmM = 20; }],
    ['resistivity-low-for-fresh-water', (d) => { magnesium(d); d.environment.water = 'fresh'; }, (d) => { magnesium(d); delete d.environment; }],
    // bare steel at most 0.25 A/m2 (DNV-RP-B401 (2010) Tables 10-1/10-2, from memory); propeller 0.5 A/m2 (published, design basis)
    ['current-density-looks-like-ma-per-m2', (d) => (d.surfaces[0].currentDensity = { initial: 200, mean: 100, final: 130 }), (d) => (d.surfaces[0].currentDensity = { initial: 0.5, mean: 0.5, final: 0.5 })],
    ['current-density-looks-like-ma-per-m2', (d) => (d.surfaces[1].currentDensity.final = 1.3), (d) => (d.surfaces[1].currentDensity.final = 1.0)],
    [
      'long-flush-outside-validity',
      (d) => { d.anode.shape = { kind: 'long-flush', lengthM: 0.6, widthM: 0.2 }; d.anode.utilisationFactor = 0.8; },
      (d) => { d.anode.shape = { kind: 'long-flush', lengthM: 1.0, widthM: 0.2 }; d.anode.utilisationFactor = 0.8; },
    ],
  ];

  it.each(rows)('%s fires in its case and not in the clean neighbour', (code, fire, calm) => {
    expect(codes(variant(fire))).toContain(code);
    expect(codes(variant(calm))).not.toContain(code);
  });

  it('magnesium on aluminium throws without the override, by hull material or protected metal', () => {
    expect(fieldOf(() => designAnodeSystem(variant((d) => { magnesium(d); d.hullMaterial = 'aluminium'; })))).toBe('anode.alloy');
    expect(fieldOf(() => designAnodeSystem(variant((d) => { magnesium(d); d.protectedMetal = 'aluminium'; d.protectivePotentialV = -0.9; })))).toBe('anode.alloy');
    expect(fieldOf(() => designAnodeSystem(variant((d) => { d.anode.alloy = 'magnesium-high-potential'; d.anode.potentialV = -1.7; d.hullMaterial = 'aluminium'; })))).toBe('anode.alloy');
  });

  it('an anode not more active than the protective potential throws', () => {
    expect(fieldOf(() => designAnodeSystem(variant((d) => (d.anode.potentialV = -0.8))))).toBe('anode.potentialV');
    expect(fieldOf(() => designAnodeSystem(variant((d) => { d.protectivePotentialV = -1.1; })))).toBe('anode.potentialV');
  });
});
