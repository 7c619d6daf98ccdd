import { drivingVoltageV } from './anode-output';
import type { ResistanceTreatment } from './anode-resistance';
import type { CheckedJob, DesignAnode } from './design-input';
import { CpInputError } from './errors';
import { utilisationFactorFor } from './lookups';
import { currentDensityWarning, resistivityWarning } from './plausibility';
import { ALLOYS, isMagnesium } from './tables/alloys';
import { ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V, MINIMUM_PROTECTION_POTENTIAL, OVER_PROTECTION_LIMIT } from './tables/potential-limits';
import type { CpWarning } from './types';
import { METAL_WORDS } from '@/lib/labels/design';

/** Chloride below which aluminium anodes may passivate, ppm (published). */
export const ALUMINIUM_PASSIVATION_CHLORIDE_PPM = 1450;

/** Where the water type is not stated, a resistivity below this is taken as seawater, ohm m (seawater 0.15-0.30). */
export const SEAWATER_RESISTIVITY_CEILING_OHM_M = 0.5;

/** Al-Zn-In capacity is derated above this water temperature, C (DNV-RP-B401, from memory). */
export const AL_ZN_IN_DERATING_ABOVE_C = 25;

/** Float slack for "less than" comparisons of lives and potentials. */
const SLACK = 1e-9;

const isAluminiumHull = (job: CheckedJob): boolean => job.protectedMetal === 'aluminium' || job.hullMaterial === 'aluminium';

/** Combinations that are invalid input rather than a caution: they throw. */
export function assertCompatible(job: CheckedJob, anode: DesignAnode, anodeField = 'anode'): void {
  if (isMagnesium(anode.alloy) && isAluminiumHull(job) && !job.allowMagnesiumOnAluminium) {
    throw new CpInputError(
      `${anodeField}.alloy`,
      'Magnesium anodes must not be fitted to an aluminium hull: they drive it beyond -1.10 V into alkaline corrosion. Set allowMagnesiumOnAluminium only for a deliberate, separately justified case.',
    );
  }
  drivingVoltageV(job.protectivePotentialV, anode.potentialV, `${anodeField}.potentialV`);
}

export interface WarningContext {
  job: CheckedJob;
  anode: DesignAnode;
  achievedLifeYears: number;
  requiredCount: number;
  installedCount: number;
  resistanceTreatment: ResistanceTreatment;
  ratedOutputScaling?: 'scaled' | 'unscaled';
}

type Check = (c: WarningContext) => CpWarning | null;

const waterIsSeawater = ({ job }: WarningContext): boolean =>
  job.environment ? job.environment.water === 'seawater' : job.resistivityOhmM < SEAWATER_RESISTIVITY_CEILING_OHM_M;

