import { describe, expect, it } from 'vitest';
import { anodeFromModel, builtinAnodeModel, designAnodeSystem, type DesignInput } from '@/lib/cp';
import { cleanDesign } from './helpers';

/** The clean design with a data-sheet output on its anode, in water of the given resistivity. */
function rated(resistivityOhmM: number, anode: { ratedOutputA: number; ratedAtResistivityOhmM?: number }): DesignInput {
  const d = cleanDesign();
  return { ...d, resistivityOhmM, environment: { water: 'brackish', temperatureC: 10, chloridePpm: 5000 }, anode: { ...d.anode, ...anode } };
}

describe('data-sheet output scaled by its resistivity', () => {
  it('4 A rated at 0.2 Ω·m gives 0.8 A initial in 1.0 Ω·m water', () => {
    // Ohm's law at the same driving voltage: I = 4 A x 0.2 / 1.0 (common practice)
    const r = designAnodeSystem(rated(1.0, { ratedOutputA: 4, ratedAtResistivityOhmM: 0.2 }));
    expect(r.perAnode.initialOutputA).toBeCloseTo(0.8, 12);
    expect(r.perAnode.ratedOutputUsed).toBe(true);
    expect(r.perAnode.ratedOutputScaling).toBe('scaled');
    expect(r.warnings.map((w) => w.code)).not.toContain('rated-output-unscaled');
  });

  it('the final output falls with the consumed anode: initial x R_initial / R_final', () => {
    const r = designAnodeSystem(rated(1.0, { ratedOutputA: 4, ratedAtResistivityOhmM: 0.2 }));
    const { initialResistanceOhm: ri, finalResistanceOhm: rf } = r.perAnode;
    expect(rf).toBeGreaterThan(ri);
    expect(r.perAnode.finalOutputA).toBeCloseTo((0.8 * ri) / rf, 12);
    // the same ratio the computed outputs have, so scaling changes nothing but the level
    const computed = designAnodeSystem({ ...rated(1.0, { ratedOutputA: 4 }), anode: cleanDesign().anode });
    expect(r.perAnode.finalOutputA / r.perAnode.initialOutputA).toBeCloseTo(computed.perAnode.finalOutputA / computed.perAnode.initialOutputA, 12);
  });

  it('at the rated resistivity the output is the data sheet’s', () => {
    const r = designAnodeSystem(rated(0.25, { ratedOutputA: 3, ratedAtResistivityOhmM: 0.25 }));
    expect(r.perAnode.initialOutputA).toBeCloseTo(3, 12);
  });

  it('a higher resistivity means fewer amperes each and more anodes by current', () => {
    const sea = designAnodeSystem(rated(0.25, { ratedOutputA: 3, ratedAtResistivityOhmM: 0.25 }));
    const brackish = designAnodeSystem(rated(1.0, { ratedOutputA: 3, ratedAtResistivityOhmM: 0.25 }));
    expect(brackish.countBy.initialCurrent).toBeGreaterThan(sea.countBy.initialCurrent);
    expect(brackish.exactCountBy.initialCurrent).toBeCloseTo(sea.exactCountBy.initialCurrent * 4, 9);
  });

  it('without a rated resistivity the output is used as given and the design warns that it is unscaled', () => {
    const r = designAnodeSystem(rated(1.0, { ratedOutputA: 4 }));
    expect(r.perAnode.initialOutputA).toBe(4);
    expect(r.perAnode.ratedOutputScaling).toBe('unscaled');
    const w = r.warnings.find((x) => x.code === 'rated-output-unscaled');
    expect(w?.message).toContain('unscaled');
    expect(w?.message).toContain('4 A');
  });

  it('the catalogue model carries its rated resistivity through to the design anode', () => {
    const model = { ...builtinAnodeModel('TW-AS-2018')!, ratedOutputA: 5, ratedAtResistivityOhmM: 0.3 };
    expect(anodeFromModel(model, 'seawater')).toMatchObject({ ratedOutputA: 5, ratedAtResistivityOhmM: 0.3 });
  });

  it('no data-sheet output: computed from the resistance, no scaling recorded', () => {
    const r = designAnodeSystem(cleanDesign());
    expect(r.perAnode.ratedOutputUsed).toBe(false);
    expect(r.perAnode.ratedOutputScaling).toBeUndefined();
    expect(r.perAnode.initialOutputA).toBeCloseTo(r.drivingVoltageV / r.perAnode.initialResistanceOhm, 12); // Ia = (Ec - Ea)/Ra, DNV-RP-B401 (2010) sec. 7
  });
});
