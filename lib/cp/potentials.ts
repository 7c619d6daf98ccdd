import { CpInputError } from './errors';
import { FARADAY_C_PER_MOL, GAS_CONSTANT_J_PER_MOL_K, ZERO_CELSIUS_K } from './physical-constants';
import { REFERENCE_ELECTRODES, type ReferenceElectrode } from './tables/reference-electrodes';
import { assertFiniteResult, finite, oneOf, optional } from './validate';
import { chlorinityGPerKg } from './water-type';

const ELECTRODES = Object.keys(REFERENCE_ELECTRODES) as ReferenceElectrode[];

/** Salinity at which the Ag/AgCl/seawater electrode's tabulated potential holds, PSU (full-strength seawater). */
export const AG_AGCL_SEAWATER_CALIBRATION_PSU = 35;

/**
 * Salinities over which the chloride correction is applied, PSU. Below 0.5 (fresh water,
 * Venice system) the chloride no longer follows the salinity of diluted seawater and the
 * electrode has no stable potential: use a saturated-KCl Ag/AgCl electrode or CSE there.
 * Above 42 the salinity is outside the scale that defines it (PSS-78).
 */
export const AG_AGCL_SEAWATER_SALINITY_RANGE_PSU = { min: 0.5, max: 42 } as const;

/** Temperature at which the chloride correction's Nernst slope is taken, C. */
export const CHLORIDE_CORRECTION_TEMPERATURE_C = 25;

export interface ConvertPotentialInput {
  valueV: number;
  from: ReferenceElectrode;
  to: ReferenceElectrode;
  /**
   * Salinity of the water the `from` electrode stood in, PSU. Used only when `from` is
   * 'ag-agcl-seawater': the reading is corrected for the chloride of that water. The `to`
   * scale is always the electrode at its calibration (Ag/AgCl/seawater at 35 PSU).
   * Omitted: the water is taken as full-strength seawater (no correction).
   */
  salinityPsu?: number;
}

/** Nernst slope RT ln10 / F, V per decade of activity for a one-electron reaction: 0.05916 V at 25 C. */
export function nernstSlopeV(temperatureC: number): number {
  const t = finite(temperatureC, 'temperatureC', 'degrees C');
  const kelvin = t + ZERO_CELSIUS_K;
  if (!(kelvin > 0)) throw new CpInputError('temperatureC', `temperatureC must be above absolute zero, -273.15 C (got ${t}).`);
  return (GAS_CONSTANT_J_PER_MOL_K * kelvin * Math.LN10) / FARADAY_C_PER_MOL; // Nernst equation, R and F from CODATA 2018
}

/**
 * How far an Ag/AgCl/seawater electrode in water of the given salinity stands from its
 * potential in full-strength seawater, V. AgCl + e- = Ag + Cl-: E = E0 - (RT/F) ln a(Cl-),
 * so E(S) = E(35) - 0.05916 log10(Cl/Cl35) at 25 C (Nernst), with chloride in proportion to
 * salinity (S = 1.80655 Cl) and concentration standing for activity (the activity
 * coefficient rises on dilution; neglecting it overstates the shift by a few mV at 3.5 PSU).
 * Positive below 35 PSU: with less chloride the electrode itself is MORE positive, so a
 * structure reads MORE NEGATIVE against it than against the electrode in seawater.
 */
export function agAgClSeawaterShiftV(salinityPsu: number, field = 'salinityPsu'): number {
  const s = finite(salinityPsu, field, 'PSU');
  const { min, max } = AG_AGCL_SEAWATER_SALINITY_RANGE_PSU;
  if (s < min || s > max) {
    throw new CpInputError(
      field,
      `${field} must be between ${min} and ${max} PSU for the chloride correction of an Ag/AgCl/seawater electrode (got ${s}); in fresh water use a saturated-KCl Ag/AgCl electrode or CSE.`,
    );
  }
  const ratio = chlorinityGPerKg(s) / chlorinityGPerKg(AG_AGCL_SEAWATER_CALIBRATION_PSU);
  return -nernstSlopeV(CHLORIDE_CORRECTION_TEMPERATURE_C) * Math.log10(ratio); // Nernst: E = E(35) - 0.05916 log10(Cl/Cl35)
}

/**
 * Re-expresses a potential measured against one reference electrode against another.
 * With `salinityPsu`, a reading against an Ag/AgCl/seawater electrode in brackish water is
 * first corrected for the chloride of that water: a tenfold dilution makes the raw reading
 * about 59 mV more negative than it is on the seawater-calibrated scale.
 */
export function convertPotential({ valueV, from, to, salinityPsu }: ConvertPotentialInput): number {
  const v = finite(valueV, 'valueV', 'V');
  const fromElectrode = oneOf(from, ELECTRODES, 'from');
  const toElectrode = oneOf(to, ELECTRODES, 'to');
  const shift = optional(salinityPsu, (s) => agAgClSeawaterShiftV(s as number)) ?? 0;
  const a = REFERENCE_ELECTRODES[fromElectrode].vsSheV + (fromElectrode === 'ag-agcl-seawater' ? shift : 0);
  const b = REFERENCE_ELECTRODES[toElectrode].vsSheV;
  return assertFiniteResult(v + a - b, 'valueV'); // E(vs to) = E(vs from) + E(from vs SHE) - E(to vs SHE)
}
