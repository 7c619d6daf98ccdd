import {
  anodeFromModel,
  coatingConstantsFor,
  currentDensityFor,
  type AnodeModel,
  type Coating,
  type CurrentDensity,
  type DesignInput,
  type DesignJob,
} from '@/lib/cp';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';

export interface DeskNotice {
  code: string;
  message: string;
}

/** The bare-metal design current density of a zone, A/m2: the engineer's value, else the DNV table. */
export function zoneCurrentDensity(surface: DeskSurface, climate: DeskInputs['climate']): CurrentDensity {
  if (surface.currentDensityOverride) {
    const o = surface.currentDensityOverride;
    return { initial: o.initial / 1000, mean: o.mean / 1000, final: o.final / 1000 };
  }
  return currentDensityFor({ climate, depthBand: surface.depthBand });
}

/**
 * Coating breakdown constants for a zone. A coating already `age` years old at the start of the
 * design life continues the same line: fc(t) = a + b(age + t) = (a + b*age) + b*t (DNV-RP-B401 (2010) 10.4).
 */
export function zoneCoating(surface: DeskSurface): Coating {
  if (surface.coatingCategory === 'bare') return 'bare';
  const depthBand = surface.depthBand === 'sediment' ? '0-30' : surface.depthBand;
  const { a, b } = coatingConstantsFor({ category: surface.coatingCategory, depthBand });
  return { a: Math.min(1, a + b * surface.coatingAgeYears), b };
}

export function buildDesignJob(inputs: DeskInputs): DesignJob {
  return {
    designLifeYears: inputs.designLifeYears,
    protectivePotentialV: inputs.protectivePotentialV,
    resistivityOhmM: inputs.resistivityOhmM,
    protectedMetal: inputs.protectedMetal,
    hullMaterial: inputs.hullMaterial ?? undefined,
    nextDockingYears: inputs.nextDockingYears ?? undefined,
    allowMagnesiumOnAluminium: inputs.allowMagnesiumOnAluminium,
    environment: {
      water: inputs.water,
      temperatureC: inputs.temperatureC ?? undefined,
      chloridePpm: inputs.chloridePpm ?? undefined,
      anaerobic: inputs.anaerobic,
    },
    surfaces: inputs.surfaces.map((s) => ({
      name: s.name,
      areaM2: s.areaM2,
      currentDensity: zoneCurrentDensity(s, inputs.climate),
      coating: zoneCoating(s),
      drainsCurrent: s.drainsCurrent ?? undefined,
    })),
  };
}

export function buildDesignInput(inputs: DeskInputs, model: AnodeModel): DesignInput {
  return { ...buildDesignJob(inputs), anode: anodeFromModel(model, inputs.water) };
}

/** Notes about the inputs that lib/cp cannot see: where a table value is used outside its scope. */
export function deskNotices(inputs: DeskInputs): DeskNotice[] {
  const notices: DeskNotice[] = [];
  const tableZones = inputs.surfaces.filter((s) => !s.currentDensityOverride);
  if (inputs.water !== 'seawater' && tableZones.length) {
    notices.push({
      code: 'table-density-outside-seawater',
      message: `The DNV-RP-B401 current densities are for seawater; ${tableZones.map((s) => s.name).join(', ')} use them in ${inputs.water} water. Enter a measured or handbook value (MIL-HDBK-1004/10 gives 22-65 mA/m² for bare steel in fresh water).`,
    });
  }
  if (inputs.water !== 'seawater' && inputs.resistivityOhmM < 1) {
    notices.push({ code: 'resistivity-looks-like-seawater', message: `A resistivity of ${inputs.resistivityOhmM} Ω·m is a seawater value; ${inputs.water} water is far more resistive. Use a measured value.` });
  }
  return notices;
}
