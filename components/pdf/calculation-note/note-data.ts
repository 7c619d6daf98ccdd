import { format } from 'date-fns';
import { anodeFromModel, HIGH_SPEED_FACTOR, HIGH_SPEED_KNOTS, type DesignAnode } from '@/lib/cp';
import { DEMAND_METHOD_SOURCES, zoneDemand } from '@/lib/design/build-design-input';
import { AREA_SOURCE_WORDS } from '@/lib/labels';
import {
  ALLOY_LABELS,
  CLIMATE_LABELS,
  COATING_LABELS,
  CRITERION_LABELS,
  DEMAND_METHOD_LABELS,
  DEPTH_BAND_LABELS,
  HULL_CONDITION_LABELS,
  METAL_LABELS,
  MOUNTING_LABELS,
  POTENTIAL_SOURCE_LABELS,
  RESISTIVITY_SOURCE_LABELS,
  STATUS_LABELS,
  WATER_LABELS,
  ZONE_KIND_LABELS,
  BASIS_FLAG_WORDS,
  RESISTANCE_FORMULA_LABELS,
  RESISTANCE_TREATMENT_WORDS,
  SHAPE_KIND_LABELS,
  assetKindWord,
  METAL_WORDS,
  MODEL_SOURCE_LABELS,
} from '@/lib/labels';
import { fmt, fmtInt, fmtSig } from '@/lib/format';
import type { AnodeModelSnapshot, StoredDesignResult, StoredInputs } from '@/lib/schemas/design-record';

/*
 * What the calculation note says: every text it prints, from the revision's inputs, anode model
 * snapshot and results. layout.ts measures these texts and plans the sheets; render.tsx draws them.
 */

export interface CalculationNoteData {
  organisation: string;
  asset: { name: string; kind: string; particulars: [string, string][] };
  design: { title: string; revision: number; status: string; appVersion: string; basedOnRevision: number | null };
  inputs: StoredInputs;
  /** Null when the revision was stored without a model snapshot: the note says so and substitutes nothing. */
  model: AnodeModelSnapshot | null;
  /** Whether the results are the revision's stored record (signed revisions) or recomputed at printing (drafts). */
  source: 'stored' | 'recomputed';
  result: StoredDesignResult | null;
  resultError: string | null;
  notices: { code: string; message: string }[];
  signatures: { role: string; name: string | null; at: Date | null }[];
  printedAt: Date;
  printedBy: string;
}

type Row = string[];
type Surface = StoredInputs['surfaces'][number];
type SurfaceResult = StoredDesignResult['surfaces'][number];
type Condition = 'initial' | 'mean' | 'final';
const CONDITIONS: Condition[] = ['initial', 'mean', 'final'];
const CURRENT_KEY = { initial: 'initialA', mean: 'meanA', final: 'finalA' } as const;

/** The basis flags in the words the note prints (lib/labels). */
export const FLAG_WORDS = BASIS_FLAG_WORDS;

export const EQUATIONS: Row[] = [
  ['Current demand of a surface', 'Ic = Ac · fc · ic', 'DNV-RP-B401 (2010) sec. 7'],
  ['Coating breakdown factor', 'fc = a + b·t; fci = a, fcm = a + b·tf/2, fcf = a + b·tf (at most 1)', 'DNV-RP-B401 (2010) sec. 7'],
  ['Net anode mass', 'M = Icm · tf · 8760 / (u · ε)', 'DNV-RP-B401 (2010) sec. 7'],
  ['Anode current output', 'Ia = (Ec - Ea) / Ra', 'DNV-RP-B401 (2010) sec. 7'],
  ['Resistance, ' + RESISTANCE_FORMULA_LABELS['modified-dwight'], 'Ra = ρ/(2πL) · (ln(4L/r) - 1)', 'DNV-RP-B401 (2010) Table 10-7'],
  ['Resistance, ' + RESISTANCE_FORMULA_LABELS['long-flush'], 'Ra = ρ/(2S), S = (L + W)/2', 'DNV-RP-B401 (2010) Table 10-7'],
  ['Resistance, ' + RESISTANCE_FORMULA_LABELS.mccoy, 'Ra = 0.315 ρ / √A', 'DNV-RP-B401 (2010) Table 10-7'],
  ['Count', 'N·m >= M; N·Iai >= Ici; N·Iaf >= Icf', 'DNV-RP-B401 (2010) sec. 7'],
];
export const EQUATIONS_NOTE = 'Section and table numbers of DNV-RP-B401 are given from memory: to be confirmed against the licensed edition.';


