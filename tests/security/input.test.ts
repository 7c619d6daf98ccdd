// Bad input is refused with a clear message and writes nothing: the cases a probe of a running
// instance answered with 500s (NUL bytes in text fields and queries, impossible dates, ids that are not
// UUIDs, lone surrogates in names). Each is sent the way the browser or the client code sends it.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import { addDays } from 'date-fns';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createZone } from '@/lib/server/services/register/zones';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { BROKEN_CHARACTER_MESSAGE, CONTROL_CHARACTER_MESSAGE } from '@/lib/schemas/text';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { databaseFingerprint, signInAs } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

const INTERNAL = 'Something went wrong on our side; nothing was changed. Please try again.';
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
const zoneFields = { kind: 'hull-bottom', areaM2: '120', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };

let home: { organisation: Organisation; users: Record<Role, User> };
const ids: Record<string, string> = {};

interface State {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
}
type FormAction = (slug: string, previous: State, form: FormData) => Promise<State>;

function formDataOf(input: Record<string, string>) {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) form.set(key, value);
  form.set('idempotencyKey', randomUUID());
  return form;
}

/** Runs a form action as the owner (who may do everything) and checks that nothing at all was written. */
async function refusedForm(load: () => Promise<Record<string, unknown>>, name: string, input: Record<string, string>): Promise<State> {
  await signInAs(home.users.owner);
  const action = (await load())[name] as FormAction;
  const before = await databaseFingerprint();
  const state = await action(home.organisation.slug, { ok: false }, formDataOf(input));
  expect(await databaseFingerprint(), 'nothing written').toEqual(before);
  expect(state.ok).toBe(false);
  expect(state.message).not.toBe(INTERNAL);
  return state;
}

