// Hostile input at every entry point: every exported method of every route.ts under app/api/orgs and
// every server action of every actions.ts, found by walking the app (a new entry point is covered without
// being listed). fast-check mixes plausible values (real ids of the organisation, real dates) with hostile
// ones (NUL bytes, lone surrogates, control characters, huge strings, impossible dates, non-UUIDs, wrong
// types, nested junk) and asserts that nothing answers 5xx or throws, and that a refusal writes no row.
import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import { addDays } from 'date-fns';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal } from '@/lib/server/services/planner/renewals';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { createAnodeModel } from '@/lib/server/services/catalogue/manage-anode-models';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { addSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { deleteSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { ctxFor, makeOrgWithRoles, runAs, uniqueEmail } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { HTTP_METHODS, ROOT, databaseFingerprint, filesNamed, importFile, signInAs, CALCULATION, PNG_HEADER as PNG } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

const INTERNAL = 'Something went wrong on our side; nothing was changed. Please try again.';
const RUNS = 8;
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);

let home: { organisation: Organisation; users: Record<Role, User> };
const ids: Record<string, any> = {};

const vessel = { kind: 'vessel', name: 'Probe Boat', hullMaterial: 'steel', lengthBppM: '60', beamM: '12', draughtM: '3.5', blockCoefficient: '0.6', notes: 'Probe' };
const zone = { name: 'Probe zone', kind: 'hull-bottom', areaM2: '120', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
const model = { designation: 'PROBE-2', alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: '0.3', widthM: '0.15', thicknessM: '0.03', exposedAreaM2: '0.06', netMassKg: '8', grossMassKg: '8.5', notes: 'Probe' };
const password = 'brass-rudder-stock-7';

/**
 * A plausible form for each action (real ids of the organisation, real dates): the property replaces one or
 * two of its fields with hostile values, so the checks behind the first one are reached too. An action that
 * is not listed is sent an empty form with hostile fields, and the test below names it.
 */
function plausibleForm(action: string): Record<string, string> | undefined {
  const forms: Record<string, Record<string, string>> = {
    createAssetAction: vessel,
    updateAssetAction: { ...vessel, assetId: ids.assetId, name: 'Probe Vessel' },
    archiveAssetAction: { assetId: ids.spareAssetId, archive: '1' },
    createZoneAction: { ...zone, assetId: ids.assetId },
    updateZoneAction: { ...zone, zoneId: ids.zoneId },
    archiveZoneAction: { zoneId: ids.spareZoneId, assetId: ids.assetId },
    restoreZoneAction: { zoneId: ids.spareZoneId },
    createAnodeGroupAction: { assetId: ids.assetId, label: 'Probe hull', anodeModelKey: 'builtin:TW-AW-4020', quantity: '4', installedOn: day(-100), positions: 'Frames 10-20', notes: 'Probe' },
    updateAnodeGroupAction: { groupId: ids.groupId, label: 'Probe bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: '10', installedOn: day(-365) },
    removeAnodeGroupAction: { groupId: ids.spareGroupId, removedOn: day(-1), reason: 'Lost in a grounding' },
    restoreAnodeGroupAction: { groupId: ids.spareGroupId },
    createDesignAction: { assetId: ids.assetId, title: 'Probe desk design' },
    checkDesignAction: { designId: ids.designId },
    approveDesignAction: { designId: ids.designId },
    newRevisionAction: { designId: ids.designId },
    fitDesignAction: { designId: ids.designId, fittedOn: day(-2) },
    bookDesignRenewalsAction: { designId: ids.designId, dockingId: ids.dockingId },
    createAnodeModelAction: model,
    archiveAnodeModelAction: { modelId: ids.modelId, archive: '1' },
    createSurveyAction: { assetId: ids.assetId, surveyedOn: day(-3), method: 'diver', surveyor: 'Harbour Divers', defaultElectrode: 'ag-agcl-seawater', notes: 'Probe' },
    addReadingAction: { surveyId: ids.surveyId, location: 'Fr 20 P', potentialV: '-0.95', electrode: 'ag-agcl-seawater', anodeGroupLabel: 'Probe bottom', comment: 'Probe' },
    updateReadingAction: { surveyId: ids.surveyId, readingId: ids.readingId, location: 'Fr 10 P', potentialV: '-0.97', electrode: 'ag-agcl-seawater', remainingPercent: '70', comment: 'Probe' },
    deleteReadingAction: { surveyId: ids.surveyId, readingId: ids.spareReadingId },
    restoreReadingAction: { surveyId: ids.surveyId, readingId: ids.spareReadingId },
    updateSurveyAction: { surveyId: ids.surveyId, surveyedOn: day(-11), method: 'rov', surveyor: 'Probe Divers', defaultElectrode: 'ag-agcl-seawater', notes: 'Probe' },
    deleteSurveyAction: { surveyId: ids.spareSurveyId },
    restoreSurveyAction: { surveyId: ids.binnedSurveyId },
    undoDeleteSurveyAction: { surveyId: ids.binnedSurveyId },
    updateAttachmentAction: { surveyId: ids.surveyId, attachmentId: ids.attachmentId, caption: 'Probe caption' },
    deleteAttachmentAction: { surveyId: ids.surveyId, attachmentId: ids.spareAttachmentId },
    restoreAttachmentAction: { surveyId: ids.surveyId, attachmentId: ids.spareAttachmentId },
    createDockingAction: { assetId: ids.assetId, kind: 'intermediate', plannedStart: day(400), plannedEnd: day(410), yard: 'North Yard', reference: 'P-1', notes: 'Probe' },
    updateDockingAction: { dockingId: ids.dockingId, kind: 'intermediate', status: 'planned', plannedStart: day(300), yard: 'South Yard' },
    renewalStepAction: { renewalId: ids.renewalId, step: 'update', quantity: '8', dockingId: ids.dockingId, notes: 'Probe', fittedOn: day(0) },
    addRenewalAction: { dockingId: ids.dockingId, groupId: ids.groupId, reason: 'damage', quantity: '3', notes: 'Probe' },
    inviteMemberAction: { email: 'probe-invitee@test.example', role: 'planner' },
    changeMemberRoleAction: { membershipId: ids.membershipId, role: 'inspector' },
    removeMemberAction: { membershipId: ids.membershipId },
    restoreMemberAction: { membershipId: ids.membershipId },
    revokeInvitationAction: { invitationId: ids.invitationId },
    updateSettingsAction: { name: 'Probe Harbour', renewalMarginMonths: '6', renewalThresholdPercent: '25', fittingRatePerKg: '12', currency: 'EUR' },
    checkoutAction: { plan: 'armada' },
    portalAction: {},
    cancelAction: { cancel: '1' },
    signUpAction: { name: 'Probe Person', email: 'probe-signup@test.example', password },
    signInAction: { email: home.users.viewer.email, password: 'not-the-password-1', next: '/orgs' },
    verifyEmailAction: { token: 'x'.repeat(43) },
    requestResetAction: { email: 'probe-reset@test.example' },
    resetPasswordAction: { token: 'y'.repeat(43), password },
    acceptInvitationAction: { token: 'z'.repeat(43) },
    acceptInvitationNewUserAction: { token: 'z'.repeat(43), name: 'Probe Newcomer', password },
    createOrganisationAction: { name: 'Probe Works' },
    resendVerificationAction: {},
    signOutAction: {},
    changePasswordAction: { currentPassword: 'not-the-password-1', password },
  };
  return forms[action];
}

const HOSTILE_STRINGS = [
  '\u0000',
  'Probe\u0000name',
  '%00',
  'half \uD800 emoji',
  '\uDC00',
  'bell \u0007 and escape \u001B',
  'two\nlines',
  '2026-02-30',
  '2026-13-01',
  '0000-00-00',
  '99999-01-01',
  '2026-2-3',
  'not-a-uuid',
  'zone-1',
  '00000000-0000-0000-0000-00000000000g',
  '00000000-0000-0000-0000-000000000000',
  "'; drop table asset; --",
  "-2+3+cmd|' /C calc'!A0",
  '',
  ' ',
  'NaN',
  'Infinity',
  '-1e309',
  '1e-400',
  '\u202Eevil',
  'x'.repeat(20_000),
];

const hostileString = fc.oneof(
  { weight: 5, arbitrary: fc.constantFrom(...HOSTILE_STRINGS) },
  { weight: 1, arbitrary: fc.string({ unit: fc.integer({ min: 0, max: 0xffff }).map((c) => String.fromCharCode(c)), maxLength: 12 }) },
  { weight: 1, arbitrary: fc.uuid() },
);
/** What a JSON body may hold besides strings: wrong types and nested junk. */
const hostileJson: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileString },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, 0, -1, 1e308, -0, 3.5, [], {}, { $ne: null }, ['a', 'b']) },
  { weight: 1, arbitrary: fc.anything({ maxDepth: 2, maxKeys: 4 }) },
);