const mm = (m: number | undefined) => (m === undefined ? null : `${fmtInt(m * 1000)} mm`);
/** A number with at most `digits` decimals, trailing zeros dropped: 16.5, 150, 0.025. */
const trimmed = (x: number, digits: number) => (Number.isFinite(x) ? x.toLocaleString('en-GB', { maximumFractionDigits: digits }) : '–');
const triple = (values: number[], show: (x: number) => string) => values.map(show).join(' / ');

/** The designation the note names, or the model key with a plain statement that no snapshot was stored. */
export function designationOf(data: CalculationNoteData): string {
  return data.model?.designation ?? `${data.inputs.anodeModelKey} (model not recorded with this revision)`;
}

/** What a desk notice says after its leading value ("Resistivity 0.25 Ω·m: estimated from …" gives "estimated from …"). */
function noticeSource(data: CalculationNoteData, code: string): string | null {
  const message = data.notices.find((n) => n.code === code)?.message;
  if (!message) return null;
  const at = message.indexOf(': ');
  return (at >= 0 ? message.slice(at + 2) : message).replace(/\.$/, '');
}

/** The basis entry a result lists for a topic, as "source (flag in words)". */
function basisFor(data: CalculationNoteData, topic: (t: string) => boolean): string | null {
  const entry = data.result?.basis.find((b) => topic(b.topic));
  return entry ? `${entry.source} (${FLAG_WORDS[entry.flag]})` : null;
}

export const NOTE_TITLE = 'Calculation note: sacrificial-anode cathodic protection';
export const titleLine = (data: CalculationNoteData) => `${data.asset.name} (${assetKindWord(data.asset.kind)}) · ${data.design.title}`;
export const revisionLine = (data: CalculationNoteData) => `Revision ${data.design.revision} · ${STATUS_LABELS[data.design.status] ?? data.design.status}`;
export const footerLeft = (data: CalculationNoteData) => `${data.organisation} · ${data.asset.name} · ${data.design.title} · revision ${data.design.revision} (${STATUS_LABELS[data.design.status] ?? data.design.status})`;
export const footerRight = (data: CalculationNoteData) => `Printed ${format(data.printedAt, 'd MMM yyyy HH:mm')} by ${data.printedBy}`;
export const resultsSourceLine = (data: CalculationNoteData) =>
  data.source === 'stored'
    ? `As stored with revision ${data.design.revision} (Tidewarden ${data.design.appVersion}); not recomputed.`
    : "Recomputed from the draft's inputs at printing; a signed revision prints its stored results.";

export function inputRows(data: CalculationNoteData): Row[] {
  const i = data.inputs;
  const hullPractice = i.demandMethod === 'ship-hull';
  const fast = i.serviceSpeedKnots !== null && i.serviceSpeedKnots > HIGH_SPEED_KNOTS;
  return [
    ['Design life tf', `${fmt(i.designLifeYears, 2)} years`],
    ['Water', WATER_LABELS[i.water] ?? i.water],
    ['Temperature band', CLIMATE_LABELS[i.climate] ?? i.climate],
    ['Water temperature', i.temperatureC !== null ? `${trimmed(i.temperatureC, 1)} °C` : 'not given (the band applies)'],
    ['Salinity', i.salinityPsu !== null ? `${trimmed(i.salinityPsu, 2)} PSU` : 'not given'],
    ...(i.chloridePpm !== null ? [['Chloride', `${fmtInt(i.chloridePpm)} ppm`]] : []),
    ['Resistivity ρ', `${fmt(i.resistivityOhmM, 3)} Ω·m`],
    ['Source of the resistivity', noticeSource(data, 'resistivity-source') ?? RESISTIVITY_SOURCE_LABELS[i.resistivitySource] ?? i.resistivitySource],
    ['Protective potential Ec', `${fmt(i.protectivePotentialV, 3)} V vs Ag/AgCl/seawater`],
    ['Criterion for Ec', noticeSource(data, 'potential-source') ?? POTENTIAL_SOURCE_LABELS[i.potentialSource] ?? i.potentialSource],
    ['Protected metal', METAL_LABELS[i.protectedMetal] ?? i.protectedMetal],
    ['Anaerobic (sulphate-reducing bacteria)', i.anaerobic ? 'yes' : 'no'],
    ['Hull material', i.hullMaterial ? (METAL_LABELS[i.hullMaterial] ?? i.hullMaterial) : 'not a hull'],
    ['Interval to next docking', i.nextDockingYears ? `${trimmed(i.nextDockingYears, 2)} years` : 'not given'],
    ['Current demand method', DEMAND_METHOD_LABELS[i.demandMethod] ?? i.demandMethod],
    ...(hullPractice
      ? [
          ['Hull coating condition', HULL_CONDITION_LABELS[i.hullCoatingCondition] ?? i.hullCoatingCondition],
          ['Service speed', i.serviceSpeedKnots !== null ? `${trimmed(i.serviceSpeedKnots, 1)} knots${fast ? ` (above ${HIGH_SPEED_KNOTS} knots: coated-hull densities × ${HIGH_SPEED_FACTOR})` : ''}` : 'not given'],
        ]
      : []),
    ...(i.allowMagnesiumOnAluminium ? [['Magnesium on aluminium', 'allowed by the engineer']] : []),
  ];
}

