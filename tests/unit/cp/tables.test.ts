import { describe, expect, it } from 'vitest';
import {
  ALLOYS,
  ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V,
  BARE_STEEL_CURRENT_DENSITY,
  BARE_STEEL_CURRENT_DENSITY_SOURCE,
  COATING_CONSTANTS,
  HARBOUR_BARE_STEEL_RANGES,
  HARBOUR_DESIGN_VALUES,
  HULL_CURRENT_DENSITY,
  MINIMUM_PROTECTION_POTENTIAL,
  OVER_PROTECTION_LIMIT,
  REGIONAL_CURRENT_DENSITY_CHECK,
  SEDIMENT_CURRENT_DENSITY,
  UTILISATION_FACTORS,
  basis,
  climateFromTemperature,
  coatingConstantsFor,
  consumptionRateKgPerAYear,
  currentDensityFor,
  depthBandFromDepth,
  milliampsPerFt2ToAPerM2,
  resistivityFor,
  utilisationFactorFor,
  CLIMATES,
  DEPTH_BANDS,
} from '@/lib/cp';

describe('pinned edition', () => {
  it('names one edition of DNV-RP-B401', () => {
    expect(basis.sacrificialAnodeDesign).toBe('DNV-RP-B401 (2010, amended 2011)');
    expect(BARE_STEEL_CURRENT_DENSITY_SOURCE.source).toContain('(2010, amended 2011)');
    expect(BARE_STEEL_CURRENT_DENSITY_SOURCE.flag).toBe('memory');
  });
});

describe('design current densities, bare steel in seawater', () => {
  it('spot values', () => {
    expect(BARE_STEEL_CURRENT_DENSITY['0-30'].tropical).toEqual({ initial: 0.15, mean: 0.07, final: 0.09 }); // DNV-RP-B401 (2010) Tables 10-1/10-2, from memory
    expect(BARE_STEEL_CURRENT_DENSITY['0-30'].arctic).toEqual({ initial: 0.25, mean: 0.12, final: 0.17 }); // DNV-RP-B401 (2010) Tables 10-1/10-2, from memory
    expect(BARE_STEEL_CURRENT_DENSITY['100-300'].temperate).toEqual({ initial: 0.19, mean: 0.09, final: 0.14 }); // DNV-RP-B401 (2010) Tables 10-1/10-2, from memory
    expect(currentDensityFor({ climate: 'sub-tropical', depthBand: '300+' })).toEqual({ initial: 0.2, mean: 0.1, final: 0.15 }); // DNV-RP-B401 (2010) Tables 10-1/10-2, from memory
    expect(currentDensityFor({ climate: 'arctic', depthBand: 'sediment' })).toEqual({ initial: 0.02, mean: 0.02, final: 0.02 }); // DNV-RP-B401 (2010), sediment, from memory
    expect(SEDIMENT_CURRENT_DENSITY.mean).toBe(0.02); // DNV-RP-B401 (2010), from memory
  });

  it('colder water needs more current in every depth band, and initial >= final >= mean', () => {
    // common practice: lower temperature, more oxygen, higher demand; polarisation lowers the demand after the start
    for (const band of DEPTH_BANDS) {
      for (let i = 1; i < CLIMATES.length; i++) {
        const warmer = BARE_STEEL_CURRENT_DENSITY[band][CLIMATES[i - 1]];
        const colder = BARE_STEEL_CURRENT_DENSITY[band][CLIMATES[i]];
        expect(colder.initial).toBeGreaterThanOrEqual(warmer.initial);
        expect(colder.mean).toBeGreaterThanOrEqual(warmer.mean);
      }
      for (const c of CLIMATES) {
        const d = BARE_STEEL_CURRENT_DENSITY[band][c];
        expect(d.initial).toBeGreaterThan(d.final);
        expect(d.final).toBeGreaterThan(d.mean);
      }
    }
  });

  it("agrees with the Lloyd's Register regional figures within a factor of 1.5", () => {
    // Lloyd's Register offshore-unit rules Table 4.1.1, published: North Sea south of 55N 150/80/100 mA/m2
    expect(REGIONAL_CURRENT_DENSITY_CHECK['north-sea-south-of-55n']).toEqual({ initial: 0.15, mean: 0.08, final: 0.1 });
    const dnv = BARE_STEEL_CURRENT_DENSITY['0-30'].temperate;
    const lr = REGIONAL_CURRENT_DENSITY_CHECK['north-sea-south-of-55n'];
    expect(dnv.initial / lr.initial).toBeLessThan(1.5);
    expect(dnv.initial / lr.initial).toBeGreaterThan(1 / 1.5);
  });
});

