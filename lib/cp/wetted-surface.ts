import { assertFiniteResult, nonNegative, positive, unitFraction } from './validate';

export interface HullParticulars {
  lengthM: number;
  beamM: number;
  draughtM: number;
  blockCoefficient: number;
}

/** Wetted surface, m2, by Denny-Mumford: S = L*(1.7*T + CB*B) (= 1.7*L*T + V/T). */
export function wettedSurfaceDennyMumford(input: HullParticulars): number {
  const p = particulars(input);
  return assertFiniteResult(p.l * (1.7 * p.t + p.cb * p.b), 'lengthM'); // Denny-Mumford, published
}

export interface HoltropMennenParticulars extends HullParticulars {
  midshipCoefficient: number;
  waterplaneCoefficient: number;
  /** Transverse sectional area of the bulb at the forward perpendicular, m2 (0 without a bulb). */
  bulbAreaM2: number;
}

/** Wetted surface, m2, by the Holtrop-Mennen (1982) regression. */
export function wettedSurfaceHoltropMennen(input: HoltropMennenParticulars): number {
  const { l, b, t, cb } = particulars(input);
  const cm = unitFraction(input.midshipCoefficient, 'midshipCoefficient');
  const cwp = unitFraction(input.waterplaneCoefficient, 'waterplaneCoefficient');
  const abt = nonNegative(input.bulbAreaM2, 'bulbAreaM2', 'm2');
  // Holtrop & Mennen (1982), wetted surface of the bare hull, from memory
  const hull = l * (2 * t + b) * Math.sqrt(cm) * (0.453 + 0.4425 * cb - 0.2862 * cm - 0.003467 * (b / t) + 0.3696 * cwp);
  return assertFiniteResult(hull + (2.38 * abt) / cb, 'lengthM');
}

function particulars(input: HullParticulars) {
  return {
    l: positive(input?.lengthM, 'lengthM', 'm'),
    b: positive(input?.beamM, 'beamM', 'm'),
    t: positive(input?.draughtM, 'draughtM', 'm'),
    cb: unitFraction(input?.blockCoefficient, 'blockCoefficient'),
  };
}
