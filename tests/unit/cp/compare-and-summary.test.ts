import { describe, expect, it } from 'vitest';
import {
  BUILTIN_ANODE_MODELS,
  builtinAnodeModel,
  compareOptions,
  impressedCurrentSummary,
  type AnodeModel,
  type DesignJob,
} from '@/lib/cp';
import { flat } from './helpers';

const jettyJob: DesignJob = {
  designLifeYears: 25,
  resistivityOhmM: 0.2,
  protectedMetal: 'steel',
  environment: { water: 'seawater', temperatureC: 15 },
  surfaces: [
    { name: 'immersed', areaM2: 1378.28, currentDensity: { initial: 0.17, mean: 0.08, final: 0.11 }, coating: 'bare' },
    { name: 'mud', areaM2: 2297.13, currentDensity: flat(0.02), coating: 'bare' },
  ],
};

describe('compareOptions', () => {
  it('sizes each model side by side', () => {
    const rows = compareOptions({ job: jettyJob, models: [builtinAnodeModel('TW-AS-2018')!, builtinAnodeModel('TW-AS-2528')!] });
    expect(rows.map((r) => r.id)).toEqual(['TW-AS-2018', 'TW-AS-2528']);
    const [small, big] = rows;
    if (!small.suitable || !big.suitable) throw new Error('both should be suitable');
    expect(small.anodeCount).toBe(107); // as the hand-checked jetty example
    // 270 kg anodes: 19,005 / 270 = 70.4 -> 71
    expect(big.anodeCount).toBe(71);
    expect(big.requiredNetMassKg).toBeCloseTo(small.requiredNetMassKg, 9);
    expect(big.cost).toBeNull(); // built-in models carry no price
  });

  it('prices an option when the model has a unit price and a fitting rate is given', () => {
    const priced: AnodeModel = { ...builtinAnodeModel('TW-AS-2018')!, unitPrice: 900 };
    const [row] = compareOptions({ job: jettyJob, models: [priced], fittingRatePerKg: 4 });
    if (!row.suitable || !row.cost) throw new Error('expected a priced, suitable row');
    // 107 x 900 = 96,300 supply; 107 x 203 kg gross x 4 = 86,884 fitting
    expect(row.cost.supply).toBe(96_300);
    expect(row.cost.fitting).toBeCloseTo(86_884, 6);
    expect(row.cost.total).toBeCloseTo(183_184, 6);
    const [noRate] = compareOptions({ job: jettyJob, models: [priced] });
    expect(noRate.suitable && noRate.cost).toBeNull();
  });

  it('reports an option the job rejects as unsuitable with the reason', () => {
    const aluminiumBoat: DesignJob = {
      ...jettyJob,
      designLifeYears: 2,
      protectedMetal: 'aluminium',
      protectivePotentialV: -0.9,
      hullMaterial: 'aluminium',
      environment: { water: 'brackish', chloridePpm: 8000 },
    };
    const rows = compareOptions({ job: aluminiumBoat, models: [builtinAnodeModel('TW-MB-3015')!, builtinAnodeModel('TW-AW-4020')!] });
    expect(rows[0]).toMatchObject({ suitable: false, field: 'models[0].alloy' });
    expect(rows[0].suitable === false && rows[0].reason).toMatch(/aluminium hull/);
    expect(rows[1].suitable).toBe(true);
  });

  it('counts warnings per option', () => {
    const rows = compareOptions({ job: jettyJob, models: [builtinAnodeModel('TW-MS-1005')!] });
    expect(rows[0].suitable && rows[0].warningCodes).toContain('magnesium-in-seawater');
    expect(rows[0].suitable && rows[0].warningsCount).toBeGreaterThan(0);
  });

  it('reports a malformed catalogue entry as unsuitable, naming its field', () => {
    const broken = { ...builtinAnodeModel('TW-AW-4020')!, alloy: 'copper' } as unknown as AnodeModel;
    const rows = compareOptions({ job: jettyJob, models: [broken, { ...builtinAnodeModel('TW-AW-4020')!, netMassKg: -1 }] });
    expect(rows[0]).toMatchObject({ suitable: false, field: 'models[0].alloy' });
    expect(rows[1]).toMatchObject({ suitable: false, field: 'models[1].netMassKg' });
  });

  it('throws for an invalid job rather than marking every option unsuitable', () => {
    expect(() => compareOptions({ job: { ...jettyJob, designLifeYears: 0 }, models: [...BUILTIN_ANODE_MODELS] })).toThrow(/designLifeYears/);
  });
});

describe('impressedCurrentSummary', () => {
  it('gives the output the system must deliver with a 25 % margin', () => {
    // 25 % margin and 5 A steps: common practice (Tidewarden's choice), not a published figure
    // hull 2,610 m2 x 0.022 = 57.42 A + propeller 10 x 0.5 = 5 A -> 62.42 A; x 1.25 = 78.0 -> 80 A (5 A steps)
    const s = impressedCurrentSummary({
      designLifeYears: 5,
      surfaces: [
        { name: 'hull', areaM2: 2610, currentDensity: flat(0.022), coating: 'bare' },
        { name: 'propeller', areaM2: 10, currentDensity: flat(0.5), coating: 'bare' },
      ],
    });
    expect(s.peakA).toBeCloseTo(62.42, 9);
    expect(s.suggestedRatingA).toBe(80);
    expect(s.margin).toBe(0.25);
  });

  it('sizes on the final demand when the coating ageing makes it the peak', () => {
    // 5,000 m2, 0.2/0.1/0.13 A/m2, category I 0-30 m (0.10 / 0.10, DNV-RP-B401 (2010) Table 10-4, from memory), 5 years:
    // initial 5,000 x 0.1 x 0.2 = 100 A; final 5,000 x 0.6 x 0.13 = 390 A; x 1.25 = 487.5 -> 490 A
    const s = impressedCurrentSummary({
      designLifeYears: 5,
      surfaces: [{ name: 'hull', areaM2: 5000, currentDensity: { initial: 0.2, mean: 0.1, final: 0.13 }, coating: { a: 0.1, b: 0.1 } }],
    });
    expect(s.peakCondition).toBe('final');
    expect(s.peakA).toBeCloseTo(390, 9);
    expect(s.suggestedRatingA).toBe(490);
  });
});
