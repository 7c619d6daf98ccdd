import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import * as L from '@/lib/labels';
import { ROLES } from '@/lib/roles';
import {
  ANODE_ALLOY_VALUES,
  ANODE_MOUNTING_VALUES,
  CLIMATE_VALUES,
  COATING_VALUES,
  CURRENT_DRAIN_VALUES,
  DEMAND_METHOD_VALUES,
  DEPTH_BAND_VALUES,
  HULL_CONDITION_VALUES,
  HULL_MATERIAL_VALUES,
  POTENTIAL_SOURCE_VALUES,
  PROTECTED_METAL_VALUES,
  RESISTIVITY_SOURCE_VALUES,
  WATER_VALUES,
  ZONE_KIND_VALUES,
} from '@/lib/schemas/design';
import { STRUCTURE_TYPES } from '@/lib/schemas/assets';
import { SURVEY_ELECTRODE_VALUES, surveyEditSchema } from '@/lib/schemas/surveys';
import { ASSET_KINDS } from '@/entities/asset.entity';
import { DESIGN_STATUSES } from '@/entities/design.entity';
import { DOCKING_KINDS as STORED_DOCKING_KINDS, DOCKING_STATUSES as STORED_DOCKING_STATUSES } from '@/entities/docking.entity';
import { RENEWAL_REASONS, RENEWAL_STATUSES } from '@/entities/renewal.entity';
import { SURVEY_METHODS as STORED_SURVEY_METHODS } from '@/entities/survey.entity';
import { dockingUpdateSchema } from '@/lib/schemas/planner';
import { anodeModelSchema, zoneSchema } from '@/lib/schemas/register';
import type { DockingStatus, RenewalStatus } from '@/lib/forecast/propose-renewals';
import type { AssetOutlook } from '@/lib/forecast/outlook';
import type { PotentialStatus, RemainingStatus } from '@/lib/surveys/criteria';
import type { Flag, ResistanceFormula } from '@/lib/cp';
import type { ResistanceTreatment } from '@/lib/cp/anode-resistance';
import { anodeListCsv, buildAnodeList, type AnodeListRenewalInput } from '@/lib/anode-list';
import { AnodeListDocument } from '@/components/pdf/anode-list';
import { CalculationNote, type CalculationNoteData } from '@/components/pdf/calculation-note';
import { registerPdfFonts } from '@/components/pdf/pdf-kit';
import { BUILTIN_ANODE_MODELS, designAnodeSystem } from '@/lib/cp';
import { buildDesignInput, deskNotices } from '@/lib/design/build-design-input';
import { underProtectionMail } from '@/lib/server/mail/templates';
import { pdfText } from '@/tests/fixtures/pdf-text';
import { smallInput } from './anode-list/helpers';
import { ferryInputs } from './design/record-fixture';

/**
 * One vocabulary (lib/labels): every value the app stores and shows has a label, and the outputs built
 * from data covering every value (the anode list's CSV and PDF, the calculation note, the e-mail words)
 * show the labels, never the stored keys.
 */

/** The options of a z.enum field of an object schema (through preprocess, nullable and default wrappers). */
function enumOptions(schema: z.ZodObject, key: string): string[] {
  let field = (schema.shape as Record<string, unknown>)[key] as { options?: readonly string[]; def?: Record<string, unknown> } | undefined;
  for (let i = 0; field && !field.options && i < 5; i++) field = (field.def?.out ?? field.def?.innerType) as typeof field;
  if (!field?.options) throw new Error(`${key} is not an enum field`);
  return [...field.options];
}

/** Lists of a TypeScript union's values: tsc refuses the file if one misses a member. */
function all<T extends string>() {
  return <const A extends readonly T[]>(values: A & ([Exclude<T, A[number]>] extends [never] ? unknown : never)) => values;
}
const DOCKING_STATUSES = all<DockingStatus>()(['planned', 'done', 'cancelled']);
const PLAN_STATUSES = all<RenewalStatus>()(['proposed', 'kept', 'no-docking', 'sound']);
const OUTLOOKS = all<AssetOutlook>()(['sound', 'no-anodes', 'renew-at-next-docking', 'overdue', 'over-protected', 'under-protected']);
const POTENTIAL_STATUSES = all<PotentialStatus>()(['under-protected', 'protected', 'over-protected']);
const REMAINING_STATUSES = all<RemainingStatus>()(['sound', 'renew', 'renew-soon']);
const FLAGS = all<Flag>()(['published', 'memory', 'practice']);
const FORMULAS = all<ResistanceFormula>()(['modified-dwight', 'short-slender', 'long-flush', 'mccoy']);
const TREATMENTS = all<ResistanceTreatment>()(['as-given', 'near-flush-slender', 'short-flush-fallback']);