const CHECKS: readonly Check[] = [
  (c) =>
    isMagnesium(c.anode.alloy) && isAluminiumHull(c.job)
      ? { code: 'magnesium-on-aluminium', message: 'Magnesium anodes on an aluminium hull (allowed by override): expect potentials beyond -1.10 V and alkaline corrosion of the aluminium.' }
      : null,
  (c) =>
    isMagnesium(c.anode.alloy) && waterIsSeawater(c)
      ? { code: 'magnesium-in-seawater', message: 'Magnesium in seawater over-protects the steel (coating disbondment, hydrogen) and is consumed rapidly; use aluminium or zinc.' }
      : null,
  (c) => {
    const limit = ALLOYS.zinc.temperatureLimitC ?? Infinity;
    const t = c.job.environment?.temperatureC;
    return c.anode.alloy === 'zinc' && t !== undefined && t > limit
      ? { code: 'zinc-above-temperature-limit', message: `Zinc anodes are not used above about ${limit} °C; the water is ${t} °C. Use an aluminium alloy qualified for the temperature.` }
      : null;
  },
  (c) =>
    c.anode.alloy === 'zinc' && c.job.environment?.water === 'fresh'
      ? { code: 'zinc-in-fresh-water', message: 'Zinc passivates in fresh water and then stops protecting; consider magnesium.' }
      : null,
  (c) => {
    const env = c.job.environment;
    if (c.anode.alloy !== 'al-zn-in' || !env) return null;
    const lowChloride = env.chloridePpm !== undefined ? env.chloridePpm < ALUMINIUM_PASSIVATION_CHLORIDE_PPM : env.water === 'fresh' || env.water === 'brackish';
    return lowChloride
      ? { code: 'aluminium-in-fresh-water', message: `Aluminium anodes may passivate below about ${ALUMINIUM_PASSIVATION_CHLORIDE_PPM} ppm chloride (${env.chloridePpm !== undefined ? `${env.chloridePpm} ppm given` : `${env.water} water, chloride not given`}).` }
      : null;
  },
  (c) =>
    c.achievedLifeYears < c.job.designLifeYears * (1 - SLACK)
      ? { code: 'life-below-design', message: `The installed anodes last about ${round(c.achievedLifeYears)} years, less than the design life of ${c.job.designLifeYears} years.` }
      : null,
  (c) =>
    c.job.nextDockingYears !== undefined && c.achievedLifeYears < c.job.nextDockingYears * (1 - SLACK)
      ? { code: 'life-below-docking-interval', message: `The anodes last about ${round(c.achievedLifeYears)} years, less than the ${c.job.nextDockingYears} years to the next docking.` }
      : null,
  (c) =>
    c.installedCount < c.requiredCount
      ? { code: 'installed-count-below-required', message: `${c.installedCount} anodes are installed; the design needs ${c.requiredCount}.` }
      : null,
  (c) => overProtection(c, 'high-strength-steel', 'over-protection-high-strength-steel', 'hydrogen embrittlement of high-strength steel'),
  (c) => (isAluminiumHull(c.job) ? overProtection({ ...c, job: { ...c.job, protectedMetal: 'aluminium' } }, 'aluminium', 'over-protection-aluminium', 'alkaline corrosion of the aluminium') : null),
  (c) => {
    const drains = c.job.surfaces.filter((s) => s.drainsCurrent !== undefined);
    return drains.length > 0
      ? { code: 'bare-item-current-drain', message: `Bare ${[...new Set(drains.map((s) => METAL_WORDS[String(s.drainsCurrent)] ?? 'metal'))].join(' and ')} items drain protective current (${drains.map((s) => s.name).join(', ')}); include their demand, keep them bonded, and expect faster anode use near them.` }
      : null;
  },
  (c) => {
    const criterion = protectionCriterionV(c.job);
    return c.job.protectivePotentialV > criterion + SLACK
      ? { code: 'protective-potential-less-negative-than-criterion', message: `The design protective potential ${c.job.protectivePotentialV} V is less negative than the ${criterion} V criterion for ${METAL_WORDS[c.job.protectedMetal] ?? 'the metal'}.` }
      : null;
  },
  (c) => {
    const table = utilisationFactorFor(c.anode.shape);
    return c.anode.utilisationFactor > table + SLACK
      ? { code: 'utilisation-above-table', message: `Utilisation factor ${c.anode.utilisationFactor} exceeds the table value ${table} for this anode shape.` }
      : null;
  },
  (c) =>
    c.resistanceTreatment === 'near-flush-slender'
      ? { code: 'standoff-treated-as-flush', message: 'Stand-off below 0.15 m: the slender-anode formulas do not hold; the anode is treated as flush-mounted (higher resistance).' }
      : null,
  (c) =>
    c.resistanceTreatment === 'short-flush-fallback'
      ? { code: 'long-flush-outside-validity', message: 'The plate is shorter than 4 x its width or thickness: the long-flush formula does not hold; McCoy on length x width is used.' }
      : null,
  (c) =>
    c.ratedOutputScaling === 'unscaled'
      ? { code: 'rated-output-unscaled', message: `The data-sheet output ${c.anode.ratedOutputA} A is used unscaled: the data sheet's resistivity is not given, so it cannot be scaled to the ${c.job.resistivityOhmM} Ω·m of this job. Enter the resistivity it was stated at, or leave the output blank to compute it.` }
      : null,
  // Interlocks: choices that are allowed but dangerous for the asset.
  (c) => {
    const limit = OVER_PROTECTION_LIMIT['high-strength-steel'];
    return c.job.protectedMetal === 'high-strength-steel' && limit && c.job.protectivePotentialV < limit.valueV
      ? { code: 'criterion-beyond-over-protection-limit', message: `The design potential ${c.job.protectivePotentialV} V is more negative than the ${limit.valueV} V limit for high-strength steel (hydrogen embrittlement): the anaerobic criterion and the over-protection limit conflict. Get the steel's own limit and a specialist's view.` }
      : null;
  },
  (c) =>
    isMagnesium(c.anode.alloy) && c.job.surfaces.some((s) => s.coating !== 'bare' || s.painted) && (c.job.protectedMetal === 'steel' || c.job.protectedMetal === 'high-strength-steel')
      ? { code: 'magnesium-on-coated-steel', message: 'Magnesium on coated steel drives the potential beyond -1.05 V: the coating disbonds (cathodic disbondment) and blisters. Use zinc or aluminium on coated steel in sea or brackish water.' }
      : null,
  (c) =>
    isMagnesium(c.anode.alloy) && c.job.environment?.water === 'brackish'
      ? { code: 'magnesium-in-brackish-water', message: 'Magnesium in brackish water over-protects the steel and is consumed fast; zinc or aluminium suit brackish water better where the chloride allows.' }
      : null,
  (c) =>
    c.anode.alloy === 'zinc' && c.job.environment?.temperatureC === undefined
      ? { code: 'zinc-temperature-unknown', message: `Zinc anodes lose capacity and may reverse polarity above about ${ALLOYS.zinc.temperatureLimitC ?? 50} °C; no water temperature is given. Enter it (cooling-water outlets and tropical harbours can be warm).` }
      : null,
  (c) => {
    const t = c.job.environment?.temperatureC;
    return c.anode.alloy === 'al-zn-in' && t !== undefined && t > AL_ZN_IN_DERATING_ABOVE_C
      ? { code: 'al-zn-in-warm-water', message: `Al-Zn-In capacity falls in warm water (${t} °C; derating above about ${AL_ZN_IN_DERATING_ABOVE_C} °C, from memory): take the capacity from the supplier's data for this temperature.` }
      : null;
  },
  // Figures that do not fit the water or look like a unit slip (lib/cp/plausibility.ts).
  (c) => (c.job.environment ? resistivityWarning(c.job.environment.water, c.job.resistivityOhmM) : null),
  (c) => currentDensityWarning(c.job.surfaces),
];

function overProtection(c: WarningContext, metal: 'high-strength-steel' | 'aluminium', code: CpWarning['code'], harm: string): CpWarning | null {
  const limit = OVER_PROTECTION_LIMIT[metal];
  if (c.job.protectedMetal !== metal || !limit || !(c.anode.potentialV < limit.valueV)) return null;
  return { code, message: `The anode potential ${c.anode.potentialV} V is more negative than the ${limit.valueV} V limit for ${METAL_WORDS[metal]}: risk of ${harm}.` };
}

/** Least negative potential that protects the job's metal, V vs Ag/AgCl/seawater. */
export function protectionCriterionV(job: Pick<CheckedJob, 'protectedMetal' | 'environment'>): number {
  const steelLike = job.protectedMetal === 'steel' || job.protectedMetal === 'high-strength-steel';
  if (steelLike && job.environment?.anaerobic) return ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V;
  return MINIMUM_PROTECTION_POTENTIAL[job.protectedMetal].valueV;
}

export function collectWarnings(c: WarningContext): CpWarning[] {
  const out: CpWarning[] = [];
  for (const check of CHECKS) {
    const w = check(c);
    if (w) out.push(w);
  }
  return out;
}

const round = (x: number): number => Math.round(x * 10) / 10;
