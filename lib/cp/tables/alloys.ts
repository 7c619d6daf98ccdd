import { DNV_RP_B401, basis } from '../basis';
import type { AnodeAlloy, SourceNote } from '../types';

export interface AlloyData {
  label: string;
  /** Electrochemical capacity, Ah/kg; null where the basis gives none. */
  capacityAhPerKg: { seawater: number; sediment: number | null };
  /** Closed-circuit potential, V vs Ag/AgCl/seawater; null where the basis gives none. */
  closedCircuitPotentialV: { seawater: number; sediment: number | null };
  /** Highest service temperature, C; null where the basis gives no figure. */
  temperatureLimitC: number | null;
  /** Alloy density, kg/m3 (common practice). */
  densityKgM3: number;
  /** Consumption rate of the trade, kg per ampere-year (common practice), as a range. */
  consumptionKgPerAYear: { min: number; max: number };
  source: SourceNote;
  notes: string;
}

export const ALLOYS: Readonly<Record<AnodeAlloy, AlloyData>> = {
  'al-zn-in': {
    label: 'Aluminium-zinc-indium',
    // DNV-RP-B401 (2010) Table 10-6, from memory
    capacityAhPerKg: { seawater: 2000, sediment: 1500 },
    closedCircuitPotentialV: { seawater: -1.05, sediment: -1.0 },
    temperatureLimitC: null,
    densityKgM3: 2750, // common practice: 2700-2800 kg/m3
    consumptionKgPerAYear: { min: 3.1, max: 4.4 }, // common practice
    source: { source: `${DNV_RP_B401} Table 10-6`, flag: 'memory' },
    notes: 'Capacity falls at high temperature; may passivate in fresh water (below about 1,450 ppm chloride).',
  },
  zinc: {
    label: 'Zinc',
    // DNV-RP-B401 (2010) Table 10-6, from memory; 780 Ah/kg also in MIL-A-18001 data (published)
    capacityAhPerKg: { seawater: 780, sediment: 700 },
    closedCircuitPotentialV: { seawater: -1.03, sediment: -0.98 },
    temperatureLimitC: 50,
    densityKgM3: 7100, // common practice
    consumptionKgPerAYear: { min: 11.2, max: 11.2 }, // common practice
    source: { source: `${DNV_RP_B401} Table 10-6; MIL-A-18001`, flag: 'memory' },
    notes: 'Not above about 50 °C; passivates in fresh water; iron impurity passivates it.',
  },
  magnesium: {
    label: 'Magnesium (standard, AZ63 type)',
    // MIL-HDBK-1004/10 (published): practical 1100-1230 Ah/kg; the lower end is taken (conservative mass)
    capacityAhPerKg: { seawater: 1100, sediment: null },
    // about -1.5 to -1.6 V (published); the less negative end is taken (conservative output)
    closedCircuitPotentialV: { seawater: -1.5, sediment: null },
    temperatureLimitC: null,
    densityKgM3: 1770, // common practice
    consumptionKgPerAYear: { min: 8, max: 8 }, // common practice
    source: { source: basis.harbourStructures, flag: 'published' },
    notes: 'Fresh and brackish water and soil; never on aluminium hulls; over-protects and wastes fast in seawater.',
  },
  'magnesium-high-potential': {
    label: 'Magnesium (high potential, Mn type)',
    capacityAhPerKg: { seawater: 1100, sediment: null }, // MIL-HDBK-1004/10 (published), as standard magnesium
    closedCircuitPotentialV: { seawater: -1.7, sediment: null }, // about -1.7 V (published)
    temperatureLimitC: null,
    densityKgM3: 1770, // common practice
    consumptionKgPerAYear: { min: 8, max: 8 }, // common practice
    source: { source: basis.harbourStructures, flag: 'published' },
    notes: 'As standard magnesium, with a higher driving voltage for resistive water and soil.',
  },
};

export const isMagnesium = (alloy: AnodeAlloy): boolean => alloy === 'magnesium' || alloy === 'magnesium-high-potential';
