// Words for the desk's choices; the trade's own terms.
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
export const WATER_LABELS: Record<string, string> = { seawater: 'Seawater', brackish: 'Brackish', fresh: 'Fresh water' };
export const STATUS_LABELS: Record<string, string> = { draft: 'Draft', checked: 'Checked', approved: 'Approved' };
/** How a basis entry was obtained, in the words a reader needs. */
export const BASIS_FLAG_WORDS: Record<string, string> = {
  published: 'published',
  memory: 'to be confirmed against the licensed edition',
  practice: 'common practice',
};
