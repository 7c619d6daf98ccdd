import { describe, expect, it } from 'vitest';
import { ALLOYS, BUILTIN_ANODE_MODELS, anodeFromModel, anodeResistanceOhm, type AnodeModel } from '@/lib/cp';

/** Volume of the body from its catalogue dimensions, m3. */
function bodyVolume(m: AnodeModel): number {
  const d = m.dimensions;
  switch (m.shape.kind) {
    case 'slender-standoff':
      return Math.PI * d.radiusM! ** 2 * d.lengthM;
    case 'bracelet': {
      const ri = d.innerDiameterM! / 2;
      return Math.PI * ((ri + d.thicknessM!) ** 2 - ri ** 2) * d.lengthM;
    }
    default:
      return d.lengthM * d.widthM! * d.thicknessM!;
  }
}

describe('built-in anode catalogue', () => {
  it('uses our own unique designations', () => {
    const ids = BUILTIN_ANODE_MODELS.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of BUILTIN_ANODE_MODELS) expect(m.designation).toMatch(/^TW-[A-Z]{2}-\d{4}$/);
  });

  it('net masses agree with dimensions x alloy density', () => {
    // alloy densities, common practice; the body is chamfered, cored or split, so net is 75-100 % of the solid volume
    for (const m of BUILTIN_ANODE_MODELS) {
      const solid = bodyVolume(m) * ALLOYS[m.alloy].densityKgM3;
      expect(m.netMassKg / solid, m.id).toBeGreaterThanOrEqual(0.75);
      expect(m.netMassKg / solid, m.id).toBeLessThanOrEqual(1);
      expect(m.grossMassKg, m.id).toBeGreaterThan(m.netMassKg);
      expect(m.grossMassKg / m.netMassKg, m.id).toBeLessThan(1.5);
    }
  });

  it('covers the ranges the product needs', () => {
    const has = (f: (m: AnodeModel) => boolean) => BUILTIN_ANODE_MODELS.some(f);
    for (const alloy of ['zinc', 'al-zn-in'] as const) {
      expect(has((m) => m.alloy === alloy && m.mounting === 'flush-weld')).toBe(true);
      expect(has((m) => m.alloy === alloy && m.mounting === 'flush-bolt')).toBe(true);
    }
    const piles = BUILTIN_ANODE_MODELS.filter((m) => m.mounting === 'pile-mounted');
    expect(piles.length).toBeGreaterThanOrEqual(3);
    for (const p of piles) {
      expect(p.alloy).toBe('al-zn-in');
      expect(p.dimensions.lengthM).toBeGreaterThanOrEqual(1.5);
      expect(p.dimensions.lengthM).toBeLessThanOrEqual(2.5);
      expect(p.netMassKg).toBeGreaterThanOrEqual(100);
      expect(p.netMassKg).toBeLessThanOrEqual(300);
    }
    expect(has((m) => m.mounting === 'bracelet')).toBe(true);
    expect(has((m) => m.alloy === 'magnesium')).toBe(true);
    expect(has((m) => m.shape.kind === 'long-flush')).toBe(true);
  });

  it('every shape matches its mounting and gives a finite resistance', () => {
    for (const m of BUILTIN_ANODE_MODELS) {
      const expected = m.mounting.startsWith('flush') ? ['short-flush', 'long-flush'] : m.mounting === 'bracelet' ? ['bracelet'] : ['slender-standoff'];
      expect(expected, m.id).toContain(m.shape.kind);
      const r = anodeResistanceOhm({ shape: m.shape, resistivityOhmM: 0.25 });
      expect(r, m.id).toBeGreaterThan(0);
      expect(Number.isFinite(r), m.id).toBe(true);
    }
  });

  it('turns a model into design data from the tables', () => {
    const zinc = BUILTIN_ANODE_MODELS.find((m) => m.id === 'TW-ZW-3015')!;
    expect(anodeFromModel(zinc, 'seawater')).toMatchObject({ capacityAhPerKg: 780, potentialV: -1.03, utilisationFactor: 0.8 }); // DNV-RP-B401 (2010) Tables 10-6/10-8, from memory
    expect(anodeFromModel(zinc, 'sediment')).toMatchObject({ capacityAhPerKg: 700, potentialV: -0.98 }); // DNV-RP-B401 (2010) Table 10-6, from memory
    const pile = BUILTIN_ANODE_MODELS.find((m) => m.id === 'TW-AS-2018')!;
    expect(anodeFromModel(pile).utilisationFactor).toBe(0.9); // long slender, DNV-RP-B401 (2010) Table 10-8, published
  });
});
