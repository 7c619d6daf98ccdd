import type { AnodeModel } from './anode-model';
import { validateShape } from './anode-shape';
import { ALLOY_NAMES, type DesignAnode } from './design-input';
import { utilisationFactorFor } from './lookups';
import { ALLOYS } from './tables/alloys';
import type { WaterType } from './types';
import { oneOf, record } from './validate';

/**
 * Design anode data for a catalogue model: capacity and potential from the alloy table
 * (sediment values when buried, where the table has them), utilisation from the shape
 * table, unless the model carries its own data-sheet values. `field` names the model in
 * error messages; the result is checked again by the design.
 */
export function anodeFromModel(model: AnodeModel, water?: WaterType, field = 'model'): DesignAnode {
  const m = record(model, field);
  const alloyName = oneOf(m.alloy, ALLOY_NAMES, `${field}.alloy`);
  const shape = validateShape(m.shape, `${field}.shape`);
  const alloy = ALLOYS[alloyName];
  const inSediment = water === 'sediment';
  return {
    alloy: alloyName,
    capacityAhPerKg: model.capacityAhPerKg ?? ((inSediment ? alloy.capacityAhPerKg.sediment : null) ?? alloy.capacityAhPerKg.seawater),
    potentialV: model.potentialV ?? ((inSediment ? alloy.closedCircuitPotentialV.sediment : null) ?? alloy.closedCircuitPotentialV.seawater),
    utilisationFactor: model.utilisationFactor ?? utilisationFactorFor(shape),
    netMassKg: model.netMassKg,
    grossMassKg: model.grossMassKg,
    shape,
    ratedOutputA: model.ratedOutputA,
    ratedAtResistivityOhmM: model.ratedAtResistivityOhmM,
  };
}
