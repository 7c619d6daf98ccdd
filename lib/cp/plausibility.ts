import { CpInputError } from './errors';
import { ANODE_METALS, theoreticalCapacityAhPerKg } from './theoretical-capacity';
import type { AnodeAlloy, CpWarning, CurrentDensity, WaterType } from './types';

/**
 * Physical range of an anode's closed-circuit potential, V vs Ag/AgCl/seawater.
 * - Most negative -1.8 V: high-potential magnesium, the most active anode alloy in use, works
 *   at about -1.7 V (MIL-HDBK-1004/10, published); 0.1 V beyond it allows for alloy and
 *   temperature. No working anode approaches magnesium's standard potential (-2.37 V vs SHE):
 *   a value past -1.8 V is a wrong unit (mV), a wrong electrode or a typing error.
 * - Least negative -0.7 V: the least active figure of the anode alloys is zinc in sediment,
 *   -0.98 V (DNV-RP-B401 (2010) Table 10-6, from memory); -0.7 V is nearly 0.3 V beyond it
 *   and less negative than the -0.80 V steel criterion. Less negative is a lost sign, a
 *   reading against another electrode or a passivated anode, not a design value.
 */
export const ANODE_POTENTIAL_RANGE_V = { mostNegative: -1.8, leastNegative: -0.7 } as const;

/**
 * Seawater resistivity that fits seawater, ohm m. The scale gives about 0.13 (42 PSU, 35 C)
 * to 0.42 (30 PSU, -2 C) over the range of seawater (computed from PSS-78, see
 * seawaterResistivityOhmM); the bounds leave room for measurement. Above 1 ohm m the water is
 * brackish (about 1.4 ohm m at 5 PSU and 15 C); 25 for seawater is 25 ohm cm = 0.25 ohm m.
 */
export const SEAWATER_RESISTIVITY_RANGE_OHM_M = { min: 0.1, max: 1.0 } as const;

/** Fresh water is 10-100+ ohm m (common practice); below 5 ohm m it is not fresh water. */
export const FRESH_WATER_MIN_RESISTIVITY_OHM_M = 5;

/**
 * Largest plausible design current density, A/m2. Bare steel in seawater needs at most
 * 0.25 A/m2 (DNV-RP-B401 (2010) Tables 10-1/10-2, from memory) and a copper-alloy propeller
 * 0.45-0.5 A/m2 (published, design basis); 1 A/m2 and more is a figure in mA/m2 typed as A/m2.
 */
export const MAX_PLAUSIBLE_CURRENT_DENSITY_A_PER_M2 = 1.0;

/** A capacity above the theoretical value of the alloy's metal (Faraday's law) is refused. */
export function plausibleCapacity(capacityAhPerKg: number, alloy: AnodeAlloy, field: string): number {
  const limit = theoreticalCapacityAhPerKg(alloy);
  if (capacityAhPerKg > limit) {
    throw new CpInputError(
      field,
      `${field} (${capacityAhPerKg} Ah/kg) is above the theoretical capacity of its metal, ${ANODE_METALS[alloy].name} (${Math.round(limit)} Ah/kg by Faraday's law): no anode gives more charge than its metal holds. Check the value and its unit.`,
    );
  }
  return capacityAhPerKg;
}

/** An anode potential outside ANODE_POTENTIAL_RANGE_V is refused. */
export function plausibleAnodePotential(potentialV: number, field: string): number {
  const { mostNegative, leastNegative } = ANODE_POTENTIAL_RANGE_V;
  if (potentialV < mostNegative || potentialV > leastNegative) {
    throw new CpInputError(
      field,
      `${field} (${potentialV} V) is outside the physical range of anode closed-circuit potentials, ${mostNegative} to ${leastNegative} V vs Ag/AgCl/seawater: check the sign, the unit (V, not mV) and the reference electrode.`,
    );
  }
  return potentialV;
}

/** A warning when the resistivity does not fit the stated water type (seawater or fresh), else null. */
export function resistivityWarning(water: WaterType, resistivityOhmM: number): CpWarning | null {
  const rho = resistivityOhmM;
  const { min, max } = SEAWATER_RESISTIVITY_RANGE_OHM_M;
  if (water === 'seawater' && rho > max) {
    return {
      code: 'resistivity-high-for-seawater',
      message: `A resistivity of ${rho} ohm·m is far above seawater (about 0.15-0.35 ohm·m): probably ohm·cm typed as ohm·m (${rho} ohm·cm = ${rho / 100} ohm·m). If the water really is this resistive, it is not seawater: set the water type.`,
    };
  }
  if (water === 'seawater' && rho < min) {
    return {
      code: 'resistivity-low-for-seawater',
      message: `A resistivity of ${rho} ohm·m is below any seawater (about 0.13 ohm·m at 42 PSU and 35 C): check the value and its unit.`,
    };
  }
  if (water === 'fresh' && rho < FRESH_WATER_MIN_RESISTIVITY_OHM_M) {
    return {
      code: 'resistivity-low-for-fresh-water',
      message: `A resistivity of ${rho} ohm·m is a seawater or brackish value; fresh water is about 10-100 ohm·m or more. Use a measured value, or set the water type.`,
    };
  }
  return null;
}

/** A warning naming the surfaces whose design current density looks like mA/m2 typed as A/m2, else null. */
export function currentDensityWarning(surfaces: ReadonlyArray<{ name: string; currentDensity: CurrentDensity }>): CpWarning | null {
  const suspect = surfaces.filter(({ currentDensity: d }) => Math.max(d.initial, d.mean, d.final) > MAX_PLAUSIBLE_CURRENT_DENSITY_A_PER_M2);
  if (suspect.length === 0) return null;
  const listed = suspect.map((s) => `${s.name} (${Math.max(s.currentDensity.initial, s.currentDensity.mean, s.currentDensity.final)} A/m²)`).join(', ');
  return {
    code: 'current-density-looks-like-ma-per-m2',
    message: `Design current density above ${MAX_PLAUSIBLE_CURRENT_DENSITY_A_PER_M2} A/m² on ${listed}: looks like mA/m² typed as A/m² (bare steel in seawater needs at most about 0.25 A/m², a coated hull about 0.01-0.03 A/m²).`,
  };
}
