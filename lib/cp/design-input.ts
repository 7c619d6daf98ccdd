import { validateShape } from './anode-shape';
import { validateSurfaceDemand } from './current-demand';
import { CpInputError } from './errors';
import { plausibleAnodePotential, plausibleCapacity } from './plausibility';
import { protectionCriterionV } from './design-checks';
import type {
  AnodeAlloy,
  AnodeShape,
  Coating,
  CurrentDensity,
  CurrentDrain,
  HullMaterial,
  ProtectedMetal,
  WaterType,
} from './types';
import { bool, finite, list, nonNegative, oneOf, optional, positive, record, text, unitFraction, wholeNonNegative } from './validate';

export const ALLOY_NAMES: readonly AnodeAlloy[] = ['al-zn-in', 'zinc', 'magnesium', 'magnesium-high-potential'];
export const PROTECTED_METALS: readonly ProtectedMetal[] = ['steel', 'high-strength-steel', 'aluminium', 'stainless', 'copper-alloy'];
const WATERS: readonly WaterType[] = ['seawater', 'brackish', 'fresh', 'sediment'];
const DRAINS: readonly CurrentDrain[] = ['copper-alloy', 'stainless'];
const HULLS: readonly HullMaterial[] = ['steel', 'aluminium'];

/** Design protective potential for steel in aerobic seawater, V vs Ag/AgCl/seawater (published). */
export const DEFAULT_PROTECTIVE_POTENTIAL_V = -0.8;

export interface DesignSurface {
  name: string;
  areaM2: number;
  /** Bare-metal design current densities, A/m2. */
  currentDensity: CurrentDensity;
  coating: Coating;
  /** Marks a bare non-steel item (bronze propeller, stainless shaft) that drains current. */
  drainsCurrent?: CurrentDrain;
  /**
   * False where no anode is placed (steel in the mud or sediment): its demand is met by the anodes in
   * the water, which are shared over the other surfaces (common practice for piles and sheet piling).
   */
  anodesAllowed?: boolean;
  /** The surface is painted although its density already covers the coated state (fc = 1, ship-hull practice). */
  painted?: boolean;
}

export interface DesignAnode {
  alloy: AnodeAlloy;
  /** Ah/kg; never above the theoretical capacity of the alloy's metal (Faraday's law). */
  capacityAhPerKg: number;
  /** Closed-circuit potential, V vs Ag/AgCl/seawater, within -1.8 to -0.7 V (ANODE_POTENTIAL_RANGE_V). */
  potentialV: number;
  utilisationFactor: number;
  netMassKg: number;
  /** Net mass plus steel insert, kg; optional, for installed gross mass. */
  grossMassKg?: number;
  shape: AnodeShape;
  /** Data-sheet output, A; replaces the computed initial and final outputs. */
  ratedOutputA?: number;
  /** Resistivity, ohm m, at which the data-sheet output was stated; the output is scaled to the job's. */
  ratedAtResistivityOhmM?: number;
  /** Alloy density, kg/m3, for end-of-life dimensions; defaults to the alloy table. */
  densityKgM3?: number;
}

export interface DesignEnvironment {
  water: WaterType;
  temperatureC?: number;
  chloridePpm?: number;
  /** Sulphate-reducing bacteria active: steel criterion -0.90 V. */
  anaerobic?: boolean;
}

/** Everything about the job except the anode. */
export interface DesignJob {
  designLifeYears: number;
  /** V vs Ag/AgCl/seawater; default -0.80. */
  protectivePotentialV?: number;
  resistivityOhmM: number;
  protectedMetal: ProtectedMetal;
  surfaces: DesignSurface[];
  environment?: DesignEnvironment;
  allowMagnesiumOnAluminium?: boolean;
  hullMaterial?: HullMaterial;
  /** Years to the next docking or renewal campaign. */
  nextDockingYears?: number;
  /** Anodes actually fitted, when checking an existing installation. */
  installedCount?: number;
}

export interface DesignInput extends DesignJob {
  anode: DesignAnode;
}

export type CheckedJob = Required<Pick<DesignJob, 'protectivePotentialV' | 'allowMagnesiumOnAluminium'>> &
  Omit<DesignJob, 'protectivePotentialV' | 'allowMagnesiumOnAluminium'>;

