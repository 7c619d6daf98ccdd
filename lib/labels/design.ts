// Words for the desk's choices; the trade's own terms (safe for client code).
export const ZONE_KIND_LABELS: Record<string, string> = {
  'hull-bottom': 'Hull bottom',
  'boot-top-sides': 'Boot-top and sides',
  rudder: 'Rudder',
  'propeller-shaft': 'Propeller and shaft',
  'sea-chest': 'Sea chest',
  'thruster-tunnel': 'Thruster tunnel',
  'pile-immersed': 'Pile, immersed zone',
  'pile-mud': 'Pile, mud zone',
  'sheet-pile-water': 'Sheet pile, water side',
  'sheet-pile-mud': 'Sheet pile, mud zone',
  other: 'Other',
};
export const CLIMATE_LABELS: Record<string, string> = {
  tropical: 'Tropical (> 20 °C)',
  'sub-tropical': 'Sub-tropical (12–20 °C)',
  temperate: 'Temperate (7–11 °C)',
  arctic: 'Arctic (< 7 °C)',
};
export const DEPTH_BAND_LABELS: Record<string, string> = {
  '0-30': '0–30 m',
  '30-100': '> 30–100 m',
  '100-300': '> 100–300 m',
  '300+': '> 300 m',
  sediment: 'Buried / sediment',
};
export const COATING_LABELS: Record<string, string> = {
  I: 'Cat. I (about 50 µm)',
  II: 'Cat. II (150–250 µm)',
  III: 'Cat. III (300 µm or more)',
  bare: 'Bare metal',
  tsa: 'Thermally sprayed aluminium',
  tsz: 'Thermally sprayed zinc',
  hdg: 'Hot-dip galvanised',
  'noble-plating': 'Noble plating (tin, nickel, chromium)',
};
export const DEMAND_METHOD_LABELS: Record<string, string> = {
  'ship-hull': 'Ship-hull practice',
  harbour: 'Harbour practice',
  'offshore-table': 'Offshore-structure table (DNV-RP-B401)',
};
export const HULL_CONDITION_LABELS: Record<string, string> = {
  new: 'New, intact (about 10 mA/m²)',
  good: 'Good (about 15 mA/m²)',
  fair: 'Fair (about 20 mA/m²)',
  poor: 'Poor or old hull (about 30 mA/m²)',
};
export const RESISTIVITY_SOURCE_LABELS: Record<string, string> = { water: 'From the water (PSS-78)', measured: 'Measured' };
export const POTENTIAL_SOURCE_LABELS: Record<string, string> = { criterion: 'Criterion for the metal', entered: 'Entered' };
export const CRITERION_LABELS: Record<string, string> = {
  mass: 'Net anode mass',
  'initial-current': 'Initial current output',
  'final-current': 'Final current output',
};
export const ALLOY_LABELS: Record<string, string> = {
  'al-zn-in': 'Al-Zn-In',
  zinc: 'Zinc',
  magnesium: 'Magnesium',
  'magnesium-high-potential': 'Magnesium (high potential)',
};
export const MOUNTING_LABELS: Record<string, string> = {
  'flush-weld': 'Flush, weld-on',
  'flush-bolt': 'Flush, bolt-on',
  standoff: 'Stand-off',
  bracelet: 'Bracelet',
  'pile-mounted': 'Pile-mounted',
};
export const METAL_LABELS: Record<string, string> = {
  steel: 'Carbon steel',
  'high-strength-steel': 'High-strength steel (yield > 550 MPa)',
  aluminium: 'Aluminium',
  stainless: 'Stainless steel',
  'copper-alloy': 'Copper alloy',
};
/** The protected metal inside a sentence: "the criterion for high-strength steel". */
export const METAL_WORDS: Readonly<Record<string, string>> = {
  steel: 'steel',
  'high-strength-steel': 'high-strength steel',
  aluminium: 'aluminium',
  stainless: 'stainless steel',
  'copper-alloy': 'copper alloy',
};

export const WATER_LABELS: Record<string, string> = { seawater: 'Seawater', brackish: 'Brackish', fresh: 'Fresh water' };
export const STATUS_LABELS: Record<string, string> = { draft: 'Draft', checked: 'Checked', approved: 'Approved' };
/** How a basis entry was obtained, in the words a reader needs (screens and the calculation note). */
export const BASIS_FLAG_WORDS: Record<'published' | 'memory' | 'practice', string> = {
  published: 'published',
  memory: 'to be confirmed against the licensed edition',
  practice: 'common practice',
};

/** What current-draining metal a zone touches (the zone form and the note). */
export const CURRENT_DRAIN_LABELS: Record<string, string> = { 'copper-alloy': 'Copper alloy', stainless: 'Stainless steel' };

/**
 * The anode resistance formulas: one name each, the same on the desk, in the calculation note and in the
 * catalogue. The slender-anode formula is named as DNV-RP-B401 (2010) Table 10-7 names it (modified Dwight).
 */
export const RESISTANCE_FORMULA_LABELS: Record<string, string> = {
  'modified-dwight': 'Modified Dwight (long slender stand-off)',
  'short-slender': 'Short slender stand-off',
  'long-flush': 'Long flush',
  mccoy: 'McCoy (short flush and bracelet)',
};

/** The shape an anode model is sized as, which chooses its resistance formula (catalogue and note). */
export const SHAPE_KIND_LABELS: Record<string, string> = {
  'slender-standoff': 'Slender, on stand-off legs',
  'long-flush': 'Long flush plate',
  'short-flush': 'Short flush plate',
  bracelet: 'Bracelet (half-shells)',
};

/** The catalogue's shape choice, named with the formula it selects (one name per formula). */
export const SHAPE_FORMULA_OPTIONS: { value: string; label: string }[] = [
  { value: 'slender-standoff', label: `${SHAPE_KIND_LABELS['slender-standoff']}: ${RESISTANCE_FORMULA_LABELS['modified-dwight']}` },
  { value: 'long-flush', label: `${SHAPE_KIND_LABELS['long-flush']}, L ≥ 4 × width: ${RESISTANCE_FORMULA_LABELS['long-flush']}` },
  { value: 'short-flush', label: `${SHAPE_KIND_LABELS['short-flush']}: ${RESISTANCE_FORMULA_LABELS.mccoy}` },
  { value: 'bracelet', label: `${SHAPE_KIND_LABELS.bracelet}: ${RESISTANCE_FORMULA_LABELS.mccoy}` },
];

/** How the sizing treated an anode that sits between two formulas' ranges (a clause after the formula). */
export const RESISTANCE_TREATMENT_WORDS: Record<string, string> = {
  'as-given': '',
  'near-flush-slender': '; slender anode below 0.15 m stand-off taken as flush-mounted',
  'short-flush-fallback': '; flush plate outside the limits of the long flush formula taken by McCoy',
};

/** Where a zone's area comes from, in words. */
export const AREA_SOURCE_WORDS: Record<string, string> = {
  entered: 'entered',
  'denny-mumford': 'estimated, Denny-Mumford S = L(1.7T + CB·B)',
  'denny-mumford-default-cb': 'estimated, Denny-Mumford with the default block coefficient for the vessel type',
  estimate: 'estimated by rule of thumb',
  placeholder: 'placeholder: enter the particulars or the area',
};

/** Where a catalogue model comes from. */
export const MODEL_SOURCE_LABELS: Record<string, string> = { 'built-in': 'Built-in', organisation: 'Our catalogue' };
