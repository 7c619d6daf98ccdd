import { nonNegative, positive, record } from './validate';

/**
 * The current a group delivers over its life, as a linear demand profile, and the charge it
 * has delivered by a given time: closed forms only (no stepping), so a fleet stays cheap.
 *
 * Why linear: coating breakdown fc = a + b*t (DNV-RP-B401, design-basis.md "Equations",
 * published) makes the demand Ic = Ac * fc * ic linear in time, so a group's share of it is
 *   I(t) = startA + slope * t,   slope = (endA - startA) / overYears,
 * with t in years (of 8760 h) since installation, startA the share at installation and endA
 * the share at overYears (the design life).
 *
 * After overYears (a choice, documented here):
 * - a rising profile (coated steel) keeps rising at the same slope: fc = a + b*t goes on
 *   growing after the design life, and an anode that outlives its design life is then
 *   forecast at the demand it will meet, not at a frozen one. The cap fc <= 1 is not known
 *   here (only currents are), so beyond it the forecast runs early: the safe side;
 * - a falling profile (bare steel: the initial current density is above the final one while
 *   the steel polarises) holds at endA: the polarised steel keeps needing its final current,
 *   it does not fall towards zero.
 *
 * Charge delivered since installation, A x years (the integral of I):
 *   Q(t) = startA * t + slope * t^2 / 2                        rising, or t <= overYears
 *   Q(t) = Q(overYears) + endA * (t - overYears)               falling, t > overYears
 * Mass consumed = Q(t) x 8760 / eps kg (eps in Ah/kg), the handbook consumption rate
 * I x 8760 / eps integrated over time.
 */
export interface DemandProfile {
  /** The group's current at installation, A (its share of the design's initial demand). */
  startA: number;
  /** The group's current at overYears, A (its share of the design's final demand). */
  endA: number;
  /** Years (of 8760 h) after installation at which the current is endA: the design life. */
  overYears: number;
}

/** Validates a demand profile; `field` names it in errors ('demandProfile'). */
export function readDemandProfile(value: unknown, field: string): DemandProfile {
  const r = record(value, field);
  return {
    startA: nonNegative(r.startA, `${field}.startA`, 'A'),
    endA: nonNegative(r.endA, `${field}.endA`, 'A'),
    overYears: positive(r.overYears, `${field}.overYears`, 'years'),
  };
}

/** A constant current as a profile (the mean-current forecast). */
export function constantProfile(currentA: number): DemandProfile {
  return { startA: currentA, endA: currentA, overYears: 1 };
}

const slopeOf = (p: DemandProfile) => (p.endA - p.startA) / p.overYears;

/** I(t), A, at `years` since installation (0 before it). */
export function currentAtA(p: DemandProfile, years: number): number {
  if (years <= 0) return p.startA;
  if (p.endA < p.startA && years > p.overYears) return p.endA;
  return p.startA + slopeOf(p) * years;
}

/** Q(t), A x years: the charge delivered from installation to `years` after it (0 before it). */
export function chargeAYears(p: DemandProfile, years: number): number {
  if (years <= 0) return 0;
  const slope = slopeOf(p);
  if (slope >= 0 || years <= p.overYears) return p.startA * years + (slope * years * years) / 2;
  return p.startA * p.overYears + (slope * p.overYears * p.overYears) / 2 + p.endA * (years - p.overYears);
}

/**
 * The inverse of chargeAYears: the years after installation at which the delivered charge
 * reaches `chargeAY` (A x years); Infinity when the profile never delivers that much.
 * Quadratic part in the cancellation-free form t = 2q / (a + sqrt(a^2 + 2 s q)).
 */
export function yearsToCharge(p: DemandProfile, chargeAY: number): number {
  if (chargeAY <= 0) return 0;
  const slope = slopeOf(p);
  // A constant current: q / a, the value the general form below gives for s = 0 (m = a, root = a), except where
  // that form overflows (a above about 9e307, where a + root is infinite): q / a is right there too.
  if (slope === 0) return p.startA > 0 ? chargeAY / p.startA : Infinity;
  const atOver = slope >= 0 ? Infinity : chargeAYears(p, p.overYears);
  if (chargeAY <= atOver) {
    // root = sqrt(a^2 + 2 s q), scaled by m so that neither term overflows nor underflows;
    // for a falling profile a^2 + 2 s q >= endA^2 >= 0 up to Q(overYears).
    const m = Math.max(p.startA, Math.sqrt(Math.abs(slope)) * Math.sqrt(chargeAY));
    const root = m > 0 ? m * Math.sqrt(Math.max(0, (p.startA / m) ** 2 + 2 * (slope / m) * (chargeAY / m))) : 0;
    const halfDenominator = (p.startA + root) / 2;
    return halfDenominator > 0 ? chargeAY / halfDenominator : Infinity;
  }
  return p.endA > 0 ? p.overYears + (chargeAY - atOver) / p.endA : Infinity;
}

/** Mean current over 0..overYears, A: (startA + endA) / 2 (the design's mean current share). */
export function meanCurrentA(p: DemandProfile): number {
  return (p.startA + p.endA) / 2;
}