// Every stored enum whose value a user reads, with the map that words it.
const SURVEY_METHODS = enumOptions(surveyEditSchema, 'method');
const DOCKING_KINDS = enumOptions(dockingUpdateSchema, 'kind');
const ZONE_WATER = enumOptions(zoneSchema, 'waterType');
const SHAPE_KINDS = enumOptions(anodeModelSchema, 'shapeKind');
const COVERAGE: [string, readonly string[], Readonly<Record<string, string>>][] = [
  ['asset kind', ASSET_KINDS, L.ASSET_KIND_LABELS],
  ['structure type', STRUCTURE_TYPES, L.STRUCTURE_TYPE_LABELS],
  ['hull material', HULL_MATERIAL_VALUES, L.HULL_MATERIAL_LABELS],
  ['water of an asset or zone', ZONE_WATER, L.WATER_TYPE_LABELS],
  ['water of a design', WATER_VALUES, L.WATER_LABELS],
  ['zone kind', ZONE_KIND_VALUES, L.ZONE_KIND_LABELS],
  ['climate', CLIMATE_VALUES, L.CLIMATE_LABELS],
  ['depth band', DEPTH_BAND_VALUES, L.DEPTH_BAND_LABELS],
  ['coating', COATING_VALUES, L.COATING_LABELS],
  ['demand method', DEMAND_METHOD_VALUES, L.DEMAND_METHOD_LABELS],
  ['hull coating condition', HULL_CONDITION_VALUES, L.HULL_CONDITION_LABELS],
  ['resistivity source', RESISTIVITY_SOURCE_VALUES, L.RESISTIVITY_SOURCE_LABELS],
  ['potential source', POTENTIAL_SOURCE_VALUES, L.POTENTIAL_SOURCE_LABELS],
  ['protected metal', PROTECTED_METAL_VALUES, L.METAL_LABELS],
  ['protected metal in a sentence', PROTECTED_METAL_VALUES, L.METAL_WORDS],
  ['current drain', CURRENT_DRAIN_VALUES, L.CURRENT_DRAIN_LABELS],
  ['alloy', ANODE_ALLOY_VALUES, L.ALLOY_LABELS],
  ['mounting', ANODE_MOUNTING_VALUES, L.MOUNTING_LABELS],
  ['anode shape', SHAPE_KINDS, L.SHAPE_KIND_LABELS],
  ['resistance formula', FORMULAS, L.RESISTANCE_FORMULA_LABELS],
  ['governing criterion', ['mass', 'initial-current', 'final-current'], L.CRITERION_LABELS],
  ['basis flag', FLAGS, L.BASIS_FLAG_WORDS],
  ['design status', DESIGN_STATUSES, L.STATUS_LABELS],
  ['area source', ['entered', 'denny-mumford', 'denny-mumford-default-cb', 'estimate', 'placeholder'], L.AREA_SOURCE_WORDS],
  ['model source', ['built-in', 'organisation'], L.MODEL_SOURCE_LABELS],
  ['survey method', SURVEY_METHODS, L.SURVEY_METHOD_LABELS],
  ['survey method, as stored', STORED_SURVEY_METHODS, L.SURVEY_METHOD_LABELS],
  ['reference electrode', SURVEY_ELECTRODE_VALUES, L.ELECTRODE_LABELS],
  ['reference electrode, short', SURVEY_ELECTRODE_VALUES, L.ELECTRODE_SHORT_LABELS],
  ['potential status', POTENTIAL_STATUSES, L.POTENTIAL_STATUS_LABELS],
  ['remaining-mass status', REMAINING_STATUSES, L.REMAINING_STATUS_LABELS],
  ['docking kind', DOCKING_KINDS, L.DOCKING_KIND_LABELS],
  ['docking kind, as stored', STORED_DOCKING_KINDS, L.DOCKING_KIND_LABELS],
  ['docking status', DOCKING_STATUSES, L.DOCKING_STATUS_LABELS],
  ['docking status, as stored', STORED_DOCKING_STATUSES, L.DOCKING_STATUS_LABELS],
  ['renewal status', RENEWAL_STATUSES, L.RENEWAL_STATUS_LABELS],
  ['renewal reason', RENEWAL_REASONS, L.RENEWAL_REASON_LABELS],
  ['outlook', OUTLOOKS, L.OUTLOOK_WORDS],
  ['role', ROLES, L.ROLE_LABELS],
  ['subscription status', ['trialing', 'active', 'past_due', 'canceled', 'unpaid', 'incomplete', 'incomplete_expired'], L.SUBSCRIPTION_STATUS_LABELS],
  ['invoice status', ['draft', 'open', 'paid', 'void', 'uncollectible'], L.INVOICE_STATUS_LABELS],
];

