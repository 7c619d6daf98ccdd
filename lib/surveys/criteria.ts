/**
 * Classification of survey readings: a potential against the protection criterion and
 * over-protection limit of the protected metal, and a remaining-anode fraction against
 * the renewal rule.
 *
 * Potential values are not repeated here: the criteria come from `protectionCriterionV`
 * and the limits from `OVER_PROTECTION_LIMIT` in `@/lib/cp` (V vs Ag/AgCl/seawater), each
 * with its flag (published, from memory, practice):
 * - steel -0.80 V aerobic, -0.90 V anaerobic with sulphate-reducing bacteria (published);
 *   over-protected beyond -1.05 V (published range, ABYC E-2 practice; coating disbondment, practice);
 * - high-strength steel (yield above 550 MPa): the steel criteria, over-protected beyond about
 *   -0.83 V (DNV, from memory: hydrogen embrittlement);
 * - aluminium -0.90 to -1.10 V, alkaline corrosion beyond (published, ABYC E-2 practice);
 * - stainless -0.75 V and copper alloys (bronze) -0.55 V minimum, no limit in the basis (published, trade).
 */
import { POTENTIAL_STATUS_LABELS } from '@/lib/labels/surveys';
import { METAL_WORDS as METAL_NAMES } from '@/lib/labels/design';
import { CpInputError, MINIMUM_PROTECTION_POTENTIAL, OVER_PROTECTION_LIMIT, protectionCriterionV, type Flag, type ProtectedMetal } from '@/lib/cp';

export type PotentialStatus = 'under-protected' | 'protected' | 'over-protected';

export interface ClassifyPotentialInput {
  /** Measured potential converted to Ag/AgCl/seawater, V. */
  potentialAgAgClV: number;
  protectedMetal: ProtectedMetal;
  /** Sulphate-reducing bacteria active (anaerobic): steel criterion -0.90 V. */
  anaerobic?: boolean;
  /**
   * Steel with a yield strength above 550 MPa: judged against the high-strength limit (about
   * -0.83 V, from memory) as `protectedMetal: 'high-strength-steel'` is. Steel only.
   */
  highStrengthSteel?: boolean;
}

export interface PotentialClassification {
  status: PotentialStatus;
  /** Words for the status, e.g. 'Under-protected'. */
  label: string;
  /** Least negative potential that protects, V vs Ag/AgCl/seawater. */
  criterionV: number;
  /** Most negative potential before over-protection harm, V vs Ag/AgCl/seawater; null = none in the basis. */
  limitV: number | null;
  /** Where the criterion comes from: 'published', 'memory' or 'practice'. */
  criterionFlag: Flag;
  /** Where the limit comes from; null when there is none. */
  limitFlag: Flag | null;
  /**
   * The rule that decided the status, in words, e.g. 'less negative than -0.90 V (anaerobic steel)',
   * 'more negative than -0.83 V (high-strength steel)', 'from -0.80 V to -1.05 V (steel)'.
   */
  criterion: string;
  /** One sentence explaining the status. */
  message: string;
}



/** What over-protection does to each metal (or its coating). */
const OVER_PROTECTION_HARM: Readonly<Record<ProtectedMetal, string>> = {
  steel: 'coating disbondment',
  'high-strength-steel': 'hydrogen embrittlement',
  aluminium: 'alkaline corrosion of the aluminium',
  stainless: 'over-protection',
  'copper-alloy': 'over-protection',
};

/**
 * Float slack, V. Readings are rounded to the microvolt on import, so a reading exactly at
 * the criterion or limit is compared as equal to it.
 */
const SLACK_V = 1e-7;

/** Formats a potential with at least 2 and at most 4 decimals: -0.8 -> "-0.80", -0.945 -> "-0.945". */
export function formatVolts(v: number): string {
  const s = v.toFixed(4).replace(/0{1,2}$/, '');
  return s === '-0.00' ? '0.00' : s;
}

/**
 * What the criteria are for, in words: 'steel', 'anaerobic steel', 'anaerobic high-strength steel',
 * 'aluminium' (the anaerobic criterion applies to steel only).
 */
export function criteriaSubject({ protectedMetal, anaerobic = false, highStrengthSteel = false }: Omit<ClassifyPotentialInput, 'potentialAgAgClV'>): string {
  const metal: ProtectedMetal = highStrengthSteel && protectedMetal === 'steel' ? 'high-strength-steel' : protectedMetal;
  const steelLike = metal === 'steel' || metal === 'high-strength-steel';
  return `${anaerobic && steelLike ? 'anaerobic ' : ''}${METAL_NAMES[metal] ?? String(metal)}`;
}

/**
 * Classifies one potential (V vs Ag/AgCl/seawater).
 *
 * - more negative than the over-protection limit: over-protected;
 * - otherwise less negative than the protection criterion: under-protected;
 * - otherwise (at the criterion, at the limit, or between): protected.
 *
 * High-strength steel in anaerobic conditions has a criterion (-0.90 V) beyond its limit
 * (about -0.83 V): no reading can be protected; the message says so.
 */
