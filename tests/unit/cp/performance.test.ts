import { describe, expect, it } from 'vitest';
import { designAnodeSystem, type DesignInput } from '@/lib/cp';

describe('performance', () => {
  it('designs a 50-surface hull well under 1 ms (median)', () => {
    const input: DesignInput = {
      designLifeYears: 5,
      resistivityOhmM: 0.25,
      protectedMetal: 'steel',
      environment: { water: 'seawater', temperatureC: 12 },
      nextDockingYears: 2.5,
      surfaces: Array.from({ length: 50 }, (_, i) => ({
        name: `zone ${i}`,
        areaM2: 20 + i * 7,
        currentDensity: { initial: 0.2, mean: 0.1, final: 0.13 },
        coating: i % 5 === 0 ? ('bare' as const) : { a: 0.05, b: 0.025 },
        drainsCurrent: i === 49 ? ('copper-alloy' as const) : undefined,
      })),
      anode: {
        alloy: 'al-zn-in',
        capacityAhPerKg: 2000,
        potentialV: -1.05,
        utilisationFactor: 0.8,
        netMassKg: 7.7,
        shape: { kind: 'short-flush', exposedAreaM2: 0.128, lengthM: 0.4, widthM: 0.2, thicknessM: 0.04 },
      },
    };
    for (let i = 0; i < 50; i++) designAnodeSystem(input); // warm up
    const times: number[] = [];
    for (let i = 0; i < 301; i++) {
      const t0 = performance.now();
      designAnodeSystem(input);
      times.push(performance.now() - t0);
    }
    times.sort((a, b) => a - b);
    expect(times[150]).toBeLessThan(0.5);
  });
});
