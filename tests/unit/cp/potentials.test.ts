import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  CpInputError,
  FARADAY_C_PER_MOL,
  GAS_CONSTANT_J_PER_MOL_K,
  REFERENCE_ELECTRODES,
  agAgClSeawaterShiftV,
  convertPotential,
  nernstSlopeV,
  type ReferenceElectrode,
} from '@/lib/cp';
import { fieldOf } from './helpers';

const ELECTRODES = Object.keys(REFERENCE_ELECTRODES) as ReferenceElectrode[];

describe('reference electrode conversion', () => {
  it('holds the trade equivalence of the steel criterion within 0.02 V', () => {
    // common practice: -0.80 V Ag/AgCl/seawater = about -0.85 V CSE = about -0.78 V SCE = about +0.25 V vs zinc
    const v = (to: ReferenceElectrode) => convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to });
    expect(Math.abs(v('cse') - -0.85)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(v('sce') - -0.78)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(v('zinc') - 0.25)).toBeLessThanOrEqual(0.02);
  });

  it('keeps the 50 mV CSE / Ag-AgCl difference of European practice', () => {
    // common practice: 50 mV between CSE and Ag/AgCl/seawater (some use 60 mV)
    expect(convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to: 'cse' })).toBeCloseTo(-0.85, 9);
  });

  it('uses the tabulated SHE offsets', () => {
    expect(convertPotential({ valueV: 0, from: 'sce', to: 'she' })).toBeCloseTo(0.241, 9); // SCE +0.241 V vs SHE, standard electrode tables (design basis), published
    expect(convertPotential({ valueV: 0, from: 'ag-agcl-saturated-kcl', to: 'she' })).toBeCloseTo(0.197, 9); // Ag/AgCl saturated KCl +0.197 V vs SHE, standard electrode tables (design basis), published
    expect(convertPotential({ valueV: 0, from: 'ag-agcl-seawater', to: 'she' })).toBeCloseTo(0.25, 9); // Ag/AgCl in seawater about +0.25 V vs SHE, from memory
    expect(convertPotential({ valueV: 0, from: 'cse', to: 'she' })).toBeCloseTo(0.3, 9); // common practice: +0.30 V keeps the 50 mV rule (strictly +0.316 V)
  });

  it('puts the galvanic series in line with the DNV anode potentials', () => {
    // ASTM G82-type galvanic series, published: zinc -1.03 V vs SCE in flowing seawater;
    // DNV-RP-B401 (2010) Table 10-6 zinc -1.03 V vs Ag/AgCl/seawater (from memory): within 0.02 V once converted
    expect(Math.abs(convertPotential({ valueV: -1.03, from: 'sce', to: 'ag-agcl-seawater' }) - -1.03)).toBeLessThanOrEqual(0.02);
    // carbon steel -0.61 V vs SCE (same series): freely corroding steel is less negative than the -0.80 V criterion
    expect(convertPotential({ valueV: -0.61, from: 'sce', to: 'ag-agcl-seawater' })).toBeGreaterThan(-0.8);
  });

  it('round-trips between every pair', () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 3, noNaN: true }), fc.constantFrom(...ELECTRODES), fc.constantFrom(...ELECTRODES), (valueV, from, to) => {
        const there = convertPotential({ valueV, from, to });
        expect(convertPotential({ valueV: there, from: to, to: from })).toBeCloseTo(valueV, 12);
      }),
    );
  });

  it('rejects an unknown electrode and a non-finite value', () => {
    expect(() => convertPotential({ valueV: -0.8, from: 'calomel' as ReferenceElectrode, to: 'she' })).toThrow(CpInputError);
    expect(fieldOf(() => convertPotential({ valueV: -0.8, from: 'calomel' as ReferenceElectrode, to: 'she' }))).toBe('from');
    expect(fieldOf(() => convertPotential({ valueV: Number.NaN, from: 'sce', to: 'she' }))).toBe('valueV');
  });
});

