import { describe, expect, it } from 'vitest';
import {
  CpInputError,
  anodeCurrentOutputA,
  anodeResistanceOhm,
  coatingBreakdown,
  designAnodeSystem,
  distributeAnodes,
  netAnodeMassKg,
  surfaceCurrentDemand,
  wettedSurfaceDennyMumford,
  type DesignInput,
} from '@/lib/cp';
import { cleanDesign, fieldOf } from './helpers';

/** The clean design with one change applied (deep enough for these cases). */
function withChange(change: (d: DesignInput & Record<string, unknown>) => void): DesignInput {
  const d = structuredClone(cleanDesign()) as DesignInput & Record<string, unknown>;
  change(d);
  return d;
}

const cases: Array<[string, (d: any) => void, string]> = [
  ['negative area', (d) => (d.surfaces = [d.surfaces[0], d.surfaces[1], { ...d.surfaces[0], areaM2: -3 }]), 'surfaces[2].areaM2'],
  ['NaN area', (d) => (d.surfaces[1].areaM2 = Number.NaN), 'surfaces[1].areaM2'],
  ['infinite area', (d) => (d.surfaces[0].areaM2 = Number.POSITIVE_INFINITY), 'surfaces[0].areaM2'],
  ['string area', (d) => (d.surfaces[0].areaM2 = '12'), 'surfaces[0].areaM2'],
  ['NaN mean current density', (d) => (d.surfaces[0].currentDensity.mean = Number.NaN), 'surfaces[0].currentDensity.mean'],
  ['negative coating b', (d) => (d.surfaces[1].coating = { a: 0.05, b: -0.01 }), 'surfaces[1].coating.b'],
  ['unknown coating', (d) => (d.surfaces[1].coating = 'painted'), 'surfaces[1].coating'],
  ['missing surface name', (d) => delete d.surfaces[0].name, 'surfaces[0].name'],
  ['unknown drain', (d) => (d.surfaces[0].drainsCurrent = 'titanium'), 'surfaces[0].drainsCurrent'],
  ['empty surfaces', (d) => (d.surfaces = []), 'surfaces'],
  ['surfaces not a list', (d) => (d.surfaces = {}), 'surfaces'],
  ['utilisation 0', (d) => (d.anode.utilisationFactor = 0), 'anode.utilisationFactor'],
  ['utilisation above 1', (d) => (d.anode.utilisationFactor = 1.2), 'anode.utilisationFactor'],
  ['utilisation NaN', (d) => (d.anode.utilisationFactor = Number.NaN), 'anode.utilisationFactor'],
  ['design life 0', (d) => (d.designLifeYears = 0), 'designLifeYears'],
  ['design life negative', (d) => (d.designLifeYears = -5), 'designLifeYears'],
  ['design life infinite', (d) => (d.designLifeYears = Number.POSITIVE_INFINITY), 'designLifeYears'],
  ['resistivity 0', (d) => (d.resistivityOhmM = 0), 'resistivityOhmM'],
  ['resistivity negative', (d) => (d.resistivityOhmM = -0.3), 'resistivityOhmM'],
  ['net mass 0', (d) => (d.anode.netMassKg = 0), 'anode.netMassKg'],
  ['gross below net', (d) => (d.anode.grossMassKg = 100), 'anode.grossMassKg'],
  ['capacity NaN', (d) => (d.anode.capacityAhPerKg = Number.NaN), 'anode.capacityAhPerKg'],
  ['anode potential infinite', (d) => (d.anode.potentialV = Number.NEGATIVE_INFINITY), 'anode.potentialV'],
  ['capacity above aluminium by Faraday', (d) => (d.anode.capacityAhPerKg = 3000), 'anode.capacityAhPerKg'], // Al 2980 Ah/kg, computed from Faraday's law
  ['zinc capacity of aluminium', (d) => (d.anode = { ...d.anode, alloy: 'zinc', potentialV: -1.03, capacityAhPerKg: 2000 }), 'anode.capacityAhPerKg'], // Zn 820 Ah/kg, computed from Faraday's law
  ['anode potential in mV', (d) => (d.anode.potentialV = -1050), 'anode.potentialV'],
  ['anode potential without its sign', (d) => (d.anode.potentialV = 1.05), 'anode.potentialV'],
  ['anode potential beyond magnesium', (d) => (d.anode.potentialV = -1.85), 'anode.potentialV'],
  ['anode not more active', (d) => (d.anode.potentialV = -0.75), 'anode.potentialV'],
  ['anode equal to the protective potential', (d) => (d.anode.potentialV = -0.8), 'anode.potentialV'],
  ['protective potential NaN', (d) => (d.protectivePotentialV = Number.NaN), 'protectivePotentialV'],
  ['unknown alloy', (d) => (d.anode.alloy = 'lithium'), 'anode.alloy'],
  ['unknown metal', (d) => (d.protectedMetal = 'titanium'), 'protectedMetal'],
  ['negative length', (d) => (d.anode.shape.lengthM = -2), 'anode.shape.lengthM'],
  ['unknown shape', (d) => (d.anode.shape = { kind: 'torus' }), 'anode.shape.kind'],
  ['core larger than anode', (d) => (d.anode.shape.coreRadiusM = 0.2), 'anode.shape.coreRadiusM'],
  ['negative stand-off', (d) => (d.anode.shape.standoffM = -0.1), 'anode.shape.standoffM'],
  ['rated output 0', (d) => (d.anode.ratedOutputA = 0), 'anode.ratedOutputA'],
  ['temperature NaN', (d) => (d.environment.temperatureC = Number.NaN), 'environment.temperatureC'],
  ['unknown water', (d) => (d.environment.water = 'lake'), 'environment.water'],
  ['docking interval 0', (d) => (d.nextDockingYears = 0), 'nextDockingYears'],
  ['fractional installed count', (d) => (d.installedCount = 2.5), 'installedCount'],
  ['zero demand everywhere', (d) => d.surfaces.forEach((s: any) => (s.areaM2 = 0)), 'surfaces'],
];

