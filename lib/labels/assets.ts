/** Words for an asset's particulars (safe for client code). */
export const ASSET_KIND_LABELS: Record<string, string> = { vessel: 'Vessel', structure: 'Structure' };

/** The asset kind inside a sentence or after a name: "(vessel)", "(structure)". */
export const assetKindWord = (kind: string): string => (ASSET_KIND_LABELS[kind] ?? kind).toLowerCase();

export const STRUCTURE_TYPE_LABELS: Record<string, string> = {
  jetty: 'Jetty',
  wharf: 'Wharf',
  dolphin: 'Dolphin',
  pontoon: 'Pontoon',
  'sheet-pile-wall': 'Sheet-pile wall',
  other: 'Other structure',
};

export const HULL_MATERIAL_LABELS: Record<string, string> = { steel: 'Steel', aluminium: 'Aluminium' };

/** The water an asset or a zone sits in (a zone can be buried: sediment). */
export const WATER_TYPE_LABELS: Record<string, string> = { seawater: 'Seawater', brackish: 'Brackish water', fresh: 'Fresh water', sediment: 'Sediment (buried)' };

/**
 * The columns of the register export, in order. Headers are words with their unit, like the screens; dates stay
 * YYYY-MM-DD so a spreadsheet sorts them, and the remaining fraction is a percentage.
 */
export const REGISTER_CSV_HEADERS = [
  'Asset',
  'Asset kind',
  'Zone',
  'Group',
  'Model',
  'Alloy',
  'Mounting',
  'Quantity',
  'Net mass each (kg)',
  'Gross mass each (kg)',
  'Net mass total (kg)',
  'Positions',
  'Installed on (YYYY-MM-DD)',
  'Last remaining (%)',
  'Last surveyed on (YYYY-MM-DD)',
  // The position as data (read from "Positions"): frames, side, height and part of a hull; piles and depth of a structure.
  'Frames',
  'Side',
  'Height above keel (m)',
  'Part of the hull',
  'Piles',
  'Depth below datum (m)',
  'Datum',
  'Position note',
] as const;
