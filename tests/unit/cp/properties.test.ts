import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CpInputError, designAnodeSystem, theoreticalCapacityAhPerKg, type AnodeShape, type DesignInput, type DesignSurface } from '@/lib/cp';
import { nonFinitePaths } from './helpers';

const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const density = fc.record({ initial: pos(0.001, 0.3), mean: pos(0.001, 0.3), final: pos(0.001, 0.3) });
// a > 0 as in every coating category (DNV-RP-B401 (2010) Table 10-4): a coating that never breaks down draws nothing to size
const coating = fc.oneof(fc.constant('bare' as const), fc.record({ a: pos(0.001, 0.2), b: pos(0, 0.1) }));
const surface: fc.Arbitrary<DesignSurface> = fc.record({
  name: fc.string({ maxLength: 8 }),
  areaM2: pos(0.01, 5000),
  currentDensity: density,
  coating,
});

const shape: fc.Arbitrary<AnodeShape> = fc.oneof(
  fc.record(
    {
      kind: fc.constant('slender-standoff' as const),
      lengthM: pos(0.1, 3),
      radiusM: pos(0.02, 0.3),
      standoffM: pos(0, 1),
      coreRadiusM: pos(0, 0.015),
    },
    { requiredKeys: ['kind', 'lengthM', 'radiusM'] },
  ),
  fc.record({ kind: fc.constant('long-flush' as const), lengthM: pos(0.1, 2), widthM: pos(0.05, 0.5) }),
  fc.record(
    { kind: fc.constantFrom('short-flush' as const, 'bracelet' as const), exposedAreaM2: pos(0.01, 2), lengthM: pos(0.1, 1), widthM: pos(0.05, 1), thicknessM: pos(0.01, 0.1) },
    { requiredKeys: ['kind', 'exposedAreaM2'] },
  ).filter((s) => (s.lengthM === undefined) === (s.widthM === undefined)),
);

const design: fc.Arbitrary<DesignInput> = fc.record(
  {
    designLifeYears: pos(0.25, 40),
    resistivityOhmM: pos(0.1, 50),
    protectedMetal: fc.constantFrom('steel' as const, 'high-strength-steel' as const, 'aluminium' as const, 'stainless' as const, 'copper-alloy' as const),
    surfaces: fc.array(surface, { minLength: 1, maxLength: 8 }),
    allowMagnesiumOnAluminium: fc.constant(true),
    nextDockingYears: pos(0.5, 10),
    environment: fc.record({ water: fc.constantFrom('seawater' as const, 'brackish' as const, 'fresh' as const, 'sediment' as const), temperatureC: pos(-2, 80) }),
    // a capacity above the alloy's theoretical value (Faraday's law) is invalid input: clamped to it
    anode: fc.record(
      {
        alloy: fc.constantFrom('al-zn-in' as const, 'zinc' as const, 'magnesium' as const, 'magnesium-high-potential' as const),
        capacityAhPerKg: pos(500, 2600),
        // more negative than every metal's default criterion (aluminium -0.90 V, ABYC E-2, published)
        potentialV: pos(-1.8, -0.95),
        utilisationFactor: pos(0.5, 1),
        netMassKg: pos(0.5, 400),
        shape,
        ratedOutputA: pos(0.05, 10),
      },
      { requiredKeys: ['alloy', 'capacityAhPerKg', 'potentialV', 'utilisationFactor', 'netMassKg', 'shape'] },
    ).map((a) => ({ ...a, capacityAhPerKg: Math.min(a.capacityAhPerKg, theoreticalCapacityAhPerKg(a.alloy)) })),
  },
  { requiredKeys: ['designLifeYears', 'resistivityOhmM', 'protectedMetal', 'surfaces', 'allowMagnesiumOnAluminium', 'anode'] },
);

const RUNS = { numRuns: 300 };