/** A plausible object with one or two of its keys (or one new key) replaced by hostile values. */
function spoilt<T>(base: Record<string, unknown>, bad: fc.Arbitrary<T>): fc.Arbitrary<Record<string, unknown>> {
  const keys = [...Object.keys(base), 'unexpected'];
  return fc
    .array(fc.tuple(fc.constantFrom(...keys), bad), { minLength: 1, maxLength: 2 })
    .map((changes) => ({ ...base, ...Object.fromEntries(changes) }));
}

function formDataOf(input: Record<string, unknown>): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) if (value !== undefined) form.set(key, String(value));
  // Forward-compatible with the idempotency keys every write will carry.
  form.set('idempotencyKey', randomUUID());
  return form;
}

/** The design desk's JSON actions: the stored inputs with one value spoilt, or junk in their place. */
function deskArbitrary(): fc.Arbitrary<unknown> {
  const inputs = ids.deskInputs as unknown as Record<string, unknown>;
  const surface = (inputs.surfaces as Record<string, unknown>[])[0];
  return fc.oneof(
    spoilt({ designId: ids.designId, title: 'Probe saved design', inputs }, hostileJson),
    spoilt(inputs, hostileJson).map((i) => ({ designId: ids.designId, title: 'Probe saved design', inputs: i })),
    spoilt(surface, hostileJson).map((s) => ({ designId: ids.designId, title: 'Probe saved design', inputs: { ...inputs, surfaces: [s] } })),
    hostileJson,
  );
}

