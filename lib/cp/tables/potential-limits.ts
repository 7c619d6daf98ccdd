import { DNV_RP_B401, basis } from '../basis';
import type { Flag, ProtectedMetal } from '../types';

export interface PotentialLimit {
  /** V vs Ag/AgCl/seawater. */
  valueV: number;
  source: string;
  flag: Flag;
}

/** Least negative potential that still protects, V vs Ag/AgCl/seawater. */
export const MINIMUM_PROTECTION_POTENTIAL: Readonly<Record<ProtectedMetal, PotentialLimit>> = {
  steel: { valueV: -0.8, source: `${DNV_RP_B401}; ${basis.harbourStructures}`, flag: 'published' }, // aerobic
  'high-strength-steel': { valueV: -0.8, source: DNV_RP_B401, flag: 'published' }, // same criterion as steel
  aluminium: { valueV: -0.9, source: basis.overProtection, flag: 'published' },
  stainless: { valueV: -0.75, source: 'trade references (design basis)', flag: 'published' },
  'copper-alloy': { valueV: -0.55, source: 'trade references (design basis)', flag: 'published' }, // bronze
};

/** Steel where sulphate-reducing bacteria are active (anaerobic): -0.90 V (published). */
export const ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V = -0.9;

/** Most negative potential before over-protection harms the metal or its coating; null = none in the basis. */
export const OVER_PROTECTION_LIMIT: Readonly<Record<ProtectedMetal, PotentialLimit | null>> = {
  steel: { valueV: -1.05, source: basis.overProtection, flag: 'published' }, // coating disbondment beyond (practice)
  'high-strength-steel': { valueV: -0.83, source: DNV_RP_B401, flag: 'memory' }, // yield > 550 MPa, hydrogen
  aluminium: { valueV: -1.1, source: basis.overProtection, flag: 'published' }, // alkaline corrosion beyond
  stainless: null,
  'copper-alloy': null,
};
