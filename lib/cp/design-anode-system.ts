import { drivingVoltageV } from './anode-output';
import { FULL_STANDOFF_M, MIN_CORRECTED_STANDOFF_M, resistanceOf, type ResistanceDetail, type ResistanceTreatment } from './anode-resistance';
import { BASIS_ENTRIES, type BasisKey } from './basis';
import { surfaceDemandDetail } from './current-demand';
import { assertCompatible, collectWarnings } from './design-checks';
import { DEFAULT_PROTECTIVE_POTENTIAL_V, validateAnode, validateJob, type CheckedJob, type DesignAnode, type DesignInput } from './design-input';
import { shareOut, type Distribution } from './distribute-anodes';
import { finalShapeOf } from './end-of-life';
import { CpInputError } from './errors';
import { ceilCount, HOURS_PER_YEAR } from './numeric';
import { assertFiniteResult, firstNonFinite } from './validate';
import { ALLOYS, isMagnesium } from './tables/alloys';
import type { AnodeShape, BasisEntry, BreakdownFactors, CpWarning, CurrentsA, CurrentDrain } from './types';

/**
 * Below a nanoampere of mean demand there is nothing to size, and the achieved life
 * (installed charge / mean current) would run off to infinity.
 */
export const MIN_MEAN_DEMAND_A = 1e-9;

export type GoverningCriterion = 'mass' | 'initial-current' | 'final-current';

export interface SurfaceResult extends CurrentsA {
  name: string;
  areaM2: number;
  breakdown: BreakdownFactors;
  drainsCurrent?: CurrentDrain;
}

export interface PerAnodeResult {
  initialResistanceOhm: number;
  finalResistanceOhm: number;
  initialOutputA: number;
  finalOutputA: number;
  initialFormula: ResistanceDetail['formula'];
  finalFormula: ResistanceDetail['formula'];
  /** Shape at end of life, from which the final resistance is computed. */
  finalShape: AnodeShape;
  /** True when the data-sheet output replaced the computed outputs. */
  ratedOutputUsed: boolean;
  /** How a data-sheet output was used: scaled to the job's resistivity (Ohm's law), or as given (no resistivity stated). */
  ratedOutputScaling?: 'scaled' | 'unscaled';
  /** How the initial shape was treated (near-flush slender, short-flush fallback, or as given). */
  initialTreatment: ResistanceTreatment;
}

export interface DesignResult {
  current: CurrentsA;
  surfaces: SurfaceResult[];
  requiredNetMassKg: number;
  drivingVoltageV: number;
  protectivePotentialV: number;
  perAnode: PerAnodeResult;
  /** Counts before rounding up. */
  exactCountBy: { mass: number; initialCurrent: number; finalCurrent: number };
  countBy: { mass: number; initialCurrent: number; finalCurrent: number };
  /** The largest count of the three criteria: the minimum the design needs. */
  anodeCount: number;
  /**
   * The one number to fit: the count after sharing over the surfaces, each share rounded up (never
   * below anodeCount). The headline, the calculation note, the register and the anode list use it.
   */
  anodesToFit: number;
  governingCriterion: GoverningCriterion;
  /** The count the life and mass figures refer to: installedCount when given, else anodesToFit. */
  installedCount: number;
  installedNetMassKg: number;
  installedGrossMassKg: number | null;
  achievedLifeYears: number;
  distribution: Distribution & { basis: 'initial' | 'mean' | 'final' };
  warnings: CpWarning[];
  basis: BasisEntry[];
}

/**
 * Sizes a sacrificial-anode system: current demand, net mass, anode resistance and
 * output at start and end of life, the count by each criterion, distribution over the
 * surfaces, and warnings. Throws CpInputError for invalid input.
 */
export function designAnodeSystem(input: DesignInput): DesignResult {
  const job = validateJob(input);
  const anode = validateAnode((input as { anode?: unknown }).anode, 'anode');
  assertCompatible(job, anode);
  return computeDesign(job, anode);
}

/** Field blamed when extreme inputs overflow: demand and mass from the surfaces, outputs from the anode. */
function overflowField(r: DesignResult): string {
  if (firstNonFinite(r.current) || firstNonFinite(r.surfaces) || !Number.isFinite(r.requiredNetMassKg)) return 'surfaces';
  if (firstNonFinite(r.perAnode) || firstNonFinite(r.exactCountBy)) return 'anode.shape';
  return 'anode.netMassKg';
}