/** The alloy values the calculation used: the model's data sheet where it gives them, else the alloy table. */
function usedAnode(data: CalculationNoteData): DesignAnode | null {
  if (!data.model) return null;
  try {
    return anodeFromModel(data.model, data.inputs.water);
  } catch {
    return null;
  }
}

/** Quantity, value, source of each anode datum. */
export function anodeRows(data: CalculationNoteData): Row[] {
  const m = data.model;
  if (!m) {
    return [['Anode model', `${data.inputs.anodeModelKey}: not recorded with this revision (no model snapshot was stored; the catalogue's current entry is not substituted)`, '']];
  }
  const used = usedAnode(data);
  const perAnode = data.result?.perAnode;
  const alloyTable = basisFor(data, (t) => t.includes('capacity and potential')) ?? 'alloy table';
  const sheetOr = (given: number | undefined, otherwise: string) => (given !== undefined ? 'anode data sheet' : otherwise);
  const shape = m.shape;
  const dims = m.dimensions;
  const dimension = (label: string, value: string | null, source = 'catalogue'): Row[] => (value ? [[label, value, source]] : []);
  const standoff =
    shape.kind === 'slender-standoff'
      ? (mm(shape.standoffM) ?? 'not given (0.30 m or more assumed)')
      : 'none (flush-mounted)';
  const rated: Row[] =
    m.ratedOutputA !== undefined
      ? [
          [
            'Rated output (data sheet)',
            `${fmtSig(m.ratedOutputA)} A${m.ratedAtResistivityOhmM !== undefined ? ` at ρ = ${fmt(m.ratedAtResistivityOhmM, 3)} Ω·m` : ', resistivity not stated'}`,
            !perAnode?.ratedOutputUsed
              ? 'not used'
              : perAnode.ratedOutputScaling === 'scaled'
                ? `used, scaled to ρ = ${fmt(data.inputs.resistivityOhmM, 3)} Ω·m`
                : 'used as given, not scaled',
          ],
        ]
      : [['Rated output', 'none on the data sheet', 'output from the resistance formula']];
  return [
    ['Designation', m.designation, m.source === 'built-in' ? `${MODEL_SOURCE_LABELS['built-in']} catalogue (generic model)` : "organisation's catalogue"],
    ['Alloy', ALLOY_LABELS[m.alloy] ?? m.alloy, ''],
    ['Mounting; shape', `${MOUNTING_LABELS[m.mounting] ?? m.mounting}; ${SHAPE_KIND_LABELS[shape.kind] ?? 'other shape'}`, 'catalogue'],
    ['Electrochemical capacity ε', used ? `${fmtInt(used.capacityAhPerKg)} Ah/kg` : '–', sheetOr(m.capacityAhPerKg, alloyTable)],
    ['Closed-circuit potential Ea', used ? `${fmt(used.potentialV, 3)} V vs Ag/AgCl/seawater` : '–', sheetOr(m.potentialV, alloyTable)],
    ['Utilisation factor u', used ? fmt(used.utilisationFactor, 2) : '–', sheetOr(m.utilisationFactor, basisFor(data, (t) => t.startsWith('utilisation')) ?? 'by shape')],
    ['Net / gross mass per anode', `${fmt(m.netMassKg, 1)} / ${fmt(m.grossMassKg, 1)} kg`, 'catalogue'],
    ...dimension('Length L', mm(dims.lengthM)),
    ...dimension('Width W', mm(dims.widthM ?? (shape.kind === 'long-flush' ? shape.widthM : undefined))),
    ...dimension('Thickness', mm(dims.thicknessM ?? (shape.kind !== 'slender-standoff' ? shape.thicknessM : undefined))),
    ...dimension('Radius r', mm(dims.radiusM ?? (shape.kind === 'slender-standoff' ? shape.radiusM : undefined))),
    ...dimension('Core radius', shape.kind === 'slender-standoff' ? mm(shape.coreRadiusM) : null),
    ...dimension('Inside diameter', mm(dims.innerDiameterM)),
    ['Stand-off', standoff, shape.kind === 'slender-standoff' ? 'catalogue' : ''],
    ...dimension('Exposed area A', shape.kind === 'short-flush' || shape.kind === 'bracelet' ? `${fmtSig(shape.exposedAreaM2)} m²` : null, 'catalogue (McCoy uses it)'),
    ...rated,
  ];
}

