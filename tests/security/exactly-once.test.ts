import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { addDays } from 'date-fns';
import { NextRequest } from 'next/server';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { getURLFromRedirectError } from 'next/dist/client/components/redirect';
import { AuditEventSchema, OrganisationSchema, RenewalSchema, ZoneSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import type { OrgContext } from '@/lib/server/org-context';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { confirmRenewal } from '@/lib/server/services/planner/renewals';
import { deleteExpiredIdempotencyKeys } from '@/lib/server/idempotency';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { databaseFingerprint, signInAs } from '../fixtures/entry-points';
import { atOnce } from '../fixtures/at-once';

vi.mock('next/headers', () => nextHeadersMock);

// Double submits and retries, fired at the real server actions and route handlers at the same moment (behind a
// barrier): each write is done once, every caller gets the first result, and what must be unique stays unique.

type State = { ok: boolean; message?: string; fieldErrors?: Record<string, string[]> };
type Outcome = { state?: State; redirect?: string };
type OrgFixture = { organisation: Organisation; users: Record<Role, User> };

let home: OrgFixture;
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
let serial = 0;
const unique = (label: string) => `${label} ${++serial}`;
const as = async <T,>(role: Role, work: (c: OrgContext) => Promise<T>, org: OrgFixture = home) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);

function formDataOf(input: Record<string, unknown>) {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) form.set(key, String(value));
  return form;
}

async function invoke(call: () => Promise<unknown>): Promise<Outcome> {
  try {
    return { state: (await call()) as State };
  } catch (error) {
    if (isRedirectError(error)) return { redirect: getURLFromRedirectError(error) };
    throw error;
  }
}


type FormAction = (slug: string, previous: State, formData: FormData) => Promise<State>;
const form = (action: FormAction, input: Record<string, unknown>) => invoke(() => action(home.organisation.slug, { ok: false }, formDataOf(input)));

async function count(sql: string, params: unknown[]): Promise<number> {
  const [row] = await (await getEm()).execute<{ n: string }[]>(sql, params);
  return Number(row!.n);
}

