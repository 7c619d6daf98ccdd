// How many SQL statements one request costs must not depend on how much the organisation holds: every GET
// route handler under app/api/orgs/[org] that answers with data (and the calculations POST) is called for a
// small organisation and for one about ten times larger, through the real handler (session check,
// membership and permission inside the unit of work included), and the two counts must be equal. The same
// for the services the server-rendered pages call directly. A count that grows with the data is an N+1.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import { addDays } from 'date-fns';
import { MembershipSchema, OrganisationSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm, queryCounter } from '@/lib/server/db';
import { outboxSettled } from '@/lib/server/mail/outbox';
import { getOrgContextOrThrow, type OrgContext } from '@/lib/server/org-context';
import { Effects } from '@/lib/server/unit-of-work';
import { listQuerySchema } from '@/lib/schemas/register';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup, removeAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createAnodeModel } from '@/lib/server/services/catalogue/manage-anode-models';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { approveDesign } from '@/lib/server/services/designs/sign-design';
import { fitDesign } from '@/lib/server/services/designs/fit-design';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal, markRenewalFitted, markRenewalOrdered } from '@/lib/server/services/planner/renewals';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { deleteSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { addSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { proposeDesignPositions } from '@/lib/server/services/designs/fit-design';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { listAssetChoices } from '@/lib/server/services/assets/list-asset-choices';
import { getPlannerView } from '@/lib/server/services/planner/planner-view';
import { listDockingRenewals } from '@/lib/server/services/planner/docking-renewals';
import { listPlannedDockings } from '@/lib/server/services/planner/dockings';
import { getFirstRun } from '@/lib/server/services/onboarding/get-first-run';
import { getDesignDesk } from '@/lib/server/services/designs/design-view';
import { listDesigns } from '@/lib/server/services/designs/list-designs';
import { getSurveyDetails } from '@/lib/server/services/surveys/survey-details';
import { listDeletedSurveys } from '@/lib/server/services/surveys/manage-surveys';
import { listGroupChoices } from '@/lib/server/services/register/list-group-choices';
import { listCatalogue } from '@/lib/server/services/catalogue/anode-models';
import { getAuditLog } from '@/lib/server/services/accounts/get-audit-log';
import { ctxFor, makeOrgWithRoles, makeUser, runAs, uniqueEmail } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { CALCULATION, PNG_HEADER, filesNamed, importFile, signInAs } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);

// ---------- the two organisations ----------

interface Built {
  name: string;
  organisation: Organisation;
  users: Record<Role, User>;
  /** The asset, docking, survey, attachment and designs the single-record routes are asked about. */
  assetId: string;
  dockingId: string;
  surveyId: string;
  attachmentId: string;
  approvedDesignId: string;
  draftDesignId: string;
}

const ZONE = { kind: 'hull-bottom', areaM2: 120, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
const OWN_MODEL = { alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: 0.3, widthM: 0.15, thicknessM: 0.03, exposedAreaM2: 0.06, netMassKg: 8, grossMassKg: 8.5 };

/**
 * An invented organisation whose size grows with `scale` (1 = small, 10 = large): 2·scale vessels, each
 * with a zone, two anode groups (one of the organisation's own model), a planned docking and a draft
 * design; `scale` approved designs fitted as groups; on the first vessel 2·scale more groups, all booked
 * for renewal at its docking, `scale` surveys with a reading per group and `scale` attachments on the
 * first; `scale` deleted surveys, `scale` own anode models, `scale` open invitations, 5·scale more
 * members, and the audit rows all of that leaves.
 */
async function buildOrganisation(name: string, scale: number): Promise<Built> {
  const { organisation, users } = await makeOrgWithRoles(await getEm(), name);
  const em = await getEm();
  const checker = await makeUser(em, { name: `${name} checker` });
  em.create(MembershipSchema, { organisation: em.getReference(OrganisationSchema, organisation.id), user: checker, role: 'engineer' });
  for (let i = 0; i < 5 * scale; i++) {
    em.create(MembershipSchema, { organisation: em.getReference(OrganisationSchema, organisation.id), user: await makeUser(em, { name: `${name} viewer ${i}` }), role: 'viewer' });
  }
  await em.flush();
  const as = <T,>(who: Role | User, work: (c: OrgContext) => Promise<T>) => runAs(ctxFor(em.fork(), organisation, typeof who === 'string' ? users[who] : who), work);

  const models: string[] = [];
  for (let i = 0; i < scale; i++) models.push((await as('engineer', (c) => createAnodeModel(c, { ...OWN_MODEL, designation: `OWN-${i + 1}` }))).id);
  for (let i = 0; i < scale; i++) await as('owner', (c) => inviteMember(c, { email: uniqueEmail('invited'), role: 'viewer' }));

  const assetIds: string[] = [];
  const dockingIds: string[] = [];
  const draftDesignIds: string[] = [];
  for (let i = 0; i < 2 * scale; i++) {
    const asset = await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: `${name} vessel ${i + 1}`, hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
    assetIds.push(asset.id);
    const zone = await as('engineer', (c) => createZone(c, asset.id, { ...ZONE, name: `Bottom ${i + 1}` }));
    await as('engineer', (c) => createAnodeGroup(c, asset.id, { zoneId: zone.id, label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 1 }));
    await as('engineer', (c) => createAnodeGroup(c, asset.id, { label: 'Sea chest', anodeModelKey: `org:${models[i % models.length]}`, quantity: 4, installedOn: day(-300), meanCurrentA: 0.2 }));
    // Worked hard: due for renewal within the year, so the scheduler proposes one.
    await as('engineer', (c) => createAnodeGroup(c, asset.id, { label: 'Thruster', anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: day(-300), meanCurrentA: 3 }));
    dockingIds.push((await as('planner', (c) => createDocking(c, { assetId: asset.id, kind: 'intermediate', plannedStart: day(200 + i), yard: 'Counting Yard' }))).id);
    draftDesignIds.push((await as('engineer', (c) => createDesign(c, { assetId: asset.id }))).id);
  }
  const approved: string[] = [];
  for (let i = 0; i < scale; i++) {
    const design = await as('engineer', (c) => createDesign(c, { assetId: assetIds[i] }));
    await as(checker, (c) => approveDesign(c, design.id));
    await as('engineer', (c) => fitDesign(c, design.id, { mode: 'installed', fittedOn: day(-200) }));
    approved.push(design.id);
  }

  // The first vessel, which the single-record routes and the asset page are asked about, grows as well:
  // zones, groups in them, dockings and draft revisions.
  const [assetId] = assetIds;
  const zoneIds: string[] = [];
  for (let i = 0; i < scale; i++) zoneIds.push((await as('engineer', (c) => createZone(c, assetId, { ...ZONE, kind: 'rudder', areaM2: 6, name: `Rudder zone ${i + 1}` }))).id);
  const labels = ['Bottom', 'Sea chest'];
  for (let i = 0; i < 2 * scale; i++) {
    const label = `Rudder ${i + 1}`;
    await as('engineer', (c) => createAnodeGroup(c, assetId, { zoneId: zoneIds[i % scale], label, anodeModelKey: i % 2 ? `org:${models[i % models.length]}` : 'builtin:TW-AW-4020', quantity: 2, installedOn: day(-400), meanCurrentA: 0.1 }));
    labels.push(label);
  }
  const { AnodeGroupSchema } = await import('@/entities');
  // Edited groups (their change history) and removed ones (the register's archive).
  for (const group of await em.fork().find(AnodeGroupSchema, { asset: assetId, label: { $like: 'Rudder %' } })) {
    await as('engineer', (c) => updateAnodeGroup(c, group.id, { zoneId: group.zone?.id ?? null, label: group.label, anodeModelKey: group.model.key, quantity: 3, installedOn: group.installedOn, meanCurrentA: 0.1 }));
  }
  for (let i = 0; i < scale; i++) {
    const spare = await as('engineer', (c) => createAnodeGroup(c, assetId, { label: `Spare ${i + 1}`, anodeModelKey: 'builtin:TW-AW-4020', quantity: 1, installedOn: day(-500), meanCurrentA: 0.1 }));
    await as('engineer', (c) => removeAnodeGroup(c, spare.id, { removedOn: day(-30), reason: 'Lost' }));
  }
  for (let i = 0; i < scale; i++) await as('planner', (c) => createDocking(c, { assetId, kind: 'renewal-survey', plannedStart: day(600 + 400 * i), yard: 'Counting Yard' }));
  for (let i = 0; i < scale; i++) await as('engineer', (c) => createDesign(c, { assetId }));
  // Every fitted group of the first vessel booked at its docking: some ordered, some already fitted.
  const booked = await em.fork().find(AnodeGroupSchema, { asset: assetId, removedOn: null }, { orderBy: { label: 'asc' } });
  for (const [k, group] of booked.entries()) {
    const renewal = await as('planner', (c) => addRenewal(c, dockingIds[0], { groupId: group.id, reason: 'damage' }));
    if (k % 4 === 1) await as('planner', (c) => markRenewalOrdered(c, renewal.id));
    if (k % 4 === 2) await as('planner', (c) => markRenewalFitted(c, renewal.id, { fittedOn: day(-1) }));
  }
  const readings = labels.map((label, k) => ({ location: `Frame ${k + 1}`, potentialV: -0.95 - k / 1000, electrode: 'ag-agcl-seawater', anodeGroupLabel: label, remainingFraction: 0.7 }));
  const surveyIds: string[] = [];
  for (let i = 0; i < scale; i++) {
    surveyIds.push((await as('inspector', (c) => createSurvey(c, { assetId: i % 2 ? assetIds[i] : assetId, surveyedOn: day(-20 - i), method: 'diver', defaultElectrode: 'ag-agcl-seawater', readings }))).id);
  }
  let attachmentId = '';
  for (let i = 0; i < scale; i++) attachmentId = (await as('inspector', (c) => addSurveyAttachment(c, surveyIds[0], { name: `photo-${i + 1}.png`, bytes: PNG_HEADER }, `Photo ${i + 1}`))).id;
  for (let i = 0; i < scale; i++) {
    const doomed = await as('inspector', (c) => createSurvey(c, { assetId, surveyedOn: day(-100 - i), method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater', readings: readings.slice(0, 2) }));
    await as('engineer', (c) => deleteSurvey(c, doomed.id));
  }
  await outboxSettled();
  return { name, organisation, users, assetId, dockingId: dockingIds[0], surveyId: surveyIds[0], attachmentId, approvedDesignId: approved[0], draftDesignId: draftDesignIds[0] };
}

// ---------- counting ----------

/** Every statement the ORM sends to PostgreSQL while recording (begin and commit included), as logged. */
let recorded: string[] | null = null;

interface Counted<T> {
  count: number;
  statements: string[];
  value: T;
}

async function countStatements<T>(run: () => Promise<T>): Promise<Counted<T>> {
  // Mail kicked after an earlier commit must not be counted as this request's statements.
  await outboxSettled();
  recorded = [];
  queryCounter.count = 0;
  let value: T;
  let statements: string[];
  try {
    value = await run();
  } finally {
    statements = recorded;
    recorded = null;
  }
  const count = queryCounter.count;
  // The logger hook and the ORM's own counter see the same statements.
  expect(statements).toHaveLength(count);
  return { count, statements, value };
}

/** A statement with its values blanked, so the same statement with other ids reads the same. */
const shape = (sql: string) =>
  sql
    .replace(/'(?:[^']|'')*'/g, '?')
    .replace(/\b\d+(\.\d+)?\b/g, '?')
    .replace(/\((\s*\$?\?\s*,?)+\)/g, '(?)')
    .replace(/\s+/g, ' ')
    .slice(0, 240);

/** Which statement shapes the large organisation ran more often than the small one, and how often. */
function growth(small: string[], large: string[]): string {
  const tally = (list: string[]) => list.reduce((m, s) => m.set(shape(s), (m.get(shape(s)) ?? 0) + 1), new Map<string, number>());
  const a = tally(small);
  const b = tally(large);
  const lines = [...new Set([...a.keys(), ...b.keys()])]
    .filter((k) => (a.get(k) ?? 0) !== (b.get(k) ?? 0))
    .map((k) => `  ${a.get(k) ?? 0} -> ${b.get(k) ?? 0}: ${k}`);
  return lines.length ? `\nstatements whose number differs (small -> large):\n${lines.join('\n')}` : '';
}

const report: string[] = [];

function expectConstant(name: string, small: Counted<unknown>, large: Counted<unknown>, sizes?: [number, number]) {
  report.push(`${name}: small ${small.count}, large ${large.count}${sizes ? ` (data ${sizes[0]} vs ${sizes[1]})` : ''}`);
  expect(small.count, `${name}: no statement counted at all`).toBeGreaterThan(0);
  expect(large.count, `${name}: ${small.count} statements with the small organisation, ${large.count} with the large one${growth(small.statements, large.statements)}`).toBe(small.count);
}

// ---------- route handlers ----------

type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface Answer {
  status: number;
  type: string;
  text: string;
  body: any;
}

interface RouteCase {
  /** The route's folder under app/api/orgs/[org]. */
  path: string;
  /** What is asked of it. */
  name: string;
  method?: 'GET' | 'POST';
  params?: (o: Built) => Record<string, string>;
  search?: string | ((o: Built) => string);
  body?: unknown;
  /** How much data the answer carries, where that can be read: it must be larger for the large organisation. */
  size?: (a: Answer) => number;
  /** The status of a good answer (200 unless stated). */
  status?: number;
}

const lines = (a: Answer) => a.text.trim().split('\r\n').length;

const ROUTE_CASES: RouteCase[] = [
  { name: 'GET assets (fleet overview)', path: 'assets', size: (a) => a.body.total },
  { name: 'GET assets, pages of 5, sorted by name', path: 'assets', search: '?pageSize=5&sort=name&dir=desc', size: (a) => a.body.total },
  { name: 'GET anode-groups (register)', path: 'anode-groups', size: (a) => a.body.total },
  { name: 'GET anode-groups sorted by remaining', path: 'anode-groups', search: '?sort=remaining&dir=desc', size: (a) => a.body.total },
  { name: 'GET anode-groups, removed groups', path: 'anode-groups', search: '?archived=1', size: (a) => a.body.total },
  { name: 'GET anode-groups searched', path: 'anode-groups', search: '?q=rudder', size: (a) => a.body.total },
  { name: 'GET anode-groups/export (CSV)', path: 'anode-groups/export', size: lines },
  { name: 'GET surveys', path: 'surveys', size: (a) => a.body.total },
  { name: 'GET surveys of one asset', path: 'surveys', search: (o) => `?assetId=${o.assetId}`, size: (a) => a.body.total },
  { name: 'GET designs', path: 'designs', size: (a) => a.body.designs.length },
  { name: 'GET designs of one asset', path: 'designs', search: (o) => `?assetId=${o.assetId}`, size: (a) => a.body.designs.length },
  { name: 'GET designs/[designId] (approved)', path: 'designs/[designId]', params: (o) => ({ designId: o.approvedDesignId }) },
  { name: 'GET designs/[designId] (draft)', path: 'designs/[designId]', params: (o) => ({ designId: o.draftDesignId }) },
  { name: 'GET designs/[designId]/note (PDF, approved)', path: 'designs/[designId]/note', params: (o) => ({ designId: o.approvedDesignId }) },
  { name: 'GET designs/[designId]/note (PDF, draft)', path: 'designs/[designId]/note', params: (o) => ({ designId: o.draftDesignId }) },
  { name: 'GET assets/[assetId]/figures/[figure] (a view of the drawing)', path: 'assets/[assetId]/figures/[figure]', params: (o) => ({ assetId: o.assetId, figure: 'port' }) },
  { name: 'GET assets/[assetId]/figures/[figure] (the depletion chart)', path: 'assets/[assetId]/figures/[figure]', params: (o) => ({ assetId: o.assetId, figure: 'chart' }) },
  { name: 'GET catalogue', path: 'catalogue', size: (a) => a.body.models.length },
  { name: 'GET audit', path: 'audit', size: (a) => a.body.total },
  { name: 'GET team', path: 'team', size: (a) => a.body.members.length + a.body.invitations.length },
  { name: 'GET dockings/[dockingId]/renewals', path: 'dockings/[dockingId]/renewals', params: (o) => ({ dockingId: o.dockingId }), size: (a) => a.body.renewals.length },
  { name: 'GET dockings/[dockingId]/anode-list (CSV)', path: 'dockings/[dockingId]/anode-list', params: (o) => ({ dockingId: o.dockingId }), search: '?format=csv', size: lines },
  { name: 'GET dockings/[dockingId]/anode-list (PDF)', path: 'dockings/[dockingId]/anode-list', params: (o) => ({ dockingId: o.dockingId }) },
  // A redirect to the stored file's short-lived link in the object storage.
  { name: 'GET surveys/[surveyId]/attachments/[attachmentId]', path: 'surveys/[surveyId]/attachments/[attachmentId]', params: (o) => ({ surveyId: o.surveyId, attachmentId: o.attachmentId }), status: 302 },
  { name: 'GET surveys/template', path: 'surveys/template' },
  { name: 'POST calculations', path: 'calculations', method: 'POST', body: CALCULATION },
];

async function callRoute(route: RouteCase, o: Built): Promise<Answer> {
  const method = route.method ?? 'GET';
  const handler = (await importFile(`app/api/orgs/[org]/${route.path}/route.ts`))[method] as Handler;
  const init = route.body === undefined ? undefined : { method, body: JSON.stringify(route.body), headers: { 'content-type': 'application/json' } };
  const search = typeof route.search === 'function' ? route.search(o) : (route.search ?? '');
  const req = new NextRequest(`http://127.0.0.1/api/orgs/${o.organisation.slug}/${route.path}${search}`, init);
  const res = await handler(req, { params: Promise.resolve({ org: o.organisation.slug, ...(route.params?.(o) ?? {}) }) });
  const type = res.headers.get('content-type') ?? '';
  const text = new TextDecoder().decode(await res.arrayBuffer());
  return { status: res.status, type, text, body: type.startsWith('application/json') ? JSON.parse(text) : undefined };
}

// ---------- services the pages call directly ----------

interface ServiceCase {
  name: string;
  run: (ctx: OrgContext, o: Built) => Promise<unknown>;
  size?: (value: any) => number;
}

const SERVICE_CASES: ServiceCase[] = [
  { name: 'fleet page: getFirstRun', run: (c) => getFirstRun(c) },
  { name: 'fleet page (its table): listFleet', run: (c) => listFleet(c, listQuerySchema.parse({})), size: (v) => v.total },
  { name: 'asset page: getAssetPage', run: (c, o) => getAssetPage(c, o.assetId), size: (v) => v.zones.length + v.designs.length + v.surveys.length + v.forecasts.length + v.dockings.length },
  { name: 'planner page: getPlannerView', run: (c) => getPlannerView(c), size: (v) => v.assets.length + v.dockings.length },
  { name: 'docking page: listDockingRenewals', run: (c, o) => listDockingRenewals(c, o.dockingId), size: (v) => v.rows.length },
  { name: 'docking and design pages: listPlannedDockings', run: (c, o) => listPlannedDockings(c, o.assetId), size: (v) => v.length },
  { name: 'docking and survey pages: listGroupChoices', run: (c, o) => listGroupChoices(c, o.assetId), size: (v) => v.length },
  { name: 'design page: getDesignDesk (draft)', run: (c, o) => getDesignDesk(c, o.draftDesignId) },
  { name: 'design page: getDesignDesk (approved)', run: (c, o) => getDesignDesk(c, o.approvedDesignId) },
  { name: 'design page: proposeDesignPositions (approved)', run: (c, o) => proposeDesignPositions(c, o.approvedDesignId) },
  { name: 'designs page: listDesigns', run: (c) => listDesigns(c), size: (v) => v.length },
  { name: 'designs and surveys pages: listAssetChoices', run: (c) => listAssetChoices(c), size: (v) => v.length },
  { name: 'survey page: getSurveyDetails', run: (c, o) => getSurveyDetails(c, o.surveyId), size: (v) => v.readings.length + v.attachments.length },
  { name: 'surveys page: listDeletedSurveys', run: (c) => listDeletedSurveys(c), size: (v) => v.length },
  { name: 'catalogue page: listCatalogue', run: (c) => listCatalogue(c, { includeArchived: true }), size: (v) => v.length },
  { name: 'audit page: getAuditLog', run: (c) => getAuditLog(c, { page: 1 }), size: (v) => v.total },
];

/** As a server component does it: the membership from the slug (getPageOrgContext), then the service. */
async function callService(service: ServiceCase, o: Built) {
  const owner = o.users.owner;
  const ctx = await getOrgContextOrThrow(await getEm(), { id: owner.id, email: owner.email, name: owner.name, emailVerified: true }, o.organisation.slug, null, new Effects());
  return service.run(ctx, o);
}

// ---------- the tests ----------

let small: Built;
let large: Built;

beforeAll(async () => {
  const logger = (await getOrm()).config.getLogger();
  const logQuery = logger.logQuery.bind(logger);
  logger.logQuery = (context) => {
    recorded?.push(context.query ?? '');
    return logQuery(context);
  };
  small = await buildOrganisation('Small Counting Harbour', 1);
  large = await buildOrganisation('Large Counting Harbour', 10);
}, 300_000);

afterAll(async () => {
  console.log(`SQL statements per request (small organisation / large organisation):\n${report.map((r) => `  ${r}`).join('\n')}`);
  await (await getOrm()).close(true);
});

describe('SQL statements per route request do not grow with the organisation', () => {
  it('every GET route handler under app/api/orgs/[org] is counted, and the calculations POST', async () => {
    const found: string[] = [];
    for (const file of await filesNamed('app/api/orgs', 'route.ts')) {
      if (typeof (await importFile(file)).GET === 'function') found.push(file.replace(/^app\/api\/orgs\/\[org\]\//, '').replace(/\/route\.ts$/, ''));
    }
    const counted = new Set(ROUTE_CASES.filter((r) => (r.method ?? 'GET') === 'GET').map((r) => r.path));
    expect(found.filter((path) => !counted.has(path)), 'GET routes without a counting case').toEqual([]);
    expect(ROUTE_CASES.some((r) => r.path === 'calculations' && r.method === 'POST')).toBe(true);
  });

  for (const route of ROUTE_CASES) {
    it(route.name, async () => {
      const measure = async (o: Built) => {
        await signInAs(o.users.owner);
        const counted = await countStatements(() => callRoute(route, o));
        expect(counted.value.status, `${route.name} for ${o.name}: ${counted.value.text.slice(0, 300)}`).toBe(route.status ?? 200);
        return counted;
      };
      const s = await measure(small);
      const l = await measure(large);
      const sizes = route.size ? ([route.size(s.value), route.size(l.value)] as [number, number]) : undefined;
      if (sizes) expect(sizes[1], `${route.name}: the large organisation's answer carries more`).toBeGreaterThan(sizes[0]);
      expectConstant(route.name, s, l, sizes);
    });
  }
});

describe('SQL statements per page service call do not grow with the organisation', () => {
  for (const service of SERVICE_CASES) {
    it(service.name, async () => {
      const s = await countStatements(() => callService(service, small));
      const l = await countStatements(() => callService(service, large));
      const sizes = service.size ? ([service.size(s.value), service.size(l.value)] as [number, number]) : undefined;
      if (sizes) expect(sizes[1], `${service.name}: the large organisation's answer carries more`).toBeGreaterThan(sizes[0]);
      expectConstant(service.name, s, l, sizes);
    });
  }
});
