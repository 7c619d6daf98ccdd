import { z } from 'zod';
import { text } from './text';

// What the design desk sends: the job in the engineer's terms (bands, categories, mA/m2),
// turned into lib/cp's SI input by lib/design/build-design-input.ts.
export const ZONE_KIND_VALUES = [
  'hull-bottom',
  'boot-top-sides',
  'rudder',
  'propeller-shaft',
  'sea-chest',
  'thruster-tunnel',
  'pile-immersed',
  'pile-mud',
  'sheet-pile-water',
  'sheet-pile-mud',
  'other',
] as const;
export const CLIMATE_VALUES = ['tropical', 'sub-tropical', 'temperate', 'arctic'] as const;
export const DEPTH_BAND_VALUES = ['0-30', '30-100', '100-300', '300+', 'sediment'] as const;
/** Paint categories, bare metal, sacrificial metallic layers (thermally sprayed Al or Zn, hot-dip galvanised) and noble platings. */
export const COATING_VALUES = ['I', 'II', 'III', 'bare', 'tsa', 'tsz', 'hdg', 'noble-plating'] as const;
/** How the zones' current demand is found: ship-hull practice, harbour practice, or the offshore-structure table (DNV-RP-B401). */
export const DEMAND_METHOD_VALUES = ['ship-hull', 'harbour', 'offshore-table'] as const;
export const HULL_CONDITION_VALUES = ['new', 'good', 'fair', 'poor'] as const;
/** Resistivity from the water (PSS-78 from temperature and salinity) or as measured. */
export const RESISTIVITY_SOURCE_VALUES = ['water', 'measured'] as const;
/** Protective potential from the criterion for the metal and environment, or as entered. */
export const POTENTIAL_SOURCE_VALUES = ['criterion', 'entered'] as const;
export const WATER_VALUES = ['seawater', 'brackish', 'fresh'] as const;
export const PROTECTED_METAL_VALUES = ['steel', 'high-strength-steel', 'aluminium', 'stainless', 'copper-alloy'] as const;
export const HULL_MATERIAL_VALUES = ['steel', 'aluminium'] as const;
export const CURRENT_DRAIN_VALUES = ['copper-alloy', 'stainless'] as const;
export const ANODE_ALLOY_VALUES = ['al-zn-in', 'zinc', 'magnesium', 'magnesium-high-potential'] as const;
export const ANODE_MOUNTING_VALUES = ['flush-weld', 'flush-bolt', 'standoff', 'bracelet', 'pile-mounted'] as const;

// Form fields arrive as strings; an empty one is "not given", never zero.
const num = (label: string, unit: string) =>
  z.preprocess(
    (v) => (v === '' || v === null ? undefined : v),
    z.coerce.number({ error: `${label}: enter a number (${unit}).` }).refine(Number.isFinite, `${label}: enter a finite number (${unit}).`),
  );
const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);

const currentDensityMa = z.object({
  initial: num('Initial current density', 'mA/m²').pipe(z.number().min(0, 'Initial current density cannot be negative.').max(5000, 'Initial current density above 5,000 mA/m² is not plausible.')),
  mean: num('Mean current density', 'mA/m²').pipe(z.number().min(0, 'Mean current density cannot be negative.').max(5000, 'Mean current density above 5,000 mA/m² is not plausible.')),
  final: num('Final current density', 'mA/m²').pipe(z.number().min(0, 'Final current density cannot be negative.').max(5000, 'Final current density above 5,000 mA/m² is not plausible.')),
});

export const deskSurfaceSchema = z.object({
  name: text().trim().min(1, 'Name the zone.').max(80, 'Use at most 80 characters.'),
  kind: z.enum(ZONE_KIND_VALUES, { error: 'Choose a zone kind.' }),
  areaM2: num('Area', 'm²').pipe(z.number().gt(0, 'The area must be more than 0 m².').max(1_000_000, 'An area above 1,000,000 m² is not plausible.')),
  areaSource: text().max(40).default('entered'),
  depthBand: z.enum(DEPTH_BAND_VALUES, { error: 'Choose a depth band.' }),
  coatingCategory: z.enum(COATING_VALUES, { error: 'Choose a coating category or bare.' }),
  coatingAgeYears: num('Coating age', 'years').pipe(z.number().min(0, 'The coating age cannot be negative.').max(60, 'A coating older than 60 years is not plausible.')).default(0),
  /** Entered design current density (bare metal), mA/m2, replacing the DNV table value. */
  currentDensityOverride: z.preprocess(blankToNull, currentDensityMa.nullable()),
  drainsCurrent: z.preprocess(blankToNull, z.enum(CURRENT_DRAIN_VALUES).nullable()),
  /** Water temperature at this zone's depth, C, where it differs from the surface (deep water is colder). */
  temperatureC: z.preprocess(blankToNull, num('Zone water temperature', '°C').pipe(z.number().min(-2, 'Water colder than -2 °C is not plausible.').max(60, 'Water above 60 °C is outside this tool.')).nullable()).default(null),
});