/** Validates the job and fills defaults; throws CpInputError naming the field. */
export function validateJob(input: unknown): CheckedJob {
  const r = record(input, 'input');
  return {
    designLifeYears: positive(r.designLifeYears, 'designLifeYears', 'years'),
    // Not given: the criterion that governs for the metal and the environment (anaerobic steel -0.90 V).
    protectivePotentialV: optional(r.protectivePotentialV, (v) => finite(v, 'protectivePotentialV', 'V')) ?? protectionCriterionV({ protectedMetal: oneOf(r.protectedMetal, PROTECTED_METALS, 'protectedMetal'), environment: optional(r.environment, (v) => validateEnvironment(v)) }),
    resistivityOhmM: positive(r.resistivityOhmM, 'resistivityOhmM', 'ohm m'),
    protectedMetal: oneOf(r.protectedMetal, PROTECTED_METALS, 'protectedMetal'),
    surfaces: list(r.surfaces, 'surfaces').map((s, i) => validateSurface(s, `surfaces[${i}]`)),
    environment: optional(r.environment, (v) => validateEnvironment(v)),
    allowMagnesiumOnAluminium: optional(r.allowMagnesiumOnAluminium, (v) => bool(v, 'allowMagnesiumOnAluminium')) ?? false,
    hullMaterial: optional(r.hullMaterial, (v) => oneOf(v, HULLS, 'hullMaterial')),
    nextDockingYears: optional(r.nextDockingYears, (v) => positive(v, 'nextDockingYears', 'years')),
    installedCount: optional(r.installedCount, (v) => wholeNonNegative(v, 'installedCount')),
  };
}

function validateSurface(value: unknown, field: string): DesignSurface {
  const r = record(value, field);
  return {
    name: text(r.name, `${field}.name`),
    ...validateSurfaceDemand(r, `${field}.`),
    drainsCurrent: optional(r.drainsCurrent, (v) => oneOf(v, DRAINS, `${field}.drainsCurrent`)),
    anodesAllowed: optional(r.anodesAllowed, (v) => bool(v, `${field}.anodesAllowed`)),
    painted: optional(r.painted, (v) => bool(v, `${field}.painted`)),
  };
}

function validateEnvironment(value: unknown): DesignEnvironment {
  const r = record(value, 'environment');
  return {
    water: oneOf(r.water, WATERS, 'environment.water'),
    temperatureC: optional(r.temperatureC, (v) => finite(v, 'environment.temperatureC', 'degrees C')),
    chloridePpm: optional(r.chloridePpm, (v) => nonNegative(v, 'environment.chloridePpm', 'ppm')),
    anaerobic: optional(r.anaerobic, (v) => bool(v, 'environment.anaerobic')),
  };
}

/** Validates the anode; `field` is its path (e.g. 'anode'). */
export function validateAnode(value: unknown, field: string): DesignAnode {
  const r = record(value, field);
  const f = (name: string) => `${field}.${name}`;
  const netMassKg = positive(r.netMassKg, f('netMassKg'), 'kg');
  const grossMassKg = optional(r.grossMassKg, (v) => positive(v, f('grossMassKg'), 'kg'));
  if (grossMassKg !== undefined && grossMassKg < netMassKg) {
    throw new CpInputError(f('grossMassKg'), `${f('grossMassKg')} (${grossMassKg} kg) cannot be less than the net mass (${netMassKg} kg).`);
  }
  const alloy = oneOf(r.alloy, ALLOY_NAMES, f('alloy'));
  return {
    alloy,
    capacityAhPerKg: plausibleCapacity(positive(r.capacityAhPerKg, f('capacityAhPerKg'), 'Ah/kg'), alloy, f('capacityAhPerKg')),
    potentialV: plausibleAnodePotential(finite(r.potentialV, f('potentialV'), 'V'), f('potentialV')),
    utilisationFactor: unitFraction(r.utilisationFactor, f('utilisationFactor')),
    netMassKg,
    grossMassKg,
    shape: validateShape(r.shape, f('shape')),
    ratedOutputA: optional(r.ratedOutputA, (v) => positive(v, f('ratedOutputA'), 'A')),
    ratedAtResistivityOhmM: optional(r.ratedAtResistivityOhmM, (v) => positive(v, f('ratedAtResistivityOhmM'), 'ohm m')),
    densityKgM3: optional(r.densityKgM3, (v) => positive(v, f('densityKgM3'), 'kg/m3')),
  };
}
