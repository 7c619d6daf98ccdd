import { describe, expect, it } from 'vitest';
import {
  CpInputError,
  PSS78_REFERENCE_CONDUCTIVITY_S_PER_M,
  chlorinityGPerKg,
  practicalSalinity,
  seawaterConductivitySPerM,
  seawaterResistivityOhmM,
  waterTypeFromSalinity,
} from '@/lib/cp';
import { fieldOf } from './helpers';

const grid = (from: number, to: number, step: number): number[] => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

describe('seawater conductivity and resistivity (PSS-78 at zero pressure)', () => {
  it('gives the defining conductivity at 35 PSU and 15 C', () => {
    // UNESCO 1981, definition of PSS-78: C(35, 15 C, 0) = 42.914 mS/cm = 4.2914 S/m, so 0.2330 ohm m.
    // (The published r_t coefficients give r_t(15) = 1 + 2e-9, hence the last digits.)
    const c = seawaterConductivitySPerM({ temperatureC: 15, salinityPsu: 35 });
    expect(Math.abs(c * 10 - 42.914)).toBeLessThanOrEqual(1e-4); // S/m -> mS/cm
    expect(Math.abs(seawaterResistivityOhmM({ temperatureC: 15, salinityPsu: 35 }) - 0.233)).toBeLessThanOrEqual(1e-4);
    expect(PSS78_REFERENCE_CONDUCTIVITY_S_PER_M).toBe(4.2914); // UNESCO 1981, definition of PSS-78
  });

  it('round-trips S -> C -> S within 1e-6 PSU over the whole range', () => {
    let worst = 0;
    for (const salinityPsu of grid(2, 42, 0.5)) {
      for (const temperatureC of grid(-2, 35, 0.5)) {
        const conductivitySPerM = seawaterConductivitySPerM({ temperatureC, salinityPsu });
        worst = Math.max(worst, Math.abs(practicalSalinity({ conductivitySPerM, temperatureC }) - salinityPsu));
      }
    }
    expect(worst).toBeLessThanOrEqual(1e-6);
  });

  it.each([
    [0, 0.34],
    [10, 0.26],
    [20, 0.21],
    [30, 0.17],
  ])('35 PSU at %s C is about %s ohm m', (temperatureC, rho) => {
    // computed from the scale, design basis (Water): 0.34 / 0.26 / 0.21 / 0.17 ohm m at 0 / 10 / 20 / 30 C
    expect(Math.abs(seawaterResistivityOhmM({ temperatureC, salinityPsu: 35 }) - rho)).toBeLessThanOrEqual(0.01);
  });

  it('brackish water at 5 PSU and 15 C is about 1.4 ohm m', () => {
    // computed from the scale, design basis (Water): about 1.4 ohm m
    expect(Math.abs(seawaterResistivityOhmM({ temperatureC: 15, salinityPsu: 5 }) - 1.4)).toBeLessThanOrEqual(0.1);
  });

  it('agrees with the published conductivity of seawater at 17 C', () => {
    // design basis (Environment), published: seawater at 17 C conducts about 4.5-4.8 S/m, about 0.21 ohm m
    expect(seawaterConductivitySPerM({ temperatureC: 17, salinityPsu: 35 })).toBeCloseTo(4.5, 1);
    expect(Math.abs(seawaterResistivityOhmM({ temperatureC: 17, salinityPsu: 35 }) - 0.21)).toBeLessThanOrEqual(0.015);
  });

  it('conductivity rises with salinity and with temperature', () => {
    for (const t of grid(-2, 35, 1)) {
      for (const s of grid(2, 41, 1)) {
        expect(seawaterConductivitySPerM({ temperatureC: t, salinityPsu: s + 1 })).toBeGreaterThan(seawaterConductivitySPerM({ temperatureC: t, salinityPsu: s }));
        if (t < 35) expect(seawaterConductivitySPerM({ temperatureC: t + 1, salinityPsu: s })).toBeGreaterThan(seawaterConductivitySPerM({ temperatureC: t, salinityPsu: s }));
      }
    }
  });

  it('accepts the edges of the range', () => {
    for (const [temperatureC, salinityPsu] of [[-2, 2], [-2, 42], [35, 2], [35, 42]]) {
      expect(Number.isFinite(seawaterResistivityOhmM({ temperatureC, salinityPsu }))).toBe(true);
    }
  });

  it.each([
    ['salinity below 2 PSU', { temperatureC: 15, salinityPsu: 1.9 }, 'salinityPsu'],
    ['salinity above 42 PSU', { temperatureC: 15, salinityPsu: 42.1 }, 'salinityPsu'],
    ['salinity NaN', { temperatureC: 15, salinityPsu: Number.NaN }, 'salinityPsu'],
    ['temperature below -2 C', { temperatureC: -2.1, salinityPsu: 35 }, 'temperatureC'],
    ['temperature above 35 C', { temperatureC: 35.1, salinityPsu: 35 }, 'temperatureC'],
    ['temperature not a number', { temperatureC: '15' as unknown as number, salinityPsu: 35 }, 'temperatureC'],
  ])('refuses %s, naming the field', (_name, input, field) => {
    expect(() => seawaterResistivityOhmM(input)).toThrow(CpInputError);
    expect(fieldOf(() => seawaterResistivityOhmM(input))).toBe(field);
    expect(fieldOf(() => seawaterConductivitySPerM(input))).toBe(field);
  });

  it('refuses a conductivity whose salinity falls outside the scale', () => {
    expect(fieldOf(() => practicalSalinity({ conductivitySPerM: 0.05, temperatureC: 15 }))).toBe('conductivitySPerM'); // fresh water, about 0.3 PSU
    expect(fieldOf(() => practicalSalinity({ conductivitySPerM: 9, temperatureC: 15 }))).toBe('conductivitySPerM'); // beyond 42 PSU
    expect(fieldOf(() => practicalSalinity({ conductivitySPerM: 0, temperatureC: 15 }))).toBe('conductivitySPerM');
    expect(fieldOf(() => practicalSalinity({ conductivitySPerM: 4.2914, temperatureC: 40 }))).toBe('temperatureC');
  });
});

describe('water type from salinity', () => {
  it.each([
    [0, 'fresh'],
    [0.49, 'fresh'],
    [0.5, 'brackish'],
    [5, 'brackish'],
    [29.9, 'brackish'],
    [30, 'seawater'],
    [35, 'seawater'],
    [45, 'seawater'],
  ] as const)('%s PSU is %s', (psu, type) => {
    // common practice (Venice system classification): fresh < 0.5, brackish 0.5-30, seawater from 30 PSU
    expect(waterTypeFromSalinity(psu)).toBe(type);
  });

  it('refuses a negative or non-numeric salinity', () => {
    expect(fieldOf(() => waterTypeFromSalinity(-1))).toBe('salinityPsu');
    expect(fieldOf(() => waterTypeFromSalinity(Number.NaN))).toBe('salinityPsu');
  });

  it('gives the chlorinity of standard seawater', () => {
    // S = 1.80655 Cl (UNESCO 1969 relation, kept by PSS-78), from memory: Cl = 19.374 g/kg at 35 PSU
    expect(chlorinityGPerKg(35)).toBeCloseTo(19.374, 3);
    expect(fieldOf(() => chlorinityGPerKg(0))).toBe('salinityPsu');
  });
});
