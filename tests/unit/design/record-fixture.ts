// A stored design record built the way the desk builds one, from pure code only: an invented 90 m
// ferry with the default zones from its particulars and a built-in flush aluminium anode.
import { BUILTIN_ANODE_MODELS, compareOptions, designAnodeSystem, impressedCurrentSummary } from '@/lib/cp';
import { buildDesignInput, buildDesignJob, deskNotices } from '@/lib/design/build-design-input';
import { defaultVesselZones } from '@/lib/design/default-zones';
import { DESIGN_SCHEMA_VERSION, type DesignRecord } from '@/lib/schemas/design-record';
import type { DeskInputs } from '@/lib/schemas/design';

export function ferryInputs(): DeskInputs {
  return {
    designLifeYears: 2.5,
    climate: 'temperate',
    water: 'seawater',
    temperatureC: null,
    chloridePpm: null,
    resistivityOhmM: 0.3,
    protectivePotentialV: -0.8,
    protectedMetal: 'steel',
    hullMaterial: 'steel',
    anaerobic: false,
    demandMethod: 'ship-hull',
    hullCoatingCondition: 'good',
    serviceSpeedKnots: 14,
    salinityPsu: null,
    resistivitySource: 'water',
    potentialSource: 'criterion',
    nextDockingYears: 2.5,
    allowMagnesiumOnAluminium: false,
    anodeModelKey: 'builtin:TW-AW-4020',
    surfaces: defaultVesselZones({ lengthBppM: 90, beamM: 16, draughtM: 4.2, blockCoefficient: 0.6 }),
  };
}

/** The record as JSON would hand it back from the jsonb columns (undefined keys gone). */
export function ferryRecord(): DesignRecord {
  const inputs = ferryInputs();
  const model = { ...BUILTIN_ANODE_MODELS.find((m) => m.id === 'TW-AW-4020')!, key: inputs.anodeModelKey, source: 'built-in' as const };
  const result = designAnodeSystem(buildDesignInput(inputs, model));
  const job = buildDesignJob(inputs);
  // An invented entry without mass gives the unsuitable kind of option row as well.
  const options = compareOptions({ job, models: [...BUILTIN_ANODE_MODELS, { ...model, id: 'NO-MASS', designation: 'NO-MASS', netMassKg: 0 }], fittingRatePerKg: 12 });
  const record: DesignRecord = {
    schemaVersion: DESIGN_SCHEMA_VERSION,
    inputs,
    anodeModel: model,
    results: { ...result, notices: deskNotices(inputs), impressedCurrent: impressedCurrentSummary({ designLifeYears: job.designLifeYears, surfaces: job.surfaces }), options },
    resultError: null,
    basis: result.basis,
  };
  return JSON.parse(JSON.stringify(record));
}