/** Design of a validated, compatible job and anode. */
export function computeDesign(job: CheckedJob, anode: DesignAnode): DesignResult {
  const tf = job.designLifeYears;
  const surfaces = job.surfaces.map((s) => ({ name: s.name, areaM2: s.areaM2, drainsCurrent: s.drainsCurrent, ...surfaceDemandDetail(s, tf) }));
  const current = totalOf(surfaces);
  if (!(current.meanA >= MIN_MEAN_DEMAND_A)) {
    throw new CpInputError(
      'surfaces',
      `The surfaces have no mean current demand (${current.meanA} A: zero area, zero current density or a coating that never breaks down): there is nothing to size.`,
    );
  }
  const u = anode.utilisationFactor;
  const requiredNetMassKg = (current.meanA * tf * HOURS_PER_YEAR) / (u * anode.capacityAhPerKg); // DNV-RP-B401 (2010) sec. 7, anode mass
  const driving = drivingVoltageV(job.protectivePotentialV, anode.potentialV, 'anode.potentialV');
  const perAnode = perAnodeOf(job, anode, driving);

  const exactCountBy = {
    mass: requiredNetMassKg / anode.netMassKg, // DNV-RP-B401 (2010) sec. 7, N*m >= M
    initialCurrent: current.initialA / perAnode.initialOutputA, // DNV-RP-B401 (2010) sec. 7, N*Iai >= Ici
    finalCurrent: current.finalA / perAnode.finalOutputA, // DNV-RP-B401 (2010) sec. 7, N*Iaf >= Icf
  };
  const countBy = { mass: ceilCount(exactCountBy.mass), initialCurrent: ceilCount(exactCountBy.initialCurrent), finalCurrent: ceilCount(exactCountBy.finalCurrent) };
  const { anodeCount, governingCriterion } = governing(countBy);

  const distBasis: 'initial' | 'mean' | 'final' = governingCriterion === 'mass' ? 'mean' : governingCriterion === 'initial-current' ? 'initial' : 'final';
  const demandKey = `${distBasis}A` as const;
  // No anode sits in the mud: the demand there is met by the anodes in the water, shared over the
  // surfaces that take anodes in proportion to their own demand (common practice).
  const placeableIndexes = surfaces.map((_, i) => i).filter((i) => job.surfaces[i].anodesAllowed !== false);
  if (!placeableIndexes.length) throw new CpInputError('surfaces', 'Every surface is marked as taking no anodes (mud or sediment): add the surface in the water where the anodes are fitted.');
  const placeableDemand = placeableIndexes.reduce((acc, i) => acc + surfaces[i][demandKey], 0);
  // Water zones with no demand of their own still carry the mud's: then they share by area.
  const byArea = !(placeableDemand > 0);
  const weight = (i: number) => (byArea ? surfaces[i].areaM2 : surfaces[i][demandKey]);
  const shared = shareOut(anodeCount, placeableIndexes.map((i) => ({ name: surfaces[i].name, demandA: weight(i) })), placeableIndexes.reduce((acc, i) => acc + weight(i), 0));
  // Rows are matched by position: two zones may share a name (twin rudders).
  const rowFor = new Map(placeableIndexes.map((surfaceIndex, k) => [surfaceIndex, { ...shared.surfaces[k], demandA: surfaces[surfaceIndex][demandKey] }]));
  const distribution = {
    basis: distBasis,
    designCount: shared.designCount,
    distributedCount: shared.distributedCount,
    surfaces: surfaces.map((s, i) => rowFor.get(i) ?? { name: s.name, demandA: s[demandKey], share: 0, exactCount: 0, count: 0, anodesAllowed: false }),
  };
  const anodesToFit = Math.max(anodeCount, shared.distributedCount);

  const installedCount = job.installedCount ?? anodesToFit;
  const installedNetMassKg = installedCount * anode.netMassKg;
  const achievedLifeYears = (installedNetMassKg * u * anode.capacityAhPerKg) / (current.meanA * HOURS_PER_YEAR); // DNV-RP-B401 (2010) sec. 7, mass equation solved for tf

  const result: DesignResult = {
    current,
    surfaces,
    requiredNetMassKg,
    drivingVoltageV: driving,
    protectivePotentialV: job.protectivePotentialV,
    perAnode,
    exactCountBy,
    countBy,
    anodeCount,
    anodesToFit,
    governingCriterion,
    installedCount,
    installedNetMassKg,
    installedGrossMassKg: anode.grossMassKg === undefined ? null : installedCount * anode.grossMassKg,
    achievedLifeYears,
    distribution,
    warnings: collectWarnings({ job, anode, achievedLifeYears, requiredCount: anodeCount, installedCount, resistanceTreatment: perAnode.initialTreatment, ratedOutputScaling: perAnode.ratedOutputScaling }),
    basis: basisOf(job, anode, perAnode),
  };
  return firstNonFinite(result) === null ? result : assertFiniteResult(result, overflowField(result));
}

