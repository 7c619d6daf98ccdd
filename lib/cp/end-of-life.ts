import { validateShape } from './anode-shape';
import type { AnodeShape, LongFlushShape, McCoyShape, SlenderStandoffShape } from './types';
import { positive, record, unitFraction } from './validate';

/** Slender anode length at end of life, as a fraction of the initial length (DNV-RP-B401 (2010), from memory). */
export const END_OF_LIFE_LENGTH_FACTOR = 0.9;

/**
 * Least fraction of the net mass assumed left at end of life when sizing the final
 * geometry. Only bites for utilisation above 0.98 (no table value exceeds 0.90); it keeps
 * the final resistance finite when u = 1 would leave nothing.
 */
export const MIN_REMAINING_FRACTION = 0.02;

/** Smallest final dimension as a fraction of the initial one: guards float underflow only. */
const MIN_DIMENSION_FRACTION = 1e-6;

export interface EndOfLifeInput {
  shape: AnodeShape;
  netMassKg: number;
  utilisationFactor: number;
  densityKgM3: number;
}

/** The anode's shape when it is consumed to its utilisation factor. */
export function endOfLifeShape(input: EndOfLifeInput): AnodeShape {
  const r = record(input, 'input');
  return finalShapeOf(
    validateShape(r.shape, 'shape'),
    positive(r.netMassKg, 'netMassKg', 'kg'),
    unitFraction(r.utilisationFactor, 'utilisationFactor'),
    positive(r.densityKgM3, 'densityKgM3', 'kg/m3'),
  );
}

/** Unchecked core for validated values. */
export function finalShapeOf(shape: AnodeShape, netMassKg: number, u: number, density: number): AnodeShape {
  const remainingVolumeM3 = (Math.max(1 - u, MIN_REMAINING_FRACTION) * netMassKg) / density;
  switch (shape.kind) {
    case 'slender-standoff':
      return finalSlender(shape, remainingVolumeM3);
    case 'long-flush':
      return finalLongFlush(shape, netMassKg / density, remainingVolumeM3);
    default:
      return finalMcCoy(shape, netMassKg / density, remainingVolumeM3, Math.max(1 - u, MIN_REMAINING_FRACTION));
  }
}

/**
 * Length 0.9 L; the remaining mass spread evenly round the core gives the radius
 * (DNV-RP-B401 (2010), from memory). Without a core radius the core is taken as
 * negligible: the smallest final radius, so the highest final resistance (conservative).
 * The radius is never taken above the initial one.
 */
function finalSlender(shape: SlenderStandoffShape, remainingVolumeM3: number): SlenderStandoffShape {
  const lengthM = END_OF_LIFE_LENGTH_FACTOR * shape.lengthM;
  const core = shape.coreRadiusM ?? 0;
  const radius = Math.sqrt(core * core + remainingVolumeM3 / (Math.PI * lengthM));
  const radiusM = Math.max(Math.min(radius, shape.radiusM), shape.radiusM * MIN_DIMENSION_FRACTION);
  return { ...shape, lengthM, radiusM };
}

/**
 * Flush plate consumed by uniform recession d of its face and four edges (its back lies
 * on the steel): (L-2d)(W-2d)(T-d) = remaining volume. Thickness, when not given, is the
 * one the net mass implies over L x W. Tidewarden model, common practice.
 */
function finalLongFlush(shape: LongFlushShape, netVolumeM3: number, remainingVolumeM3: number): LongFlushShape {
  const thicknessM = shape.thicknessM ?? netVolumeM3 / (shape.lengthM * shape.widthM);
  const plate = recede(shape.lengthM, shape.widthM, thicknessM, remainingVolumeM3);
  return { ...shape, lengthM: plate.l, widthM: plate.w, thicknessM: plate.t };
}

/**
 * Short flush plates and bracelets keep their McCoy form with a smaller exposed area.
 * With plan dimensions: the uniform recession above, the exposed area scaled by the
 * change of the box's exposed area (face + edges). Without them: isotropic shrinkage,
 * area x (remaining fraction)^(2/3), which overstates the loss of a thin plate and so
 * errs high on resistance. DNV practice may keep a bracelet's area unchanged; we do not
 * (conservative).
 */
function finalMcCoy(shape: McCoyShape, netVolumeM3: number, remainingVolumeM3: number, remainingFraction: number): McCoyShape {
  if (shape.lengthM === undefined || shape.widthM === undefined) {
    return { ...shape, exposedAreaM2: shape.exposedAreaM2 * remainingFraction ** (2 / 3) };
  }
  const t0 = shape.thicknessM ?? netVolumeM3 / (shape.lengthM * shape.widthM);
  const plate = recede(shape.lengthM, shape.widthM, t0, remainingVolumeM3);
  const ratio = exposedBoxArea(plate.l, plate.w, plate.t) / exposedBoxArea(shape.lengthM, shape.widthM, t0);
  return { ...shape, lengthM: plate.l, widthM: plate.w, thicknessM: plate.t, exposedAreaM2: shape.exposedAreaM2 * ratio };
}

const exposedBoxArea = (l: number, w: number, t: number): number => l * w + 2 * (l + w) * t;

/** Solves (L-2d)(W-2d)(T-d) = V for d by bisection (the left side falls with d). */
function recede(l: number, w: number, t: number, volumeM3: number): { l: number; w: number; t: number } {
  let lo = 0;
  let hi = Math.min(l / 2, w / 2, t);
  if (volumeM3 < l * w * t) {
    for (let i = 0; i < 60; i++) {
      const d = (lo + hi) / 2;
      if ((l - 2 * d) * (w - 2 * d) * (t - d) > volumeM3) lo = d;
      else hi = d;
    }
  } else {
    hi = 0;
  }
  const d = (lo + hi) / 2;
  return {
    l: Math.max(l - 2 * d, l * MIN_DIMENSION_FRACTION),
    w: Math.max(w - 2 * d, w * MIN_DIMENSION_FRACTION),
    t: Math.max(t - d, t * MIN_DIMENSION_FRACTION),
  };
}
