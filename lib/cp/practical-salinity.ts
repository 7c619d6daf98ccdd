import { CpInputError } from './errors';
import { assertFiniteResult, finite, positive } from './validate';

/**
 * The Practical Salinity Scale 1978 (PSS-78) at zero pressure: UNESCO technical papers in
 * marine science 36 and 37 (1981) define it, no. 44 (Fofonoff & Millard, 1983) gives the
 * algorithms. It gives the salinity S from the conductivity ratio R_t and the temperature;
 * here it is also inverted (S, T -> conductivity) for the resistivity of the water.
 *
 * Temperature: the scale is defined on IPTS-68. An ITS-90 reading differs by a factor
 * 1.00024, under 0.01 C over -2 to 35 C (about 0.02 % in conductivity), so the input is
 * used as it is.
 */

/** C(35, 15 C, 0) = 42.914 mS/cm = 4.2914 S/m, the conductivity that defines the scale (UNESCO 1981, PSS-78). */
export const PSS78_REFERENCE_CONDUCTIVITY_S_PER_M = 4.2914;

/** Salinity range of the scale, PSU (UNESCO 1981, PSS-78 valid 2-42). */
export const PSS78_SALINITY_RANGE_PSU = { min: 2, max: 42 } as const;

/** Temperature range of the scale, C (UNESCO 1981, PSS-78 valid -2 to 35 C). */
export const PSS78_TEMPERATURE_RANGE_C = { min: -2, max: 35 } as const;

// Coefficients as published in UNESCO tech. paper 44 (1983); from memory (they agree digit
// for digit with the TEOS-10 GSW library's gsw_sp_from_c).
const A = [0.008, -0.1692, 25.3851, 14.0941, -7.0261, 2.7081] as const; // S(R_t) at 15 C; they sum to 35
const B = [0.0005, -0.0056, -0.0066, -0.0375, 0.0636, -0.0144] as const; // temperature correction; they sum to 0
const K = 0.0162;
const C = [0.6766097, 2.00564e-2, 1.104259e-4, -6.9698e-7, 1.0031e-9] as const; // r_t(T) = C(35, T, 0) / C(35, 15, 0)

export interface SeawaterStateInput {
  /** Water temperature, C (-2 to 35). */
  temperatureC: number;
  /** Practical salinity, PSU (2 to 42). */
  salinityPsu: number;
}

export interface PracticalSalinityInput {
  conductivitySPerM: number;
  temperatureC: number;
}

/** r_t(T) = C(35, T, 0) / C(35, 15, 0), the temperature ratio of standard seawater (UNESCO 44 (1983), PSS-78). */
function rt(t: number): number {
  return C[0] + t * (C[1] + t * (C[2] + t * (C[3] + t * C[4])));
}

/** S(R_t, T) and dS/dR_t (UNESCO 44 (1983), PSS-78: S = sum a_i R_t^(i/2) + (T-15)/(1+k(T-15)) sum b_i R_t^(i/2)). */
function salinityAndSlope(rT: number, t: number): { s: number; dsdr: number } {
  const x = Math.sqrt(rT);
  const f = (t - 15) / (1 + K * (t - 15));
  let s = 0;
  let dsdx = 0;
  for (let i = 0; i < 6; i++) {
    const c = A[i] + f * B[i];
    s += c * x ** i;
    if (i > 0) dsdx += i * c * x ** (i - 1);
  }
  return { s, dsdr: dsdx / (2 * x) };
}

function checkedTemperature(value: unknown, field = 'temperatureC'): number {
  const t = finite(value, field, 'degrees C');
  const { min, max } = PSS78_TEMPERATURE_RANGE_C;
  if (t < min || t > max) {
    throw new CpInputError(field, `${field} must be between ${min} and ${max} °C, the range of the Practical Salinity Scale 1978 (got ${t}).`);
  }
  return t;
}

function checkedSalinity(value: unknown, field = 'salinityPsu'): number {
  const s = finite(value, field, 'PSU');
  const { min, max } = PSS78_SALINITY_RANGE_PSU;
  if (s < min || s > max) {
    throw new CpInputError(
      field,
      `${field} must be between ${min} and ${max} PSU, the range of the Practical Salinity Scale 1978 (got ${s}); below ${min} PSU measure the resistivity instead.`,
    );
  }
  return s;
}

/** Bracket of R_t searched by the inversion: S(1e-3) is below 0.1 and S(2) above 70 at every temperature in range. */
const RT_BRACKET = { lo: 1e-3, hi: 2 } as const;

/** R_t with S(R_t, T) = S: Newton steps, kept inside a shrinking bracket (bisection when a step leaves it). */
function rtFromSalinity(s: number, t: number): number {
  let lo: number = RT_BRACKET.lo;
  let hi: number = RT_BRACKET.hi;
  let r = s / 35;
  for (let i = 0; i < 100; i++) {
    const { s: at, dsdr } = salinityAndSlope(r, t);
    const f = at - s;
    if (f === 0) return r;
    if (f < 0) lo = r;
    else hi = r;
    let next = r - f / dsdr;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - r) <= 1e-15 * r) return next;
    r = next;
  }
  return r;
}

/** Float slack at the ends of the salinity range, so a conductivity computed at 2 or 42 PSU is read back. */
const RANGE_SLACK_PSU = 1e-9;

/** Conductivity of seawater at zero pressure, S/m, from its salinity and temperature (PSS-78 inverted). */
export function seawaterConductivitySPerM(input: SeawaterStateInput): number {
  const t = checkedTemperature(input?.temperatureC);
  const s = checkedSalinity(input?.salinityPsu);
  const rT = rtFromSalinity(s, t);
  return rT * rt(t) * PSS78_REFERENCE_CONDUCTIVITY_S_PER_M; // UNESCO 44 (1983), PSS-78 at p = 0: C = R_t * r_t(T) * C(35, 15, 0)
}

/** Resistivity of seawater at zero pressure, ohm m = 1 / (conductivity in S/m). */
export function seawaterResistivityOhmM(input: SeawaterStateInput): number {
  return 1 / seawaterConductivitySPerM(input);
}

/** Practical salinity, PSU, from conductivity (S/m) and temperature at zero pressure (UNESCO 44 (1983), PSS-78). */
export function practicalSalinity(input: PracticalSalinityInput): number {
  const t = checkedTemperature(input?.temperatureC);
  const c = positive(input?.conductivitySPerM, 'conductivitySPerM', 'S/m');
  const rT = c / PSS78_REFERENCE_CONDUCTIVITY_S_PER_M / rt(t); // R_t = R / r_t(T), R_p = 1 at zero pressure
  const s = assertFiniteResult(salinityAndSlope(rT, t).s, 'conductivitySPerM');
  const { min, max } = PSS78_SALINITY_RANGE_PSU;
  if (s < min - RANGE_SLACK_PSU || s > max + RANGE_SLACK_PSU) {
    throw new CpInputError('conductivitySPerM', `conductivitySPerM (${c} S/m at ${t} °C) gives ${s.toFixed(3)} PSU, outside the ${min}-${max} PSU range of the Practical Salinity Scale 1978.`);
  }
  return s;
}