describe('coating breakdown constants', () => {
  it('spot values', () => {
    expect(COATING_CONSTANTS['0-30'].I).toEqual({ a: 0.1, b: 0.1 }); // DNV-RP-B401 (2010) Table 10-4, from memory
    expect(COATING_CONSTANTS['0-30'].II).toEqual({ a: 0.05, b: 0.025 }); // DNV-RP-B401 (2010) Table 10-4, from memory
    expect(coatingConstantsFor({ category: 'III', depthBand: '100-300' })).toEqual({ a: 0.02, b: 0.008 }); // DNV-RP-B401 (2010) Table 10-4, from memory
    expect(coatingConstantsFor({ category: 'II', depthBand: '30-100' })).toEqual({ a: 0.05, b: 0.015 }); // DNV-RP-B401 (2010) Table 10-4, from memory
  });

  it('thicker coatings break down more slowly', () => {
    // common practice: a better coating starts with less bare steel and ages more slowly
    for (const band of ['0-30', '>30'] as const) {
      expect(COATING_CONSTANTS[band].II.a).toBeLessThan(COATING_CONSTANTS[band].I.a);
      expect(COATING_CONSTANTS[band].III.b).toBeLessThan(COATING_CONSTANTS[band].II.b);
    }
  });
});

describe('anode alloys', () => {
  it('capacities and potentials', () => {
    expect(ALLOYS['al-zn-in'].capacityAhPerKg).toEqual({ seawater: 2000, sediment: 1500 }); // DNV-RP-B401 (2010) Table 10-6, from memory
    expect(ALLOYS['al-zn-in'].closedCircuitPotentialV).toEqual({ seawater: -1.05, sediment: -1.0 }); // DNV-RP-B401 (2010) Table 10-6, from memory
    expect(ALLOYS.zinc.capacityAhPerKg.seawater).toBe(780); // MIL-A-18001 data, published; DNV-RP-B401 (2010) Table 10-6
    expect(ALLOYS.zinc.closedCircuitPotentialV).toEqual({ seawater: -1.03, sediment: -0.98 }); // DNV-RP-B401 (2010) Table 10-6, from memory
    expect(ALLOYS.zinc.temperatureLimitC).toBe(50); // zinc not above about 50 C, design basis (memory)
    // MIL-HDBK-1004/10, published: magnesium practical capacity 1100-1230 Ah/kg, potential about -1.5 to -1.6 V
    expect(ALLOYS.magnesium.capacityAhPerKg.seawater).toBeGreaterThanOrEqual(1100);
    expect(ALLOYS.magnesium.capacityAhPerKg.seawater).toBeLessThanOrEqual(1230);
    expect(ALLOYS.magnesium.closedCircuitPotentialV.seawater).toBeGreaterThanOrEqual(-1.6);
    expect(ALLOYS.magnesium.closedCircuitPotentialV.seawater).toBeLessThanOrEqual(-1.5);
    expect(ALLOYS['magnesium-high-potential'].closedCircuitPotentialV.seawater).toBeCloseTo(-1.7, 9); // MIL-HDBK-1004/10, published
  });

  it('consumption rates match the trade figures', () => {
    expect(consumptionRateKgPerAYear(ALLOYS.zinc.capacityAhPerKg.seawater)).toBeCloseTo(11.2, 1); // common practice: about 11.2 kg/A-yr
    const al = consumptionRateKgPerAYear(ALLOYS['al-zn-in'].capacityAhPerKg.seawater);
    expect(al).toBeGreaterThanOrEqual(3.1); // common practice: 3.1-4.4 kg/A-yr
    expect(al).toBeLessThanOrEqual(4.4);
    expect(consumptionRateKgPerAYear(ALLOYS.magnesium.capacityAhPerKg.seawater)).toBeCloseTo(8, 0); // common practice: about 8 kg/A-yr
  });

  it('densities', () => {
    expect(ALLOYS['al-zn-in'].densityKgM3).toBeGreaterThanOrEqual(2700); // common practice: 2700-2800 kg/m3
    expect(ALLOYS['al-zn-in'].densityKgM3).toBeLessThanOrEqual(2800);
    expect(ALLOYS.zinc.densityKgM3).toBe(7100); // common practice
    expect(ALLOYS.magnesium.densityKgM3).toBe(1770); // common practice
  });

  it('every anode alloy is more active than the steel protection criterion', () => {
    // common practice: zinc, aluminium and magnesium are more active than steel and protect it
    for (const alloy of Object.values(ALLOYS)) {
      expect(alloy.closedCircuitPotentialV.seawater).toBeLessThan(MINIMUM_PROTECTION_POTENTIAL.steel.valueV);
    }
  });
});

