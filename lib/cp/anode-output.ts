import { CpInputError } from './errors';
import { assertFiniteResult, finite, positive } from './validate';

export interface AnodeOutputInput {
  /** Design protective potential Ec, V vs Ag/AgCl/seawater (e.g. -0.80). */
  protectivePotentialV: number;
  /** Anode closed-circuit potential Ea, V vs Ag/AgCl/seawater (e.g. -1.05). */
  anodePotentialV: number;
  resistanceOhm: number;
}

/** Current one anode delivers, A. The anode must be more negative than the protective potential. */
export function anodeCurrentOutputA(input: AnodeOutputInput): number {
  const ec = finite(input?.protectivePotentialV, 'protectivePotentialV', 'V');
  const ea = finite(input?.anodePotentialV, 'anodePotentialV', 'V');
  const ra = positive(input?.resistanceOhm, 'resistanceOhm', 'ohm');
  const driving = drivingVoltageV(ec, ea, 'anodePotentialV');
  return assertFiniteResult(driving / ra, 'resistanceOhm'); // DNV-RP-B401 (2010) sec. 7, Ia = (Ec - Ea)/Ra
}

/** Ec - Ea, V; throws when the anode is not more active than the protective potential. */
export function drivingVoltageV(protectivePotentialV: number, anodePotentialV: number, field: string): number {
  const driving = protectivePotentialV - anodePotentialV;
  if (!(driving > 0)) {
    throw new CpInputError(
      field,
      `The anode potential (${anodePotentialV} V) must be more negative than the protective potential (${protectivePotentialV} V): an anode that is not more active cannot protect.`,
    );
  }
  return driving;
}