export function classifyPotential({ potentialAgAgClV, protectedMetal: metalIn, anaerobic = false, highStrengthSteel = false }: ClassifyPotentialInput): PotentialClassification {
  if (typeof potentialAgAgClV !== 'number' || !Number.isFinite(potentialAgAgClV)) {
    throw new CpInputError('potentialAgAgClV', 'The potential must be a finite number of volts.');
  }
  if (!(metalIn in METAL_NAMES)) {
    throw new CpInputError('protectedMetal', `Unknown protected metal "${String(metalIn)}".`);
  }
  if (highStrengthSteel && metalIn !== 'steel' && metalIn !== 'high-strength-steel') {
    throw new CpInputError('highStrengthSteel', `High-strength steel applies to steel, not to ${METAL_NAMES[metalIn]}.`);
  }
  const protectedMetal: ProtectedMetal = highStrengthSteel ? 'high-strength-steel' : metalIn;
  const criterionV = protectionCriterionV({ protectedMetal, environment: anaerobic ? { water: 'seawater', anaerobic: true } : undefined });
  const limit = OVER_PROTECTION_LIMIT[protectedMetal] ?? null;
  const limitV = limit?.valueV ?? null;
  const anaerobicApplies = anaerobic && criterionV !== protectionCriterionV({ protectedMetal });
  // -0.90 V where sulphate-reducing bacteria are active (published, design basis); else the metal's own minimum.
  const criterionFlag: Flag = anaerobicApplies ? 'published' : MINIMUM_PROTECTION_POTENTIAL[protectedMetal].flag;
  const v = potentialAgAgClV;
  const metal = METAL_NAMES[protectedMetal] + (anaerobicApplies ? ' in anaerobic conditions' : '');
  const subject = criteriaSubject({ protectedMetal, anaerobic: anaerobicApplies });
  const noWindow = limitV !== null && criterionV < limitV - SLACK_V;
  const windowNote = noWindow
    ? ` (no potential meets both the ${formatVolts(criterionV)} V criterion and the ${formatVolts(limitV)} V limit for ${metal}; seek specialist advice)`
    : '';

  let status: PotentialStatus;
  let criterion: string;
  let message: string;
  if (limitV !== null && v < limitV - SLACK_V) {
    status = 'over-protected';
    criterion = `more negative than ${formatVolts(limitV)} V (${subject})`;
    message = `${formatVolts(v)} V is more negative than the ${formatVolts(limitV)} V limit for ${metal}: over-protected, risk of ${OVER_PROTECTION_HARM[protectedMetal]}${windowNote}.`;
  } else if (v > criterionV + SLACK_V) {
    status = 'under-protected';
    criterion = `less negative than ${formatVolts(criterionV)} V (${subject})`;
    message = `${formatVolts(v)} V is less negative than the ${formatVolts(criterionV)} V criterion for ${metal}: under-protected${windowNote}.`;
  } else {
    status = 'protected';
    criterion = limitV === null ? `${formatVolts(criterionV)} V or more negative (${subject})` : `from ${formatVolts(criterionV)} V to ${formatVolts(limitV)} V (${subject})`;
    message =
      limitV === null
        ? `${formatVolts(v)} V is at least as negative as the ${formatVolts(criterionV)} V criterion for ${metal}: protected.`
        : `${formatVolts(v)} V lies within the ${formatVolts(criterionV)} V criterion and the ${formatVolts(limitV)} V limit for ${metal}: protected.`;
  }
  return { status, label: POTENTIAL_STATUS_LABELS[status], criterionV, limitV, criterionFlag, limitFlag: limit?.flag ?? null, criterion, message };
}

export type RemainingStatus = 'sound' | 'renew' | 'renew-soon';


/** Renew when less than 25 % of the original mass remains (published, NAVFAC mooring practice; design basis, Inspection). */
export const RENEW_BELOW_REMAINING_FRACTION = 0.25;

/**
 * Plan the renewal when less than 40 % remains (practice: one survey interval of warning;
 * not from a single source). With a utilisation factor below 0.60 the renewal rule is
 * reached first and 'renew-soon' is never returned.
 */
export const RENEW_SOON_BELOW_REMAINING_FRACTION = 0.4;

/**
 * Classifies the remaining share of an anode's original mass (0..1).
 * 'renew' when less than 25 % remains, or, when `utilisationFactor` is given, when the
 * consumed share (1 - fraction) has reached it; 'renew-soon' when less than 40 % remains;
 * otherwise 'sound'.
 */
export function classifyRemaining(fraction: number, utilisationFactor?: number): RemainingStatus {
  if (typeof fraction !== 'number' || !Number.isFinite(fraction) || fraction < 0 || fraction > 1) {
    throw new CpInputError('remainingFraction', 'The remaining fraction must be a number from 0 to 1.');
  }
  if (utilisationFactor !== undefined && (typeof utilisationFactor !== 'number' || !Number.isFinite(utilisationFactor) || utilisationFactor <= 0 || utilisationFactor > 1)) {
    throw new CpInputError('utilisationFactor', 'The utilisation factor must be greater than 0 and at most 1.');
  }
  const consumedReachesU = utilisationFactor !== undefined && 1 - fraction >= utilisationFactor - 1e-9;
  if (fraction < RENEW_BELOW_REMAINING_FRACTION - 1e-9 || consumedReachesU) return 'renew';
  if (fraction < RENEW_SOON_BELOW_REMAINING_FRACTION - 1e-9) return 'renew-soon';
  return 'sound';
}
