import { FARADAY_C_PER_MOL, SECONDS_PER_HOUR } from './physical-constants';
import type { AnodeAlloy } from './types';
import { oneOf } from './validate';

/** The metal that carries the charge of each anode alloy, with its molar mass and valence. */
export interface AnodeMetal {
  symbol: 'Al' | 'Zn' | 'Mg';
  name: 'aluminium' | 'zinc' | 'magnesium';
  /** Standard atomic weight, kg/mol (IUPAC standard atomic weights, from memory). */
  molarMassKgPerMol: number;
  /** Electrons given up per atom dissolved (Al3+, Zn2+, Mg2+). */
  valence: number;
}

const ALUMINIUM: AnodeMetal = { symbol: 'Al', name: 'aluminium', molarMassKgPerMol: 26.9815385e-3, valence: 3 };
const ZINC: AnodeMetal = { symbol: 'Zn', name: 'zinc', molarMassKgPerMol: 65.38e-3, valence: 2 };
const MAGNESIUM: AnodeMetal = { symbol: 'Mg', name: 'magnesium', molarMassKgPerMol: 24.305e-3, valence: 2 };

/**
 * Base metal of each alloy. Al-Zn-In is taken as pure aluminium: its few per cent of zinc
 * and indium only lower the figure, so pure aluminium is the upper bound that matters.
 */
export const ANODE_METALS: Readonly<Record<AnodeAlloy, AnodeMetal>> = {
  'al-zn-in': ALUMINIUM,
  zinc: ZINC,
  magnesium: MAGNESIUM,
  'magnesium-high-potential': MAGNESIUM,
};

const ALLOYS = Object.keys(ANODE_METALS) as AnodeAlloy[];

/**
 * Theoretical electrochemical capacity of an alloy's base metal, Ah/kg: all of the metal
 * dissolved at its valence, nothing lost to self-corrosion. About 2980 (Al), 820 (Zn),
 * 2200 (Mg). No real anode reaches it; a stated capacity above it is a wrong number.
 */
export function theoreticalCapacityAhPerKg(alloy: AnodeAlloy): number {
  const m = ANODE_METALS[oneOf(alloy, ALLOYS, 'alloy')];
  return (m.valence * FARADAY_C_PER_MOL) / (m.molarMassKgPerMol * SECONDS_PER_HOUR); // Faraday's law: Q/m = nF/M, C/kg -> Ah/kg
}