describe('utilisation factors', () => {
  it('spot values', () => {
    expect(UTILISATION_FACTORS['long-slender-standoff'].factor).toBe(0.9); // DNV-RP-B401 (2010) Table 10-8, published
    expect(UTILISATION_FACTORS['bracelet-half-shell'].factor).toBe(0.8); // DNV-RP-B401 (2010) Table 10-8, published
    expect(UTILISATION_FACTORS['bracelet-segmented'].factor).toBe(0.75); // DNV-RP-B401 (2010) Table 10-8, published
    expect(UTILISATION_FACTORS['long-flush'].factor).toBe(0.85); // DNV-RP-B401 (2010) Table 10-8, from memory
  });

  it('picks the row from the shape', () => {
    expect(utilisationFactorFor({ kind: 'slender-standoff', lengthM: 2, radiusM: 0.1 })).toBe(0.9); // L >= 4r, DNV-RP-B401 (2010) Table 10-8, published
    expect(utilisationFactorFor({ kind: 'slender-standoff', lengthM: 0.3, radiusM: 0.1 })).toBe(0.85); // L < 4r, from memory
    expect(utilisationFactorFor({ kind: 'long-flush', lengthM: 0.3, widthM: 0.15 })).toBe(0.8); // too short: short flush, from memory
    expect(utilisationFactorFor({ kind: 'bracelet', exposedAreaM2: 0.5, segmented: true })).toBe(0.75); // published
  });
});

