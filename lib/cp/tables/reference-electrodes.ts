import type { Flag } from '../types';

export type ReferenceElectrode = 'she' | 'ag-agcl-seawater' | 'ag-agcl-saturated-kcl' | 'cse' | 'sce' | 'zinc';

export interface ElectrodeOffset {
  /** Potential of the electrode vs the standard hydrogen electrode, V. */
  vsSheV: number;
  flag: Flag;
  note: string;
}

/**
 * Offsets chosen so the trade's equivalence holds: -0.80 V Ag/AgCl/seawater = -0.85 V CSE
 * = about -0.78 V SCE = +0.25 V vs zinc.
 */
export const REFERENCE_ELECTRODES: Readonly<Record<ReferenceElectrode, ElectrodeOffset>> = {
  she: { vsSheV: 0, flag: 'published', note: 'By definition.' },
  'ag-agcl-seawater': {
    vsSheV: 0.25,
    flag: 'memory',
    note: 'About +0.25 V in full-strength seawater (35 PSU); depends on chloride: convertPotential corrects it for the salinity given (Nernst).',
  },
  'ag-agcl-saturated-kcl': { vsSheV: 0.197, flag: 'published', note: 'Saturated KCl filling.' },
  cse: {
    vsSheV: 0.3,
    flag: 'practice',
    note: 'Strictly +0.316 to +0.318 V; +0.30 V keeps the 50 mV CSE/Ag-AgCl difference of European practice (some use 60 mV).',
  },
  sce: { vsSheV: 0.241, flag: 'published', note: 'Saturated calomel.' },
  zinc: { vsSheV: -0.8, flag: 'memory', note: 'About -0.78 to -0.80 V; -0.80 V gives +0.25 V vs zinc at the steel criterion.' },
};
