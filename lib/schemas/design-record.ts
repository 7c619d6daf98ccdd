import { z } from 'zod';
import { multilineText } from './text';
import type { AnodeModel, DesignResult, ImpressedCurrentSummary, OptionRow } from '@/lib/cp';
import {
  ANODE_ALLOY_VALUES,
  ANODE_MOUNTING_VALUES,
  CLIMATE_VALUES,
  COATING_VALUES,
  CURRENT_DRAIN_VALUES,
  DEPTH_BAND_VALUES,
  HULL_MATERIAL_VALUES,
  PROTECTED_METAL_VALUES,
  WATER_VALUES,
  DEMAND_METHOD_VALUES,
  HULL_CONDITION_VALUES,
  RESISTIVITY_SOURCE_VALUES,
  POTENTIAL_SOURCE_VALUES,
  ZONE_KIND_VALUES,
  type DeskInputs,
} from './design';

/**
 * Version of the stored design record: the design table's inputs, anode_model, results, result_error
 * and basis columns, read and written together.
 * 1: the anode model snapshot lived inside inputs as `anodeModelSnapshot` (no schema_version column).
 * 2: the snapshot has its own column (Migration20261202003500_design_record).
 * 3: inputs name the demand method, hull coating condition, service speed, salinity and where the
 *    resistivity and protective potential come from; results carry the one count to fit
 *    (Migration20261202011500_demand_method; earlier rows keep the offshore table they were sized with).
 * Bump it, with a migration for the rows, whenever a stored field changes shape or meaning.
 */
export const DESIGN_SCHEMA_VERSION = 3;

// Stored values are checked for shape only, never against today's plausibility limits: a limit
// tightened later must not make an approved revision unreadable.
const num = z.number();
// Texts were checked as they came in (lib/schemas/text); line breaks are let through so no stored note is refused.
const storedText = () => multilineText();
const opt = z.number().optional();
const triple = z.object({ initial: num, mean: num, final: num });
const currents = z.object({ initialA: num, meanA: num, finalA: num });

export const storedSurfaceSchema = z.object({
  name: storedText(),
  kind: z.enum(ZONE_KIND_VALUES),
  areaM2: num,
  areaSource: storedText(),
  depthBand: z.enum(DEPTH_BAND_VALUES),
  coatingCategory: z.enum(COATING_VALUES),
  coatingAgeYears: num,
  /** mA/m2, as the engineer entered it. */
  currentDensityOverride: triple.nullable(),
  drainsCurrent: z.enum(CURRENT_DRAIN_VALUES).nullable(),
  /** Added with per-zone resistivity; rows stored before carry none (the surface temperature applies). */
  temperatureC: num.nullable().default(null),
});

/** The desk's inputs as stored with a revision. */
export const storedInputsSchema = z.object({
  designLifeYears: num,
  climate: z.enum(CLIMATE_VALUES),
  water: z.enum(WATER_VALUES),
  temperatureC: num.nullable(),
  chloridePpm: num.nullable(),
  resistivityOhmM: num,
  protectivePotentialV: num,
  protectedMetal: z.enum(PROTECTED_METAL_VALUES),
  hullMaterial: z.enum(HULL_MATERIAL_VALUES).nullable(),
  anaerobic: z.boolean(),
  nextDockingYears: num.nullable(),
  allowMagnesiumOnAluminium: z.boolean(),
  demandMethod: z.enum(DEMAND_METHOD_VALUES),
  hullCoatingCondition: z.enum(HULL_CONDITION_VALUES),
  serviceSpeedKnots: num.nullable(),
  salinityPsu: num.nullable(),
  resistivitySource: z.enum(RESISTIVITY_SOURCE_VALUES),
  potentialSource: z.enum(POTENTIAL_SOURCE_VALUES),
  anodeModelKey: storedText().min(1),
  surfaces: z.array(storedSurfaceSchema).min(1),
});

const anodeShapeSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('slender-standoff'), lengthM: num, radiusM: num, standoffM: opt, coreRadiusM: opt }),
  z.object({ kind: z.literal('long-flush'), lengthM: num, widthM: num, thicknessM: opt }),
  z.object({ kind: z.enum(['short-flush', 'bracelet']), exposedAreaM2: num, lengthM: opt, widthM: opt, thicknessM: opt, segmented: z.boolean().optional() }),
]);

/** The catalogue model as it was when the results were computed (the catalogue may change later). */
export const anodeModelSnapshotSchema = z.object({
  key: storedText().min(1),
  source: z.enum(['built-in', 'organisation']),
  id: storedText(),
  designation: storedText(),
  alloy: z.enum(ANODE_ALLOY_VALUES),
  mounting: z.enum(ANODE_MOUNTING_VALUES),
  shape: anodeShapeSchema,
  dimensions: z.object({ lengthM: num, widthM: opt, thicknessM: opt, radiusM: opt, innerDiameterM: opt }),
  netMassKg: num,
  grossMassKg: num,
  ratedOutputA: opt,
  ratedAtResistivityOhmM: opt,
  unitPrice: opt,
  capacityAhPerKg: opt,
  potentialV: opt,
  utilisationFactor: opt,
});

const criterion = z.enum(['mass', 'initial-current', 'final-current']);
const formula = z.enum(['modified-dwight', 'short-slender', 'long-flush', 'mccoy']);
const counts = z.object({ mass: num, initialCurrent: num, finalCurrent: num });
const basisEntrySchema = z.object({ topic: storedText(), source: storedText(), flag: z.enum(['published', 'memory', 'practice']) });
// A warning's code stays a plain string: a code lib/cp no longer raises must still print.
const messageSchema = z.object({ code: storedText(), message: storedText() });
const alloy = z.enum(ANODE_ALLOY_VALUES);

/** lib/cp's DesignResult, every field (the round-trip unit test fails when one is missing). */
export const storedDesignResultSchema = z.object({
  current: currents,
  surfaces: z.array(currents.extend({ name: storedText(), areaM2: num, breakdown: triple, drainsCurrent: z.enum(CURRENT_DRAIN_VALUES).optional() })),
  requiredNetMassKg: num,
  drivingVoltageV: num,
  protectivePotentialV: num,
  perAnode: z.object({
    initialResistanceOhm: num,
    finalResistanceOhm: num,
    initialOutputA: num,
    finalOutputA: num,
    initialFormula: formula,
    finalFormula: formula,
    finalShape: anodeShapeSchema,
    ratedOutputUsed: z.boolean(),
    ratedOutputScaling: z.enum(['scaled', 'unscaled']).optional(),
    initialTreatment: z.enum(['as-given', 'near-flush-slender', 'short-flush-fallback']),
  }),
  exactCountBy: counts,
  countBy: counts,
  anodeCount: z.number().int(),
  anodesToFit: z.number().int(),
  governingCriterion: criterion,
  installedCount: z.number().int(),
  installedNetMassKg: num,
  installedGrossMassKg: num.nullable(),
  achievedLifeYears: num,
  distribution: z.object({
    designCount: z.number().int(),
    distributedCount: z.number().int(),
    surfaces: z.array(z.object({ name: storedText(), demandA: num, share: num, exactCount: num, count: z.number().int(), anodesAllowed: z.boolean().optional() })),
    basis: z.enum(['initial', 'mean', 'final']),
  }),
  warnings: z.array(messageSchema),
  basis: z.array(basisEntrySchema),
});

const impressedCurrentSchema = z.object({
  current: currents,
  peakA: num,
  peakCondition: z.enum(['initial', 'final']),
  margin: num,
  suggestedRatingA: num,
  surfaces: z.array(currents.extend({ name: storedText() })),
  note: storedText(),
});

const optionRowSchema = z.discriminatedUnion('suitable', [
  z.object({
    id: storedText(),
    designation: storedText(),
    alloy,
    suitable: z.literal(true),
    anodeCount: z.number().int(),
    governingCriterion: criterion,
    requiredNetMassKg: num,
    installedNetMassKg: num,
    installedGrossMassKg: num,
    achievedLifeYears: num,
    warningsCount: z.number().int(),
    warningCodes: z.array(storedText()),
    cost: z.object({ supply: num, fitting: num, total: num }).nullable(),
  }),
  z.object({ id: storedText(), designation: storedText(), alloy, suitable: z.literal(false), reason: storedText(), field: storedText() }),
]);

