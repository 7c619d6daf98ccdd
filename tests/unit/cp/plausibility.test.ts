import { describe, expect, it } from 'vitest';
import {
  ALLOYS,
  ANODE_POTENTIAL_RANGE_V,
  BUILTIN_ANODE_MODELS,
  CpInputError,
  FRESH_WATER_MIN_RESISTIVITY_OHM_M,
  SEAWATER_RESISTIVITY_RANGE_OHM_M,
  WATER_TYPE_SALINITY_LIMITS_PSU,
  compareOptions,
  designAnodeSystem,
  seawaterResistivityOhmM,
  theoreticalCapacityAhPerKg,
  type AnodeAlloy,
  type AnodeModel,
  type DesignInput,
} from '@/lib/cp';
import { cleanDesign, fieldOf } from './helpers';

function variant(change: (d: any) => void): DesignInput {
  const d = structuredClone(cleanDesign()) as any;
  change(d);
  return d;
}

const warningOf = (input: DesignInput, code: string) => designAnodeSystem(input).warnings.find((w) => w.code === code);

describe("theoretical capacity (Faraday's law)", () => {
  it.each([
    ['zinc', 820, 1],
    ['al-zn-in', 2980, 1],
    ['magnesium', 2200, 10],
    ['magnesium-high-potential', 2200, 10],
  ] as const)('%s: about %s Ah/kg', (alloy, ahPerKg, within) => {
    // computed from Faraday's law, n F / M (F CODATA 2018; atomic weights IUPAC, from memory):
    // Zn 819.9, Al 2980.0, Mg 2205.4 Ah/kg; design basis: Mg "about 2200 theoretical" (published)
    expect(Math.abs(theoreticalCapacityAhPerKg(alloy) - ahPerKg)).toBeLessThanOrEqual(within);
  });

  it('every tabulated and built-in capacity is below it', () => {
    for (const [alloy, data] of Object.entries(ALLOYS) as Array<[AnodeAlloy, (typeof ALLOYS)[AnodeAlloy]]>) {
      expect(data.capacityAhPerKg.seawater).toBeLessThan(theoreticalCapacityAhPerKg(alloy));
      if (data.capacityAhPerKg.sediment !== null) expect(data.capacityAhPerKg.sediment).toBeLessThan(theoreticalCapacityAhPerKg(alloy));
    }
    for (const m of BUILTIN_ANODE_MODELS) {
      if (m.capacityAhPerKg !== undefined) expect(m.capacityAhPerKg).toBeLessThan(theoreticalCapacityAhPerKg(m.alloy));
    }
  });

  it('a design refuses a capacity above it and accepts the value itself', () => {
    const over = variant((d) => (d.anode.capacityAhPerKg = 3000));
    expect(() => designAnodeSystem(over)).toThrow(CpInputError);
    expect(fieldOf(() => designAnodeSystem(over))).toBe('anode.capacityAhPerKg');
    expect(() => designAnodeSystem(over)).toThrow(/theoretical capacity of its metal, aluminium \(2980 Ah\/kg by Faraday's law\)/);
    expect(() => designAnodeSystem(variant((d) => (d.anode.capacityAhPerKg = theoreticalCapacityAhPerKg('al-zn-in'))))).not.toThrow();
  });

  it('a catalogue model with an impossible capacity is listed as unsuitable, naming the field', () => {
    const { anode: _anode, ...job } = cleanDesign();
    const model: AnodeModel = { ...BUILTIN_ANODE_MODELS.find((m) => m.alloy === 'zinc')!, id: 'typo', capacityAhPerKg: 7800 };
    const [row] = compareOptions({ job, models: [model] });
    expect(row.suitable).toBe(false);
    if (!row.suitable) expect(row.field).toBe('models[0].capacityAhPerKg');
  });

  it('rejects an unknown alloy', () => {
    expect(fieldOf(() => theoreticalCapacityAhPerKg('lithium' as AnodeAlloy))).toBe('alloy');
  });
});

describe('anode closed-circuit potential', () => {
  it('accepts every tabulated potential and the ends of the range', () => {
    // the tabulated values: Al-Zn-In -1.05/-1.00, Zn -1.03/-0.98 (DNV-RP-B401 (2010) Table 10-6, from memory), Mg -1.5 and -1.7 (published)
    for (const data of Object.values(ALLOYS)) {
      for (const v of [data.closedCircuitPotentialV.seawater, data.closedCircuitPotentialV.sediment]) {
        if (v === null) continue;
        expect(v).toBeGreaterThanOrEqual(ANODE_POTENTIAL_RANGE_V.mostNegative);
        expect(v).toBeLessThanOrEqual(ANODE_POTENTIAL_RANGE_V.leastNegative);
      }
    }
    expect(() => designAnodeSystem(variant((d) => (d.anode.potentialV = -1.8)))).not.toThrow();
  });

  it('refuses a potential outside -1.8 to -0.7 V with a sentence about sign, unit and electrode', () => {
    for (const potentialV of [-1.81, -1050, 1.05, -0.69, 0]) {
      const input = variant((d) => (d.anode.potentialV = potentialV));
      expect(fieldOf(() => designAnodeSystem(input))).toBe('anode.potentialV');
      expect(() => designAnodeSystem(input)).toThrow(/physical range .* check the sign, the unit \(V, not mV\) and the reference electrode/);
    }
  });
});

describe('resistivity that does not fit the water', () => {
  it('the seawater bounds enclose the scale over the whole range of seawater', () => {
    // computed from the scale (PSS-78): 30-42 PSU, -2 to 35 C gives about 0.13 to 0.42 ohm m
    for (let s = WATER_TYPE_SALINITY_LIMITS_PSU.seawaterFrom; s <= 42; s += 1) {
      for (let t = -2; t <= 35; t += 1) {
        const rho = seawaterResistivityOhmM({ temperatureC: t, salinityPsu: s });
        expect(rho).toBeGreaterThan(SEAWATER_RESISTIVITY_RANGE_OHM_M.min);
        expect(rho).toBeLessThan(SEAWATER_RESISTIVITY_RANGE_OHM_M.max);
      }
    }
    // and brackish water at 5 PSU (about 1.4 ohm m, computed from the scale) is outside them
    expect(seawaterResistivityOhmM({ temperatureC: 15, salinityPsu: 5 })).toBeGreaterThan(SEAWATER_RESISTIVITY_RANGE_OHM_M.max);
    expect(FRESH_WATER_MIN_RESISTIVITY_OHM_M).toBeLessThan(10); // fresh water 10-100+ ohm m, common practice
  });

  it('says ohm·cm typed as ohm·m for 25 in seawater, and gives the converted value', () => {
    const w = warningOf(variant((d) => (d.resistivityOhmM = 25)), 'resistivity-high-for-seawater');
    expect(w?.message).toContain('probably ohm·cm typed as ohm·m');
    expect(w?.message).toContain('25 ohm·cm = 0.25 ohm·m');
  });

  it('is a warning, not an error: the design is still sized', () => {
    const d = designAnodeSystem(variant((x) => (x.resistivityOhmM = 25)));
    expect(d.anodeCount).toBeGreaterThan(0);
  });

  it('names fresh-water resistivity that is a seawater value', () => {
    const w = warningOf(variant((d) => { d.environment.water = 'fresh'; d.resistivityOhmM = 0.25; }), 'resistivity-low-for-fresh-water');
    expect(w?.message).toContain('fresh water is about 10-100 ohm·m');
  });

  it('leaves brackish water and sediment alone', () => {
    for (const [water, rho] of [['brackish', 0.3], ['brackish', 30], ['sediment', 1.5]] as const) {
      const codes = designAnodeSystem(variant((d) => { d.environment.water = water; d.resistivityOhmM = rho; })).warnings.map((w) => w.code);
      expect(codes.filter((c) => c.startsWith('resistivity-'))).toEqual([]);
    }
  });
});

describe('current density in the wrong unit', () => {
  it('says mA/m² typed as A/m² and names the surface', () => {
    const w = warningOf(variant((d) => (d.surfaces[1].currentDensity = { initial: 20, mean: 15, final: 18 })), 'current-density-looks-like-ma-per-m2');
    expect(w?.message).toContain('looks like mA/m² typed as A/m²');
    expect(w?.message).toContain('coated (20 A/m²)');
    expect(w?.message).not.toContain('immersed');
  });

  it('does not fire for the published propeller value', () => {
    // copper-alloy propeller 450-500 mA/m2 (published, Japanese ship-equipment guide, design basis)
    const d = designAnodeSystem(variant((x) => x.surfaces.push({ name: 'propeller', areaM2: 30, currentDensity: { initial: 0.5, mean: 0.5, final: 0.5 }, coating: 'bare', drainsCurrent: 'copper-alloy' })));
    expect(d.warnings.map((w) => w.code)).not.toContain('current-density-looks-like-ma-per-m2');
  });
});
