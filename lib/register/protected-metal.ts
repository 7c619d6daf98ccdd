import { AG_AGCL_SEAWATER_CALIBRATION_PSU } from '@/lib/cp';

// The metal whose criteria apply to an asset's surveys: aluminium hulls have their own; all else is steel.
export function protectedMetalOf(asset: { kind: string; hullMaterial?: string | null }): 'steel' | 'aluminium' {
  return asset.kind === 'vessel' && asset.hullMaterial === 'aluminium' ? 'aluminium' : 'steel';
}

export interface SurveyCriteriaAsset {
  kind: string;
  hullMaterial?: string | null;
  anaerobic?: boolean | null;
  highStrengthSteel?: boolean | null;
}

/**
 * What classifyPotential (lib/surveys/criteria.ts) takes from the asset: its metal, anaerobic
 * conditions, and high-strength steel (steel only: an aluminium hull ignores the flag).
 */
export function surveyCriteriaOf(asset: SurveyCriteriaAsset): { protectedMetal: 'steel' | 'aluminium'; anaerobic: boolean; highStrengthSteel: boolean } {
  const protectedMetal = protectedMetalOf(asset);
  return { protectedMetal, anaerobic: Boolean(asset.anaerobic), highStrengthSteel: protectedMetal === 'steel' && Boolean(asset.highStrengthSteel) };
}

/**
 * Salinity of the water an asset's readings are taken in, PSU, for the chloride correction of an
 * Ag/AgCl/seawater electrode: the recorded value; without one, full-strength seawater (35 PSU) for
 * a vessel or a structure in seawater; null (unknown) for a structure in brackish or fresh water.
 */
export function waterSalinityOf(asset: { kind: string; waterType?: string | null; waterSalinityPsu?: number | null }): number | null {
  if (asset.waterSalinityPsu !== null && asset.waterSalinityPsu !== undefined) return asset.waterSalinityPsu;
  return asset.kind === 'vessel' || asset.waterType === 'seawater' ? AG_AGCL_SEAWATER_CALIBRATION_PSU : null;
}
