import { describe, expect, it } from 'vitest';
import { seawaterResistivityOhmM } from '@/lib/cp';
import { BAND_TEMPERATURE_C, buildDesignJob, resolveEnvironment } from '@/lib/design/build-design-input';
import type { DeskInputs } from '@/lib/schemas/design';
import { fieldOf } from '../cp/helpers';
import { JETTY, WORKBOAT, size, structureInputs, vesselInputs } from './desk-inputs';

const round3 = (x: number) => Math.round(x * 1000) / 1000;
const inputs = (change: Partial<DeskInputs> = {}): DeskInputs => vesselInputs(WORKBOAT, change);

describe('resistivity from the water unless measured', () => {
  it('full-strength seawater at the band’s mid temperature when neither salinity nor temperature is given', () => {
    for (const climate of ['tropical', 'sub-tropical', 'temperate', 'arctic'] as const) {
      const env = resolveEnvironment(inputs({ climate, resistivityOhmM: 0.3 }));
      // PSS-78 (UNESCO 44, 1983) at 35 PSU, common practice for seawater
      expect(env.resistivityOhmM).toBe(round3(seawaterResistivityOhmM({ temperatureC: BAND_TEMPERATURE_C[climate], salinityPsu: 35 })));
      expect(env.resistivitySource).toMatch(/PSS-78 .*mid-band.*35 PSU.*full-strength seawater assumed/);
    }
    // bands: tropical > 20, sub-tropical 12-20, temperate 7-11, arctic < 7 C (design basis); mid-band values common practice
    expect(BAND_TEMPERATURE_C).toEqual({ tropical: 25, 'sub-tropical': 16, temperate: 9, arctic: 4 });
  });

  it('lands on the design basis’s figures for 35 PSU: about 0.26 Ω·m at 10 °C and 0.21 at 20 °C', () => {
    // computed from the scale (design basis): 0.34 at 0, 0.26 at 10, 0.21 at 20, 0.17 at 30 C
    expect(resolveEnvironment(inputs({ temperatureC: 10 })).resistivityOhmM).toBeCloseTo(0.26, 2);
    expect(resolveEnvironment(inputs({ temperatureC: 20 })).resistivityOhmM).toBeCloseTo(0.21, 2);
    expect(resolveEnvironment(inputs({ temperatureC: 10 })).resistivitySource).not.toContain('mid-band');
  });

  it('by zone where the anodes sit in water of different temperatures: the highest resistivity sizes them', () => {
    const base = inputs({ temperatureC: 20 });
    const surfaces = base.surfaces.map((s, i) => (i === 0 ? { ...s, temperatureC: 4 } : s));
    const env = resolveEnvironment({ ...base, surfaces });
    // PSS-78 at 35 PSU: colder water is more resistive (design basis: 0.34 at 0 C, 0.21 at 20 C, computed from the scale)
    expect(env.resistivityOhmM).toBe(round3(seawaterResistivityOhmM({ temperatureC: 4, salinityPsu: 35 })));
    expect(env.resistivityOhmM).toBeGreaterThan(resolveEnvironment(base).resistivityOhmM);
    expect(env.resistivitySource).toMatch(new RegExp(`by zone .*${surfaces[0].name} .* at 4 °C.*the highest \\(${surfaces[0].name}\\) sizes the anodes`));
    // a mud zone's temperature never governs: no anode sits there
    const jetty = structureInputs(JETTY, { temperatureC: 15 });
    const coldMud = jetty.surfaces.map((s) => (s.kind === 'pile-mud' ? { ...s, temperatureC: 2 } : s));
    expect(resolveEnvironment({ ...jetty, surfaces: coldMud }).resistivityOhmM).toBe(resolveEnvironment(jetty).resistivityOhmM);
  });

  it('brackish water at its salinity: about 1.4 Ω·m at 5 PSU and 15 °C', () => {
    // computed from PSS-78 (design basis)
    const env = resolveEnvironment(inputs({ water: 'brackish', salinityPsu: 5, temperatureC: 15 }));
    expect(env.resistivityOhmM).toBeCloseTo(1.4, 1);
    expect(env.resistivitySource).toContain('5 PSU');
  });

  it('a measured value overrides the water', () => {
    const env = resolveEnvironment(inputs({ resistivitySource: 'measured', resistivityOhmM: 0.31, temperatureC: 25 }));
    expect(env).toMatchObject({ resistivityOhmM: 0.31, resistivitySource: 'measured (entered)' });
    expect(buildDesignJob(inputs({ water: 'fresh', resistivitySource: 'measured', resistivityOhmM: 45 })).resistivityOhmM).toBe(45);
  });

  it('refuses brackish water without a salinity (naming salinityPsu) and fresh water from the water (naming resistivityOhmM)', () => {
    expect(fieldOf(() => resolveEnvironment(inputs({ water: 'brackish', salinityPsu: null })))).toBe('salinityPsu');
    // fresh water 10-100+ ohm m: measure it (design basis, common practice)
    expect(fieldOf(() => resolveEnvironment(inputs({ water: 'fresh' })))).toBe('resistivityOhmM');
    expect(fieldOf(() => buildDesignJob(inputs({ water: 'fresh', salinityPsu: 0.3 })))).toBe('resistivityOhmM');
  });

  it('refuses a salinity below the scale’s 2 PSU rather than extrapolating', () => {
    // PSS-78 valid 2-42 PSU (UNESCO 1981, design basis)
    expect(fieldOf(() => resolveEnvironment(inputs({ water: 'brackish', salinityPsu: 1 })))).toBe('salinityPsu');
  });
});

