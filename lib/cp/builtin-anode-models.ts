import type { AnodeModel, AnodeMounting } from './anode-model';
import type { AnodeAlloy } from './types';

/**
 * Built-in catalogue of GENERIC anode models. Designations are Tidewarden's own
 * (TW-<alloy letter><mounting letter>-<size>); dimensions and masses are typical of the
 * trade, not any maker's. Net masses are the body volume x alloy density less chamfers,
 * the core or gaps; gross adds the steel strap, insert or core.
 *   Alloy letters: Z zinc, A Al-Zn-In, M magnesium. Mounting: W weld-on, B bolt-on,
 *   S stand-off or pile-mounted, K bracelet; magnesium high-potential rods use MH.
 */

function plate(
  id: string, alloy: AnodeAlloy, mounting: AnodeMounting,
  [lengthM, widthM, thicknessM]: [number, number, number], netMassKg: number, grossMassKg: number,
): AnodeModel {
  const long = lengthM >= 4 * widthM && lengthM >= 4 * thicknessM;
  return {
    id,
    designation: id,
    alloy,
    mounting,
    dimensions: { lengthM, widthM, thicknessM },
    // Exposed area of a flush plate: face plus four edges (its back lies on the hull).
    shape: long
      ? { kind: 'long-flush', lengthM, widthM, thicknessM }
      : { kind: 'short-flush', exposedAreaM2: round4(lengthM * widthM + 2 * (lengthM + widthM) * thicknessM), lengthM, widthM, thicknessM },
    netMassKg,
    grossMassKg,
  };
}

function rod(
  id: string, alloy: AnodeAlloy, mounting: AnodeMounting,
  [lengthM, radiusM, coreRadiusM]: [number, number, number], netMassKg: number, grossMassKg: number,
): AnodeModel {
  return {
    id,
    designation: id,
    alloy,
    mounting,
    dimensions: { lengthM, radiusM },
    // Welded stand-off legs hold the body 0.30 m off the steel, where the slender formulas hold.
    shape: { kind: 'slender-standoff', lengthM, radiusM, standoffM: 0.3, coreRadiusM },
    netMassKg,
    grossMassKg,
  };
}

function bracelet(
  id: string, alloy: AnodeAlloy,
  [innerDiameterM, thicknessM, lengthM]: [number, number, number], netMassKg: number, grossMassKg: number,
): AnodeModel {
  const circumferenceM = Math.PI * (innerDiameterM + 2 * thicknessM);
  return {
    id,
    designation: id,
    alloy,
    mounting: 'bracelet',
    dimensions: { lengthM, thicknessM, innerDiameterM },
    // Two half-shells; exposed area is the outer face, unrolled as length x outer circumference.
    shape: { kind: 'bracelet', exposedAreaM2: round4(circumferenceM * lengthM), lengthM, widthM: round4(circumferenceM), thicknessM },
    netMassKg,
    grossMassKg,
  };
}

const round4 = (x: number): number => Math.round(x * 1e4) / 1e4;

export const BUILTIN_ANODE_MODELS: readonly AnodeModel[] = [
  // Zinc hull plates, weld-on (steel strap cast in)
  plate('TW-ZW-2010', 'zinc', 'flush-weld', [0.2, 0.1, 0.025], 3.1, 3.4),
  plate('TW-ZW-3015', 'zinc', 'flush-weld', [0.3, 0.15, 0.03], 8.4, 8.9),
  plate('TW-ZW-4020', 'zinc', 'flush-weld', [0.4, 0.2, 0.04], 20, 21),
  plate('TW-ZW-6012', 'zinc', 'flush-weld', [0.6, 0.12, 0.04], 18, 19),
  // Zinc hull plates, bolt-on (insert with studs)
  plate('TW-ZB-2510', 'zinc', 'flush-bolt', [0.25, 0.1, 0.03], 4.7, 5),
  plate('TW-ZB-3015', 'zinc', 'flush-bolt', [0.3, 0.15, 0.04], 11.2, 11.7),
  // Aluminium hull plates
  plate('TW-AW-3015', 'al-zn-in', 'flush-weld', [0.3, 0.15, 0.03], 3.3, 3.8),
  plate('TW-AW-4020', 'al-zn-in', 'flush-weld', [0.4, 0.2, 0.04], 7.7, 8.7),
  plate('TW-AW-6512', 'al-zn-in', 'flush-weld', [0.65, 0.125, 0.05], 9.8, 11),
  plate('TW-AB-3015', 'al-zn-in', 'flush-bolt', [0.3, 0.15, 0.04], 4.4, 4.9),
  // Aluminium slender anodes on steel cores: [length, equivalent radius, core radius]
  rod('TW-AS-1207', 'al-zn-in', 'standoff', [1.2, 0.07, 0.025], 42, 52),
  rod('TW-AS-1510', 'al-zn-in', 'pile-mounted', [1.5, 0.095, 0.03], 100, 118),
  rod('TW-AS-2018', 'al-zn-in', 'pile-mounted', [2.0, 0.11, 0.035], 178, 203),
  rod('TW-AS-2528', 'al-zn-in', 'pile-mounted', [2.5, 0.12, 0.035], 270, 300),
  // Bracelets: [inside diameter, thickness, length]
  bracelet('TW-AK-0324', 'al-zn-in', [0.324, 0.05, 0.5], 74, 80),
  bracelet('TW-AK-0610', 'al-zn-in', [0.61, 0.06, 0.6], 190, 200),
  bracelet('TW-ZK-0219', 'zinc', [0.219, 0.03, 0.3], 46, 49),
  // Magnesium for fresh and brackish water
  plate('TW-MB-3015', 'magnesium', 'flush-bolt', [0.3, 0.15, 0.04], 2.8, 3.3),
  rod('TW-MS-1005', 'magnesium', 'standoff', [1.0, 0.05, 0.01], 12.7, 15),
  rod('TW-MH-1005', 'magnesium-high-potential', 'standoff', [1.0, 0.05, 0.01], 12.7, 15),
];

/** A built-in model by id, or undefined. */
export function builtinAnodeModel(id: string): AnodeModel | undefined {
  return BUILTIN_ANODE_MODELS.find((m) => m.id === id);
}
