import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { atOnceSettled } from '../fixtures/at-once';
import { subMinutes } from 'date-fns';
import { AuditEventSchema, MembershipSchema, OrganisationSchema, type Organisation, type User } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { ROLES, type Role } from '@/lib/roles';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { restoreMember, MEMBER_RESTORE_MINUTES } from '@/lib/server/services/team/restore-member';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { archiveZone, createZone } from '@/lib/server/services/register/zones';
import { restoreZone } from '@/lib/server/services/register/restore-zone';
import { OutboxMessageSchema, SurveyReadingSchema, ZoneSchema } from '@/entities';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { deleteReading, restoreReading, READING_RESTORE_MINUTES } from '@/lib/server/services/surveys/correct-readings';
import { deleteSurvey, undoDeleteSurvey, SURVEY_UNDO_MINUTES } from '@/lib/server/services/surveys/manage-surveys';
import { SurveySchema, SurveyAttachmentSchema, AnodeGroupSchema, AnodeGroupChangeSchema } from '@/entities';
import { createAnodeGroup, removeAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { restoreAnodeGroup, GROUP_RESTORE_MINUTES } from '@/lib/server/services/register/restore-anode-group';
import { createAnodeModel, setAnodeModelArchived } from '@/lib/server/services/catalogue/manage-anode-models';
import { getStorage } from '@/lib/server/storage/object-storage';
import { addSurveyAttachment, deleteSurveyAttachment, purgeAttachmentBin, restoreSurveyAttachment, ATTACHMENT_UNDO_MINUTES } from '@/lib/server/services/surveys/attachments';
import { ctxFor, makeOrgWithRoles, makeUser, runAs } from '../fixtures/factories';

// Undo of "Remove member" (the same membership back, from the removal's own audit row), of "Archive zone" and of "Delete" beside a reading.
let organisation: Organisation;
let users: Record<Role, User>;
let other: { organisation: Organisation; users: Record<Role, User> };

beforeAll(async () => {
  ({ organisation, users } = await makeOrgWithRoles(await getEm(), 'Undo Harbour'));
  other = await makeOrgWithRoles(await getEm(), 'Other Undo Harbour');
});
afterAll(async () => (await getOrm()).close(true));

const as = async <T,>(role: Role, work: Parameters<typeof runAs<T>>[1], org = { organisation, users }) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);

/** A fresh member in the given role, removed by the owner; returns the removed membership's id and person. */
async function removedMember(role: Role = 'planner') {
  const em = await getEm();
  const user = await makeUser(em, { name: `Removed ${role}` });
  const membership = em.create(MembershipSchema, { organisation: em.getReference(OrganisationSchema, organisation.id), user, role });
  await em.flush();
  await as('owner', (c) => removeMember(c, { membershipId: membership.id }));
  return { membershipId: membership.id, user };
}

const membershipsOf = async (userId: string) => (await getEm()).find(MembershipSchema, { user: userId, organisation: organisation.id });
const auditRows = async (action: string, targetId: string) => (await getEm()).find(AuditEventSchema, { action, targetId });

