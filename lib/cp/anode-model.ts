import type { AnodeAlloy, AnodeShape } from './types';

export type AnodeMounting = 'flush-weld' | 'flush-bolt' | 'standoff' | 'bracelet' | 'pile-mounted';

/** Overall dimensions of an anode body, m (what a catalogue prints). */
export interface AnodeDimensions {
  lengthM: number;
  widthM?: number;
  thicknessM?: number;
  radiusM?: number;
  /** Bracelets: inside diameter, i.e. the pipe or pile outside diameter. */
  innerDiameterM?: number;
}

/** A catalogue entry: built-in or an organisation's own. */
export interface AnodeModel {
  id: string;
  designation: string;
  alloy: AnodeAlloy;
  mounting: AnodeMounting;
  shape: AnodeShape;
  dimensions: AnodeDimensions;
  netMassKg: number;
  /** Net mass plus the steel core, strap or insert, kg. */
  grossMassKg: number;
  ratedOutputA?: number;
  /** Resistivity, ohm m, the data-sheet output was stated for. */
  ratedAtResistivityOhmM?: number;
  /** Price of one anode in the organisation's currency; absent in the built-in catalogue. */
  unitPrice?: number;
  /** Data-sheet overrides of the alloy table. */
  capacityAhPerKg?: number;
  potentialV?: number;
  utilisationFactor?: number;
}