describe('protective potential from the criterion', () => {
  it('steel -0.80 V, anaerobic steel -0.90 V, aluminium -0.90 V vs Ag/AgCl/seawater', () => {
    // -0.80 V aerobic and -0.90 V with sulphate-reducing bacteria (DNV-RP-B401; MIL-HDBK-1004/10, published)
    expect(resolveEnvironment(inputs()).protectivePotentialV).toBe(-0.8);
    const anaerobic = resolveEnvironment(inputs({ anaerobic: true }));
    expect(anaerobic.protectivePotentialV).toBe(-0.9);
    expect(anaerobic.potentialSource).toContain('anaerobic');
    expect(resolveEnvironment(inputs({ protectedMetal: 'high-strength-steel', anaerobic: true })).protectivePotentialV).toBe(-0.9);
    // aluminium -0.90 V (ABYC E-2, published)
    expect(resolveEnvironment(inputs({ protectedMetal: 'aluminium', hullMaterial: 'aluminium' })).protectivePotentialV).toBe(-0.9);
  });

  it('the entered value stands when the engineer chose to enter it', () => {
    expect(resolveEnvironment(inputs({ potentialSource: 'entered', protectivePotentialV: -0.85, anaerobic: true }))).toMatchObject({ protectivePotentialV: -0.85, potentialSource: 'entered' });
  });

  it('an anaerobic case sized at -0.90 V needs more anodes than at -0.80 V (less driving voltage)', () => {
    // Al-Zn-In -1.05 V (DNV-RP-B401 (2010) Table 10-6, from memory): driving 0.25 V falls to 0.15 V
    for (const base of [vesselInputs(WORKBOAT), structureInputs(JETTY, { designLifeYears: 5 })]) {
      const aerobic = size(base);
      const anaerobic = size({ ...base, anaerobic: true });
      expect(aerobic.protectivePotentialV).toBe(-0.8);
      expect(anaerobic.protectivePotentialV).toBe(-0.9);
      expect(anaerobic.drivingVoltageV).toBeCloseTo(0.15, 9);
      expect(anaerobic.perAnode.initialOutputA).toBeCloseTo((aerobic.perAnode.initialOutputA * 0.15) / 0.25, 9); // Ia = (Ec - Ea)/Ra
      expect(anaerobic.anodesToFit).toBeGreaterThan(aerobic.anodesToFit);
      expect(anaerobic.requiredNetMassKg).toBeCloseTo(aerobic.requiredNetMassKg, 9); // the mass does not depend on the potential
    }
  });
});
