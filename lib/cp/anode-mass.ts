import { HOURS_PER_YEAR } from './numeric';
import { assertFiniteResult, nonNegative, positive, unitFraction } from './validate';

export interface NetMassInput {
  meanCurrentA: number;
  designLifeYears: number;
  utilisationFactor: number;
  capacityAhPerKg: number;
}

/** Net anode mass that delivers the mean current for the design life, kg. */
export function netAnodeMassKg(input: NetMassInput): number {
  const icm = nonNegative(input?.meanCurrentA, 'meanCurrentA', 'A');
  const tf = positive(input?.designLifeYears, 'designLifeYears', 'years');
  const u = unitFraction(input?.utilisationFactor, 'utilisationFactor');
  const eps = positive(input?.capacityAhPerKg, 'capacityAhPerKg', 'Ah/kg');
  return assertFiniteResult((icm * tf * HOURS_PER_YEAR) / (u * eps), 'meanCurrentA'); // DNV-RP-B401 (2010) sec. 7, M = Icm*tf*8760/(u*eps)
}

/** Years an anode mass lasts at a current: Y = eps*W/(8760*I) (handbook practice, published). */
export function remainingLifeYears(input: { remainingMassKg: number; capacityAhPerKg: number; currentA: number }): number {
  const w = nonNegative(input?.remainingMassKg, 'remainingMassKg', 'kg');
  const eps = positive(input?.capacityAhPerKg, 'capacityAhPerKg', 'Ah/kg');
  const i = positive(input?.currentA, 'currentA', 'A');
  return assertFiniteResult((eps * w) / (HOURS_PER_YEAR * i), 'remainingMassKg');
}

/** Consumption rate, kg per ampere-year, of an alloy of a given capacity (8760/eps). */
export function consumptionRateKgPerAYear(capacityAhPerKg: number): number {
  return HOURS_PER_YEAR / positive(capacityAhPerKg, 'capacityAhPerKg', 'Ah/kg');
}

/** Capacity, Ah/kg, equivalent to a consumption rate in kg per ampere-year. */
export function capacityFromConsumptionRate(kgPerAYear: number): number {
  return HOURS_PER_YEAR / positive(kgPerAYear, 'kgPerAYear', 'kg/A-yr');
}

/**
 * Handbook-style mass: current x years x consumption rate / efficiency, kg
 * (the form of MIL-HDBK-1004/10's magnesium example).
 */
export function massFromConsumptionRate(input: { currentA: number; years: number; kgPerAYear: number; efficiency: number }): number {
  const i = nonNegative(input?.currentA, 'currentA', 'A');
  const years = positive(input?.years, 'years', 'years');
  const rate = positive(input?.kgPerAYear, 'kgPerAYear', 'kg/A-yr');
  const eff = unitFraction(input?.efficiency, 'efficiency');
  return assertFiniteResult((i * years * rate) / eff, 'currentA');
}
