import { designAnodeSystem, type CurrentDensity, type DesignInput, type WarningCode } from '@/lib/cp';

/** Same density at start, mean and end: harbour and hull values are single figures. */
export const flat = (aPerM2: number): CurrentDensity => ({ initial: aPerM2, mean: aPerM2, final: aPerM2 });

/**
 * A clean design that raises no warning: bare steel in temperate seawater, a long
 * slender Al-Zn-In anode at full stand-off with DNV table values.
 */
export function cleanDesign(): DesignInput {
  return {
    designLifeYears: 20,
    resistivityOhmM: 0.25,
    protectedMetal: 'steel',
    environment: { water: 'seawater', temperatureC: 10 },
    surfaces: [
      { name: 'immersed', areaM2: 500, currentDensity: { initial: 0.2, mean: 0.1, final: 0.13 }, coating: 'bare' },
      { name: 'coated', areaM2: 800, currentDensity: { initial: 0.2, mean: 0.1, final: 0.13 }, coating: { a: 0.05, b: 0.025 } },
    ],
    anode: {
      alloy: 'al-zn-in',
      capacityAhPerKg: 2000,
      potentialV: -1.05,
      utilisationFactor: 0.9,
      netMassKg: 178,
      shape: { kind: 'slender-standoff', lengthM: 2, radiusM: 0.11, standoffM: 0.3, coreRadiusM: 0.035 },
    },
  };
}

/** The codes of the warnings a design raises. */
export const warningCodes = (input: DesignInput): WarningCode[] => designAnodeSystem(input).warnings.map((w) => w.code);

/** The clean design changed by `change` (a deep copy; the clean design is untouched). */
export function variant(change: (d: any) => void): DesignInput {
  const d = structuredClone(cleanDesign()) as any;
  change(d);
  return d;
}

/** Standard magnesium, -1.5 V and 1100 Ah/kg (MIL-HDBK-1004/10, published). */
export const magnesium = (d: any) => (d.anode = { ...d.anode, alloy: 'magnesium', potentialV: -1.5, capacityAhPerKg: 1100 });
/** Zinc, -1.03 V and 780 Ah/kg (DNV-RP-B401 (2010) Table 10-6, from memory). */
export const zinc = (d: any) => (d.anode = { ...d.anode, alloy: 'zinc', potentialV: -1.03, capacityAhPerKg: 780 });

/** Walks a value and returns the paths of every number that is NaN or infinite. */
export function nonFinitePaths(value: unknown, path = 'result'): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`));
  return [];
}

/** Runs fn and returns the CpInputError's field, or fails the test. */
export function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e && typeof e === 'object' && 'field' in e) return String((e as { field: unknown }).field);
    throw e;
  }
  throw new Error('expected a CpInputError, nothing was thrown');
}
