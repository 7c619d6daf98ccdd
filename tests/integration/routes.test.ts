import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { randomUUID } from 'node:crypto';
import { NextRequest } from 'next/server';
import { addDays } from 'date-fns';
import { StripeEventSchema, SurveyReadingSchema, type Organisation, type User } from '@/entities';
import { ROLES, type Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal } from '@/lib/server/services/planner/renewals';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { HTTP_METHODS, databaseFingerprint, filesNamed, importFile, signInAs, signedInUserId, CALCULATION, PNG_HEADER as PNG } from '../fixtures/entry-points';
import { pdfText } from '../fixtures/pdf-text';
import { uploadDirect } from '../fixtures/direct-upload';
import { newWorkerIdentity, recordHeartbeat } from '@/lib/server/worker-status';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { assetFigures, figureDay, figureHref } from '@/lib/server/services/assets/asset-figures';

vi.mock('next/headers', () => nextHeadersMock);

// Every organisation route handler (each exported method of each route.ts under app/api/orgs/[org]) with the
// roles it admits; a test below fails when a route file exports a method this table does not list.
const VESSEL = 'Route Test Vessel';
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);

type Ids = Record<'designId' | 'dockingId' | 'surveyId' | 'attachmentId' | 'assetId' | 'deviceId' | 'figure', string>;
type Method = (typeof HTTP_METHODS)[number];
type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface Called {
  status: number;
  type: string;
  bytes: Uint8Array;
  text: string;
  body: any;
  location: string | null;
}
interface Route {
  /** The route's folder under app/api/orgs/[org], with its dynamic segments as named there. */
  path: string;
  method: Method;
  load: () => Promise<Record<string, unknown>>;
  permission: (role: Role) => boolean;
  /** The status a permitted member gets (200 unless stated). */
  status?: number;
  /** A request body: plain objects are sent as JSON, strings with `contentType`, FormData as multipart. */
  body?: () => unknown;
  contentType?: string;
  /** What a permitted member receives. */
  check?: (res: Called, role: Role) => void | Promise<void>;
}

const all = () => true;
const owner = (r: Role) => r === 'owner';
const engineers = (r: Role) => r === 'owner' || r === 'engineer';
const surveyors = (r: Role) => r === 'owner' || r === 'engineer' || r === 'inspector';
const isPdf = async (res: Called, role: Role) => {
  expect(res.type).toBe('application/pdf');
  expect(res.text.slice(0, 5)).toBe('%PDF-');
  // Reading the text back is slow; once per route is enough.
  if (role === 'viewer') expect(await pdfText(res.bytes)).toContain(VESSEL);
};