/** Every stored key of the lists above. */
const STORED_KEYS = new Set(COVERAGE.flatMap(([, values]) => values).concat(TREATMENTS, PLAN_STATUSES));
/** Keys that are ordinary English too ("under-protected", "by ship-hull practice"), so a sentence may use them as words. */
const ENGLISH = new Set(['under-protected', 'over-protected', 'ship-hull']);
/** Keys whose word is the key itself, so "Brindlemoor (vessel)" and "Accepted by (owner)" are words. */
const SAME_AS_WORD = new Set(['vessel', 'structure', 'entered', ...ROLES]);
/** A key written as a key: hyphenated or with an underscore, or an abbreviation nobody says in lower case. */
const KEY_LIKE = [...STORED_KEYS].filter((k) => (/[-_]/.test(k) && /^[a-z0-9+_-]+$/.test(k) && !ENGLISH.has(k)) || ['rov', 'cse', 'sce', 'tsa', 'tsz', 'hdg', 'mccoy', 'trialing', 'canceled'].includes(k));
const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const KEY_TOKEN = new RegExp(`(?<![\\w/-])(${KEY_LIKE.map(escapeRe).join('|')})(?![\\w/-])`, 'g');

/** The stored keys a text shows: key-like tokens anywhere, any key as a whole cell, list item or in brackets after a name. */
function rawKeysIn(text: string): string[] {
  const found = new Set<string>(text.match(KEY_TOKEN) ?? []);
  for (const fragment of text.split(/[\n\r;·•|]|,\s|:\s|\s[–—-]\s/)) {
    const t = fragment.trim();
    if (STORED_KEYS.has(t) && !ENGLISH.has(t) && /^[a-z]/.test(t) && t.length > 2) found.add(t);
    for (const m of t.matchAll(/\(([a-z][a-z0-9_-]*)\)/g)) if (STORED_KEYS.has(m[1]!) && !SAME_AS_WORD.has(m[1]!)) found.add(m[1]!);
  }
  return [...found];
}

describe('every stored value has a label', () => {
  it.each(COVERAGE)('%s', (_name, values, labels) => {
    expect(values.length).toBeGreaterThan(0);
    const missing = values.filter((v) => !labels[v]?.trim());
    expect(missing).toEqual([]);
    // A label is words, not the key again (e.g. 'al-zn-in' is printed 'Al-Zn-In'), except where empty means "nothing to add".
    if (!_name.endsWith('in a sentence')) expect(values.filter((v) => labels[v] === v && /[-_]|^[a-z]/.test(v) && !/^(entered|published)$/.test(v))).toEqual([]);
  });

  it('the treatments of an anode between two formulas all have words', () => {
    expect(TREATMENTS.filter((t) => L.RESISTANCE_TREATMENT_WORDS[t] === undefined)).toEqual([]);
  });

  it('finds a raw key when one is shown (the detector itself)', () => {
    expect(rawKeysIn('Brindlemoor: rov survey of 3 Sep 2025')).toEqual(['rov']);
    expect(rawKeysIn('Brindlemoor (practice) · Hull bottom')).toEqual(['practice']);
    expect(rawKeysIn('Brindlemoor (vessel) · Hull bottom')).toEqual([]);
    expect(rawKeysIn('seawater, temperate')).toEqual(['seawater', 'temperate']);
    expect(rawKeysIn('Zone,Group\r\nHull,al-zn-in')).toEqual(['al-zn-in']);
    expect(rawKeysIn('The criterion for high-strength-steel')).toEqual(['high-strength-steel']);
    expect(rawKeysIn('Seawater, temperate (7–11 °C) · Al-Zn-In · 2 readings under-protected')).toEqual([]);
  });
});

describe('the words follow the asset: a vessel docks at a yard, a structure has campaigns by a contractor', () => {
  it('never docks a structure', () => {
    const s = L.eventWords('structure');
    expect([s.event, s.events, s.place, s.verb].join(' ')).not.toMatch(/dock|yard/i);
    expect(L.eventWords('vessel')).toMatchObject({ event: 'docking', place: 'yard' });
    expect(L.renewalRuleSentence({ marginMonths: 6, thresholdPercent: 25 }, 'structure')).not.toMatch(/dock/i);
    expect(L.renewalMarginSentence(6, 'structure')).not.toMatch(/dock/i);
    for (const status of PLAN_STATUSES) expect(L.renewalPlanWords({ status, dockingDate: '2027-02-10', deadline: '2027-03-01', earlierDockingBy: '2026-12-02', overdue: true }, 'structure')).not.toMatch(/dock/i);
    expect(L.dockingKindOptions('structure').map((o) => o.value)).toEqual(['campaign']);
    expect(L.dockingKindOptions('vessel').map((o) => o.value)).not.toContain('campaign');
  });

  it('names the renewal-survey docking one way', () => {
    expect(L.dockingKindWords('renewal-survey')).toBe('Renewal survey docking');
  });
});