describe('chloride correction of the Ag/AgCl/seawater electrode', () => {
  it('uses the Nernst slope of 0.05916 V per decade at 25 C', () => {
    // Nernst equation, RT ln10 / F at 298.15 K, with R and F from CODATA 2018 (exact since the SI 2019): 0.05916 V
    expect(GAS_CONSTANT_J_PER_MOL_K).toBeCloseTo(8.314462618, 9); // CODATA 2018
    expect(FARADAY_C_PER_MOL).toBeCloseTo(96485.33212, 5); // CODATA 2018
    expect(Math.abs(nernstSlopeV(25) - 0.05916)).toBeLessThanOrEqual(5e-6);
    expect(nernstSlopeV(0)).toBeLessThan(nernstSlopeV(25)); // proportional to absolute temperature
    expect(fieldOf(() => nernstSlopeV(-300))).toBe('temperatureC');
  });

  it('a tenfold dilution makes the corrected reading 59.2 mV less negative than the raw one', () => {
    // Nernst (design basis, Water): with a tenth of the chloride the electrode is 59 mV more positive, so the
    // structure reads 59 mV more negative against it than against the electrode in seawater.
    const raw = -0.85;
    const corrected = convertPotential({ valueV: raw, from: 'ag-agcl-seawater', to: 'ag-agcl-seawater', salinityPsu: 3.5 });
    expect(corrected).toBeGreaterThan(raw);
    expect(Math.abs((corrected - raw) * 1000 - 59.2)).toBeLessThanOrEqual(0.05);
    expect(agAgClSeawaterShiftV(3.5)).toBeCloseTo(nernstSlopeV(25), 12);
    // the same correction carries through to every other electrode
    for (const to of ELECTRODES) {
      const plain = convertPotential({ valueV: raw, from: 'ag-agcl-seawater', to });
      expect(convertPotential({ valueV: raw, from: 'ag-agcl-seawater', to, salinityPsu: 3.5 }) - plain).toBeCloseTo(nernstSlopeV(25), 12);
    }
  });

  it('a higher salinity moves the reading the other way', () => {
    expect(agAgClSeawaterShiftV(40)).toBeLessThan(0);
    expect(convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to: 'ag-agcl-seawater', salinityPsu: 40 })).toBeLessThan(-0.8);
  });

  it('no salinity, or full-strength seawater, gives no correction', () => {
    for (const to of ELECTRODES) {
      const plain = convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to });
      expect(convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to, salinityPsu: 35 })).toBeCloseTo(plain, 12);
      expect(convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to, salinityPsu: undefined })).toBe(plain);
    }
  });

  it('keeps the trade equivalence of the steel criterion in full-strength seawater', () => {
    // common practice: -0.80 V Ag/AgCl/seawater = about -0.85 V CSE = about -0.78 V SCE (within 0.02 V)
    const v = (to: ReferenceElectrode) => convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to, salinityPsu: 35 });
    expect(Math.abs(v('cse') - -0.85)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(v('sce') - -0.78)).toBeLessThanOrEqual(0.02);
  });

  it('corrects only readings taken against the Ag/AgCl/seawater electrode', () => {
    for (const from of ELECTRODES.filter((e) => e !== 'ag-agcl-seawater')) {
      expect(convertPotential({ valueV: -0.85, from, to: 'ag-agcl-seawater', salinityPsu: 3.5 })).toBe(convertPotential({ valueV: -0.85, from, to: 'ag-agcl-seawater' }));
    }
  });

  it('a corrected reading converts back to the calibrated scale through any electrode', () => {
    fc.assert(
      fc.property(fc.double({ min: -2, max: 0.5, noNaN: true }), fc.double({ min: 0.5, max: 42, noNaN: true }), fc.constantFrom(...ELECTRODES), (valueV, salinityPsu, via) => {
        const there = convertPotential({ valueV, from: 'ag-agcl-seawater', to: via, salinityPsu });
        const back = convertPotential({ valueV: there, from: via, to: 'ag-agcl-seawater' });
        expect(back).toBeCloseTo(valueV + agAgClSeawaterShiftV(salinityPsu), 12);
      }),
    );
  });

  it('refuses a salinity outside the range of the correction, naming it', () => {
    for (const salinityPsu of [0.2, 0, -1, 43, Number.NaN]) {
      expect(() => convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to: 'cse', salinityPsu })).toThrow(CpInputError);
      expect(fieldOf(() => convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to: 'cse', salinityPsu }))).toBe('salinityPsu');
    }
  });
});