/**
 * The design current density of a zone, mA/m2, as the calculation used it: Ic = Ac · fc · ic read
 * back from the result (the revision's record when signed), so it agrees with the printed currents
 * whatever the tables say today. Where fc is 0 the current tells nothing, and the density is the
 * one the method gives for the stored inputs (zoneDemand).
 */
export function zoneDensitiesMaPerM2(surface: Surface, row: SurfaceResult, inputs: StoredInputs): number[] {
  let method: Record<Condition, number> | null = null;
  return CONDITIONS.map((k) => {
    const fc = row.breakdown[k];
    if (fc > 0 && row.areaM2 > 0) return (row[CURRENT_KEY[k]] / (row.areaM2 * fc)) * 1000;
    method ??= zoneDemand(surface, inputs).currentDensity;
    return method[k] * 1000;
  });
}

/**
 * The coating constants a zone was sized with, read back from its breakdown factors: a = fci (with the
 * coating's age already in it) and b from the first factor below the cap of 1.
 */
function coatingConstants(surface: Surface, row: SurfaceResult | undefined, designLifeYears: number): string {
  const bareLike = surface.coatingCategory === 'bare' || surface.coatingCategory === 'noble-plating';
  if (!row) return bareLike ? 'bare, fc = 1' : '–';
  const fc = row.breakdown;
  if (fc.initial >= 1 && fc.mean >= 1 && fc.final >= 1) return bareLike ? 'bare, fc = 1' : 'fc = 1 (painted-hull density)';
  const a = fc.initial;
  const b = fc.final < 1 ? (fc.final - a) / designLifeYears : fc.mean < 1 ? (2 * (fc.mean - a)) / designLifeYears : null;
  return `a ${trimmed(a, 4)}, b ${b === null ? '–' : trimmed(b, 4)}`;
}

/** Zones, first table: what each is, its area and where it comes from, its coating and constants. */
export function zoneAreaRows(data: CalculationNoteData): Row[] {
  return data.inputs.surfaces.map((s, i) => [
    s.name,
    (ZONE_KIND_LABELS[s.kind] ?? s.kind) + (s.drainsCurrent ? `, bare ${METAL_WORDS[s.drainsCurrent] ?? 'metal'} (drain)` : ''),
    fmt(s.areaM2, 1),
    AREA_SOURCE_WORDS[s.areaSource] ?? s.areaSource,
    DEPTH_BAND_LABELS[s.depthBand] ?? s.depthBand,
    COATING_LABELS[s.coatingCategory] ?? s.coatingCategory,
    s.coatingCategory === 'bare' ? '–' : trimmed(s.coatingAgeYears, 1),
    coatingConstants(s, data.result?.surfaces[i], data.inputs.designLifeYears),
  ]);
}

/** Whether any coated zone starts its life already aged (its a then includes b · age). */
export const hasAgedCoating = (data: CalculationNoteData) =>
  data.inputs.surfaces.some((s, i) => s.coatingAgeYears > 0 && (data.result?.surfaces[i]?.breakdown.initial ?? 1) < 1);

/** Zones, second table: densities used, breakdown factors, currents and anodes; the total last. */
export function zoneDemandRows(data: CalculationNoteData): { cells: Row; total: boolean }[] {
  const result = data.result;
  if (!result) return [];
  const rows = result.surfaces.map((r, i) => {
    const surface = data.inputs.surfaces[i];
    const densities = surface ? triple(zoneDensitiesMaPerM2(surface, r, data.inputs), (x) => trimmed(x, 2)) : '–';
    const share = result.distribution.surfaces[i];
    return {
      cells: [
        r.name,
        surface?.currentDensityOverride ? `${densities} (entered)` : densities,
        triple(CONDITIONS.map((k) => r.breakdown[k]), (x) => trimmed(x, 3)),
        fmtSig(r.initialA),
        fmtSig(r.meanA),
        fmtSig(r.finalA),
        share?.anodesAllowed === false ? '0 — in the mud, served from the water' : share ? fmtInt(share.count) : '–',
      ],
      total: false,
    };
  });
  const c = result.current;
  return [...rows, { cells: ['Total', '', '', fmtSig(c.initialA), fmtSig(c.meanA), fmtSig(c.finalA), fmtInt(result.distribution.distributedCount)], total: true }];
}