/** The results column: the design result with what the desk showed beside it. */
export const storedResultsSchema = storedDesignResultSchema.extend({
  notices: z.array(messageSchema),
  impressedCurrent: impressedCurrentSchema.nullable(),
  options: z.array(optionRowSchema),
});

export const designRecordSchema = z.object({
  schemaVersion: z.literal(DESIGN_SCHEMA_VERSION, { error: (issue) => `version ${JSON.stringify(issue.input)} found, this app reads version ${DESIGN_SCHEMA_VERSION} (run the migrations)` }),
  inputs: storedInputsSchema,
  /** Null only on rows written before the snapshot was kept (nothing is substituted for it). */
  anodeModel: anodeModelSnapshotSchema.nullable(),
  /** Null when the inputs could not be sized; resultError says why. */
  results: storedResultsSchema.nullable(),
  resultError: storedText().nullable(),
  basis: z.array(basisEntrySchema).nullable(),
});

export type StoredInputs = z.infer<typeof storedInputsSchema>;
export type AnodeModelSnapshot = z.infer<typeof anodeModelSnapshotSchema>;
export type StoredDesignResult = z.infer<typeof storedDesignResultSchema>;
export type StoredResults = z.infer<typeof storedResultsSchema>;
export type DesignRecord = z.infer<typeof designRecordSchema>;

// Compile-time: what the desk and lib/cp produce today can be stored, and stored inputs feed the desk.
type Fits<T extends U, U> = T;
export type StorableShapes = [
  Fits<DesignResult, StoredDesignResult>,
  Fits<OptionRow, StoredResults['options'][number]>,
  Fits<ImpressedCurrentSummary, NonNullable<StoredResults['impressedCurrent']>>,
  Fits<AnodeModel & { key: string; source: 'built-in' | 'organisation' }, AnodeModelSnapshot>,
  Fits<AnodeModelSnapshot, AnodeModel>,
  Fits<DeskInputs, StoredInputs>,
  Fits<StoredInputs, DeskInputs>,
];

/** A stored design record that does not match the schema: a fault in the row, never recomputed around. */
export class StoredRecordError extends Error {
  constructor(
    readonly where: string,
    readonly fields: string[],
    detail: string,
  ) {
    super(`${where}: the stored record does not match design record version ${DESIGN_SCHEMA_VERSION}: ${detail}`);
    this.name = 'StoredRecordError';
  }
}

/** `results.surfaces.0.meanA` written as `results.surfaces[0].meanA`. */
function fieldPath(path: readonly PropertyKey[]) {
  return path.reduce<string>((out, key) => (typeof key === 'number' ? `${out}[${key}]` : out ? `${out}.${String(key)}` : String(key)), '') || '(record)';
}

function parseOrThrow<S extends z.ZodType>(schema: S, raw: unknown, where: string): z.output<S> {
  const parsed = schema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const issues = parsed.error.issues;
  const fields = issues.map((i) => fieldPath(i.path));
  const detail = issues.slice(0, 3).map((i, n) => `${fields[n]}: ${i.message}`).join('; ') + (issues.length > 3 ? ` (and ${issues.length - 3} more)` : '');
  throw new StoredRecordError(where, fields, detail);
}

/** Checks a whole record, on the way into the table and on the way out; `where` names the row in the message. */
export function parseDesignRecord(raw: unknown, where: string): DesignRecord {
  return parseOrThrow(designRecordSchema, raw, where);
}

/** Only the results column (lists and the register load no inputs); the version is checked all the same. */
export function parseStoredResults(raw: { schemaVersion: unknown; results: unknown }, where: string): StoredResults | null {
  return parseOrThrow(designRecordSchema.pick({ schemaVersion: true, results: true }), raw, where).results;
}
