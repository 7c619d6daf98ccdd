import { describe, expect, it } from 'vitest';
import { HULL_CURRENT_DENSITY } from '@/lib/cp';
import { zoneDemand } from '@/lib/design/build-design-input';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { zone } from './desk-inputs';

type Method = Pick<DeskInputs, 'demandMethod' | 'climate' | 'water' | 'hullCoatingCondition' | 'serviceSpeedKnots'>;
const hull = (change: Partial<Method> = {}): Method => ({ demandMethod: 'ship-hull', climate: 'temperate', water: 'seawater', hullCoatingCondition: 'good', serviceSpeedKnots: null, ...change });
const mA = (surface: DeskSurface, method: Method) => {
  const { currentDensity } = zoneDemand(surface, method);
  return { initial: currentDensity.initial * 1000, mean: currentDensity.mean * 1000, final: currentDensity.final * 1000 };
};
const flatMa = (x: number) => ({ initial: expect.closeTo(x, 9), mean: expect.closeTo(x, 9), final: expect.closeTo(x, 9) });

const bottom = zone('Hull bottom', 'hull-bottom', 400, 'II');

describe('ship-hull practice: coated zones', () => {
  it('a good-paint hull bottom takes 15 mA/m² plus 10 %, 16.5 mA/m², for its whole area (fc = 1)', () => {
    // 15-20 mA/m² good paint, add about 10 % (design basis, common practice; 15 by condition from memory)
    expect(mA(bottom, hull())).toEqual(flatMa(16.5));
    expect(zoneDemand(bottom, hull()).coating).toBe('bare'); // fc = 1: the density is already for the coated state
  });

  it('takes the density of the paint condition: new 10, good 15, fair 20, poor 30 mA/m², each plus 10 %', () => {
    // common practice, from memory (design basis: new about 10, good 15, fair 20, poor or old hull about 30)
    expect(mA(bottom, hull({ hullCoatingCondition: 'new' }))).toEqual(flatMa(11));
    expect(mA(bottom, hull({ hullCoatingCondition: 'fair' }))).toEqual(flatMa(22));
    expect(mA(bottom, hull({ hullCoatingCondition: 'poor' }))).toEqual(flatMa(33));
  });

  it('does not depend on the paint category, the coating age or the climate: the condition is the engineer’s word for it', () => {
    for (const z of [zone('b', 'hull-bottom', 400, 'I'), zone('b', 'hull-bottom', 400, 'III', { coatingAgeYears: 10 })]) {
      expect(mA(z, hull())).toEqual(flatMa(16.5));
    }
    expect(mA(bottom, hull({ climate: 'arctic' }))).toEqual(flatMa(16.5));
  });

  it.each(['rudder', 'sea-chest', 'thruster-tunnel'] as const)('the %s, in the highest flow, takes the next worse condition', (kind) => {
    const z = zone(kind, kind, 10, 'II');
    // good -> fair 20, new -> good 15, fair -> poor 30, poor stays poor 30; each plus 10 % (common practice, from memory)
    expect(mA(z, hull())).toEqual(flatMa(22));
    expect(mA(z, hull({ hullCoatingCondition: 'new' }))).toEqual(flatMa(16.5));
    expect(mA(z, hull({ hullCoatingCondition: 'fair' }))).toEqual(flatMa(33));
    expect(mA(z, hull({ hullCoatingCondition: 'poor' }))).toEqual(flatMa(33));
  });

  it('the sides are not a high-flow zone', () => {
    expect(mA(zone('Sides', 'boot-top-sides', 300, 'II'), hull())).toEqual(flatMa(16.5));
  });

  it('adds about 25 % above 20 knots, and nothing at or below', () => {
    // about +25 % above roughly 20 knots (design basis, from memory)
    expect(mA(bottom, hull({ serviceSpeedKnots: 25 }))).toEqual(flatMa(16.5 * 1.25));
    expect(mA(zone('Rudder', 'rudder', 10, 'II'), hull({ serviceSpeedKnots: 28 }))).toEqual(flatMa(22 * 1.25));
    expect(mA(bottom, hull({ serviceSpeedKnots: 20 }))).toEqual(flatMa(16.5));
    expect(mA(bottom, hull({ serviceSpeedKnots: 12 }))).toEqual(flatMa(16.5));
  });
});

describe('ship-hull practice: bare fittings and bare steel', () => {
  it('a bare copper-alloy propeller drains 500 mA/m², the top of the guide’s 450-500', () => {
    // copper-alloy propeller 450-500 mA/m², Japanese ship-equipment guide (published, design basis)
    const propeller = zone('Propeller', 'propeller-shaft', 6, 'bare', { drainsCurrent: 'copper-alloy' });
    expect(mA(propeller, hull())).toEqual(flatMa(500));
    expect(HULL_CURRENT_DENSITY['copper-alloy-propeller'].maxAPerM2).toBe(0.5);
    // a bare propeller zone with no drain named is taken as copper alloy
    expect(mA(zone('Propeller', 'propeller-shaft', 6, 'bare'), hull())).toEqual(flatMa(500));
  });

  it('a bare stainless shaft drains 120 mA/m², the top of the guide’s 100-120', () => {
    // stainless shaft 100-120 mA/m², Japanese ship-equipment guide (published, design basis)
    expect(mA(zone('Shaft', 'propeller-shaft', 3, 'bare', { drainsCurrent: 'stainless' }), hull())).toEqual(flatMa(120));
    expect(mA(zone('Stern tube liner', 'other', 1, 'bare', { drainsCurrent: 'stainless' }), hull())).toEqual(flatMa(120));
  });

  it('propeller and shaft take neither the 10 % allowance nor the speed factor (the guide’s value is used as published)', () => {
    expect(mA(zone('Propeller', 'propeller-shaft', 6, 'bare', { drainsCurrent: 'copper-alloy' }), hull({ serviceSpeedKnots: 30 }))).toEqual(flatMa(500));
  });

  it('other bare steel moving in seawater takes 250 mA/m² initial, 150 mean and final', () => {
    // bare steel moving in seawater 150-250 mA/m² (design basis, from memory)
    const bare = mA(zone('Bare patch', 'hull-bottom', 20, 'bare'), hull());
    expect(bare.initial).toBeCloseTo(250, 9);
    expect(bare.mean).toBeCloseTo(150, 9);
    expect(bare.final).toBeCloseTo(150, 9);
  });

  it('the Japanese guide’s cargo ship: 4,500 m² at 4.5 mA/m² plus a 30 m² propeller at 500 mA/m² is 35.25 A', () => {
    // Japanese ship-equipment guide, 10,000 t cargo ship (published, design basis worked example 3)
    const propeller = zoneDemand(zone('Propeller', 'propeller-shaft', 30, 'bare', { drainsCurrent: 'copper-alloy' }), hull()).currentDensity.mean * 30;
    const hullA = 4500 * HULL_CURRENT_DENSITY['coated-hull-excellent-yearly-docking'].minAPerM2;
    expect(hullA + propeller).toBeCloseTo(35.25, 9);
  });

  it('the engineer’s own value wins over the practice (a bare-metal density: the paint breakdown applies to it)', () => {
    const own = zone('Hull bottom', 'hull-bottom', 400, 'bare', { currentDensityOverride: { initial: 30, mean: 25, final: 28 } });
    expect(mA(own, hull())).toEqual({ initial: expect.closeTo(30, 9), mean: expect.closeTo(25, 9), final: expect.closeTo(28, 9) });
  });
});