describe('properties of designAnodeSystem', () => {
  it('every valid input gives finite numbers everywhere in the result', () => {
    fc.assert(fc.property(design, (input) => {
      expect(nonFinitePaths(designAnodeSystem(input))).toEqual([]);
    }), RUNS);
  });

  it('the count meets every criterion, and the installed mass lasts the design life', () => {
    fc.assert(fc.property(design, (input) => {
      const d = designAnodeSystem(input);
      const slack = 1 + 1e-9;
      expect(d.anodeCount * input.anode.netMassKg * slack).toBeGreaterThanOrEqual(d.requiredNetMassKg);
      expect(d.anodeCount * d.perAnode.initialOutputA * slack).toBeGreaterThanOrEqual(d.current.initialA);
      expect(d.anodeCount * d.perAnode.finalOutputA * slack).toBeGreaterThanOrEqual(d.current.finalA);
      expect(d.achievedLifeYears * slack).toBeGreaterThanOrEqual(input.designLifeYears);
      expect(d.anodeCount).toBe(Math.max(d.countBy.mass, d.countBy.initialCurrent, d.countBy.finalCurrent));
      expect(d.distribution.distributedCount).toBeGreaterThanOrEqual(d.anodeCount);
      expect(d.perAnode.finalResistanceOhm).toBeGreaterThanOrEqual(d.perAnode.initialResistanceOhm * (1 - 1e-12));
    }), RUNS);
  });

  const notFewer = (a: ReturnType<typeof designAnodeSystem>, b: ReturnType<typeof designAnodeSystem>) => {
    expect(b.anodeCount).toBeGreaterThanOrEqual(a.anodeCount);
    expect(b.requiredNetMassKg).toBeGreaterThanOrEqual(a.requiredNetMassKg * (1 - 1e-12));
    expect(b.countBy.mass).toBeGreaterThanOrEqual(a.countBy.mass);
    expect(b.countBy.initialCurrent).toBeGreaterThanOrEqual(a.countBy.initialCurrent);
    expect(b.countBy.finalCurrent).toBeGreaterThanOrEqual(a.countBy.finalCurrent);
  };

  it('more area never gives fewer anodes or less mass', () => {
    fc.assert(fc.property(design, fc.nat(), pos(1, 10), (input, pick, k) => {
      const i = pick % input.surfaces.length;
      const bigger = structuredClone(input);
      bigger.surfaces[i].areaM2 *= k;
      notFewer(designAnodeSystem(input), designAnodeSystem(bigger));
    }), RUNS);
  });

  it('a higher current density never gives fewer anodes or less mass', () => {
    fc.assert(fc.property(design, fc.nat(), pos(1, 5), (input, pick, k) => {
      const i = pick % input.surfaces.length;
      const denser = structuredClone(input);
      const cd = denser.surfaces[i].currentDensity;
      denser.surfaces[i].currentDensity = { initial: cd.initial * k, mean: cd.mean * k, final: cd.final * k };
      notFewer(designAnodeSystem(input), designAnodeSystem(denser));
    }), RUNS);
  });

  it('a longer life never gives fewer anodes or less mass', () => {
    fc.assert(fc.property(design, pos(0, 30), (input, extra) => {
      notFewer(designAnodeSystem(input), designAnodeSystem({ ...input, designLifeYears: input.designLifeYears + extra }));
    }), RUNS);
  });

  it('a higher resistivity never gives fewer anodes', () => {
    fc.assert(fc.property(design, pos(1, 10), (input, k) => {
      const computed = { ...input, anode: { ...input.anode, ratedOutputA: undefined } };
      notFewer(designAnodeSystem(computed), designAnodeSystem({ ...computed, resistivityOhmM: input.resistivityOhmM * k }));
    }), RUNS);
  });

  it('any numbers at all either give a finite result or a CpInputError, never anything else', () => {
    // mostly valid-signed but extreme magnitudes (subnormals to 1e308), sometimes NaN or infinite
    const any = fc.oneof(fc.double({ min: Number.MIN_VALUE, max: Number.MAX_VALUE, noNaN: true }), fc.double());
    const wild = fc.record({
      area: any, density: any, a: any, b: any, life: any, rho: any, u: any, eps: any, mass: any, len: any, rad: any, gap: any,
      ea: fc.oneof(fc.double({ min: -Number.MAX_VALUE, max: -0.81, noNaN: true }), fc.double()),
    });
    fc.assert(fc.property(wild, (w) => {
      const input = {
        designLifeYears: w.life,
        resistivityOhmM: w.rho,
        protectedMetal: 'steel',
        surfaces: [{ name: 's', areaM2: w.area, currentDensity: { initial: w.density, mean: w.density, final: w.density }, coating: { a: w.a, b: w.b } }],
        anode: { alloy: 'zinc', capacityAhPerKg: w.eps, potentialV: w.ea, utilisationFactor: w.u, netMassKg: w.mass, shape: { kind: 'slender-standoff', lengthM: w.len, radiusM: w.rad, standoffM: w.gap } },
      } as DesignInput;
      try {
        expect(nonFinitePaths(designAnodeSystem(input))).toEqual([]);
      } catch (e) {
        if (!(e instanceof CpInputError)) throw e;
        expect(e.field.length).toBeGreaterThan(0);
      }
    }), { numRuns: 2000 });
  });
});