/** A group on the renewal vessel with a renewal booked (confirmed) at the vessel's docking. */
async function bookedRenewal(vesselId: string) {
  const group = await as('engineer', (c) => createAnodeGroup(c, vesselId, { label: unique('Renewal group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
  const proposed = await (await getEm()).findOneOrFail(RenewalSchema, { group: group.id, status: 'proposed' });
  await as('planner', (c) => confirmRenewal(c, proposed.id));
  return { groupId: group.id, renewalId: proposed.id };
}

const fixtures: Record<string, string> = {};
const vessel = { kind: 'vessel', hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 } as const;

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Exactly Once Harbour');
  fixtures.vessel = (await as('engineer', (c) => createAsset(c, { ...vessel, name: 'Once Vessel' }))).id;
  fixtures.renewalVessel = (await as('engineer', (c) => createAsset(c, { ...vessel, name: 'Once Renewal Vessel' }))).id;
  fixtures.renewalDocking = (await as('planner', (c) => createDocking(c, { assetId: fixtures.renewalVessel, kind: 'intermediate', plannedStart: day(200), yard: 'Once Yard' }))).id;
});

afterAll(async () => (await getOrm()).close(true));

describe('a double submit (one form, one key) is done once and both callers get the first result', () => {
  it('dockings', async () => {
    const { createDockingAction } = await import('@/app/o/[org]/dockings/actions');
    await signInAs(home.users.planner);
    const yard = unique('Double Yard');
    const input = { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(420), yard, idempotencyKey: randomUUID() };
    const outcomes = await atOnce(4, () => form(createDockingAction, input));
    expect(await count(`select count(*) as n from docking where yard = ?`, [yard])).toBe(1);
    const [docking] = await (await getEm()).execute<{ id: string }[]>(`select id from docking where yard = ?`, [yard]);
    for (const o of outcomes) expect(o).toEqual({ redirect: `/o/${home.organisation.slug}/dockings/${docking!.id}` });
  });

  it('anode groups with the same label', async () => {
    const { createAnodeGroupAction } = await import('@/app/o/[org]/assets/actions');
    await signInAs(home.users.engineer);
    const label = unique('Double label');
    const input = { assetId: fixtures.vessel, label, anodeModelKey: 'builtin:TW-AW-4020', quantity: '4', installedOn: day(-30), idempotencyKey: randomUUID() };
    const outcomes = await atOnce(4, () => form(createAnodeGroupAction, input));
    expect(await count(`select count(*) as n from anode_group where asset_id = ? and label = ?`, [fixtures.vessel, label])).toBe(1);
    for (const o of outcomes) expect(o.state).toEqual({ ok: true, message: `4 × TW-AW-4020 recorded as "${label}".` });
  });

  it('manual renewals', async () => {
    const { addRenewalAction } = await import('@/app/o/[org]/dockings/actions');
    const group = await as('engineer', (c) => createAnodeGroup(c, fixtures.renewalVessel, { label: unique('Damaged group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 6, installedOn: day(-100) }));
    await signInAs(home.users.planner);
    const input = { dockingId: fixtures.renewalDocking, groupId: group.id, reason: 'damage', quantity: '3', notes: 'Lost two', idempotencyKey: randomUUID() };
    const outcomes = await atOnce(4, () => form(addRenewalAction, input));
    expect(await count(`select count(*) as n from renewal where group_id = ? and status in ('confirmed', 'ordered')`, [group.id])).toBe(1);
    for (const o of outcomes) expect(o.state).toEqual({ ok: true, message: 'Renewal booked.' });
  });

  it('record as fitted: the register gets one new group', async () => {
    const { renewalStepAction } = await import('@/app/o/[org]/dockings/actions');
    const { groupId, renewalId } = await bookedRenewal(fixtures.renewalVessel);
    await signInAs(home.users.planner);
    const input = { renewalId, step: 'fitted', fittedOn: day(0), idempotencyKey: randomUUID() };
    const outcomes = await atOnce(4, () => form(renewalStepAction, input));
    expect(await count(`select count(*) as n from anode_group where replaces_group_id = ?`, [groupId])).toBe(1);
    for (const o of outcomes) expect(o.state).toEqual({ ok: true, message: 'Recorded as fitted: the new anodes are in the register and the old group is closed.' });
  });

  it('surveys', async () => {
    const { createSurveyAction } = await import('@/app/o/[org]/surveys/actions');
    await signInAs(home.users.inspector);
    const surveyor = unique('Double Divers');
    const input = { assetId: fixtures.vessel, surveyedOn: day(-2), method: 'diver', surveyor, defaultElectrode: 'ag-agcl-seawater', idempotencyKey: randomUUID() };
    const outcomes = await atOnce(4, () => form(createSurveyAction, input));
    expect(await count(`select count(*) as n from survey where surveyor = ?`, [surveyor])).toBe(1);
    const [survey] = await (await getEm()).execute<{ id: string }[]>(`select id from survey where surveyor = ?`, [surveyor]);
    for (const o of outcomes) expect(o).toEqual({ redirect: `/o/${home.organisation.slug}/surveys/${survey!.id}` });
  });

  it('invitations: one invitation and one e-mail', async () => {
    const { inviteMemberAction } = await import('@/app/o/[org]/team/actions');
    await signInAs(home.users.owner);
    const email = `double-${randomUUID().slice(0, 8)}@test.example`;
    const idempotencyKey = randomUUID();
    const outcomes = await atOnce(4, () => form(inviteMemberAction, { email, role: 'planner', idempotencyKey }));
    expect(await count(`select count(*) as n from invitation where email = ?`, [email])).toBe(1);
    expect(await count(`select count(*) as n from outbox_message where to_address = ?`, [email])).toBe(1);
    for (const o of outcomes) expect(o.state).toEqual({ ok: true, message: `Invitation to ${email} queued for sending. The link expires in 7 days.` });
  });

  it('a public action (a new organisation): one organisation, the same redirect', async () => {
    const { createOrganisationAction } = await import('@/app/orgs/actions');
    await signInAs(home.users.owner);
    const name = unique('Double Marine');
    const idempotencyKey = randomUUID();
    const outcomes = await atOnce(4, () => invoke(() => createOrganisationAction({ ok: false }, formDataOf({ name, idempotencyKey }))));
    expect(await count(`select count(*) as n from organisation where name = ?`, [name])).toBe(1);
    const [org] = await (await getEm()).execute<{ slug: string }[]>(`select slug from organisation where name = ?`, [name]);
    for (const o of outcomes) expect(o).toEqual({ redirect: `/o/${org!.slug}` });
  });

  it('a JSON request to a route handler with one Idempotency-Key: one asset, the same answer', async () => {
    const { POST } = await import('@/app/api/orgs/[org]/assets/route');
    await signInAs(home.users.engineer);
    const name = unique('Route boat');
    const key = randomUUID();
    const responses = await atOnce(4, async () => {
      const req = new NextRequest(`http://127.0.0.1/api/orgs/${home.organisation.slug}/assets`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'idempotency-key': key},
        body: JSON.stringify({ kind: 'vessel', name, hullMaterial: 'steel' }),
      });
      const res = await POST(req, { params: Promise.resolve({ org: home.organisation.slug }) });
      return { status: res.status, body: await res.json() };
    });
    expect(await count(`select count(*) as n from asset where name = ?`, [name])).toBe(1);
    expect(responses[0]!.status).toBe(201);
    for (const r of responses) expect(r).toEqual(responses[0]);
  });
});

describe('separate submits at the same moment (different keys): the database keeps what must be unique', () => {
  it('two groups with one label on one asset: one is recorded, the others are told why', async () => {
    const { createAnodeGroupAction } = await import('@/app/o/[org]/assets/actions');
    await signInAs(home.users.engineer);
    const label = unique('Contested label');
    const outcomes = await atOnce(4, () => form(createAnodeGroupAction, { assetId: fixtures.vessel, label, anodeModelKey: 'builtin:TW-AW-4020', quantity: '4', installedOn: day(-30), idempotencyKey: randomUUID() }));
    expect(await count(`select count(*) as n from anode_group where asset_id = ? and label = ? and removed_on is null`, [fixtures.vessel, label])).toBe(1);
    expect(outcomes.filter((o) => o.state?.ok)).toHaveLength(1);
    for (const o of outcomes.filter((o) => !o.state?.ok)) expect(o.state?.message).toBe('Another group on this asset has that label.');
  });

  it('a renewal recorded as fitted from two pages: one new group, the second told it is fitted', async () => {
    const { renewalStepAction } = await import('@/app/o/[org]/dockings/actions');
    const { groupId, renewalId } = await bookedRenewal(fixtures.renewalVessel);
    await signInAs(home.users.planner);
    const outcomes = await atOnce(4, () => form(renewalStepAction, { renewalId, step: 'fitted', fittedOn: day(0), idempotencyKey: randomUUID() }));
    expect(await count(`select count(*) as n from anode_group where replaces_group_id = ?`, [groupId])).toBe(1);
    expect(outcomes.filter((o) => o.state?.ok)).toHaveLength(1);
    for (const o of outcomes.filter((o) => !o.state?.ok)) expect(o.state?.message).toBe('This renewal is fitted.');
  });

  it('one group booked for renewal twice: one booking', async () => {
    const { addRenewalAction } = await import('@/app/o/[org]/dockings/actions');
    const group = await as('engineer', (c) => createAnodeGroup(c, fixtures.renewalVessel, { label: unique('Booked twice'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 6, installedOn: day(-100) }));
    await signInAs(home.users.planner);
    const outcomes = await atOnce(4, () => form(addRenewalAction, { dockingId: fixtures.renewalDocking, groupId: group.id, reason: 'damage', quantity: '3', idempotencyKey: randomUUID() }));
    expect(await count(`select count(*) as n from renewal where group_id = ? and status in ('confirmed', 'ordered')`, [group.id])).toBe(1);
    expect(outcomes.filter((o) => o.state?.ok)).toHaveLength(1);
  });

  it('one address invited twice: one live invitation', async () => {
    const { inviteMemberAction } = await import('@/app/o/[org]/team/actions');
    await signInAs(home.users.owner);
    const email = `twice-${randomUUID().slice(0, 8)}@test.example`;
    const outcomes = await atOnce(4, () => form(inviteMemberAction, { email, role: 'planner', idempotencyKey: randomUUID() }));
    expect(await count(`select count(*) as n from invitation where organisation_id = ? and email = ? and accepted_at is null and revoked_at is null`, [home.organisation.id, email])).toBe(1);
    for (const o of outcomes) expect(o.state?.ok).toBe(true);
  });

  it('six creates for the one free slot of the plan: the limit holds exactly', async () => {
    const { createAssetAction } = await import('@/app/o/[org]/assets/actions');
    const limited = await makeOrgWithRoles(await getEm(), 'Limited Harbour');
    const em = await getEm();
    const org = await em.findOneOrFail(OrganisationSchema, { id: limited.organisation.id });
    org.plan = 'harbour';
    org.subscriptionStatus = 'active';
    await em.flush();
    for (const name of ['Slot one', 'Slot two']) await as('engineer', (c) => createAsset(c, { kind: 'vessel', name, hullMaterial: 'steel' }), limited);
    await signInAs(limited.users.engineer);
    const outcomes = await atOnce(6, (i) => invoke(() => createAssetAction(limited.organisation.slug, { ok: false }, formDataOf({ kind: 'vessel', name: `Contender ${i}`, hullMaterial: 'steel', idempotencyKey: randomUUID() }))));
    expect(await count(`select count(*) as n from asset where organisation_id = ? and archived_at is null`, [limited.organisation.id])).toBe(3);
    expect(outcomes.filter((o) => o.redirect)).toHaveLength(1);
    for (const o of outcomes.filter((o) => !o.redirect)) expect(o.state?.message).toMatch(/^Your Harbour plan covers 3 active vessels and structures and 3 are in use\./);
  });
});

describe('keys', () => {
  it('the same key with other values is refused with a clear message and writes nothing', async () => {
    const { createDockingAction } = await import('@/app/o/[org]/dockings/actions');
    await signInAs(home.users.planner);
    const key = randomUUID();
    const first = await form(createDockingAction, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(500), yard: unique('Key Yard'), idempotencyKey: key });
    expect(first.redirect).toBeDefined();
    const before = await databaseFingerprint();
    const second = await form(createDockingAction, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(501), yard: unique('Other Yard'), idempotencyKey: key });
    expect(second.state).toMatchObject({ ok: false, message: 'This form was already sent with other values. Reload the page to send the new values. Nothing was changed.' });
    expect(await databaseFingerprint()).toEqual(before);
  });

  it('a key that is not a UUID is refused and nothing is written', async () => {
    const { createDockingAction } = await import('@/app/o/[org]/dockings/actions');
    await signInAs(home.users.planner);
    const before = await databaseFingerprint();
    const outcome = await form(createDockingAction, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(502), yard: 'Bad key yard', idempotencyKey: 'not-a-key' });
    expect(outcome.state?.ok).toBe(false);
    expect(outcome.state?.message).toMatch(/damaged key/);
    expect(await databaseFingerprint()).toEqual(before);
  });

  it('a refused write does not spend its key: the corrected form goes through', async () => {
    const { createDockingAction } = await import('@/app/o/[org]/dockings/actions');
    await signInAs(home.users.planner);
    const key = randomUUID();
    const yard = unique('Corrected Yard');
    const refused = await form(createDockingAction, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: 'soon', yard, idempotencyKey: key });
    expect(refused.state?.ok).toBe(false);
    const accepted = await form(createDockingAction, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(503), yard, idempotencyKey: key });
    expect(accepted.redirect).toMatch(/^\/o\/[\w-]+\/dockings\//);
    expect(await count(`select count(*) as n from docking where yard = ?`, [yard])).toBe(1);
  });

  it('keys older than the window are forgotten', async () => {
    const em = await getEm();
    const owner = home.users.owner.id;
    const [oldKey, newKey] = [randomUUID(), randomUUID()];
    await em.execute(`insert into idempotency_key (owner, key, fingerprint, result, created_at) values (?, ?, 'x', '{}', now() - interval '3 days'), (?, ?, 'x', '{}', now())`, [owner, oldKey, owner, newKey]);
    expect(await deleteExpiredIdempotencyKeys(em)).toBeGreaterThanOrEqual(1);
    const left = await em.execute<{ key: string }[]>(`select key from idempotency_key where owner = ? and key in (?, ?)`, [owner, oldKey, newKey]);
    expect(left.map((r) => r.key)).toEqual([newKey]);
  });
});

describe('a refused action writes nothing', () => {
  it('archiving a zone without its id: refused, the zone stays and no audit row is written', async () => {
    const { archiveZoneAction } = await import('@/app/o/[org]/assets/actions');
    const zone = await as('engineer', (c) => createZone(c, fixtures.vessel, { kind: 'hull-bottom', areaM2: 100, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30', name: unique('Kept zone') }));
    await signInAs(home.users.engineer);
    const before = await databaseFingerprint();
    const outcome = await form(archiveZoneAction, { assetId: fixtures.vessel });
    expect(outcome.state).toMatchObject({ ok: false, message: 'The form is missing an identifier; reload the page.' });
    expect(await databaseFingerprint()).toEqual(before);
    const em = await getEm();
    expect((await em.findOneOrFail(ZoneSchema, { id: zone.id })).archivedAt).toBeNull();
    expect(await em.count(AuditEventSchema, { action: 'zone.archived', targetId: zone.id })).toBe(0);
  });
});
