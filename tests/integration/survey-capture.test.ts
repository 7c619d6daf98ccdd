import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import { AuditEventSchema, OutboxMessageSchema, SurveyReadingSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { deleteSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { deleteReading, restoreReading } from '@/lib/server/services/surveys/correct-readings';
import { CAPTURE_CONFLICT_MESSAGES } from '@/lib/labels';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { Migration20261218000000_reading_device_ids_kept } from '@/migrations/Migration20261218000000_reading_device_ids_kept';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { signInAs, signedInUserId } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

// The capture route: a phone's queue sent in batches, each item recorded once by the UUID the phone gave it.
let org: { organisation: Organisation; users: Record<Role, User> };
let other: { organisation: Organisation; users: Record<Role, User> };
let assetId: string;
let groupId: string;
const as = async <T,>(role: Role, work: Parameters<typeof runAs<T>>[1]) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);
let serial = 0;
const newSurvey = () => as('inspector', (c) => createSurvey(c, { assetId, surveyedOn: `2025-0${1 + (++serial % 9)}-0${1 + (serial % 9)}`, method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater' }));
const reading = (location: string, extra: Record<string, unknown> = {}) => ({ deviceId: randomUUID(), kind: 'reading', location, potentialV: -0.95, ...extra });
const readingsOf = async (surveyId: string) => (await getEm()).find(SurveyReadingSchema, { survey: surveyId }, { orderBy: { location: 'asc' } });

// Sent as captured by the member signed in, as the phone does, unless the body names someone.
async function send(surveyId: string, body: Record<string, unknown>, slug = org.organisation.slug) {
  const { POST } = await import('@/app/api/orgs/[org]/surveys/[surveyId]/capture/route');
  const sent = 'capturedBy' in body ? body : { capturedBy: signedInUserId(), ...body };
  const req = new NextRequest(`http://127.0.0.1/api/orgs/${slug}/surveys/${surveyId}/capture`, { method: 'POST', body: JSON.stringify(sent), headers: { 'content-type': 'application/json' } });
  const res = await POST(req, { params: Promise.resolve({ org: slug, surveyId }) });
  return { status: res.status, body: await res.json() };
}

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Capture Quay Works');
  other = await makeOrgWithRoles(await getEm(), 'Capture Other Port');
  assetId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Capture Pontoon', structureType: 'jetty', waterType: 'seawater' }))).id;
  groupId = (await as('engineer', (c) => createAnodeGroup(c, assetId, { label: 'Pile bracelets', anodeModelKey: 'builtin:TW-AW-4020', quantity: 12, installedOn: '2024-03-01', meanCurrentA: 4 }))).id;
});
afterAll(async () => (await getOrm()).close(true));

describe('POST /api/orgs/[org]/surveys/[surveyId]/capture', () => {
  it('records each item of a batch once: a duplicate inside the batch and the same batch again answer duplicate with the same reading', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const a = reading('Fr 22 P', { anodeGroupId: groupId, remainingFraction: 0.6, comment: 'Bracelet sound' });
    const b = reading('Fr 24 P', { potentialV: -1.0, electrode: 'cse' });
    const c = reading('Fr 26 P', { potentialV: null, remainingFraction: 0.4 });
    const first = await send(survey.id, { items: [a, b, a, c] });
    expect(first.status).toBe(200);
    expect(first.body.results.map((r: { status: string }) => r.status)).toEqual(['recorded', 'recorded', 'duplicate', 'recorded']);
    expect(first.body.results[2].readingId).toBe(first.body.results[0].readingId);
    expect(first.body.results[0].message).toMatch(/^Recorded at Fr 22 P: -0\.950 V against Ag\/AgCl\/seawater: protected/);

    const rows = await readingsOf(survey.id);
    expect(rows.map((r) => r.location)).toEqual(['Fr 22 P', 'Fr 24 P', 'Fr 26 P']);
    expect(rows[0]).toMatchObject({ deviceId: a.deviceId, remainingFraction: 0.6, comment: 'Bracelet sound', electrode: 'ag-agcl-seawater' });
    expect(rows[0].anodeGroup?.id).toBe(groupId);
    // -1.00 V CSE is about -0.95 V Ag/AgCl/seawater (50 mV between them): common practice
    expect(rows[1].potentialAgAgClV).toBeCloseTo(-0.95, 2);
    expect(rows[2]).toMatchObject({ potentialV: null, electrode: null, remainingFraction: 0.4 });

    const again = await send(survey.id, { items: [a, b, c] });
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(['duplicate', 'duplicate', 'duplicate']);
    expect(again.body.results.map((r: { readingId: string }) => r.readingId)).toEqual(first.body.results.filter((_: unknown, i: number) => i !== 2).map((r: { readingId: string }) => r.readingId));
    expect(await readingsOf(survey.id)).toHaveLength(3);
  });

  it('a reading deleted on the desk does not come back when the phone resends it after a lost answer; undone, it answers duplicate again', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const a = reading('Pile C3');
    const first = await send(survey.id, { items: [a] });
    expect(first.body.results[0].status).toBe('recorded');
    const readingId = first.body.results[0].readingId as string;
    await as('engineer', (c) => deleteReading(c, survey.id, readingId));
    expect(await readingsOf(survey.id)).toHaveLength(0);

    const resent = await send(survey.id, { items: [a] });
    expect(resent.status).toBe(200);
    expect(resent.body.results[0]).toMatchObject({ deviceId: a.deviceId, status: 'duplicate', message: CAPTURE_CONFLICT_MESSAGES.deletedSince });
    expect(await readingsOf(survey.id)).toHaveLength(0);

    // The desk's undo puts the same reading back (same id and device id): a resend names it again.
    await as('engineer', (c) => restoreReading(c, survey.id, readingId));
    const afterUndo = await send(survey.id, { items: [a] });
    expect(afterUndo.body.results[0]).toMatchObject({ status: 'duplicate', readingId });
    expect(await readingsOf(survey.id)).toHaveLength(1);
  });

  it('the migration keeps the ids of readings captured before it: those still there and those deleted since (from the audit log)', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const kept = reading('Pile D1');
    const gone = reading('Pile D2');
    const answer = await send(survey.id, { items: [kept, gone] });
    await as('engineer', (c) => deleteReading(c, survey.id, answer.body.results[1].readingId));
    const orm = await getOrm();
    const migration = new Migration20261218000000_reading_device_ids_kept(orm.em.getDriver(), orm.config);
    const used = await (await getEm()).transactional(async (tx) => {
      // As before the migration: no id kept.
      await tx.execute('delete from used_device_id where device_id in (?, ?)', [kept.deviceId, gone.deviceId]);
      migration.reset();
      migration.setTransactionContext(tx.getTransactionContext());
      await migration.up();
      for (const sql of migration.getQueries()) await tx.execute(sql as string);
      return tx.execute<{ organisation_id: string; device_id: string }[]>('select organisation_id, device_id from used_device_id where device_id in (?, ?) order by device_id', [kept.deviceId, gone.deviceId]);
    });
    expect(used).toEqual([kept.deviceId, gone.deviceId].sort().map((device_id) => ({ organisation_id: org.organisation.id, device_id })));
    // And so the deleted one is not recorded again.
    const resent = await send(survey.id, { items: [gone] });
    expect(resent.body.results[0]).toMatchObject({ status: 'duplicate', message: CAPTURE_CONFLICT_MESSAGES.deletedSince });
  });

  it('two identical batches at the same moment record each reading once', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const items = Array.from({ length: 6 }, (_, i) => reading(`Pile B${i + 1}`));
    let open!: () => void;
    const gate = new Promise<void>((resolve) => (open = resolve));
    const racers = [0, 1, 2].map(async () => {
      await gate;
      return send(survey.id, { items });
    });
    open();
    const answers = await Promise.all(racers);
    for (const answer of answers) expect(answer.status).toBe(200);
    const rows = await readingsOf(survey.id);
    expect(rows.map((r) => r.location).sort()).toEqual(items.map((i) => i.location).sort());
    // Each item: recorded exactly once over the three answers, the others duplicates naming the same reading.
    items.forEach((item, i) => {
      const statuses = answers.map((a) => a.body.results[i].status).sort();
      expect(statuses).toEqual(['duplicate', 'duplicate', 'recorded']);
      const row = rows.find((r) => r.deviceId === item.deviceId)!;
      for (const a of answers) expect(a.body.results[i].readingId).toBe(row.id);
    });
  });

  it('an invalid item is answered with its field message while the others are recorded', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const good1 = reading('Fender 1');
    const bad = reading('Fender 2', { potentialV: -7 });
    const empty = reading('Fender 3', { potentialV: null });
    const good2 = reading('Fender 4', { remainingFraction: 0.5 });
    const { status, body } = await send(survey.id, { items: [good1, bad, empty, good2] });
    expect(status).toBe(200);
    expect(body.results.map((r: { status: string }) => r.status)).toEqual(['recorded', 'invalid', 'invalid', 'recorded']);
    expect(body.results[1]).toMatchObject({ deviceId: bad.deviceId, message: 'A potential below -2.0 V is not plausible.', fieldErrors: { potentialV: ['A potential below -2.0 V is not plausible.'] } });
    expect(body.results[2].message).toBe('Enter a potential or a remaining fraction.');
    expect(body.results[1].readingId).toBeUndefined();
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['Fender 1', 'Fender 4']);
    // Corrected and sent again under the same UUID, it is recorded.
    const fixed = await send(survey.id, { items: [{ ...bad, potentialV: -0.97 }] });
    expect(fixed.body.results[0].status).toBe('recorded');
  });

  it('a batch without UUIDs is refused whole (422) and writes nothing', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const { status, body } = await send(survey.id, { items: [reading('Quay 1'), { kind: 'reading', location: 'Quay 2', potentialV: -0.9 }] });
    expect(status).toBe(422);
    expect(body.error.fieldErrors['items.1.deviceId']).toEqual(['Each item needs the UUID made on the device.']);
    expect(await readingsOf(survey.id)).toHaveLength(0);
  });

  it('a deleted survey answers 404 for the batch with the words of lib/labels (the phone marks each item), and writes nothing', async () => {
    const survey = await newSurvey();
    await as('engineer', (c) => deleteSurvey(c, survey.id));
    await signInAs(org.users.inspector);
    const { status, body } = await send(survey.id, { items: [reading('Dolphin 1'), reading('Dolphin 2')] });
    expect(status).toBe(404);
    expect(body.error).toMatchObject({ code: 'not-found', message: CAPTURE_CONFLICT_MESSAGES.surveyGone });
    const em = await getEm();
    expect(await em.count(SurveyReadingSchema, { location: { $in: ['Dolphin 1', 'Dolphin 2'] } })).toBe(0);
  });

  it('a survey deleted while a batch is under way is a conflict for the items after it', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const em = await getEm();
    const { captureReading } = await import('@/lib/server/services/surveys/capture-reading');
    await as('engineer', (c) => deleteSurvey(c, survey.id));
    const refused = await as('inspector', (c) => captureReading(c, survey.id, reading('Dolphin 3'))).then(() => null, (e) => e);
    expect(refused).toMatchObject({ code: 'conflict', message: CAPTURE_CONFLICT_MESSAGES.surveyGone });
    expect(await em.count(SurveyReadingSchema, { location: 'Dolphin 3' })).toBe(0);
  });

  it('an archived asset or a closed anode group is a conflict; an item recorded before stays a duplicate', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    const before = reading('Ladder 1');
    expect((await send(survey.id, { items: [before] })).body.results[0].status).toBe('recorded');
    const em = await getEm();
    const closedGroup = await as('engineer', (c) => createAnodeGroup(c, assetId, { label: 'Old ladder anodes', anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: '2023-03-01', meanCurrentA: 1 }));
    await em.execute(`update anode_group set removed_on = current_date where id = ?`, [closedGroup.id]);
    const otherAsset = await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Capture Other Jetty', structureType: 'jetty', waterType: 'seawater' }));
    const foreignGroup = await as('engineer', (c) => createAnodeGroup(c, otherAsset.id, { label: 'Other piles', anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: '2023-03-01', meanCurrentA: 1 }));
    const groups = await send(survey.id, { items: [reading('Ladder 2', { anodeGroupId: closedGroup.id }), reading('Ladder 3', { anodeGroupId: foreignGroup.id }), reading('Ladder 4')] });
    expect(groups.body.results.map((r: { status: string; message: string }) => [r.status, r.message])).toEqual([
      ['conflict', CAPTURE_CONFLICT_MESSAGES.groupGone],
      ['conflict', CAPTURE_CONFLICT_MESSAGES.groupNotOnAsset],
      ['recorded', expect.stringMatching(/^Recorded at Ladder 4/)],
    ]);

    await em.execute(`update asset set archived_at = now() where id = ?`, [assetId]);
    try {
      const { body } = await send(survey.id, { items: [before, reading('Ladder 5')] });
      expect(body.results.map((r: { status: string }) => r.status)).toEqual(['duplicate', 'conflict']);
      expect(body.results[1].message).toBe(CAPTURE_CONFLICT_MESSAGES.assetArchived);
    } finally {
      await em.execute(`update asset set archived_at = null where id = ?`, [assetId]);
    }
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['Ladder 1', 'Ladder 4']);
  });

  it('a member whose role lost the right to write, or a read-only organisation, gets conflicts per item and nothing is written', async () => {
    const survey = await newSurvey();
    const recorded = reading('Stair 1');
    await signInAs(org.users.inspector);
    expect((await send(survey.id, { items: [recorded] })).body.results[0].status).toBe('recorded');

    await signInAs(org.users.viewer);
    const asViewer = await send(survey.id, { items: [reading('Stair 2')] });
    expect(asViewer.status).toBe(200);
    expect(asViewer.body.results[0]).toMatchObject({ status: 'conflict', message: CAPTURE_CONFLICT_MESSAGES.notAllowed });

    const em = await getEm();
    await em.execute(`update organisation set subscription_status = 'canceled' where id = ?`, [org.organisation.id]);
    try {
      await signInAs(org.users.inspector);
      const { body } = await send(survey.id, { items: [recorded, reading('Stair 3')] });
      expect(body.results[0].status).toBe('duplicate');
      expect(body.results[1].status).toBe('conflict');
      expect(body.results[1].message).toMatch(/The subscription has ended\. The organisation is read-only/);
    } finally {
      await em.execute(`update organisation set subscription_status = ? where id = ?`, [org.organisation.subscriptionStatus, org.organisation.id]);
    }
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['Stair 1']);
  });

  it("items captured by another member on the phone are refused per item under this member's session, and recorded once their own member sends them", async () => {
    const survey = await newSurvey();
    const items = [reading('Bollard 1'), reading('Bollard 2')];
    // The inspector's session ended; the engineer signed in on the same phone, and the inspector's queue is sent with the engineer's cookie.
    await signInAs(org.users.engineer);
    const refused = await send(survey.id, { capturedBy: org.users.inspector.id, items });
    expect(refused.status).toBe(200);
    expect(refused.body.results).toEqual(items.map((i) => ({ deviceId: i.deviceId, status: 'conflict', message: CAPTURE_CONFLICT_MESSAGES.otherMember })));
    expect(await readingsOf(survey.id)).toHaveLength(0);
    const audits = await (await getEm()).count(AuditEventSchema, { organisationId: org.organisation.id, action: 'survey.reading-added', targetId: survey.id });
    expect(audits).toBe(0);

    // A batch that does not say who captured it is refused whole.
    const unnamed = await send(survey.id, { capturedBy: undefined, items });
    expect(unnamed.status).toBe(422);
    expect(await readingsOf(survey.id)).toHaveLength(0);

    await signInAs(org.users.inspector);
    const own = await send(survey.id, { capturedBy: org.users.inspector.id, items });
    expect(own.body.results.map((r: { status: string }) => r.status)).toEqual(['recorded', 'recorded']);
    const rows = await (await getEm()).find(SurveyReadingSchema, { survey: survey.id }, { orderBy: { location: 'asc' } });
    expect(rows.map((r) => r.location)).toEqual(['Bollard 1', 'Bollard 2']);
    const actors = await (await getEm()).find(AuditEventSchema, { organisationId: org.organisation.id, action: 'survey.reading-added', targetId: survey.id });
    expect(actors.map((a) => a.actorUserId)).toEqual([org.users.inspector.id, org.users.inspector.id]);
  });

  it("a non-member gets 404 for the whole batch, and so does another organisation's survey id sent to one's own", async () => {
    const survey = await newSurvey();
    await signInAs(other.users.owner);
    const outsider = await send(survey.id, { items: [reading('Gate 1')] });
    expect(outsider.status).toBe(404);
    expect(outsider.body.error.message).toBe('Organisation was not found.');
    const inOwn = await send(survey.id, { items: [reading('Gate 2')] }, other.organisation.slug);
    expect(inOwn.status).toBe(404);
    expect(inOwn.body.error.message).toBe(CAPTURE_CONFLICT_MESSAGES.surveyGone);
    expect(await readingsOf(survey.id)).toHaveLength(0);
  });

  it('an under-protected reading alerts the engineers once per survey, as a reading typed in does', async () => {
    const survey = await newSurvey();
    await signInAs(org.users.inspector);
    // Steel in aerobic seawater: under-protected less negative than -0.80 V Ag/AgCl/seawater (DNV-RP-B401, published)
    const { body } = await send(survey.id, { items: [reading('Low 1', { potentialV: -0.7 }), reading('Low 2', { potentialV: -0.72 })] });
    expect(body.results[0].message).toMatch(/It is under-protected; the engineers have been told\./);
    expect(body.results[1].message).toMatch(/It is under-protected; the engineers were already told/);
    const em = await getEm();
    const mails = await em.find(OutboxMessageSchema, { organisationId: org.organisation.id, subject: { $like: '%Capture Pontoon%' } });
    expect(mails.map((m) => m.toAddress).sort()).toEqual([org.users.engineer.email, org.users.owner.email].sort());
    const audits = await em.find(AuditEventSchema, { organisationId: org.organisation.id, action: 'survey.reading-added', targetId: survey.id });
    expect(audits).toHaveLength(2);
  });
});
