import { REFERENCE_ELECTRODES, type ReferenceElectrode } from './tables/reference-electrodes';
import { assertFiniteResult, finite, oneOf } from './validate';

const ELECTRODES = Object.keys(REFERENCE_ELECTRODES) as ReferenceElectrode[];

export interface ConvertPotentialInput {
  valueV: number;
  from: ReferenceElectrode;
  to: ReferenceElectrode;
}

/** Re-expresses a potential measured against one reference electrode against another. */
export function convertPotential({ valueV, from, to }: ConvertPotentialInput): number {
  const v = finite(valueV, 'valueV', 'V');
  const a = REFERENCE_ELECTRODES[oneOf(from, ELECTRODES, 'from')].vsSheV;
  const b = REFERENCE_ELECTRODES[oneOf(to, ELECTRODES, 'to')].vsSheV;
  return assertFiniteResult(v + a - b, 'valueV'); // E(vs to) = E(vs from) + E(from vs SHE) - E(to vs SHE)
}
