import { DNV_RP_B401 } from '../basis';
import type { Flag } from '../types';

export type UtilisationCase =
  | 'long-slender-standoff'
  | 'short-slender-standoff'
  | 'long-flush'
  | 'short-flush'
  | 'bracelet-half-shell'
  | 'bracelet-segmented';

export interface UtilisationRow {
  factor: number;
  flag: Flag;
}

// DNV-RP-B401 (2010) Table 10-8 (number from memory); long slender and bracelets published, others from memory
export const UTILISATION_FACTORS: Readonly<Record<UtilisationCase, UtilisationRow>> = {
  'long-slender-standoff': { factor: 0.9, flag: 'published' },
  'short-slender-standoff': { factor: 0.85, flag: 'memory' },
  'long-flush': { factor: 0.85, flag: 'memory' },
  'short-flush': { factor: 0.8, flag: 'memory' },
  'bracelet-half-shell': { factor: 0.8, flag: 'published' },
  'bracelet-segmented': { factor: 0.75, flag: 'published' },
};

export const UTILISATION_FACTORS_SOURCE = `${DNV_RP_B401} Table 10-8`;
