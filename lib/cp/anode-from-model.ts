import type { AnodeModel } from './anode-model';
import type { DesignAnode } from './design-input';
import { utilisationFactorFor } from './lookups';
import { ALLOYS } from './tables/alloys';
import type { WaterType } from './types';

/**
 * Design anode data for a catalogue model: capacity and potential from the alloy table
 * (sediment values when buried, where the table has them), utilisation from the shape
 * table, unless the model carries its own data-sheet values.
 */
export function anodeFromModel(model: AnodeModel, water?: WaterType): DesignAnode {
  const alloy = ALLOYS[model.alloy];
  const inSediment = water === 'sediment';
  return {
    alloy: model.alloy,
    capacityAhPerKg: model.capacityAhPerKg ?? ((inSediment ? alloy.capacityAhPerKg.sediment : null) ?? alloy.capacityAhPerKg.seawater),
    potentialV: model.potentialV ?? ((inSediment ? alloy.closedCircuitPotentialV.sediment : null) ?? alloy.closedCircuitPotentialV.seawater),
    utilisationFactor: model.utilisationFactor ?? utilisationFactorFor(model.shape),
    netMassKg: model.netMassKg,
    grossMassKg: model.grossMassKg,
    shape: model.shape,
    ratedOutputA: model.ratedOutputA,
  };
}
