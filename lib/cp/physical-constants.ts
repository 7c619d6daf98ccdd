/**
 * Physical constants, SI. The three defining constants below are exact since the 2019
 * revision of the SI (BIPM SI Brochure, 9th edition, 2019; values from memory); the Faraday
 * and gas constants follow from them, so no rounded derived value is typed in.
 */

/** Elementary charge e, C (exact, SI 2019). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;

/** Avogadro constant N_A, 1/mol (exact, SI 2019). */
export const AVOGADRO_PER_MOL = 6.02214076e23;

/** Boltzmann constant k, J/K (exact, SI 2019). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;

/** Faraday constant F = e N_A = 96485.33212... C/mol (CODATA 2018, exact by the SI 2019 definitions). */
export const FARADAY_C_PER_MOL = ELEMENTARY_CHARGE_C * AVOGADRO_PER_MOL;

/** Molar gas constant R = k N_A = 8.314462618... J/(mol K) (CODATA 2018, exact by the SI 2019 definitions). */
export const GAS_CONSTANT_J_PER_MOL_K = BOLTZMANN_J_PER_K * AVOGADRO_PER_MOL;

/** 0 degrees Celsius in kelvin (by definition of the Celsius scale). */
export const ZERO_CELSIUS_K = 273.15;

/** Seconds in an hour, for coulombs to ampere-hours. */
export const SECONDS_PER_HOUR = 3600;