/** Where the densities of the zones come from, under the design's method. */
export function densityNote(data: CalculationNoteData): string {
  return `ic: design current density of the zone's area in mA/m², initial / mean / final, by ${DEMAND_METHOD_SOURCES[data.inputs.demandMethod] ?? data.inputs.demandMethod}; "(entered)" marks the engineer's own value. fc: coating breakdown factor. Ic = Ac · fc · ic. Anodes: the governing count shared over the zones by their ${data.result?.distribution.basis ?? 'mean'} demand, each share rounded up.`;
}

export const AGED_COATING_NOTE = 'a includes the coating’s age at the start of the design life: a = a0 + b · age (DNV-RP-B401 (2010) 10.4).';

export const headline = (data: CalculationNoteData, result: StoredDesignResult) =>
  `${result.anodesToFit} anodes of ${designationOf(data)} to fit (at least ${result.anodeCount} by the governing criterion: ${CRITERION_LABELS[result.governingCriterion] ?? result.governingCriterion})`;

/** The three criteria as minimums, then the count to fit. */
export function criteriaRows(result: StoredDesignResult): { cells: Row; total: boolean }[] {
  const row = (label: string, exact: string, n: number, total = false) => ({ cells: [label, exact, fmtInt(n)], total });
  return [
    row('Net anode mass (N·m >= M)', fmt(result.exactCountBy.mass, 2), result.countBy.mass),
    row('Initial current (N·Iai >= Ici)', fmt(result.exactCountBy.initialCurrent, 2), result.countBy.initialCurrent),
    row('Final current (N·Iaf >= Icf)', fmt(result.exactCountBy.finalCurrent, 2), result.countBy.finalCurrent),
    row(`Governing: ${CRITERION_LABELS[result.governingCriterion] ?? result.governingCriterion}`, '', result.anodeCount),
    row('Shared over the zones, each share rounded up', '', result.distribution.distributedCount),
    row('Anodes to fit', '', result.anodesToFit, true),
  ];
}

export function performanceRows(result: StoredDesignResult): Row[] {
  const p = result.perAnode;
  return [
    ['Required net mass M', `${fmt(result.requiredNetMassKg, 1)} kg`],
    ['Driving voltage Ec - Ea', `${fmt(result.drivingVoltageV, 3)} V`],
    ['Resistance formula, initial / end of life', `${RESISTANCE_FORMULA_LABELS[p.initialFormula]} / ${RESISTANCE_FORMULA_LABELS[p.finalFormula]}${RESISTANCE_TREATMENT_WORDS[p.initialTreatment] ?? ''}`],
    ['Resistance, initial / end of life', `${fmtSig(p.initialResistanceOhm, 4)} / ${fmtSig(p.finalResistanceOhm, 4)} Ω`],
    ['Output, initial / end of life', `${fmtSig(p.initialOutputA)} / ${fmtSig(p.finalOutputA)} A${p.ratedOutputUsed ? ' (data sheet)' : ''}`],
    ['Installed net / gross mass', `${fmt(result.installedNetMassKg, 1)} / ${result.installedGrossMassKg !== null ? fmt(result.installedGrossMassKg, 1) : '–'} kg`],
    ['Achieved life', `${fmt(result.achievedLifeYears, 2)} years`],
  ];
}

export const basisRows = (data: CalculationNoteData): Row[] => (data.result?.basis ?? []).map((b) => [b.topic, b.source, FLAG_WORDS[b.flag]]);

/** Warnings from the checks first, then the desk's notices, each with its words. */
export const messages = (data: CalculationNoteData): { kind: 'warning' | 'notice'; text: string }[] => [
  ...(data.result?.warnings ?? []).map((w) => ({ kind: 'warning' as const, text: `Warning: ${w.message}` })),
  ...data.notices.map((n) => ({ kind: 'notice' as const, text: `Note: ${n.message}` })),
];

export const signatureRows = (data: CalculationNoteData): Row[] => data.signatures.map((s) => [s.role, s.name ?? '', s.at ? format(s.at, 'd MMM yyyy HH:mm') : '', '']);