function perAnodeOf(job: CheckedJob, anode: DesignAnode, driving: number): PerAnodeResult {
  const density = anode.densityKgM3 ?? ALLOYS[anode.alloy].densityKgM3;
  const finalShape = finalShapeOf(anode.shape, anode.netMassKg, anode.utilisationFactor, density);
  const initial = resistanceOf(anode.shape, job.resistivityOhmM);
  const final = resistanceOf(finalShape, job.resistivityOhmM);
  // A consumed anode cannot resist less than the new one; where the shrunken shape falls
  // into another formula family (e.g. long flush -> McCoy) the families disagree at their
  // boundary, so the final resistance is never taken below the initial (conservative).
  const finalOhm = Math.max(final.ohm, initial.ohm);
  const rated = ratedOutputs(anode, job.resistivityOhmM, initial.ohm, finalOhm, driving);
  return {
    initialResistanceOhm: initial.ohm,
    finalResistanceOhm: finalOhm,
    initialOutputA: rated?.initialA ?? driving / initial.ohm, // DNV-RP-B401 (2010) sec. 7, Ia = (Ec - Ea)/Ra
    finalOutputA: rated?.finalA ?? driving / finalOhm, // DNV-RP-B401 (2010) sec. 7, Ia = (Ec - Ea)/Ra
    initialFormula: initial.formula,
    finalFormula: final.formula,
    finalShape,
    ratedOutputUsed: rated !== null,
    ...(rated ? { ratedOutputScaling: rated.scaling } : {}),
    initialTreatment: initial.treatment,
  };
}

/**
 * A data-sheet output holds for the resistivity it was stated at: at the same driving voltage the
 * output is inversely proportional to the resistance, and the resistance to the resistivity (Ohm's
 * law), so it scales by rated resistivity / job resistivity; the final output also by the ratio of
 * the new to the consumed anode's resistance. Without a stated resistivity it is used as given (and
 * the design warns).
 */
function ratedOutputs(anode: DesignAnode, resistivityOhmM: number, initialOhm: number, finalOhm: number, drivingV: number) {
  const rated = anode.ratedOutputA;
  if (rated === undefined) return null;
  // Without the resistivity it was stated at, the data-sheet output is used exactly as given (and the
  // design warns), as the handbooks' worked examples do.
  if (anode.ratedAtResistivityOhmM === undefined) return { initialA: rated, finalA: rated, scaling: 'unscaled' as const };
  // A data sheet states its output at the usual -0.80 V criterion (common practice): at another
  // protective potential the driving voltage, and so the output, changes in proportion.
  const ratedDrivingV = DEFAULT_PROTECTIVE_POTENTIAL_V - anode.potentialV;
  const voltage = ratedDrivingV > 0 ? drivingV / ratedDrivingV : 1;
  const initialA = (rated * voltage * anode.ratedAtResistivityOhmM) / resistivityOhmM;
  // The consumed anode's higher resistance lowers its output.
  return { initialA, finalA: (initialA * initialOhm) / finalOhm, scaling: 'scaled' as const };
}

function totalOf(rows: readonly CurrentsA[]): CurrentsA {
  let initialA = 0;
  let meanA = 0;
  let finalA = 0;
  for (const r of rows) {
    initialA += r.initialA;
    meanA += r.meanA;
    finalA += r.finalA;
  }
  return { initialA, meanA, finalA };
}

/** The largest count governs; ties go to mass, then initial, then final current. */
function governing(c: { mass: number; initialCurrent: number; finalCurrent: number }) {
  const anodeCount = Math.max(c.mass, c.initialCurrent, c.finalCurrent);
  const governingCriterion: GoverningCriterion =
    c.mass === anodeCount ? 'mass' : c.initialCurrent === anodeCount ? 'initial-current' : 'final-current';
  return { anodeCount, governingCriterion };
}

const FORMULA_BASIS = { 'modified-dwight': 'modifiedDwight', 'short-slender': 'shortSlender', 'long-flush': 'longFlush', mccoy: 'mcCoy' } as const;

function basisOf(job: CheckedJob, anode: DesignAnode, perAnode: PerAnodeResult): BasisEntry[] {
  const keys = new Set<BasisKey>(['currentDemand', 'anodeMass', 'countCriteria', 'protectionCriteria', 'distribution', 'utilisationTable']);
  if (job.surfaces.some((s) => s.coating !== 'bare')) keys.add('coatingBreakdown');
  keys.add(anode.alloy === 'al-zn-in' ? 'alloyAlZnIn' : anode.alloy === 'zinc' ? 'alloyZinc' : 'alloyMagnesium');
  if (job.protectedMetal === 'high-strength-steel' || job.protectedMetal === 'aluminium' || job.hullMaterial === 'aluminium' || isMagnesium(anode.alloy)) {
    keys.add('overProtectionLimits');
  }
  if (perAnode.ratedOutputUsed) keys.add('ratedOutput');
  else {
    keys.add('anodeOutput');
    keys.add(FORMULA_BASIS[perAnode.initialFormula]);
    keys.add(FORMULA_BASIS[perAnode.finalFormula]);
    const s = anode.shape;
    const standoff = s.kind === 'slender-standoff' ? (s.standoffM ?? FULL_STANDOFF_M) : FULL_STANDOFF_M;
    if (standoff < FULL_STANDOFF_M) keys.add('standoffFactor');
    if (standoff < MIN_CORRECTED_STANDOFF_M) keys.add('nearFlushSlender');
    keys.add(s.kind === 'slender-standoff' ? 'endOfLifeSlender' : 'endOfLifeFlush');
  }
  return [...keys].map((k) => ({ ...BASIS_ENTRIES[k] }));
}
