import { CpInputError } from './errors';
import type { AnodeShape } from './types';
import { bool, nonNegative, optional, positive, record, show } from './validate';

/** Checks an anode shape and returns a clean copy; `field` is the path of the shape. */
export function validateShape(value: unknown, field: string): AnodeShape {
  const s = record(value, field);
  const f = (name: string) => `${field}.${name}`;
  switch (s.kind) {
    case 'slender-standoff': {
      const lengthM = positive(s.lengthM, f('lengthM'), 'm');
      const radiusM = positive(s.radiusM, f('radiusM'), 'm');
      const standoffM = optional(s.standoffM, (v) => nonNegative(v, f('standoffM'), 'm'));
      const coreRadiusM = optional(s.coreRadiusM, (v) => nonNegative(v, f('coreRadiusM'), 'm'));
      if (coreRadiusM !== undefined && coreRadiusM >= radiusM) {
        throw new CpInputError(f('coreRadiusM'), `${f('coreRadiusM')} must be smaller than the anode radius (${radiusM} m).`);
      }
      return { kind: 'slender-standoff', lengthM, radiusM, standoffM, coreRadiusM };
    }
    case 'long-flush':
      return {
        kind: 'long-flush',
        lengthM: positive(s.lengthM, f('lengthM'), 'm'),
        widthM: positive(s.widthM, f('widthM'), 'm'),
        thicknessM: optional(s.thicknessM, (v) => positive(v, f('thicknessM'), 'm')),
      };
    case 'short-flush':
    case 'bracelet': {
      const lengthM = optional(s.lengthM, (v) => positive(v, f('lengthM'), 'm'));
      const widthM = optional(s.widthM, (v) => positive(v, f('widthM'), 'm'));
      if ((lengthM === undefined) !== (widthM === undefined)) {
        const missing = lengthM === undefined ? f('lengthM') : f('widthM');
        throw new CpInputError(missing, `Give both ${f('lengthM')} and ${f('widthM')}, or neither.`);
      }
      return {
        kind: s.kind,
        exposedAreaM2: positive(s.exposedAreaM2, f('exposedAreaM2'), 'm2'),
        lengthM,
        widthM,
        thicknessM: optional(s.thicknessM, (v) => positive(v, f('thicknessM'), 'm')),
        segmented: optional(s.segmented, (v) => bool(v, f('segmented'))),
      };
    }
    default:
      throw new CpInputError(
        f('kind'),
        `${f('kind')} must be 'slender-standoff', 'long-flush', 'short-flush' or 'bracelet' (got ${show(s.kind)}).`,
      );
  }
}