// Data covering every alloy, mounting and renewal status, for a vessel's docking and a structure's campaign.
function everyValueRenewals(): AnodeListRenewalInput[] {
  const statuses = ['proposed', 'confirmed', 'ordered', 'fitted'] as const;
  return ANODE_ALLOY_VALUES.flatMap((alloy, i) =>
    ANODE_MOUNTING_VALUES.map((mounting, j) => ({
      zone: j % 2 ? 'Hull bottom' : null,
      groupLabel: `G${i}-${j}`,
      designation: `TW-TEST-${i}${j}`,
      alloy,
      mounting,
      quantity: 2,
      netMassKg: 5,
      grossMassKg: 6,
      positions: null,
      reason: 'forecast depletion',
      status: statuses[(i + j) % statuses.length]!,
    })),
  );
}

describe('no raw key in the outputs', () => {
  const lists = (['vessel', 'structure'] as const).flatMap((kind) =>
    DOCKING_KINDS.filter((k) => (kind === 'structure') === (k === 'campaign')).map((dockingKind) =>
      buildAnodeList(smallInput({ asset: { name: 'Invented Asset', kind, particulars: [['Type', 'Invented']] }, docking: { ...smallInput().docking, kind: dockingKind }, renewals: everyValueRenewals() })),
    ),
  );

  it('the anode-list CSV, for every docking kind, alloy, mounting and status', () => {
    expect(lists.length).toBe(DOCKING_KINDS.length);
    for (const list of lists) expect(rawKeysIn(anodeListCsv(list))).toEqual([]);
  });

  it('the anode-list PDF', async () => {
    registerPdfFonts();
    for (const list of [lists[0]!, lists.at(-1)!]) {
      const bytes = await renderToBuffer(createElement(AnodeListDocument, { list, pagination: 'planned' }) as unknown as ReactElement<DocumentProps>);
      const text = (await pdfText(bytes)).replace(/[ \t]+/g, ' ');
      expect(text).toContain(list.words.title);
      expect(rawKeysIn(text)).toEqual([]);
    }
  }, 60_000);

  it('the calculation note of a structure, with every zone kind, coating and a bare current drain', async () => {
    const base = ferryInputs();
    const surfaces = ZONE_KIND_VALUES.map((kind, i) => ({
      ...base.surfaces[0]!,
      name: `Zone ${i + 1}`,
      kind,
      coatingCategory: COATING_VALUES[i % 3]!,
      drainsCurrent: i === 3 ? ('copper-alloy' as const) : null,
    }));
    const inputs = { ...base, surfaces, protectedMetal: 'high-strength-steel' as const };
    const model = { ...BUILTIN_ANODE_MODELS.find((m) => m.id === 'TW-AW-4020')!, key: 'builtin:TW-AW-4020', source: 'built-in' as const };
    const data: CalculationNoteData = {
      organisation: 'Invented Harbour Board',
      asset: { name: 'Invented Jetty', kind: 'structure', particulars: [['Structure', 'Invented Jetty, jetty']] },
      design: { title: 'Pile anodes', revision: 1, status: 'draft', appVersion: '0.1.0', basedOnRevision: null },
      inputs,
      model,
      source: 'recomputed',
      result: designAnodeSystem(buildDesignInput(inputs, model)),
      resultError: null,
      notices: deskNotices(inputs),
      signatures: [{ role: 'Prepared', name: 'Ada Rennick', at: new Date(Date.UTC(2026, 0, 5, 9)) }],
      printedAt: new Date(Date.UTC(2026, 0, 7, 9)),
      printedBy: 'Viewer Person',
    };
    registerPdfFonts();
    const bytes = await renderToBuffer(createElement(CalculationNote, { data, pagination: 'planned' }) as unknown as ReactElement<DocumentProps>);
    const text = (await pdfText(bytes)).replace(/[ \t]+/g, ' ');
    expect(text).toContain('Invented Jetty');
    expect(rawKeysIn(text)).toEqual([]);
    expect(text).not.toMatch(/\d C\b/); // temperatures with the degree sign
  }, 60_000);

  it('the e-mail words: survey names, electrodes, renewal statuses', () => {
    for (const method of SURVEY_METHODS) {
      const mail = underProtectionMail('Invented Jetty', `${L.surveyInSentence(method)} of 3 Sep 2025`, [{ location: 'P1', value: `+0.200 V against ${L.electrodeWords('zinc')}` }], 'http://127.0.0.1/x');
      expect(rawKeysIn(`${mail.subject}\n${mail.text}`)).toEqual([]);
    }
    for (const e of SURVEY_ELECTRODE_VALUES) expect(rawKeysIn(`against ${L.electrodeWords(e)}`)).toEqual([]);
    for (const s of RENEWAL_STATUSES) expect(rawKeysIn(`- G1: 2 × TW-1 (${L.statusWords(s)})`)).toEqual([]);
  });
});