const ROUTES: Route[] = [
  { path: 'team', method: 'GET', load: () => import('@/app/api/orgs/[org]/team/route'), permission: owner, check: (r) => expect(r.body.members).toHaveLength(ROLES.length) },
  { path: 'audit', method: 'GET', load: () => import('@/app/api/orgs/[org]/audit/route'), permission: owner },
  { path: 'designs', method: 'GET', load: () => import('@/app/api/orgs/[org]/designs/route'), permission: all, check: (r) => expect(r.body.designs.map((d: { id: string }) => d.id)).toContain(ids.designId) },
  {
    path: 'designs',
    method: 'POST',
    status: 201,
    body: () => ({ assetId: ids.assetId, title: 'Route test revision' }),
    load: () => import('@/app/api/orgs/[org]/designs/route'),
    permission: engineers,
    check: (r) => expect(r.body.design.title).toBe('Route test revision'),
  },
  { path: 'designs/[designId]', method: 'GET', load: () => import('@/app/api/orgs/[org]/designs/[designId]/route'), permission: all, check: (r) => expect(r.body.design.id).toBe(ids.designId) },
  { path: 'designs/[designId]/note', method: 'GET', load: () => import('@/app/api/orgs/[org]/designs/[designId]/note/route'), permission: all, check: isPdf },
  { path: 'assets', method: 'GET', load: () => import('@/app/api/orgs/[org]/assets/route'), permission: all, check: (r) => expect(r.text).toContain(VESSEL) },
  {
    path: 'assets/[assetId]/figures/[figure]',
    method: 'GET',
    load: () => import('@/app/api/orgs/[org]/assets/[assetId]/figures/[figure]/route'),
    permission: all,
    check: (r) => {
      expect(r.type).toBe('image/svg+xml; charset=utf-8');
      expect(r.text.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
      expect(r.text).toContain('Starboard side (bow right)');
    },
  },
  {
    path: 'assets',
    method: 'POST',
    status: 201,
    body: () => ({ kind: 'vessel', name: 'Route Test Boat', hullMaterial: 'steel' }),
    load: () => import('@/app/api/orgs/[org]/assets/route'),
    permission: engineers,
    check: (r) => expect(r.body.asset).toMatchObject({ name: 'Route Test Boat', kind: 'vessel' }),
  },
  { path: 'anode-groups', method: 'GET', load: () => import('@/app/api/orgs/[org]/anode-groups/route'), permission: all, check: (r) => expect(r.text).toContain('Route bottom') },
  {
    path: 'anode-groups/export',
    method: 'GET',
    load: () => import('@/app/api/orgs/[org]/anode-groups/export/route'),
    permission: all,
    check: (r) => {
      expect(r.type).toBe('text/csv; charset=utf-8');
      expect(r.text.split('\r\n')[0]).toMatch(/^Asset,Asset kind,/);
      expect(r.text).toContain(`${VESSEL},Vessel,`);
    },
  },
  { path: 'calculations', method: 'POST', body: () => CALCULATION, load: () => import('@/app/api/orgs/[org]/calculations/route'), permission: all, check: (r) => expect(r.body.result.anodeCount).toBeGreaterThan(0) },
  { path: 'surveys', method: 'GET', load: () => import('@/app/api/orgs/[org]/surveys/route'), permission: all, check: (r) => expect(r.text).toContain(ids.surveyId) },
  {
    path: 'surveys',
    method: 'POST',
    status: 201,
    body: () => ({ assetId: ids.assetId, surveyedOn: day(-1), method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater', readings: [{ location: 'Stern', potentialV: -0.98, electrode: 'ag-agcl-seawater' }] }),
    load: () => import('@/app/api/orgs/[org]/surveys/route'),
    permission: surveyors,
    check: (r) => expect(r.body.survey.id).toMatch(/^[0-9a-f-]{36}$/),
  },
  {
    path: 'surveys/[surveyId]/readings',
    method: 'POST',
    // New locations on every call: rows already in the survey would be skipped as duplicates.
    body: () => `location,potential_v,electrode,remaining\nFr 20 P ${++csvCalls},-0.97,ag-agcl-seawater,\nFr 20 S ${csvCalls},,,70%\n`,
    contentType: 'text/csv',
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/readings/route'),
    permission: surveyors,
    check: (r) => expect(r.body).toEqual({ imported: 2, underProtected: 0, engineersMailed: false, duplicates: 0, badLinesSkipped: 0, message: '2 readings imported.' }),
  },
  {
    path: 'surveys/[surveyId]/capture',
    method: 'POST',
    // A new UUID on every call: an item already recorded would be answered as a duplicate.
    // Sent as captured by whoever is signed in, as the phone does.
    body: () => ({ capturedBy: signedInUserId() ?? 'nobody', items: [{ deviceId: randomUUID(), kind: 'reading', location: `Capture ${++captureCalls}`, potentialV: -0.97 }] }),
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/capture/route'),
    // Every member is answered item by item: a role that may not write gets a conflict for each item, and nothing is written.
    permission: all,
    check: async (r, role) => {
      expect(r.body.results).toHaveLength(1);
      const [result] = r.body.results;
      const rows = await (await getEm()).count(SurveyReadingSchema, { survey: ids.surveyId, deviceId: result.deviceId });
      if (surveyors(role)) {
        expect(result).toMatchObject({ status: 'recorded', readingId: expect.any(String) });
        expect(rows).toBe(1);
      } else {
        expect(result).toMatchObject({ status: 'conflict', message: 'Your role in this organisation no longer allows recording readings. Ask an owner, or discard the item.' });
        expect(rows).toBe(0);
      }
    },
  },
  {
    path: 'surveys/[surveyId]/attachments',
    method: 'POST',
    status: 201,
    body: () => {
      const form = new FormData();
      form.set('file', new File([PNG], 'stern-tube.png', { type: 'image/png' }));
      form.set('caption', 'Stern tube anode');
      return form;
    },
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/route'),
    permission: surveyors,
    check: (r) => expect(r.body.attachment).toMatchObject({ filename: 'stern-tube.png', contentType: 'image/png', sizeBytes: PNG.length }),
  },
  {
    path: 'surveys/[surveyId]/attachments/[attachmentId]',
    method: 'GET',
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/[attachmentId]/route'),
    permission: all,
    // A redirect to a short-lived link of the object storage, which serves the bytes with the sniffed type.
    status: 302,
    check: async (r) => {
      expect(r.location).toMatch(/X-Amz-Signature=[0-9a-f]{64}/);
      const served = await fetch(r.location!);
      expect(served.status).toBe(200);
      expect(served.headers.get('content-type')).toBe('image/png');
      expect(served.headers.get('content-disposition')).toBe('inline; filename="bow.png"');
      expect(new Uint8Array(await served.arrayBuffer())).toEqual(PNG);
    },
  },
  {
    path: 'surveys/[surveyId]/attachments/uploads',
    method: 'POST',
    body: () => ({ deviceId: `route-item-${++uploadCalls}`, filename: 'keel.png', contentType: 'image/png', sizeBytes: PNG.length, caption: 'Keel' }),
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/uploads/route'),
    permission: surveyors,
    check: (r) => {
      expect(r.body.upload).toMatchObject({ status: 'upload', method: 'PUT', headers: { 'content-type': 'image/png' } });
      // A staging key under the organisation's prefix, new for this request; the attachment is recorded under another.
      expect(r.body.upload.objectKey).toMatch(new RegExp(`^org/${home.organisation.id}/upload/[0-9a-f-]{36}/[0-9a-f-]{36}$`));
      expect(r.body.upload.url).toMatch(/X-Amz-SignedHeaders=content-length%3Bcontent-type%3Bhost/);
    },
  },
  {
    path: 'surveys/[surveyId]/attachments/uploads/[deviceId]/complete',
    method: 'POST',
    // The device item was completed once in the set-up: a permitted repeat finds the same attachment (200).
    load: () => import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/uploads/[deviceId]/complete/route'),
    permission: surveyors,
    check: (r) => expect(r.body.attachment).toMatchObject({ id: completedAttachmentId, filename: 'rudder.png', contentType: 'image/png', sizeBytes: PNG.length }),
  },
  {
    path: 'surveys/template',
    method: 'GET',
    load: () => import('@/app/api/orgs/[org]/surveys/template/route'),
    permission: all,
    check: (r) => {
      expect(r.type).toBe('text/csv; charset=utf-8');
      expect(r.text.split('\r\n')[0]).toBe('location,potential_v,electrode,anode_group,remaining,comment');
    },
  },
  { path: 'catalogue', method: 'GET', load: () => import('@/app/api/orgs/[org]/catalogue/route'), permission: all, check: (r) => expect(r.body.models.length).toBeGreaterThan(0) },
  { path: 'dockings/[dockingId]/anode-list', method: 'GET', load: () => import('@/app/api/orgs/[org]/dockings/[dockingId]/anode-list/route'), permission: all, check: isPdf },
  {
    path: 'dockings/[dockingId]/renewals',
    method: 'GET',
    load: () => import('@/app/api/orgs/[org]/dockings/[dockingId]/renewals/route'),
    permission: all,
    check: (r) => expect(r.body.renewals.map((x: { groupLabel: string }) => x.groupLabel)).toEqual(['Route bottom']),
  },
];

let csvCalls = 0;
let captureCalls = 0;
let uploadCalls = 0;
let completedAttachmentId = '';
let home: { organisation: Organisation; users: Record<Role, User> };
let other: { organisation: Organisation; users: Record<Role, User> };
let ids: Ids;

const paramsOf = (path: string): Record<string, string> =>
  Object.fromEntries([...path.matchAll(/\[(\w+)\]/g)].map(([, name]) => [name, ids[name as keyof Ids]]));
const urlOf = (path: string) => path.replace(/\[(\w+)\]/g, (_, name: keyof Ids) => ids[name]);

function requestInit(method: Method, body: unknown, contentType?: string): RequestInit | undefined {
  if (body === undefined) return method === 'GET' ? undefined : { method };
  if (body instanceof FormData) return { method, body };
  if (typeof body === 'string') return { method, body, headers: contentType ? { 'content-type': contentType } : {} };
  return { method, body: JSON.stringify(body), headers: { 'content-type': 'application/json' } };
}

async function call(route: Route, slug: string, search = '', body = route.body?.()): Promise<Called> {
  const handler = (await route.load())[route.method] as Handler;
  const req = new NextRequest(`http://127.0.0.1/api/orgs/${slug}/${urlOf(route.path)}${search}`, requestInit(route.method, body, route.contentType) as ConstructorParameters<typeof NextRequest>[1]);
  const res = await handler(req, { params: Promise.resolve({ org: slug, ...paramsOf(route.path) }) });
  const type = res.headers.get('content-type') ?? '';
  const bytes = new Uint8Array(await res.arrayBuffer());
  const text = new TextDecoder().decode(bytes);
  return { status: res.status, type, bytes, text, body: type.startsWith('application/json') ? JSON.parse(text) : undefined, location: res.headers.get('location') };
}

/** A refused request answers and writes nothing. */
async function refused(route: Route, slug: string) {
  const before = await databaseFingerprint();
  const res = await call(route, slug);
  expect(await databaseFingerprint()).toEqual(before);
  return res;
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Home Port');
  other = await makeOrgWithRoles(await getEm(), 'Other Port');
  const as = async (role: Role) => ctxFor(await getEm(), home.organisation, home.users[role]);
  const vessel = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: VESSEL, hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
  const group = await runAs(as('engineer'), (c) => createAnodeGroup(c, vessel.id, { label: 'Route bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
  const design = await runAs(as('engineer'), (c) => createDesign(c, { assetId: vessel.id }));
  const docking = await runAs(as('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(200), yard: 'Route Yard' }));
  await runAs(as('planner'), (c) => addRenewal(c, docking.id, { groupId: group.id, reason: 'damage' }));
  const survey = await runAs(as('inspector'), (c) => createSurvey(c, { assetId: vessel.id, surveyedOn: day(-10), method: 'diver', defaultElectrode: 'ag-agcl-seawater' }));
  const attachment = await runAs(as('inspector'), (c) => addSurveyAttachment(c, survey.id, { name: 'bow.png', bytes: PNG }, 'Bow thruster'));
  const direct = await uploadDirect(await as('inspector'), survey.id, 'route-completed-item', { name: 'rudder.png', bytes: PNG, contentType: 'image/png' });
  completedAttachmentId = direct.completed.attachment.id;
  ids = { assetId: vessel.id, designId: design.id, dockingId: docking.id, surveyId: survey.id, attachmentId: attachment.id, deviceId: 'route-completed-item', figure: 'starboard' };
});
afterAll(async () => (await getOrm()).close(true));

describe('organisation route handlers', () => {
  it('the table lists every exported method of every route file under app/api/orgs, and nothing else', async () => {
    const found: string[] = [];
    for (const file of await filesNamed('app/api/orgs', 'route.ts')) {
      const mod = await importFile(file);
      const path = file.replace(/^app\/api\/orgs\/\[org\]\//, '').replace(/\/route\.ts$/, '');
      for (const method of HTTP_METHODS) {
        if (typeof mod[method] !== 'function') continue;
        found.push(`${method} ${path}`);
        const listed = ROUTES.find((r) => r.path === path && r.method === method);
        if (listed) expect((await listed.load())[method], `${method} ${path} is loaded from its own file`).toBe(mod[method]);
      }
    }
    const listed = ROUTES.map((r) => `${r.method} ${r.path}`);
    expect(found.filter((f) => !listed.includes(f)), 'route methods missing from ROUTES').toEqual([]);
    expect(listed.filter((l) => !found.includes(l)), 'ROUTES entries without a route').toEqual([]);
    expect(new Set(listed).size).toBe(listed.length);
  });

  for (const route of ROUTES) {
    const name = `${route.method} ${route.path}`;
    it(`${name}: 401 without a session, nothing written`, async () => {
      await signInAs(null);
      const { status, body } = await refused(route, home.organisation.slug);
      expect(status).toBe(401);
      expect(body.error.code).toBe('unauthenticated');
    });

    for (const role of ROLES) {
      const status = route.permission(role) ? (route.status ?? 200) : 403;
      it(`${name}: ${role} of the organisation gets ${status}${status === 403 ? ', nothing written' : ''}`, async () => {
        await signInAs(home.users[role]);
        if (status === 403) {
          const res = await refused(route, home.organisation.slug);
          expect(res.status).toBe(403);
          expect(res.body.error.code).toBe('forbidden');
          return;
        }
        const res = await call(route, home.organisation.slug);
        expect(res.status, res.text.slice(0, 300)).toBe(status);
        await route.check?.(res, role);
      });

      it(`${name}: ${role} of another organisation gets 404, never the data, nothing written`, async () => {
        await signInAs(other.users[role]);
        const { status, body, text } = await refused(route, home.organisation.slug);
        expect(status).toBe(404);
        expect(body.error.code).toBe('not-found');
        expect(JSON.stringify(body)).not.toContain(home.users.owner.email);
        for (const secret of [VESSEL, home.organisation.name, 'Route bottom', '%PDF-']) expect(text).not.toContain(secret);
      });
    }

    it(`${name}: an unknown organisation is 404 too`, async () => {
      await signInAs(home.users.owner);
      expect((await refused(route, 'no-such-org')).status).toBe(404);
    });
  }

  it('the team route lists members with their roles and no secrets', async () => {
    await signInAs(home.users.owner);
    const { body } = await call(ROUTES.find((r) => r.path === 'team')!, home.organisation.slug);
    expect(body.members).toHaveLength(ROLES.length);
    expect(body.members.map((m: { role: string }) => m.role).sort()).toEqual([...ROLES].sort());
    expect(JSON.stringify(body)).not.toMatch(/argon2|passwordHash|tokenHash/);
  });

  it('the stateless calculation returns the sizing; invalid input is a 422 naming the field', async () => {
    await signInAs(home.users.viewer);
    const calculations = ROUTES.find((r) => r.path === 'calculations')!;
    const ok = await call(calculations, home.organisation.slug);
    expect(ok.body.result.current.meanA).toBeCloseTo(100, 6); // 1,000 m² x 0.100 A/m² bare
    expect(ok.body.result.governingCriterion).toBeTruthy();
    const bad = await call(calculations, home.organisation.slug, '', { ...CALCULATION, surfaces: [{ ...CALCULATION.surfaces[0], areaM2: -1 }] });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fieldErrors)).toEqual(['surfaces[0].areaM2']);
  });

  it('a malformed query is a 422 with the field named', async () => {
    await signInAs(home.users.owner);
    const { status, body } = await call(ROUTES.find((r) => r.path === 'audit')!, home.organisation.slug, '?page=-3');
    expect(status).toBe(422);
    expect(body.error.fieldErrors.page).toBeTruthy();
  });

  it('the anode list comes as CSV when asked, with the booked group', async () => {
    await signInAs(home.users.viewer);
    const res = await call(ROUTES.find((r) => r.path === 'dockings/[dockingId]/anode-list')!, home.organisation.slug, '?format=csv');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/csv; charset=utf-8');
    expect(res.text).toContain('Route bottom');
    expect((await call(ROUTES.find((r) => r.path === 'dockings/[dockingId]/anode-list')!, home.organisation.slug, '?format=xml')).status).toBe(422);
  });

  it('survey readings also come as a multipart upload, with the upload naming the electrode', async () => {
    await signInAs(home.users.inspector);
    const form = new FormData();
    form.set('file', new File(['location,potential_v\nMultipart 1,-1.00\n'], 'readings.csv', { type: 'text/csv' }));
    form.set('defaultElectrode', 'cse');
    const res = await call(ROUTES.find((r) => r.path === 'surveys/[surveyId]/readings')!, home.organisation.slug, '', form);
    expect(res.status, res.text).toBe(200);
    expect(res.body).toEqual({ imported: 1, underProtected: 0, engineersMailed: false, duplicates: 0, badLinesSkipped: 0, message: '1 reading imported.' });
    const [reading] = await (await getEm()).find(SurveyReadingSchema, { survey: ids.surveyId, location: 'Multipart 1' });
    expect(reading.electrode).toBe('cse');
    // -1.00 V CSE is about -0.95 V Ag/AgCl/seawater (50 mV between them): common practice
    expect(reading.potentialAgAgClV).toBeCloseTo(-0.95, 2);
  });

  it("an id that names nothing, or another organisation's record, is 404 on every parameterised route", async () => {
    const outsider = async (role: Role) => ctxFor(await getEm(), other.organisation, other.users[role]);
    const boat = await runAs(outsider('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Foreign Boat', hullMaterial: 'steel' }));
    const design = await runAs(outsider('engineer'), (c) => createDesign(c, { assetId: boat.id }));
    const docking = await runAs(outsider('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'unplanned', plannedStart: day(30) }));
    const survey = await runAs(outsider('inspector'), (c) => createSurvey(c, { assetId: boat.id, surveyedOn: day(-1), method: 'diver', defaultElectrode: 'cse' }));
    const attachment = await runAs(outsider('inspector'), (c) => addSurveyAttachment(c, survey.id, { name: 'foreign.png', bytes: PNG }, null));
    await uploadDirect(await outsider('inspector'), survey.id, 'foreign-completed-item', { name: 'foreign.png', bytes: PNG, contentType: 'image/png' });
    const foreign: Ids = { assetId: boat.id, designId: design.id, dockingId: docking.id, surveyId: survey.id, attachmentId: attachment.id, deviceId: 'foreign-completed-item', figure: 'starboard' };
    await signInAs(home.users.owner);
    const saved = ids;
    try {
      for (const route of ROUTES.filter((r) => r.path.includes('['))) {
        for (const replacement of ['not-a-uuid', '00000000-0000-4000-8000-000000000000', 'foreign'] as const) {
          // A figure's name stays a figure's: the asset is what is looked up (and refused) here.
          ids = Object.fromEntries(Object.entries(saved).map(([k, v]) => [k, route.path.includes(`[${k}]`) && k !== 'figure' ? (replacement === 'foreign' ? foreign[k as keyof Ids] : replacement) : v])) as Ids;
          const res = await refused(route, home.organisation.slug);
          expect(res.status, `${route.method} ${route.path} with ${replacement} ids: ${res.text.slice(0, 200)}`).toBe(404);
          expect(res.text).not.toContain('Foreign Boat');
        }
      }
      // The attachment of another survey of the same organisation is not served through this survey either.
      ids = { ...saved, surveyId: (await runAs(ctxFor(await getEm(), home.organisation, home.users.inspector), (c) => createSurvey(c, { assetId: saved.assetId, surveyedOn: day(-2), method: 'rov', defaultElectrode: 'cse' }))).id };
      await signInAs(home.users.owner);
      expect((await refused(ROUTES.find((r) => r.path === 'surveys/[surveyId]/attachments/[attachmentId]')!, home.organisation.slug)).status).toBe(404);
    } finally {
      ids = saved;
    }
  });
});

describe("the asset page's figures", () => {
  it('a figure asked for at the version the page names may be kept for a day; at another it is checked again; a repeat with its ETag is 304', async () => {
    await signInAs(home.users.viewer);
    // The page and the route draw for the day (figureDay): the same documents, hence the same versions, all day.
    expect(figureDay(new Date('2027-03-14T23:59:59Z'))).toEqual(new Date('2027-03-14T00:00:00Z'));
    expect(figureDay(new Date('2027-03-14T00:00:00Z'))).toEqual(new Date('2027-03-14T00:00:00Z'));
    const page = await getAssetPage(await ctxFor(await getEm(), home.organisation, home.users.viewer), ids.assetId, figureDay());
    const figures = assetFigures(page);
    expect(figures.views.map((v) => v.name)).toEqual(['starboard', 'port']);
    const route = ROUTES.find((r) => r.path === 'assets/[assetId]/figures/[figure]')!;
    const handler = (await route.load()).GET as Handler;
    const get = async (figure: string, version: string, headers: Record<string, string> = {}) => {
      const href = figureHref(home.organisation.slug, ids.assetId, figure, version);
      expect(href).toBe(`/api/orgs/${home.organisation.slug}/assets/${ids.assetId}/figures/${figure}?v=${version}`);
      return handler(new NextRequest(`http://127.0.0.1${href}`, { headers }), { params: Promise.resolve({ org: home.organisation.slug, assetId: ids.assetId, figure }) });
    };
    for (const figure of figures.views) {
      const res = await get(figure.name, figure.version);
      expect(res.status).toBe(200);
      expect(res.headers.get('cache-control')).toBe('private, max-age=86400, immutable');
      expect(res.headers.get('etag')).toBe(`"${figure.version}"`);
      // The same document the page's version was taken from.
      expect(await res.text()).toBe(figure.document);
      const repeat = await get(figure.name, figure.version, { 'if-none-match': `"${figure.version}"` });
      expect(repeat.status).toBe(304);
      expect(await repeat.text()).toBe('');
    }
    // A page opened before a change names an older version: it gets the current figure, not to be kept.
    const stale = await get('port', '0000000000beef');
    expect(stale.status).toBe(200);
    expect(stale.headers.get('cache-control')).toBe('private, no-cache');
    expect(await stale.text()).toBe(figures.views[1]!.document);
    // The route vessel's group has a mean current: its chart is drawn too.
    expect(figures.chart).not.toBeNull();
    const chart = await get('chart', figures.chart!.version);
    expect(chart.headers.get('content-type')).toBe('image/svg+xml; charset=utf-8');
    expect(await chart.text()).toBe(figures.chart!.document);
    // A name that is no figure is 404, as is a vessel's pile plan.
    for (const name of ['plan', 'elevation', 'Chart']) expect((await get(name, 'x')).status).toBe(404);
  });
});

describe('public route handlers', () => {
  it('GET /api/health answers without a session: app, database and worker up, with the queue depth', async () => {
    await signInAs(null);
    const em = await getEm();
    await em.execute(`delete from worker_heartbeat`);
    const { GET } = await import('@/app/api/health/route');

    // No worker has ever beaten: mail and reminders would not go out.
    let res = await GET();
    expect(res.status).toBe(503);
    expect(await res.json()).toMatchObject({ status: 'degraded', database: { status: 'ok' }, worker: { status: 'never', lastHeartbeatAt: null } });

    const worker = newWorkerIdentity();
    await recordHeartbeat(em.fork(), worker);
    const waitingBefore = Number((await em.execute<{ n: string }[]>(`select count(*) as n from outbox_message where status = 'pending'`))[0].n);
    await em.execute(`insert into outbox_message (id, to_address, subject, text_body, status, attempts, next_attempt_at, created_at) values (gen_random_uuid(), 'queued@example.com', 'Queued', 'x', 'pending', 0, now(), now() - interval '90 seconds')`);
    res = await GET();
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ status: 'ok', app: { status: 'ok' }, database: { status: 'ok' }, worker: { status: 'ok', running: 1 } });
    expect(body.worker.secondsSinceHeartbeat).toBeLessThanOrEqual(5);
    expect(body.queue.mailWaiting).toBe(waitingBefore + 1);
    expect(body.queue.oldestMailWaitingSeconds).toBeGreaterThanOrEqual(90);

    // A worker silent for more than a minute is late.
    await em.execute(`update worker_heartbeat set beat_at = now() - interval '61 seconds'`);
    res = await GET();
    expect(res.status).toBe(503);
    expect(await res.json()).toMatchObject({ status: 'degraded', worker: { status: 'late', running: 0 } });
    await em.execute(`delete from outbox_message where to_address = 'queued@example.com'`);
    await em.execute(`delete from worker_heartbeat`);
  });

  it('POST /api/webhooks/stripe refuses an unsigned body with 400 and records nothing, without any session', async () => {
    await signInAs(null);
    const { POST } = await import('@/app/api/webhooks/stripe/route');
    const before = await databaseFingerprint();
    const payload = JSON.stringify({ id: 'evt_unsigned_route_test', object: 'event', type: 'customer.subscription.deleted', data: { object: { id: 'sub_x', object: 'subscription', customer: 'cus_x', status: 'canceled' } } });
    const res = await POST(new Request('http://127.0.0.1/api/webhooks/stripe', { method: 'POST', body: payload, headers: { 'content-type': 'application/json' } }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.code).toBe('invalid');
    expect(await databaseFingerprint()).toEqual(before);
    expect(await (await getEm()).count(StripeEventSchema, { id: 'evt_unsigned_route_test' })).toBe(0);
  });
});
