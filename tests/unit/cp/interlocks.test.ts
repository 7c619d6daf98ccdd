import { describe, expect, it } from 'vitest';
import { designAnodeSystem, type WarningCode } from '@/lib/cp';
import { AL_ZN_IN_DERATING_ABOVE_C } from '@/lib/cp/design-checks';
import { magnesium, variant, warningCodes as codes, zinc } from './helpers';

const fresh = (d: any) => { d.environment.water = 'fresh'; d.resistivityOhmM = 20; }; // fresh water 10-100+ ohm m, common practice
const brackish = (d: any) => { d.environment.water = 'brackish'; d.resistivityOhmM = 1.4; }; // about 1.4 ohm m at 5 PSU, 15 C (PSS-78, computed)
const allBare = (d: any) => { for (const s of d.surfaces) s.coating = 'bare'; };

describe('interlocks: each fires in its case and not in its clean neighbour', () => {
  const rows: Array<[WarningCode, (d: any) => void, (d: any) => void]> = [
    // magnesium over-protects coated steel, coating disbondment beyond -1.05 V (design basis, published / practice)
    ['magnesium-on-coated-steel', (d) => { magnesium(d); fresh(d); }, (d) => { magnesium(d); fresh(d); allBare(d); }],
    ['magnesium-on-coated-steel', (d) => { d.anode = { ...d.anode, alloy: 'magnesium-high-potential', potentialV: -1.7, capacityAhPerKg: 1100 }; fresh(d); }, (d) => fresh(d)],
    ['magnesium-on-coated-steel', (d) => { magnesium(d); fresh(d); d.protectedMetal = 'high-strength-steel'; }, (d) => { magnesium(d); fresh(d); d.protectedMetal = 'stainless'; d.protectivePotentialV = -0.75; }],
    ['magnesium-in-brackish-water', (d) => { magnesium(d); brackish(d); allBare(d); }, (d) => { magnesium(d); fresh(d); allBare(d); }],
    ['magnesium-in-brackish-water', (d) => { magnesium(d); brackish(d); allBare(d); }, (d) => { zinc(d); brackish(d); allBare(d); }],
    // zinc not above about 50 C (design basis, from memory): the temperature must be known
    ['zinc-temperature-unknown', (d) => { zinc(d); delete d.environment.temperatureC; }, (d) => zinc(d)],
    ['zinc-temperature-unknown', (d) => { zinc(d); delete d.environment; }, (d) => { zinc(d); d.environment.temperatureC = 28; }],
    ['zinc-temperature-unknown', (d) => { zinc(d); delete d.environment.temperatureC; }, (d) => delete d.environment.temperatureC],
    // Al-Zn-In capacity falls at high temperature (design basis, from memory)
    ['al-zn-in-warm-water', (d) => (d.environment.temperatureC = 30), (d) => (d.environment.temperatureC = 20)],
    ['al-zn-in-warm-water', (d) => (d.environment.temperatureC = 30), (d) => { zinc(d); d.environment.temperatureC = 30; }],
    ['rated-output-unscaled', (d) => (d.anode.ratedOutputA = 4), (d) => { d.anode.ratedOutputA = 4; d.anode.ratedAtResistivityOhmM = 0.25; }],
    ['rated-output-unscaled', (d) => (d.anode.ratedOutputA = 4), () => {}],
    // anaerobic steel -0.90 V (published) against high-strength steel's -0.83 V limit (DNV-RP-B401, from memory)
    ['criterion-beyond-over-protection-limit', (d) => { d.protectedMetal = 'high-strength-steel'; d.environment.anaerobic = true; delete d.protectivePotentialV; }, (d) => { d.protectedMetal = 'high-strength-steel'; delete d.protectivePotentialV; }],
  ];

  it.each(rows)('%s', (code, fire, calm) => {
    expect(codes(variant(fire))).toContain(code);
    expect(codes(variant(calm))).not.toContain(code);
  });

  it('the warm-water limit for Al-Zn-In is 25 °C, exclusive', () => {
    expect(AL_ZN_IN_DERATING_ABOVE_C).toBe(25); // DNV-RP-B401, from memory
    expect(codes(variant((d) => (d.environment.temperatureC = 25)))).not.toContain('al-zn-in-warm-water');
    expect(codes(variant((d) => (d.environment.temperatureC = 25.5)))).toContain('al-zn-in-warm-water');
  });

  it('each interlock says what to do instead', () => {
    const w = designAnodeSystem(variant((d) => { magnesium(d); brackish(d); })).warnings;
    expect(w.find((x) => x.code === 'magnesium-on-coated-steel')?.message).toMatch(/disbond.*zinc or aluminium/);
    expect(w.find((x) => x.code === 'magnesium-in-brackish-water')?.message).toMatch(/zinc or aluminium/);
    const z = designAnodeSystem(variant((d) => { zinc(d); delete d.environment.temperatureC; })).warnings;
    expect(z.find((x) => x.code === 'zinc-temperature-unknown')?.message).toContain('50 °C'); // zinc limit about 50 °C (design basis, from memory)
  });
});
