/** Exact conversions for checking US-customary handbook examples (NIST definitions). */
export const FOOT_M = 0.3048;
export const SQUARE_FOOT_M2 = FOOT_M * FOOT_M;
export const POUND_KG = 0.45359237;

export const squareFeetToM2 = (ft2: number): number => ft2 * SQUARE_FOOT_M2;
export const kgToPounds = (kg: number): number => kg / POUND_KG;
export const poundsToKg = (lb: number): number => lb * POUND_KG;

/** mA/ft2 (US handbooks) to A/m2; 1 mA/ft2 = 10.764 mA/m2. */
export const milliampsPerFt2ToAPerM2 = (mAPerFt2: number): number => (mAPerFt2 / 1000) / SQUARE_FOOT_M2;

export const milliampsPerM2 = (mA: number): number => mA / 1000;
