// Desk inputs for the practice tests, built the way a new design is (the defaults of
// lib/server/services/designs/create-design.ts defaultInputs, which is server code), from pure code only.
import { builtinAnodeModel, designAnodeSystem, type AnodeModel, type DesignResult } from '@/lib/cp';
import { buildDesignInput } from '@/lib/design/build-design-input';
import { defaultStructureZones, defaultVesselZones, type StructureParticulars, type VesselParticulars } from '@/lib/design/default-zones';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { ferryInputs } from './record-fixture';

/** One zone as the desk holds it: entered area, 0-30 m, no override, no drain unless given. */
export function zone(name: string, kind: DeskSurface['kind'], areaM2: number, coatingCategory: DeskSurface['coatingCategory'], extra: Partial<DeskSurface> = {}): DeskSurface {
  return { name, kind, areaM2, areaSource: 'entered', depthBand: '0-30', coatingCategory, coatingAgeYears: 0, currentDensityOverride: null, drainsCurrent: null, temperatureC: null, ...extra } as DeskSurface;
}

/**
 * A steel vessel as a new design starts it: ship-hull practice over a 2.5-year docking interval, good
 * paint, no speed given, resistivity from the water (PSS-78) and potential from the criterion, the
 * built-in flush Al-Zn-In plate TW-AW-4020.
 */
export function vesselInputs(particulars: VesselParticulars, change: Partial<DeskInputs> = {}): DeskInputs {
  return { ...ferryInputs(), serviceSpeedKnots: null, surfaces: defaultVesselZones(particulars), ...change };
}

/** A piled structure as a new design starts it: harbour practice over 20 years, bare piles, stand-off TW-AS-2018. */
export function structureInputs(particulars: StructureParticulars, change: Partial<DeskInputs> = {}): DeskInputs {
  return {
    ...ferryInputs(),
    designLifeYears: 20,
    hullMaterial: null,
    nextDockingYears: null,
    serviceSpeedKnots: null,
    demandMethod: 'harbour',
    anodeModelKey: 'builtin:TW-AS-2018',
    surfaces: defaultStructureZones(particulars),
    ...change,
  };
}

/** The built-in model named by the inputs' key (builtin:<id>). */
export function modelOf(inputs: DeskInputs): AnodeModel {
  const model = builtinAnodeModel(inputs.anodeModelKey.replace(/^builtin:/, ''));
  if (!model) throw new Error(`no built-in model ${inputs.anodeModelKey}`);
  return model;
}

/** Sizes the inputs as the desk does (environment resolved inside buildDesignInput). */
export function size(inputs: DeskInputs, model: AnodeModel = modelOf(inputs)): DesignResult {
  return designAnodeSystem(buildDesignInput(inputs, model));
}

/** The 60 m workboat of the acceptance case (invented particulars). */
export const WORKBOAT: VesselParticulars = { lengthBppM: 60, beamM: 13, draughtM: 4, blockCoefficient: 0.6, vesselType: 'Workboat' };
/** The 40-pile jetty of the acceptance case (invented; 610 mm tubular piles). */
export const JETTY: StructureParticulars = { pileCount: 40, pileDiameterM: 0.61 };
