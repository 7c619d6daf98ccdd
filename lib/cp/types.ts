/** Shared types of the cathodic-protection core. All quantities SI. */

/** How a value was obtained: read in a named source, recalled, or common practice. */
export type Flag = 'published' | 'memory' | 'practice';

/** Where a tabulated value or an equation comes from. */
export interface SourceNote {
  source: string;
  flag: Flag;
  note?: string;
}

/** Surface water temperature bands (DNV-RP-B401 (2010) climatic regions). */
export type Climate = 'tropical' | 'sub-tropical' | 'temperate' | 'arctic';

/** Water depth bands of the current-density table, metres. */
export type DepthBand = '0-30' | '30-100' | '100-300' | '300+';

export type WaterType = 'seawater' | 'brackish' | 'fresh' | 'sediment';

/** Design current densities, A/m2. */
export interface CurrentDensity {
  initial: number;
  mean: number;
  final: number;
}

/** Coating breakdown constants of fc = a + b*t (t in years). */
export interface CoatingConstants {
  a: number;
  b: number;
}

/** A coated surface carries its constants; bare metal has fc = 1. */
export type Coating = CoatingConstants | 'bare';

export type AnodeAlloy = 'al-zn-in' | 'zinc' | 'magnesium' | 'magnesium-high-potential';

export type ProtectedMetal = 'steel' | 'high-strength-steel' | 'aluminium' | 'stainless' | 'copper-alloy';

export type HullMaterial = 'steel' | 'aluminium';

/** Bare non-steel items bonded to the structure that drain protective current. */
export type CurrentDrain = 'copper-alloy' | 'stainless';

/**
 * Slender anode on a stand-off core. `standoffM` is the clear gap between anode and
 * structure; when omitted the formula's own condition (at least 0.30 m) is assumed.
 * `coreRadiusM` is the steel insert, used only for the end-of-life radius.
 */
export interface SlenderStandoffShape {
  kind: 'slender-standoff';
  lengthM: number;
  radiusM: number;
  standoffM?: number;
  coreRadiusM?: number;
}

/** Flush-mounted plate; `thicknessM` is optional (else implied from the net mass). */
export interface LongFlushShape {
  kind: 'long-flush';
  lengthM: number;
  widthM: number;
  thicknessM?: number;
}

/**
 * Short flush plate or bracelet, sized by its exposed area (McCoy). Plan dimensions,
 * when given, refine the end-of-life area; `segmented` marks segmented bracelets.
 */
export interface McCoyShape {
  kind: 'short-flush' | 'bracelet';
  exposedAreaM2: number;
  lengthM?: number;
  widthM?: number;
  thicknessM?: number;
  segmented?: boolean;
}

export type AnodeShape = SlenderStandoffShape | LongFlushShape | McCoyShape;

export type ResistanceFormula = 'modified-dwight' | 'short-slender' | 'long-flush' | 'mccoy';

export interface CurrentsA {
  initialA: number;
  meanA: number;
  finalA: number;
}

export interface BreakdownFactors {
  initial: number;
  mean: number;
  final: number;
}

export interface CpWarning {
  code: WarningCode;
  message: string;
}

export type WarningCode =
  | 'magnesium-on-aluminium'
  | 'magnesium-in-seawater'
  | 'zinc-above-temperature-limit'
  | 'zinc-in-fresh-water'
  | 'aluminium-in-fresh-water'
  | 'life-below-design'
  | 'life-below-docking-interval'
  | 'installed-count-below-required'
  | 'over-protection-high-strength-steel'
  | 'over-protection-aluminium'
  | 'bare-item-current-drain'
  | 'protective-potential-less-negative-than-criterion'
  | 'utilisation-above-table'
  | 'standoff-treated-as-flush'
  | 'long-flush-outside-validity'
  | 'resistivity-high-for-seawater'
  | 'resistivity-low-for-seawater'
  | 'resistivity-low-for-fresh-water'
  | 'current-density-looks-like-ma-per-m2'
  | 'rated-output-unscaled'
  | 'magnesium-on-coated-steel'
  | 'magnesium-in-brackish-water'
  | 'zinc-temperature-unknown'
  | 'al-zn-in-warm-water'
  | 'criterion-beyond-over-protection-limit';

/** One line of the calculation basis: what was used and where it comes from. */
export interface BasisEntry {
  topic: string;
  source: string;
  flag: Flag;
}