describe('restoreMember', () => {
  it('puts the same membership back (same id, person and role) and audits it', async () => {
    const { membershipId, user } = await removedMember('planner');
    expect(await membershipsOf(user.id)).toHaveLength(0);
    const { restored } = await as('owner', (c) => restoreMember(c, { membershipId }));
    expect(restored).toBe(true);
    const back = await membershipsOf(user.id);
    expect(back.map((m) => [m.id, m.role])).toEqual([[membershipId, 'planner']]);
    const rows = await auditRows('member.restored', membershipId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.owner.id, details: { email: user.email, role: 'planner' } });
  });

  it('is idempotent: a second undo changes nothing and writes no second audit row', async () => {
    const { membershipId, user } = await removedMember('inspector');
    await as('owner', (c) => restoreMember(c, { membershipId }));
    const again = await as('owner', (c) => restoreMember(c, { membershipId }));
    expect(again.restored).toBe(false);
    expect(await membershipsOf(user.id)).toHaveLength(1);
    expect(await auditRows('member.restored', membershipId)).toHaveLength(1);
  });

  for (const role of ROLES.filter((r) => r !== 'owner')) {
    it(`${role} may not undo a removal (team:manage is the owner's)`, async () => {
      const { membershipId, user } = await removedMember();
      await expect(as(role, (c) => restoreMember(c, { membershipId }))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await membershipsOf(user.id)).toHaveLength(0);
      expect(await auditRows('member.restored', membershipId)).toHaveLength(0);
    });
  }

  it("another organisation's owner cannot bring back our member (404, nothing written)", async () => {
    const { membershipId, user } = await removedMember();
    await expect(as('owner', (c) => restoreMember(c, { membershipId }), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await membershipsOf(user.id)).toHaveLength(0);
  });

  it('a membership that was never removed here is a 404: nobody can be added this way', async () => {
    await expect(as('owner', (c) => restoreMember(c, { membershipId: crypto.randomUUID() }))).rejects.toBeInstanceOf(AppError);
  });

  it(`a removal older than ${MEMBER_RESTORE_MINUTES} minutes can no longer be undone`, async () => {
    const { membershipId, user } = await removedMember();
    const em = await getEm();
    await em.nativeUpdate(AuditEventSchema, { action: 'member.removed', targetId: membershipId }, { createdAt: subMinutes(new Date(), MEMBER_RESTORE_MINUTES + 1) });
    await expect(as('owner', (c) => restoreMember(c, { membershipId }))).rejects.toMatchObject({ code: 'conflict' });
    expect(await membershipsOf(user.id)).toHaveLength(0);
  });
});

describe('restoreZone', () => {
  const zoneFields = { kind: 'hull-bottom', areaM2: '80', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
  let assetId: string;
  beforeAll(async () => {
    assetId = (await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: 'Undo Tender', hullMaterial: 'steel' }))).id;
  });
  let serial = 0;
  async function archivedZone() {
    const zone = await as('engineer', (c) => createZone(c, assetId, { ...zoneFields, name: `Flat bottom ${++serial}` }));
    await as('engineer', (c) => archiveZone(c, zone.id));
    return zone.id;
  }
  const archivedAt = async (id: string) => (await (await getEm()).findOneOrFail(ZoneSchema, { id })).archivedAt;

  it('brings the zone back as it was and audits it once, however often it is sent', async () => {
    const id = await archivedZone();
    expect(await archivedAt(id)).not.toBeNull();
    expect((await as('engineer', (c) => restoreZone(c, id))).restored).toBe(true);
    expect(await archivedAt(id)).toBeNull();
    expect((await as('engineer', (c) => restoreZone(c, id))).restored).toBe(false);
    const rows = await auditRows('zone.restored', id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.engineer.id });
  });

  for (const role of ['planner', 'inspector', 'viewer'] as const) {
    it(`${role} may not restore a zone (asset:write)`, async () => {
      const id = await archivedZone();
      await expect(as(role, (c) => restoreZone(c, id))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await archivedAt(id)).not.toBeNull();
      expect(await auditRows('zone.restored', id)).toHaveLength(0);
    });
  }

  it("another organisation's engineer gets a 404 and the zone stays archived", async () => {
    const id = await archivedZone();
    await expect(as('engineer', (c) => restoreZone(c, id), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await archivedAt(id)).not.toBeNull();
  });
});