type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler as the engineer; params as Next decodes them from the path. */
async function refusedRoute(load: () => Promise<Record<string, unknown>>, method: string, { params = {}, search = '', body, slug }: { params?: Record<string, string>; search?: string; body?: unknown; slug?: string } = {}) {
  await signInAs(home.users.engineer);
  const handler = (await load())[method] as Handler;
  const headers: Record<string, string> = { origin: 'http://127.0.0.1', 'sec-fetch-site': 'same-origin', 'idempotency-key': randomUUID() };
  if (body !== undefined) headers['content-type'] = 'application/json';
  const req = new NextRequest(`http://127.0.0.1/api/orgs/probe/route${search}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
  const before = await databaseFingerprint();
  const res = await handler(req, { params: Promise.resolve({ org: slug ?? home.organisation.slug, ...params }) });
  expect(await databaseFingerprint(), 'nothing written').toEqual(before);
  return { status: res.status, body: await res.json() };
}

const assetActions = () => import('@/app/o/[org]/assets/actions');
const dockingActions = () => import('@/app/o/[org]/dockings/actions');
const surveyActions = () => import('@/app/o/[org]/surveys/actions');
const assetsRoute = () => import('@/app/api/orgs/[org]/assets/route');
const surveysRoute = () => import('@/app/api/orgs/[org]/surveys/route');

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Input Harbour');
  const as = async (role: Role) => ctxFor(await getEm(), home.organisation, home.users[role]);
  ids.vessel = (await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Input Vessel', hullMaterial: 'steel' }))).id;
  ids.zone = (await runAs(as('engineer'), (c) => createZone(c, ids.vessel, { ...zoneFields, areaM2: 120, name: 'Input zone' }))).id;
  ids.survey = (await runAs(as('inspector'), (c) => createSurvey(c, { assetId: ids.vessel, surveyedOn: day(-5), method: 'diver', defaultElectrode: 'ag-agcl-seawater' }))).id;
});
afterAll(async () => (await getOrm()).close(true));

describe('a NUL byte', () => {
  it('in a text field of a form: the field is named, nothing written', async () => {
    const state = await refusedForm(assetActions, 'createAssetAction', { kind: 'vessel', name: 'Nul\u0000Boat', hullMaterial: 'steel' });
    expect(state.fieldErrors).toEqual({ name: [CONTROL_CHARACTER_MESSAGE] });
  });

  it('in the notes of a docking and of a survey reading', async () => {
    const docking = await refusedForm(dockingActions, 'createDockingAction', { assetId: ids.vessel, kind: 'intermediate', plannedStart: day(100), notes: 'Bring \u0000 anodes' });
    expect(docking.fieldErrors).toEqual({ notes: [CONTROL_CHARACTER_MESSAGE] });
    const reading = await refusedForm(surveyActions, 'addReadingAction', { surveyId: ids.survey, location: 'Fr 20 P', potentialV: '-0.95', electrode: 'ag-agcl-seawater', comment: 'pitted\u0000' });
    expect(reading.fieldErrors).toEqual({ comment: [CONTROL_CHARACTER_MESSAGE] });
  });

  it('in a JSON body: 422 naming the field', async () => {
    const res = await refusedRoute(assetsRoute, 'POST', { body: { kind: 'vessel', name: 'Json\u0000Boat', hullMaterial: 'steel' } });
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors).toEqual({ name: [CONTROL_CHARACTER_MESSAGE] });
  });

  it('in a query string: 422 naming the parameter', async () => {
    const res = await refusedRoute(assetsRoute, 'GET', { search: '?q=%00' });
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors).toEqual({ q: [CONTROL_CHARACTER_MESSAGE] });
  });

  it('in the organisation of the address: 404, as for any organisation that does not exist', async () => {
    const res = await refusedRoute(assetsRoute, 'GET', { slug: 'input\u0000harbour' });
    expect(res.status).toBe(404);
  });
});

describe('a lone surrogate (half of an emoji)', () => {
  it('in a name sent by the client code (a JSON action): the field is named, nothing written', async () => {
    // A form cannot carry one (FormData and multipart decoding replace it), JSON can: "\ud83d" is valid JSON.
    const design = await runAs(ctxFor(await getEm(), home.organisation, home.users.engineer), (c) => createDesign(c, { assetId: ids.vessel }));
    const [stored] = await (await getEm()).execute<{ inputs: unknown }[]>('select inputs from design where id = ?', [design.id]);
    const input = JSON.parse(`{"designId":"${design.id}","idempotencyKey":"${randomUUID()}","title":"Design \\ud83d"}`) as Record<string, unknown>;
    expect(input.title).toBe('Design \uD83D');
    await signInAs(home.users.engineer);
    const { saveDesignAction } = await import('@/app/o/[org]/designs/actions');
    const before = await databaseFingerprint();
    const result = await saveDesignAction(home.organisation.slug, { ...input, inputs: stored.inputs });
    expect(await databaseFingerprint(), 'nothing written').toEqual(before);
    expect(result).toMatchObject({ ok: false, fieldErrors: { title: [BROKEN_CHARACTER_MESSAGE] } });
  });

  it('in a JSON body: 422', async () => {
    const res = await refusedRoute(surveysRoute, 'POST', { body: { assetId: ids.vessel, surveyedOn: day(-1), method: 'diver', defaultElectrode: 'ag-agcl-seawater', surveyor: '\uDE00 divers' } });
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors).toEqual({ surveyor: [BROKEN_CHARACTER_MESSAGE] });
  });

  it('a whole emoji is kept', async () => {
    await signInAs(home.users.engineer);
    const { createAssetAction } = await assetActions();
    const outcome = await createAssetAction(home.organisation.slug, { ok: false }, formDataOf({ kind: 'vessel', name: 'Boat 🚢', hullMaterial: 'steel' })).catch((error: unknown) => error);
    // Success redirects to the new asset's page.
    expect(String((outcome as { digest?: string }).digest)).toMatch(/NEXT_REDIRECT/);
  });
});

describe('an impossible date', () => {
  it('2026-02-30 in a form is refused with a field message, never rolled over to 2 March', async () => {
    const state = await refusedForm(dockingActions, 'createDockingAction', { assetId: ids.vessel, kind: 'intermediate', plannedStart: '2026-02-30' });
    expect(state.fieldErrors).toEqual({ plannedStart: ['The planned start is not a real date.'] });
  });

  it('2026-02-30 in a JSON body is a 422', async () => {
    const res = await refusedRoute(surveysRoute, 'POST', { body: { assetId: ids.vessel, surveyedOn: '2026-02-30', method: 'diver', defaultElectrode: 'ag-agcl-seawater' } });
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors).toEqual({ surveyedOn: ['The survey date is not a real date.'] });
  });
});

describe('an id that is not a UUID', () => {
  for (const zoneId of ['zone-1', '1', "1' or '1'='1", '\u0000', `${randomUUID()}x`]) {
    it(`zone id ${JSON.stringify(zoneId)}: "not found", nothing written`, async () => {
      const update = await refusedForm(assetActions, 'updateZoneAction', { ...zoneFields, zoneId, name: 'Renamed' });
      expect(update.message).toMatch(/was not found\.$/);
      const archive = await refusedForm(assetActions, 'archiveZoneAction', { zoneId, assetId: ids.vessel });
      expect(archive.message).toMatch(/was not found\.$/);
      const group = await refusedForm(assetActions, 'createAnodeGroupAction', { assetId: ids.vessel, zoneId, label: 'Zoned group', anodeModelKey: 'builtin:TW-AW-4020', quantity: '2', installedOn: day(-10) });
      expect(group.fieldErrors?.zoneId).toBeTruthy();
    });
  }

  it('in the path of a route: 404', async () => {
    const res = await refusedRoute(() => import('@/app/api/orgs/[org]/dockings/[dockingId]/renewals/route'), 'GET', { params: { dockingId: 'docking-1' } });
    expect(res.status).toBe(404);
  });

  it('in a query: 422 naming the parameter', async () => {
    const res = await refusedRoute(() => import('@/app/api/orgs/[org]/designs/route'), 'GET', { search: '?assetId=asset-1' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(['assetId']);
  });
});