describe('environment', () => {
  it('seawater resistivity by climate and sediment', () => {
    expect(resistivityFor('tropical')).toBe(0.15); // DNV-RP-B401 (2010) default, from memory
    expect(resistivityFor('arctic')).toBe(0.3); // DNV-RP-B401 (2010) default, from memory
    expect(resistivityFor('sediment')).toBeGreaterThanOrEqual(1.0); // sediment about 1.0-1.5 ohm m, from memory
    expect(resistivityFor('sediment')).toBeLessThanOrEqual(1.5);
  });

  it('the sub-tropical default is near the measured conductivity of seawater at 17 C', () => {
    // published: seawater at 17 C conducts about 4.5-4.8 S/m, about 0.21 ohm m
    expect(Math.abs(resistivityFor(climateFromTemperature(17)) - 0.21)).toBeLessThanOrEqual(0.015);
  });

  it('climate bands from temperature', () => {
    // DNV-RP-B401 (2010) climatic regions, from memory: tropical > 20 C, sub-tropical 12-20, temperate 7-11, arctic < 7
    expect(climateFromTemperature(25)).toBe('tropical');
    expect(climateFromTemperature(20)).toBe('sub-tropical');
    expect(climateFromTemperature(12)).toBe('sub-tropical');
    expect(climateFromTemperature(11.5)).toBe('temperate'); // gap 11-12 C: colder band (our choice)
    expect(climateFromTemperature(7)).toBe('temperate');
    expect(climateFromTemperature(6.9)).toBe('arctic');
  });

  it('depth bands', () => {
    expect(depthBandFromDepth(30)).toBe('0-30');
    expect(depthBandFromDepth(30.1)).toBe('30-100');
    expect(depthBandFromDepth(300)).toBe('100-300');
    expect(depthBandFromDepth(450)).toBe('300+');
  });

  it('protection and over-protection limits', () => {
    expect(MINIMUM_PROTECTION_POTENTIAL.steel.valueV).toBe(-0.8); // DNV-RP-B401 (2010) and MIL-HDBK-1004/10, published
    expect(ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V).toBe(-0.9); // published, sulphate-reducing bacteria
    expect(MINIMUM_PROTECTION_POTENTIAL.aluminium.valueV).toBe(-0.9); // ABYC E-2, published
    expect(MINIMUM_PROTECTION_POTENTIAL['copper-alloy'].valueV).toBe(-0.55); // bronze, published (trade)
    expect(MINIMUM_PROTECTION_POTENTIAL.stainless.valueV).toBe(-0.75); // published (trade)
    expect(OVER_PROTECTION_LIMIT['high-strength-steel']?.valueV).toBe(-0.83); // DNV-RP-B401 (2010), from memory
    expect(OVER_PROTECTION_LIMIT.aluminium?.valueV).toBe(-1.1); // ABYC E-2, published
    expect(OVER_PROTECTION_LIMIT.steel?.valueV).toBe(-1.05); // ABYC E-2 practice, published
  });
});

describe('harbour and hull values', () => {
  it('MIL-HDBK-1004/10 Table 1 ranges', () => {
    expect(HARBOUR_BARE_STEEL_RANGES['still-seawater']).toEqual({ minAPerM2: 0.011, maxAPerM2: 0.032 }); // MIL-HDBK-1004/10 Table 1, published
    expect(HARBOUR_BARE_STEEL_RANGES['moving-seawater'].maxAPerM2).toBeCloseTo(0.27, 9); // MIL-HDBK-1004/10 Table 1, published
  });

  it('worked-example design values in SI', () => {
    expect(milliampsPerFt2ToAPerM2(1)).toBeCloseTo(0.010764, 6); // 1 mA/ft2 = 10.764 mA/m2 (design basis)
    expect(HARBOUR_DESIGN_VALUES['h-pile-water'].aPerM2).toBeCloseTo(0.021528, 6); // MIL-HDBK-1004/10 example, 2 mA/ft2, published
    expect(HARBOUR_DESIGN_VALUES['sheet-pile-mud'].aPerM2).toBeCloseTo(0.0021528, 7); // MIL-HDBK-1004/10 example, 0.2 mA/ft2, published
  });

  it('hull fittings', () => {
    expect(HULL_CURRENT_DENSITY['copper-alloy-propeller']).toMatchObject({ minAPerM2: 0.45, maxAPerM2: 0.5 }); // Japanese ship-equipment guide, published
    expect(HULL_CURRENT_DENSITY['stainless-shaft']).toMatchObject({ minAPerM2: 0.1, maxAPerM2: 0.12 }); // Japanese ship-equipment guide, published
    expect(HULL_CURRENT_DENSITY['coated-hull-excellent-yearly-docking'].minAPerM2).toBe(0.0045); // Japanese ship-equipment guide, published
    expect(HULL_CURRENT_DENSITY['coated-hull-good-paint'].maxAPerM2).toBe(0.02); // common practice
  });
});