describe('restoreReading', () => {
  let jettyId: string;
  beforeAll(async () => {
    jettyId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Undo Jetty', structureType: 'jetty', waterType: 'seawater' }))).id;
  });
  let day = 0;
  const newSurvey = () => as('inspector', (c) => createSurvey(c, { assetId: jettyId, surveyedOn: `2025-03-${String(++day).padStart(2, '0')}`, method: 'diver', surveyor: 'Undo Divers', defaultElectrode: 'ag-agcl-seawater' }));
  const readingsOf = async (surveyId: string) => (await getEm()).find(SurveyReadingSchema, { survey: surveyId }, { orderBy: { location: 'asc' } });
  const mailsAbout = async (subjectPart: string) => (await getEm()).find(OutboxMessageSchema, { organisationId: organisation.id, subject: { $like: `%${subjectPart}%` }, toAddress: users.engineer.email });
  const comparable = (r: { id: string; line?: number | null; location: string; potentialV?: number | null; electrode?: string | null; potentialAgAgClV?: number | null; remainingFraction?: number | null; comment?: string | null }) => ({
    id: r.id, line: r.line ?? null, location: r.location, potentialV: r.potentialV ?? null, electrode: r.electrode ?? null, potentialAgAgClV: r.potentialAgAgClV ?? null, remainingFraction: r.remainingFraction ?? null, comment: r.comment ?? null,
  });

  /** A survey with one reading (given against a zinc electrode, so the stored converted value is not the typed one), deleted by the inspector. */
  async function deletedReading(potentialV = '+0.200') {
    const survey = await newSurvey();
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Pile 7 splash', potentialV, electrode: 'zinc', remainingPercent: '62.5', comment: 'marine growth scraped' }));
    const [reading] = await readingsOf(survey.id);
    const before = comparable(reading);
    await as('inspector', (c) => deleteReading(c, survey.id, reading.id));
    expect(await readingsOf(survey.id)).toEqual([]);
    return { survey, readingId: reading.id, before };
  }

  it('puts the same reading back, every value as it was, audited once however often it is sent', async () => {
    const { survey, readingId, before } = await deletedReading();
    const first = await as('inspector', (c) => restoreReading(c, survey.id, readingId));
    expect(first.restored).toBe(true);
    const back = await readingsOf(survey.id);
    expect(back.map(comparable)).toEqual([before]);
    const again = await as('inspector', (c) => restoreReading(c, survey.id, readingId));
    expect(again.restored).toBe(false);
    expect(await readingsOf(survey.id)).toHaveLength(1);
    const rows = await auditRows('survey.reading-restored', survey.id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.inspector.id, details: { readingId, after: { location: 'Pile 7 splash', comment: 'marine growth scraped' } } });
  });

  it('two undos of one deletion sent at the same moment (a double click) put the reading back once, with one audit row', async () => {
    const { survey, readingId, before } = await deletedReading();
    const outcomes = await atOnceSettled(2, () => as('inspector', (c) => restoreReading(c, survey.id, readingId)));
    // Each either restores or finds it restored; at most one says it did the work, and neither fails.
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'fulfilled']);
    expect(outcomes.filter((o) => o.status === 'fulfilled' && o.value.restored)).toHaveLength(1);
    expect((await readingsOf(survey.id)).map(comparable)).toEqual([before]);
    expect(await auditRows('survey.reading-restored', survey.id)).toHaveLength(1);
  });

  for (const role of ['planner', 'viewer'] as const) {
    it(`${role} may not put a reading back (survey:write, as for the delete)`, async () => {
      const { survey, readingId } = await deletedReading();
      await expect(as(role, (c) => restoreReading(c, survey.id, readingId))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await readingsOf(survey.id)).toEqual([]);
    });
  }

  it("another organisation's inspector gets a 404 and nothing comes back", async () => {
    const { survey, readingId } = await deletedReading();
    await expect(as('inspector', (c) => restoreReading(c, survey.id, readingId), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await readingsOf(survey.id)).toEqual([]);
  });

  it('a reading that was never deleted here is a 404: nothing can be invented this way', async () => {
    const survey = await newSurvey();
    await expect(as('inspector', (c) => restoreReading(c, survey.id, crypto.randomUUID()))).rejects.toMatchObject({ code: 'not-found' });
    expect(await readingsOf(survey.id)).toEqual([]);
  });

  it(`a delete older than ${READING_RESTORE_MINUTES} minutes can no longer be undone`, async () => {
    const { survey, readingId } = await deletedReading();
    await (await getEm()).nativeUpdate(AuditEventSchema, { action: 'survey.reading-deleted', targetId: survey.id }, { createdAt: subMinutes(new Date(), READING_RESTORE_MINUTES + 1) });
    await expect(as('inspector', (c) => restoreReading(c, survey.id, readingId))).rejects.toMatchObject({ code: 'conflict' });
    expect(await readingsOf(survey.id)).toEqual([]);
  });

  // Steel in aerobic seawater is under-protected when less negative than -0.80 V Ag/AgCl/seawater (DNV-RP-B401, published; the asset's criteria in lib/register/protected-metal).
  it('an under-protected reading whose delete was mailed as a correction comes back unflagged and is told once more as a new one is', async () => {
    const survey = await newSurvey();
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Pile 9', potentialV: '-0.600', electrode: 'ag-agcl-seawater' }));
    const [reading] = await readingsOf(survey.id);
    expect(reading.alertedAt).not.toBeNull();
    await as('inspector', (c) => deleteReading(c, survey.id, reading.id));
    const alertsBefore = (await mailsAbout('Under-protection found on Undo Jetty')).length;
    expect(await mailsAbout('Correction: readings of Undo Jetty')).toHaveLength(1);
    const result = await as('inspector', (c) => restoreReading(c, survey.id, reading.id));
    expect(result).toMatchObject({ restored: true, correctionWasMailed: true, isUnder: true, alertMailed: true });
    const [back] = await readingsOf(survey.id);
    expect(back.alertedAt).not.toBeNull();
    expect((await mailsAbout('Under-protection found on Undo Jetty')).length).toBe(alertsBefore + 1);
    // No second correction: the restore does not contradict the mail that told of the delete.
    expect(await mailsAbout('Correction: readings of Undo Jetty')).toHaveLength(1);
  });
});