describe('designAnodeSystem rejects invalid input naming the field', () => {
  it.each(cases)('%s', (_name, change, field) => {
    const input = withChange(change);
    expect(() => designAnodeSystem(input)).toThrow(CpInputError);
    expect(fieldOf(() => designAnodeSystem(input))).toBe(field);
  });

  it('extreme but finite values that overflow throw instead of returning Infinity', () => {
    expect(fieldOf(() => designAnodeSystem(withChange((d: any) => (d.surfaces[0].areaM2 = 1e308))))).toBe('surfaces');
    expect(fieldOf(() => designAnodeSystem(withChange((d: any) => (d.anode.shape.lengthM = 1e-320))))).toBe('anode.shape');
    expect(fieldOf(() => surfaceCurrentDemand({ areaM2: 1e308, currentDensity: { initial: 10, mean: 10, final: 10 }, coating: 'bare', designLifeYears: 1 }))).toBe('areaM2');
  });

  it('the clean input itself is accepted', () => {
    expect(designAnodeSystem(cleanDesign()).anodeCount).toBeGreaterThan(0);
  });

  it('the error is an Error with a name and a message that names the field', () => {
    try {
      designAnodeSystem(withChange((d: any) => (d.surfaces[0].areaM2 = -1)));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(Error);
      expect((e as Error).name).toBe('CpInputError');
      expect((e as Error).message).toContain('surfaces[0].areaM2');
    }
  });

  it('magnesium on an aluminium hull throws without the override', () => {
    const input = withChange((d: any) => {
      d.hullMaterial = 'aluminium';
      d.environment.water = 'brackish';
      d.anode = { ...d.anode, alloy: 'magnesium', potentialV: -1.5, capacityAhPerKg: 1100 };
    });
    expect(fieldOf(() => designAnodeSystem(input))).toBe('anode.alloy');
    expect(() => designAnodeSystem({ ...input, allowMagnesiumOnAluminium: true })).not.toThrow();
  });
});

describe('the building blocks reject invalid input naming the field', () => {
  it.each([
    ['coating a', () => coatingBreakdown({ a: -0.1, b: 0.02, designLifeYears: 10 }), 'a'],
    ['coating life', () => coatingBreakdown({ a: 0.1, b: 0.02, designLifeYears: 0 }), 'designLifeYears'],
    ['demand area', () => surfaceCurrentDemand({ areaM2: Number.NaN, currentDensity: { initial: 0.1, mean: 0.1, final: 0.1 }, coating: 'bare', designLifeYears: 5 }), 'areaM2'],
    ['demand density', () => surfaceCurrentDemand({ areaM2: 1, currentDensity: { initial: 0.1, mean: -1, final: 0.1 }, coating: 'bare', designLifeYears: 5 }), 'currentDensity.mean'],
    ['mass utilisation', () => netAnodeMassKg({ meanCurrentA: 1, designLifeYears: 1, utilisationFactor: 0, capacityAhPerKg: 2000 }), 'utilisationFactor'],
    ['mass capacity', () => netAnodeMassKg({ meanCurrentA: 1, designLifeYears: 1, utilisationFactor: 0.9, capacityAhPerKg: 0 }), 'capacityAhPerKg'],
    ['resistance resistivity', () => anodeResistanceOhm({ shape: { kind: 'short-flush', exposedAreaM2: 0.1 }, resistivityOhmM: -1 }), 'resistivityOhmM'],
    ['resistance area', () => anodeResistanceOhm({ shape: { kind: 'short-flush', exposedAreaM2: 0 }, resistivityOhmM: 0.3 }), 'shape.exposedAreaM2'],
    ['resistance half dimensions', () => anodeResistanceOhm({ shape: { kind: 'bracelet', exposedAreaM2: 0.3, lengthM: 0.5 }, resistivityOhmM: 0.3 }), 'shape.widthM'],
    ['output resistance', () => anodeCurrentOutputA({ protectivePotentialV: -0.8, anodePotentialV: -1.05, resistanceOhm: 0 }), 'resistanceOhm'],
    ['output anode potential', () => anodeCurrentOutputA({ protectivePotentialV: -0.8, anodePotentialV: -0.7, resistanceOhm: 0.1 }), 'anodePotentialV'],
    ['wetted CB', () => wettedSurfaceDennyMumford({ lengthM: 100, beamM: 20, draughtM: 6, blockCoefficient: 0 }), 'blockCoefficient'],
    ['distribution total', () => distributeAnodes({ total: -1, surfaces: [{ name: 'a', demandA: 1 }] }), 'total'],
    ['distribution demand', () => distributeAnodes({ total: 3, surfaces: [{ name: 'a', demandA: Number.NaN }] }), 'surfaces[0].demandA'],
  ] as const)('%s', (_name, fn, field) => {
    expect(() => fn()).toThrow(CpInputError);
    expect(fieldOf(fn)).toBe(field);
  });
});