/** Every action declared in an actions.ts: its wrapper kind read from the source. */
async function allActions() {
  const found: { file: string; name: string; kind: 'orgAction' | 'orgJsonAction' | 'publicAction' | 'plain' }[] = [];
  for (const file of await filesNamed('app', 'actions.ts')) {
    const source = await readFile(path.join(ROOT, file), 'utf8');
    for (const [, name, kind] of source.matchAll(/^export const (\w+) = (orgAction|orgJsonAction|publicAction)\(/gm)) found.push({ file, name, kind: kind as never });
    for (const [, name] of source.matchAll(/^export async function (\w+)\(/gm)) found.push({ file, name, kind: 'plain' });
  }
  return found;
}

/**
 * Refused ⇒ nothing written. A refused sign-in records the attempt (and a lock in the audit log) through a
 * connection of its own on purpose, so the throttle counts it although the request rolls back.
 */
async function expectNoWrites(before: Record<string, string>, label: string) {
  const after = await databaseFingerprint();
  const ignore = label === 'signInAction' ? { sign_in_attempt: '', audit_event: '' } : {};
  expect({ ...after, ...ignore }, `${label}: a refusal writes nothing`).toEqual({ ...before, ...ignore });
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Probe Harbour');
  const as = async (role: Role) => ctxFor(await getEm(), home.organisation, home.users[role]);
  const vessel = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Probe Vessel', hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
  const zone = await runAs(as('engineer'), (c) => createZone(c, vessel.id, { name: 'Probe zone', kind: 'hull-bottom', areaM2: 120, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }));
  const group = await runAs(as('engineer'), (c) => createAnodeGroup(c, vessel.id, { label: 'Probe bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
  const design = await runAs(as('engineer'), (c) => createDesign(c, { assetId: vessel.id }));
  const docking = await runAs(as('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(200) }));
  const renewal = await runAs(as('planner'), (c) => addRenewal(c, docking.id, { groupId: group.id, reason: 'damage' }));
  const survey = await runAs(as('inspector'), (c) => createSurvey(c, { assetId: vessel.id, surveyedOn: day(-10), method: 'diver', defaultElectrode: 'ag-agcl-seawater' }));
  const model = await runAs(as('engineer'), (c) =>
    createAnodeModel(c, { designation: 'PROBE-1', alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: 0.3, widthM: 0.15, thicknessM: 0.03, exposedAreaM2: 0.06, netMassKg: 8, grossMassKg: 8.5 }),
  );
  const invitation = await runAs(as('owner'), (c) => inviteMember(c, { email: uniqueEmail('probe-invitee'), role: 'viewer' }));
  const spareAsset = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Probe Spare', hullMaterial: 'steel' }));
  const spareZone = await runAs(as('engineer'), (c) => createZone(c, vessel.id, { name: 'Probe spare zone', kind: 'hull-bottom', areaM2: 50, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }));
  const spareGroup = await runAs(as('engineer'), (c) => createAnodeGroup(c, vessel.id, { label: 'Probe spare group', anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: day(-100) }));
  const attachment = await runAs(as('inspector'), (c) => addSurveyAttachment(c, survey.id, { name: 'bow.png', bytes: PNG }, 'Bow'));
  const spareAttachment = await runAs(as('inspector'), (c) => addSurveyAttachment(c, survey.id, { name: 'stern.png', bytes: PNG }, 'Stern'));
  await runAs(as('inspector'), (c) => addReading(c, survey.id, { location: 'Fr 10 P', potentialV: '-0.98', electrode: 'ag-agcl-seawater' }));
  await runAs(as('inspector'), (c) => addReading(c, survey.id, { location: 'Fr 12 S', potentialV: '-0.99', electrode: 'ag-agcl-seawater' }));
  const spareSurvey = await runAs(as('inspector'), (c) => createSurvey(c, { assetId: vessel.id, surveyedOn: day(-20), method: 'diver', defaultElectrode: 'ag-agcl-seawater' }));
  const binnedSurvey = await runAs(as('inspector'), (c) => createSurvey(c, { assetId: vessel.id, surveyedOn: day(-30), method: 'rov', defaultElectrode: 'ag-agcl-seawater' }));
  await runAs(as('inspector'), (c) => deleteSurvey(c, binnedSurvey.id));
  const em = await getEm();
  const [stored] = await em.execute<{ inputs: unknown }[]>('select inputs from design where id = ?', [design.id]);
  const [membership] = await em.execute<{ id: string }[]>(`select id from membership where organisation_id = ? and role = 'viewer'`, [home.organisation.id]);
  const readingId = async (location: string) => (await em.execute<{ id: string }[]>('select id from survey_reading where survey_id = ? and location = ?', [survey.id, location]))[0]!.id;
  Object.assign(ids, {
    assetId: vessel.id,
    zoneId: zone.id,
    groupId: group.id,
    designId: design.id,
    dockingId: docking.id,
    renewalId: renewal.id,
    surveyId: survey.id,
    modelId: model.id,
    membershipId: membership.id,
    invitationId: invitation.invitation.id,
    attachmentId: attachment.id,
    spareAttachmentId: spareAttachment.id,
    readingId: await readingId('Fr 10 P'),
    spareReadingId: await readingId('Fr 12 S'),
    spareSurveyId: spareSurvey.id,
    binnedSurveyId: binnedSurvey.id,
    spareAssetId: spareAsset.id,
    spareZoneId: spareZone.id,
    spareGroupId: spareGroup.id,
    deskInputs: stored.inputs,
  });
});
afterAll(async () => (await getOrm()).close(true));

describe('hostile input to every server action: no 5xx, no throw, nothing written on refusal', async () => {
  const actions = await allActions();
  it('finds the actions', () => expect(actions.length).toBeGreaterThan(30));

  for (const action of actions) {
    it(`${action.file}: ${action.name}`, { timeout: 120_000 }, async () => {
      const fn = (await importFile(action.file))[action.name] as (...args: unknown[]) => Promise<unknown>;
      const base = plausibleForm(action.name);
      expect(base ?? action.kind === 'orgJsonAction', `${action.name} has a plausible form in this test`).toBeTruthy();
      const input = action.kind === 'orgJsonAction' ? deskArbitrary() : spoilt(base ?? {}, hostileString);
      await fc.assert(
        fc.asyncProperty(input, fc.constantFrom<'owner' | 'none'>('owner', 'owner', 'none'), async (value, who) => {
          await signInAs(who === 'owner' ? home.users.owner : null);
          const before = await databaseFingerprint();
          let result: unknown;
          try {
            if (action.kind === 'orgAction') result = await fn(home.organisation.slug, { ok: false }, formDataOf(value as never));
            else if (action.kind === 'orgJsonAction') result = await fn(home.organisation.slug, value && typeof value === 'object' ? { idempotencyKey: randomUUID(), ...value } : value);
            else if (action.kind === 'publicAction') result = await fn({ ok: false }, formDataOf(value as never));
            else result = await fn();
          } catch (error) {
            if (isRedirectError(error)) return; // navigated: it succeeded
            throw error;
          }
          const state = result as { ok?: boolean; message?: string } | undefined;
          expect(state?.message, JSON.stringify(value)?.slice(0, 300)).not.toBe(INTERNAL);
          if (state && state.ok === false) await expectNoWrites(before, action.name);
        }),
        { numRuns: RUNS, endOnFailure: true },
      );
    });
  }
});

type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;


interface Body {
  type: string;
  body: string | { caption: string; name: string; bytes: Uint8Array };
}

/** A request body for a route: its plausible body with a value spoilt, malformed JSON, or junk. */
function bodyArbitrary(route: string): fc.Arbitrary<Body> {
  const json = (base: Record<string, unknown>) => spoilt(base, hostileJson).map((v) => ({ type: 'application/json', body: JSON.stringify(v) }));
  const malformed = fc.constantFrom('{"name":', '\u0000', '[[[[[[[[[[', 'null', '"x"', '{"name":"\\u0000"}', '{"name":"\\ud800"}').map((body) => ({ type: 'application/json', body }));
  const plausible: Record<string, fc.Arbitrary<Body>> = {
    designs: json({ assetId: ids.assetId, title: 'Probe revision' }),
    assets: json({ kind: 'vessel', name: 'Probe JSON boat', hullMaterial: 'steel', lengthBppM: 60, notes: 'Probe' }),
    calculations: fc.oneof(json(CALCULATION), spoilt(CALCULATION.surfaces[0], hostileJson).map((s) => ({ type: 'application/json', body: JSON.stringify({ ...CALCULATION, surfaces: [s] }) }))),
    surveys: fc.oneof(
      json({ assetId: ids.assetId, surveyedOn: day(-1), method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater', surveyor: 'Probe', readings: [{ location: 'Stern', potentialV: -0.98, electrode: 'ag-agcl-seawater' }] }),
      spoilt({ location: 'Stern', potentialV: -0.98, electrode: 'ag-agcl-seawater', comment: 'Probe' }, hostileJson).map((r) => ({
        type: 'application/json',
        body: JSON.stringify({ assetId: ids.assetId, surveyedOn: day(-1), method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater', readings: [r] }),
      })),
    ),
    'surveys/[surveyId]/readings': fc
      .tuple(hostileString, fc.integer({ min: 0, max: 5 }))
      .map(([bad, column]) => {
        const row = ['Fr 20 P', '-0.97', 'ag-agcl-seawater', 'Probe bottom', '70%', 'Probe'];
        row[column] = `"${bad.replaceAll('"', '""')}"`;
        return { type: 'text/csv', body: `location,potential_v,electrode,anode_group,remaining,comment\n${row.join(',')}\n` };
      }),
    'surveys/[surveyId]/attachments': fc
      .tuple(hostileString, hostileString, fc.boolean())
      .map(([caption, name, spoilName]) => ({ type: 'multipart', body: { caption, name: spoilName ? name : 'probe.png', bytes: PNG } })),
  };
  return fc.oneof({ weight: 4, arbitrary: plausible[route] ?? json({}) }, { weight: 1, arbitrary: malformed });
}

describe('hostile input to every organisation route: no 5xx, nothing written on refusal', async () => {
  const routes: { file: string; path: string; method: (typeof HTTP_METHODS)[number] }[] = [];
  for (const file of await filesNamed('app/api/orgs', 'route.ts')) {
    const mod = await importFile(file);
    for (const method of HTTP_METHODS) if (typeof mod[method] === 'function') routes.push({ file, method, path: file.replace(/^app\/api\/orgs\/\[org\]\//, '').replace(/\/route\.ts$/, '') });
  }
  it('finds the routes', () => expect(routes.length).toBeGreaterThan(15));

  for (const route of routes) {
    it(`${route.method} ${route.path}`, { timeout: 120_000 }, async () => {
      const handler = (await importFile(route.file))[route.method] as Handler;
      const names = [...route.path.matchAll(/\[(\w+)\]/g)].map(([, name]) => name);
      const realParams = Object.fromEntries(names.map((n) => [n, ids[n] as string]));
      const params = names.length ? fc.oneof(fc.constant(realParams), spoilt(realParams, hostileString)) : fc.constant({});
      const query = fc.oneof(fc.constant({}), spoilt({ q: 'Probe', sort: 'name', dir: 'asc', page: '1', pageSize: '50', archived: '0', assetId: ids.assetId, defaultElectrode: 'cse' }, hostileString));
      await fc.assert(
        fc.asyncProperty(params, query, bodyArbitrary(route.path), fc.constantFrom('slug', 'slug', 'slug', '\u0000', 'x'.repeat(5000), '\uD800'), async (p, q, b, slugKind) => {
          await signInAs(home.users.owner);
          const slug = slugKind === 'slug' ? home.organisation.slug : slugKind;
          // The handler takes its params from the second argument (as Next decodes them); the URL only carries the query.
          const url = new URL(`http://127.0.0.1/api/orgs/probe/${route.path}`);
          for (const [k, v] of Object.entries(q)) url.searchParams.set(k, String(v));
          const headers: Record<string, string> = { origin: 'http://127.0.0.1', 'sec-fetch-site': 'same-origin', 'idempotency-key': randomUUID() };
          let body: BodyInit | undefined;
          if (route.method !== 'GET') {
            if (typeof b.body !== 'string') {
              const form = new FormData();
              form.set('file', new File([new Uint8Array(b.body.bytes)], b.body.name, { type: 'image/png' }));
              form.set('caption', b.body.caption);
              body = form;
            } else {
              body = b.body;
              headers['content-type'] = b.type;
            }
          }
          const before = await databaseFingerprint();
          const res = await handler(new NextRequest(url, { method: route.method, headers, body }), { params: Promise.resolve({ org: slug, ...(p as Record<string, string>) }) });
          const text = await res.text();
          expect(res.status, `${url.pathname}${url.search} ${text.slice(0, 200)}`).toBeLessThan(500);
          if (res.status >= 400) await expectNoWrites(before, `${route.method} ${route.path}`);
        }),
        { numRuns: RUNS * 2, endOnFailure: true },
      );
    });
  }
});