describe('undoDeleteSurvey', () => {
  let jettyId: string;
  beforeAll(async () => {
    jettyId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Undo Pier', structureType: 'jetty', waterType: 'seawater' }))).id;
  });
  let day = 0;
  /** A survey with two readings, deleted by the inspector a moment ago. */
  async function deletedSurvey() {
    const survey = await as('inspector', (c) => createSurvey(c, { assetId: jettyId, surveyedOn: `2025-04-${String(++day).padStart(2, '0')}`, method: 'drop-cell', surveyor: 'Quay Team', defaultElectrode: 'ag-agcl-seawater' }));
    for (const location of ['Berth 1', 'Berth 2']) await as('inspector', (c) => addReading(c, survey.id, { location, potentialV: '-0.950', electrode: 'ag-agcl-seawater' }));
    await as('inspector', (c) => deleteSurvey(c, survey.id));
    return survey.id;
  }
  const surveyRow = async (id: string) => (await getEm()).findOne(SurveySchema, { id });
  const readingCount = async (id: string) => (await getEm()).count(SurveyReadingSchema, { survey: id });

  it('the inspector who may delete may undo: the survey and its readings come back, audited once however often it is sent', async () => {
    const id = await deletedSurvey();
    expect(await surveyRow(id)).toBeNull();
    expect((await as('inspector', (c) => undoDeleteSurvey(c, id))).restored).toBe(true);
    expect(await surveyRow(id)).not.toBeNull();
    expect(await readingCount(id)).toBe(2);
    expect((await as('inspector', (c) => undoDeleteSurvey(c, id))).restored).toBe(false);
    const rows = await auditRows('survey.restored', id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.inspector.id, details: { undo: true, after: { readings: 2 } } });
  });

  for (const role of ['planner', 'viewer'] as const) {
    it(`${role} may not undo a survey's delete (survey:write, as for the delete)`, async () => {
      const id = await deletedSurvey();
      await expect(as(role, (c) => undoDeleteSurvey(c, id))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await surveyRow(id)).toBeNull();
    });
  }

  it("another organisation's inspector gets a 404 and the survey stays in the bin", async () => {
    const id = await deletedSurvey();
    await expect(as('inspector', (c) => undoDeleteSurvey(c, id), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await surveyRow(id)).toBeNull();
  });

  it(`after ${SURVEY_UNDO_MINUTES} minutes the undo is refused (the bin is then an engineer's), and nothing comes back`, async () => {
    const id = await deletedSurvey();
    await (await getEm()).execute(`update survey_bin set deleted_at = now() - interval '${SURVEY_UNDO_MINUTES + 1} minutes' where id = ?`, [id]);
    await expect(as('inspector', (c) => undoDeleteSurvey(c, id))).rejects.toMatchObject({ code: 'conflict' });
    expect(await surveyRow(id)).toBeNull();
  });
});

