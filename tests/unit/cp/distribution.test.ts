import { describe, expect, it } from 'vitest';
import { distributeAnodes } from '@/lib/cp';

describe('distributeAnodes', () => {
  it('shares in proportion to demand, each rounded up', () => {
    // 10 anodes over 1 : 1 : 1 -> 3.33 each -> 4 each, 12 in all (common practice: round up per surface)
    const d = distributeAnodes({ total: 10, surfaces: [{ name: 'a', demandA: 1 }, { name: 'b', demandA: 1 }, { name: 'c', demandA: 1 }] });
    expect(d.surfaces.map((s) => s.count)).toEqual([4, 4, 4]);
    expect(d.designCount).toBe(10);
    expect(d.distributedCount).toBe(12);
  });

  it('does not round float noise up', () => {
    // 0.3 / 1.0 x 10 = 3.0000000000000004 in binary: still 3
    const d = distributeAnodes({ total: 10, surfaces: [{ name: 'a', demandA: 0.3 }, { name: 'b', demandA: 0.7 }] });
    expect(d.surfaces.map((s) => s.count)).toEqual([3, 7]);
    expect(d.distributedCount).toBe(10);
  });

  it('gives nothing to a surface without demand', () => {
    const d = distributeAnodes({ total: 5, surfaces: [{ name: 'a', demandA: 2 }, { name: 'dry', demandA: 0 }] });
    expect(d.surfaces.map((s) => s.count)).toEqual([5, 0]);
  });

  it('rejects a count to share over no demand', () => {
    expect(() => distributeAnodes({ total: 5, surfaces: [{ name: 'a', demandA: 0 }] })).toThrow(/no current demand/);
  });
});