export const deskInputsSchema = z.object({
  designLifeYears: num('Design life', 'years').pipe(z.number().gt(0, 'The design life must be more than 0 years.').max(50, 'Use a design life of at most 50 years.')),
  climate: z.enum(CLIMATE_VALUES, { error: 'Choose the water temperature band.' }),
  water: z.enum(WATER_VALUES, { error: 'Choose the water type.' }),
  temperatureC: z.preprocess(blankToNull, num('Water temperature', '°C').pipe(z.number().min(-2, 'Water colder than -2 °C is not plausible.').max(60, 'Water above 60 °C is outside this tool.')).nullable()),
  chloridePpm: z.preprocess(blankToNull, num('Chloride', 'ppm').pipe(z.number().min(0, 'Chloride cannot be negative.').max(40000, 'Chloride above 40,000 ppm is not plausible.')).nullable()),
  resistivityOhmM: num('Resistivity', 'Ω·m').pipe(z.number().gt(0, 'The resistivity must be more than 0 Ω·m.').max(10000, 'A resistivity above 10,000 Ω·m is not plausible.')),
  protectivePotentialV: num('Protective potential', 'V').pipe(z.number().min(-1.3, 'Use a protective potential of at least -1.3 V.').max(-0.5, 'Use a protective potential of at most -0.5 V.')),
  protectedMetal: z.enum(PROTECTED_METAL_VALUES, { error: 'Choose the protected metal.' }),
  hullMaterial: z.preprocess(blankToNull, z.enum(HULL_MATERIAL_VALUES).nullable()),
  anaerobic: z.boolean().default(false),
  nextDockingYears: z.preprocess(blankToNull, num('Next docking', 'years').pipe(z.number().gt(0, 'The interval to the next docking must be more than 0 years.').max(50, 'Use at most 50 years.')).nullable()),
  allowMagnesiumOnAluminium: z.boolean().default(false),
  demandMethod: z.enum(DEMAND_METHOD_VALUES, { error: 'Choose how the current demand is found.' }).default('offshore-table'),
  hullCoatingCondition: z.enum(HULL_CONDITION_VALUES, { error: 'Choose the condition of the hull coating.' }).default('good'),
  serviceSpeedKnots: z.preprocess(blankToNull, num('Service speed', 'knots').pipe(z.number().min(0, 'The speed cannot be negative.').max(60, 'A service speed above 60 knots is outside this tool.')).nullable()).default(null),
  salinityPsu: z.preprocess(blankToNull, num('Salinity', 'PSU').pipe(z.number().min(0, 'The salinity cannot be negative.').max(42, 'Salinity above 42 PSU is outside the Practical Salinity Scale.')).nullable()).default(null),
  resistivitySource: z.enum(RESISTIVITY_SOURCE_VALUES).default('measured'),
  potentialSource: z.enum(POTENTIAL_SOURCE_VALUES).default('entered'),
  anodeModelKey: text().min(1, 'Choose an anode model.').max(80),
  surfaces: z.array(deskSurfaceSchema).min(1, 'Add at least one zone.').max(200, 'Use at most 200 zones.'),
});

export type DeskInputs = z.infer<typeof deskInputsSchema>;
export type DeskSurface = z.infer<typeof deskSurfaceSchema>;

/** What the desk holds while the engineer types: numbers may still be strings. */
type Loose<T> = { [K in keyof T]: T[K] extends number ? number | string : T[K] extends number | null ? number | string | null : T[K] };
export type DeskSurfaceDraft = Loose<Omit<DeskSurface, 'currentDensityOverride'>> & {
  currentDensityOverride: { initial: number | string; mean: number | string; final: number | string } | null;
};
export type DeskInputsDraft = Loose<Omit<DeskInputs, 'surfaces'>> & { surfaces: DeskSurfaceDraft[] };