describe('restoreSurveyAttachment', () => {
  let surveyId: string;
  beforeAll(async () => {
    const assetId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Undo Quay', structureType: 'jetty', waterType: 'seawater' }))).id;
    surveyId = (await as('inspector', (c) => createSurvey(c, { assetId, surveyedOn: '2025-05-02', method: 'diver', surveyor: 'Photo Divers', defaultElectrode: 'ag-agcl-seawater' }))).id;
  });
  // The first bytes of a PNG file (the format's signature and header chunk), enough to be taken as a photo.
  const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
  let serial = 0;
  async function deletedAttachment() {
    const attachment = await as('inspector', (c) => addSurveyAttachment(c, surveyId, { name: `pile-${++serial}.png`, bytes: PNG }, 'Pile 4 at low water'));
    await as('inspector', (c) => deleteSurveyAttachment(c, surveyId, attachment.id));
    return attachment.id;
  }
  const stored = async (id: string) => {
    const em = await getEm();
    const [row] = await em.execute<{ filename: string; caption: string | null; object_key: string }[]>('select filename, caption, object_key from survey_attachment where id = ?', [id]);
    // The bytes are the object the row names in the storage.
    return row ? { ...row, data: (await getStorage().getObject(row.object_key)) ?? new Uint8Array() } : null;
  };

  it('puts the same file back, bytes and caption, audited once however often it is sent', async () => {
    const id = await deletedAttachment();
    expect(await stored(id)).toBeNull();
    expect((await as('inspector', (c) => restoreSurveyAttachment(c, surveyId, id))).restored).toBe(true);
    const back = await stored(id);
    expect(back).toMatchObject({ caption: 'Pile 4 at low water' });
    expect(new Uint8Array(back!.data)).toEqual(PNG);
    expect((await as('inspector', (c) => restoreSurveyAttachment(c, surveyId, id))).restored).toBe(false);
    expect(await (await getEm()).count(SurveyAttachmentSchema, { id })).toBe(1);
    const rows = await auditRows('survey.attachment-restored', surveyId);
    expect(rows.filter((r) => r.details?.attachmentId === id)).toHaveLength(1);
  });

  for (const role of ['planner', 'viewer'] as const) {
    it(`${role} may not put an attachment back (survey:write, as for the delete)`, async () => {
      const id = await deletedAttachment();
      await expect(as(role, (c) => restoreSurveyAttachment(c, surveyId, id))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await stored(id)).toBeNull();
    });
  }

  it("another organisation's inspector gets a 404 and the file stays deleted", async () => {
    const id = await deletedAttachment();
    await expect(as('inspector', (c) => restoreSurveyAttachment(c, surveyId, id), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await stored(id)).toBeNull();
  });

  it(`after ${ATTACHMENT_UNDO_MINUTES} minutes the undo is refused and nothing comes back`, async () => {
    const id = await deletedAttachment();
    await (await getEm()).execute(`update survey_attachment_bin set deleted_at = now() - interval '${ATTACHMENT_UNDO_MINUTES + 1} minutes' where id = ?`, [id]);
    await expect(as('inspector', (c) => restoreSurveyAttachment(c, surveyId, id))).rejects.toMatchObject({ code: 'conflict' });
    expect(await stored(id)).toBeNull();
  });
  it('the housekeeping sweep removes a file from the bin only once its undo window has passed', async () => {
    const id = await deletedAttachment();
    const inBin = async () => (await (await getEm()).execute<{ n: string }[]>('select count(*) as n from survey_attachment_bin where id = ?', [id]))[0].n;
    await purgeAttachmentBin(await getEm());
    expect(Number(await inBin())).toBe(1);
    await purgeAttachmentBin(await getEm(), new Date(Date.now() + (ATTACHMENT_UNDO_MINUTES + 1) * 60_000));
    expect(Number(await inBin())).toBe(0);
  });
});

describe('restoreAnodeGroup', () => {
  let assetId: string;
  beforeAll(async () => {
    assetId = (await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: 'Undo Coaster', hullMaterial: 'steel' }))).id;
  });
  let serial = 0;
  async function closedGroup() {
    const group = await as('engineer', (c) => createAnodeGroup(c, assetId, { label: `Bilge keel ${++serial}`, anodeModelKey: 'builtin:TW-AW-4020', quantity: 6, installedOn: '2024-06-01' }));
    await as('engineer', (c) => removeAnodeGroup(c, group.id, { removedOn: '2026-11-30', reason: 'Closed by mistake' }));
    return group.id;
  }
  const groupRow = async (id: string) => (await getEm()).findOneOrFail(AnodeGroupSchema, { id }, { refresh: true });

  it('fits the group again as it was, with the undo in its history, audited once however often it is sent', async () => {
    const id = await closedGroup();
    expect((await groupRow(id)).removedOn).toBe('2026-11-30');
    expect((await as('engineer', (c) => restoreAnodeGroup(c, id))).restored).toBe(true);
    const back = await groupRow(id);
    expect([back.removedOn ?? null, back.removalReason ?? null, back.quantity]).toEqual([null, null, 6]);
    expect((await as('engineer', (c) => restoreAnodeGroup(c, id))).restored).toBe(false);
    expect(await auditRows('anode-group.restored', id)).toHaveLength(1);
    const changes = await (await getEm()).find(AnodeGroupChangeSchema, { group: id }, { orderBy: { createdAt: 'desc' } });
    expect(changes[0].changes).toEqual({ removedOn: ['2026-11-30', null], removalReason: ['Closed by mistake', null] });
  });

  for (const role of ['planner', 'inspector', 'viewer'] as const) {
    it(`${role} may not reopen a group (asset:write, as for closing it)`, async () => {
      const id = await closedGroup();
      await expect(as(role, (c) => restoreAnodeGroup(c, id))).rejects.toMatchObject({ code: 'forbidden' });
      expect((await groupRow(id)).removedOn).toBe('2026-11-30');
    });
  }

  it("another organisation's engineer gets a 404 and the group stays closed", async () => {
    const id = await closedGroup();
    await expect(as('engineer', (c) => restoreAnodeGroup(c, id), other)).rejects.toMatchObject({ code: 'not-found' });
    expect((await groupRow(id)).removedOn).toBe('2026-11-30');
  });

  it(`a close older than ${GROUP_RESTORE_MINUTES} minutes can no longer be undone`, async () => {
    const id = await closedGroup();
    await (await getEm()).nativeUpdate(AuditEventSchema, { action: 'anode-group.removed', targetId: id }, { createdAt: subMinutes(new Date(), GROUP_RESTORE_MINUTES + 1) });
    await expect(as('engineer', (c) => restoreAnodeGroup(c, id))).rejects.toMatchObject({ code: 'conflict' });
    expect((await groupRow(id)).removedOn).toBe('2026-11-30');
  });
});

describe('undo of archiving a catalogue model (the same action, restoring)', () => {
  it('restores once: the Undo sent twice changes nothing more and is audited once; another organisation gets a 404', async () => {
    const model = await as('engineer', (c) => createAnodeModel(c, { designation: 'UNDO-PLATE-1', alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: 0.3, widthM: 0.15, thicknessM: 0.03, exposedAreaM2: 0.06, netMassKg: 8, grossMassKg: 8.5 }));
    await as('engineer', (c) => setAnodeModelArchived(c, model.id, true));
    await expect(as('engineer', (c) => setAnodeModelArchived(c, model.id, false), other)).rejects.toMatchObject({ code: 'not-found' });
    await as('engineer', (c) => setAnodeModelArchived(c, model.id, false));
    await as('engineer', (c) => setAnodeModelArchived(c, model.id, false));
    expect(await auditRows('catalogue.model-archived', model.id)).toHaveLength(1);
    expect(await auditRows('catalogue.model-restored', model.id)).toHaveLength(1);
  });
});
