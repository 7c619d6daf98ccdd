import { ALLOY_LABELS, MOUNTING_LABELS } from './design';
import { FORECAST_DATE_LABELS } from './forecast';
import { ASSET_KIND_LABELS } from './assets';
import { RENEWAL_STATUS_LABELS, dockingKindWords } from './planner';

/**
 * The words of the anode list, in one place for the PDF, the CSV and the screens (safe for client
 * code). They follow the work: a ship's dry-docking is done by a yard, with blasting and painting
 * around it; a diving campaign (a jetty's, or a ship's in the water) by a contractor, under water.
 */

export type AnodeListOccasion = 'docking' | 'campaign';

/** A campaign is in-water work; a structure is never dry-docked, whatever the booking is called. */
export function anodeListOccasion(assetKind: 'vessel' | 'structure', dockingKind: string): AnodeListOccasion {
  return dockingKind === 'campaign' || assetKind === 'structure' ? 'campaign' : 'docking';
}

export interface AnodeListWords {
  occasion: AnodeListOccasion;
  /** The document's title. */
  title: string;
  /** "Docking" / "Campaign": the header table's title and the footer's noun. */
  occasionTitle: string;
  /** Who does the work: "Yard" / "Contractor". */
  worksBy: string;
  /** The booking's reference, as labelled on the list. */
  reference: string;
  /** The signature line of whoever fits the anodes. */
  fittedBy: string;
  /** The asset's table title ("Vessel" / "Structure"), also its kind after its name. */
  assetTitle: string;
  /** The sentence of an empty list. */
  empty: string;
}

export { dockingKindWords };

export function anodeListWords(assetKind: 'vessel' | 'structure', dockingKind: string): AnodeListWords {
  const occasion = anodeListOccasion(assetKind, dockingKind);
  const assetTitle = ASSET_KIND_LABELS[assetKind] ?? 'Asset';
  return occasion === 'docking'
    ? {
        occasion,
        title: 'Dry-dock anode list',
        occasionTitle: 'Docking',
        worksBy: 'Yard',
        reference: 'Docking reference',
        fittedBy: 'Fitted by (yard)',
        assetTitle,
        empty: 'No renewals are booked for this docking.',
      }
    : {
        occasion,
        title: 'Anode list, diving campaign',
        occasionTitle: 'Campaign',
        worksBy: 'Contractor',
        reference: 'Campaign reference',
        fittedBy: 'Fitted by (contractor)',
        assetTitle,
        empty: 'No renewals are booked for this campaign.',
      };
}

export const alloyWords = (alloy: string): string => ALLOY_LABELS[alloy] ?? 'Other alloy';
export const mountingWords = (mounting: string): string => MOUNTING_LABELS[mounting] ?? 'Other mounting';
export const statusWords = (status: string): string => RENEWAL_STATUS_LABELS[status] ?? 'Unknown';
export const zoneWords = (zone: string | null): string => zone ?? 'No zone';

/** Overall dimensions of an anode body as a catalogue gives them, m. */
export interface AnodeListDimensions {
  lengthM: number;
  widthM?: number;
  thicknessM?: number;
  radiusM?: number;
  innerDiameterM?: number;
}

const mm = (m: number): string => String(Math.round(m * 1000));

/**
 * A model's dimensions in millimetres, in the order the list's key explains: length × width ×
 * thickness for a plate, length × Ø diameter for a rod, length × thickness with the inside
 * diameter for a bracelet. '–' when the catalogue has none.
 */
export function dimensionsWords(d: AnodeListDimensions | null | undefined): string {
  if (!d || !(d.lengthM > 0)) return '–';
  const parts = [mm(d.lengthM)];
  if (d.widthM) parts.push(mm(d.widthM));
  if (d.radiusM) parts.push(`Ø${mm(2 * d.radiusM)}`);
  if (d.thicknessM) parts.push(mm(d.thicknessM));
  const text = parts.join(' × ');
  return d.innerDiameterM ? `${text}, ID ${mm(d.innerDiameterM)}` : text;
}

export const DIMENSIONS_KEY = 'Dimensions in mm: length × width × thickness; Ø is the diameter of a rod; ID is the inside diameter of a bracelet.';

/**
 * The columns of a line of the list, the same in the PDF (under each zone's title) and the CSV
 * (which adds the zone as its first column, being one table). Masses are kg.
 */
export const ANODE_LIST_LINE_COLUMNS = [
  'Group',
  'Model',
  'Dimensions, mm',
  'Alloy',
  'Mounting',
  'Qty',
  'Net each, kg',
  'Gross each, kg',
  'Net total, kg',
  'Gross total, kg',
  'Positions',
  FORECAST_DATE_LABELS.renewBy,
  'Status',
] as const;

export const ZONE_COLUMN = 'Zone';
