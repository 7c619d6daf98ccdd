import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEventSchema, OutboxMessageSchema, SurveyAttachmentSchema, SurveyReadingSchema, SurveySchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { toErrorBody } from '@/lib/server/errors';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { importSurveyCsv } from '@/lib/server/services/surveys/import-survey-csv';
import { deleteReading, updateReading } from '@/lib/server/services/surveys/correct-readings';
import { deleteSurvey, listDeletedSurveys, purgeDeletedSurveys, restoreSurvey, updateSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { getStorage } from '@/lib/server/storage/object-storage';
import { addSurveyAttachment, deleteSurveyAttachment, updateSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

let org: { organisation: Organisation; users: Record<Role, User> };
let jettyId: string;
const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
const as = <T,>(role: Role, work: Parameters<typeof runAs<T>>[1]) => runAs(ctx(role), work);
const failure = async (p: Promise<unknown>) => {
  const error = await p.then(() => null, (e) => e);
  expect(error, 'the call should have been refused').not.toBeNull();
  return toErrorBody(error);
};
const csvBytes = (lines: string[]) => new TextEncoder().encode(lines.join('\n') + '\n');
const readingsOf = async (surveyId: string) => (await getEm()).find(SurveyReadingSchema, { survey: surveyId }, { orderBy: { location: 'asc' } });
const mailsAbout = async (subjectPart: string) => (await getEm()).find(OutboxMessageSchema, { organisationId: org.organisation.id, subject: { $like: `%${subjectPart}%` } }, { orderBy: { createdAt: 'asc' } });
const auditOf = async (action: string, surveyId: string) => (await getEm()).find(AuditEventSchema, { organisationId: org.organisation.id, action, targetId: surveyId }, { orderBy: { createdAt: 'asc' } });
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);

let serial = 0;
async function newSurvey(defaultElectrode = 'ag-agcl-seawater', assetName?: string) {
  let assetId = jettyId;
  if (assetName) assetId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: assetName, structureType: 'jetty', waterType: 'seawater' }))).id;
  const surveyedOn = `2025-0${1 + (++serial % 9)}-1${serial % 10}`;
  return as('inspector', (c) => createSurvey(c, { assetId, surveyedOn, method: 'diver', surveyor: 'Harbour Divers', defaultElectrode }));
}

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Survey Corrections Harbour');
  jettyId = (await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Corrections Jetty', structureType: 'jetty', waterType: 'seawater' }))).id;
});
afterAll(async () => (await getOrm()).close(true));

// Steel in aerobic seawater: under-protected when less negative than -0.80 V Ag/AgCl/seawater (DNV-RP-B401 / MIL-HDBK-1004/10 via design-basis.md, published).
describe('several under-protected readings in one survey', () => {
  it('by hand: every one is saved, and the engineers get one message for the survey, not one per reading', async () => {
    const survey = await newSurvey('ag-agcl-seawater', 'Low Jetty A');
    for (const [location, v] of [['P1', '-0.62'], ['P2', '-0.70'], ['P3', '-0.75']] as const) {
      const result = await as('inspector', (c) => addReading(c, survey.id, { location, potentialV: v, electrode: 'ag-agcl-seawater' }));
      expect(result.under).toBe(1);
    }
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['P1', 'P2', 'P3']);
    const mails = await mailsAbout('Under-protection found on Low Jetty A');
    expect(mails.map((m) => m.toAddress).sort()).toEqual([org.users.engineer.email, org.users.owner.email].sort());
    expect(mails[0].textBody).toContain('P1');
  });

  it('by CSV, after a hand reading, and a second CSV: all saved', async () => {
    const survey = await newSurvey('ag-agcl-seawater', 'Low Jetty B');
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Hand 1', potentialV: '-0.65', electrode: 'ag-agcl-seawater' }));
    const first = await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['location,potential_v,electrode', 'C1,-0.70,ag-agcl-seawater', 'C2,-0.71,ag-agcl-seawater'])));
    expect(first).toMatchObject({ imported: 2, underProtected: 2, engineersMailed: false, duplicates: 0 });
    const second = await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['location,potential_v,electrode', 'C3,-0.72,ag-agcl-seawater', 'C4,-0.95,ag-agcl-seawater'])));
    expect(second).toMatchObject({ imported: 2, underProtected: 1 });
    expect((await readingsOf(survey.id)).length).toBe(5);
    expect((await mailsAbout('Under-protection found on Low Jetty B')).length).toBe(2); // one each to the engineer and the owner
  });
});

describe('the survey’s reference electrode', () => {
  it('is the default of a reading typed without one, and the value is converted from it', async () => {
    const survey = await newSurvey('zinc', 'Zinc Jetty');
    expect(survey.defaultElectrode).toBe('zinc');
    // +0.200 V against zinc is about -0.85 V Ag/AgCl/seawater (zinc about +0.25 V at -0.80 V Ag/AgCl; lib/cp reference table, from memory): protected.
    const { under } = await as('inspector', (c) => addReading(c, survey.id, { location: 'Z1', potentialV: '0.200', electrode: '' }));
    expect(under).toBe(0);
    const [reading] = await readingsOf(survey.id);
    expect(reading.electrode).toBe('zinc');
    expect(reading.potentialAgAgClV).toBeCloseTo(-0.85, 2);
    expect(await mailsAbout('Under-protection found on Zinc Jetty')).toEqual([]);
  });

  it('fills the blank electrode cells of a CSV when the upload names none', async () => {
    const survey = await newSurvey('cse', 'CSE Jetty');
    await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['location,potential_v', 'K1,-0.95'])));
    expect((await readingsOf(survey.id))[0].electrode).toBe('cse');
  });

  it('speaks of the remaining mass in per cent', async () => {
    const survey = await newSurvey();
    const { body } = await failure(as('inspector', (c) => addReading(c, survey.id, { location: 'R1', remainingPercent: '150' })));
    expect(body.error.fieldErrors?.remainingPercent).toEqual(['The remaining mass is between 0 and 100 %.']);
    expect((await readingsOf(survey.id)).length).toBe(0);
  });
});

describe('corrections, audited with the values before and after', () => {
  it('an inspector corrects a reading that was mailed as under-protected: audit before/after, correction mail, forecast input updated', async () => {
    const survey = await newSurvey('zinc', 'Mistyped Jetty');
    // Read against zinc, typed as Ag/AgCl: +0.200 V Ag/AgCl is far under-protected, and the engineers are told.
    await as('inspector', (c) => addReading(c, survey.id, { location: 'M1', potentialV: '0.200', electrode: 'ag-agcl-seawater' }));
    const [wrong] = await readingsOf(survey.id);
    expect(wrong.alertedAt).toBeInstanceOf(Date);
    const result = await as('inspector', (c) => updateReading(c, survey.id, wrong.id, { location: 'M1', potentialV: '0.200', electrode: 'zinc', comment: 'electrode corrected' }));
    expect(result).toMatchObject({ correctionMailed: true, isUnder: false });
    const [fixed] = await readingsOf(survey.id);
    expect(fixed).toMatchObject({ electrode: 'zinc', comment: 'electrode corrected', alertedAt: null });
    expect(fixed.potentialAgAgClV).toBeCloseTo(-0.85, 2);
    const [row] = await auditOf('survey.reading-updated', survey.id);
    expect(row.actorEmail).toBe(org.users.inspector.email);
    expect(row.details).toMatchObject({ readingId: wrong.id, before: { location: 'M1', potentialV: 0.2, electrode: 'ag-agcl-seawater' }, after: { location: 'M1', potentialV: 0.2, electrode: 'zinc', comment: 'electrode corrected' } });
    const corrections = await mailsAbout('Correction: readings of Mistyped Jetty');
    expect(corrections.map((m) => m.toAddress).sort()).toEqual([org.users.engineer.email, org.users.owner.email].sort());
    expect(corrections[0].textBody).toContain('M1: was +0.200 V against Ag/AgCl/seawater: under-protected; now +0.200 V against zinc (-0.850 V Ag/AgCl/seawater): protected');
    expect(corrections[0].textBody).toContain('The survey now has no under-protected reading.');
  });

  it('a comment-only edit of a mailed reading sends no correction; a reading not mailed sends none', async () => {
    const survey = await newSurvey('ag-agcl-seawater', 'Quiet Jetty');
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Q1', potentialV: '-0.70', electrode: 'ag-agcl-seawater' }));
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Q2', potentialV: '-0.95', electrode: 'ag-agcl-seawater' }));
    const [q1, q2] = await readingsOf(survey.id);
    await as('engineer', (c) => updateReading(c, survey.id, q1.id, { location: 'Q1', potentialV: '-0.70', electrode: 'ag-agcl-seawater', comment: 'growth' }));
    await as('engineer', (c) => updateReading(c, survey.id, q2.id, { location: 'Q2', potentialV: '-0.96', electrode: 'ag-agcl-seawater' }));
    expect(await mailsAbout('Correction: readings of Quiet Jetty')).toEqual([]);
  });

  it('deletes a mailed reading with its audit row and a correction; a viewer and a planner cannot', async () => {
    const survey = await newSurvey('ag-agcl-seawater', 'Delete Jetty');
    await as('inspector', (c) => addReading(c, survey.id, { location: 'D1', potentialV: '-0.60', electrode: 'ag-agcl-seawater' }));
    const [reading] = await readingsOf(survey.id);
    for (const role of ['viewer', 'planner'] as const) expect((await failure(as(role, (c) => deleteReading(c, survey.id, reading.id)))).status).toBe(403);
    await as('inspector', (c) => deleteReading(c, survey.id, reading.id));
    expect(await readingsOf(survey.id)).toEqual([]);
    const [row] = await auditOf('survey.reading-deleted', survey.id);
    expect(row.details).toMatchObject({ readingId: reading.id, before: { location: 'D1', potentialV: -0.6 }, after: null });
    const [mail] = (await mailsAbout('Correction: readings of Delete Jetty')).filter((m) => m.toAddress === org.users.engineer.email);
    expect(mail.textBody).toContain('D1: -0.600 V against Ag/AgCl/seawater: under-protected — deleted');
  });

  it('edits a survey’s fields with before and after in the audit', async () => {
    const survey = await newSurvey();
    await as('inspector', (c) => updateSurvey(c, survey.id, { surveyedOn: '2024-12-01', method: 'rov', surveyor: 'ROV Ltd', defaultElectrode: 'sce', notes: 'Re-dated from the dive log' }));
    const stored = await (await getEm()).findOneOrFail(SurveySchema, { id: survey.id });
    expect(stored).toMatchObject({ surveyedOn: '2024-12-01', method: 'rov', surveyor: 'ROV Ltd', defaultElectrode: 'sce' });
    const [row] = await auditOf('survey.updated', survey.id);
    expect(row.details).toMatchObject({ before: { method: 'diver', surveyor: 'Harbour Divers', defaultElectrode: 'ag-agcl-seawater' }, after: { surveyedOn: '2024-12-01', method: 'rov', surveyor: 'ROV Ltd', defaultElectrode: 'sce' } });
  });

  it('changes an attachment’s caption and deletes it, each audited', async () => {
    const survey = await newSurvey();
    const attachment = await as('inspector', (c) => addSurveyAttachment(c, survey.id, { name: 'b.png', bytes: PNG }, 'Bent 1'));
    await as('inspector', (c) => updateSurveyAttachment(c, survey.id, attachment.id, { caption: 'Bent 1, after cleaning' }));
    expect((await (await getEm()).findOneOrFail(SurveyAttachmentSchema, { id: attachment.id })).caption).toBe('Bent 1, after cleaning');
    expect((await auditOf('survey.attachment-updated', survey.id))[0].details).toMatchObject({ before: { caption: 'Bent 1' }, after: { caption: 'Bent 1, after cleaning' } });
    // A caption with a NUL byte is refused with a field message (it was a 500), and the caption stays as it was.
    const refused = await failure(as('inspector', (c) => updateSurveyAttachment(c, survey.id, attachment.id, { caption: 'Bent\u00001' })));
    expect(refused.status).toBe(422);
    expect((await (await getEm()).findOneOrFail(SurveyAttachmentSchema, { id: attachment.id })).caption).toBe('Bent 1, after cleaning');
    expect((await failure(as('viewer', (c) => deleteSurveyAttachment(c, survey.id, attachment.id)))).status).toBe(403);
    await as('engineer', (c) => deleteSurveyAttachment(c, survey.id, attachment.id));
    expect(await (await getEm()).count(SurveyAttachmentSchema, { id: attachment.id })).toBe(0);
    expect((await auditOf('survey.attachment-deleted', survey.id))[0].details).toMatchObject({ before: { file: 'b.png', caption: 'Bent 1, after cleaning' }, after: null });
  });
});

describe('a deleted survey, restorable for 30 days', () => {
  it('leaves every live table, is listed for engineers, and comes back whole', async () => {
    const survey = await newSurvey('ag-agcl-seawater', 'Bin Jetty');
    await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['location,potential_v,electrode,remaining', 'B1,-0.70,ag-agcl-seawater,55%', 'B2,-0.98,ag-agcl-seawater,'])));
    const attachment = await as('inspector', (c) => addSurveyAttachment(c, survey.id, { name: 'pile.png', bytes: PNG }, 'Pile B1'));
    await as('inspector', (c) => deleteSurvey(c, survey.id));
    const em = await getEm();
    expect(await em.count(SurveySchema, { id: survey.id })).toBe(0);
    expect(await em.count(SurveyReadingSchema, { survey: survey.id })).toBe(0);
    expect((await auditOf('survey.deleted', survey.id))[0].details).toMatchObject({ before: { asset: 'Bin Jetty', readings: 2, attachments: 1 }, after: null });
    // The under-protection message named B1: a correction says the survey is gone.
    expect((await mailsAbout('Correction: readings of Bin Jetty'))[0].textBody).toContain('The whole survey was deleted');
    // An inspector deletes; only an engineer (or the owner) restores.
    expect((await failure(as('inspector', (c) => restoreSurvey(c, survey.id)))).status).toBe(403);
    const listed = await listDeletedSurveys(await ctx('engineer'));
    expect(listed.find((r) => r.id === survey.id)).toMatchObject({ assetName: 'Bin Jetty', readings: 2, attachments: 1, deletedBy: org.users.inspector.email });

    await as('engineer', (c) => restoreSurvey(c, survey.id));
    const back = await readingsOf(survey.id);
    expect(back.map((r) => [r.location, r.potentialV, r.remainingFraction])).toEqual([['B1', -0.7, 0.55], ['B2', -0.98, null]]);
    const [file] = await (await getEm()).execute<{ object_key: string; caption: string }[]>('select object_key, caption from survey_attachment where id = ?', [attachment.id]);
    expect(file.caption).toBe('Pile B1');
    // The file itself stayed in the object storage while the survey was in the bin.
    expect(await getStorage().getObject(file.object_key)).toEqual(PNG);
    expect((await auditOf('survey.restored', survey.id))[0].details).toMatchObject({ before: null, after: { asset: 'Bin Jetty', readings: 2 } });
    expect((await listDeletedSurveys(await ctx('engineer'))).find((r) => r.id === survey.id)).toBeUndefined();
  });

  it('after 30 days it is gone from the restore list, cannot be restored, and the purge removes it', async () => {
    const survey = await newSurvey();
    await as('inspector', (c) => addReading(c, survey.id, { location: 'Old 1', potentialV: '-0.95', electrode: 'ag-agcl-seawater' }));
    await as('engineer', (c) => deleteSurvey(c, survey.id));
    const em = await getEm();
    await em.execute(`update survey_bin set deleted_at = now() - interval '31 days' where id = ?`, [survey.id]);
    expect((await listDeletedSurveys(await ctx('owner'))).find((r) => r.id === survey.id)).toBeUndefined();
    const refused = await failure(as('engineer', (c) => restoreSurvey(c, survey.id)));
    expect(refused.body.error.message).toBe('The survey was deleted more than 30 days ago and can no longer be restored.');
    expect(await purgeDeletedSurveys(em)).toBeGreaterThanOrEqual(1);
    expect(await em.execute(`select id from survey_bin where id = ?`, [survey.id])).toEqual([]);
  });
});

describe('CSV imports: duplicates and good lines only', () => {
  const file = ['location,potential_v,electrode,remaining', 'F1,-0.95,ag-agcl-seawater,70%', 'F2,-0.97,ag-agcl-seawater,', 'F3,,,0.4'];

  it('the same file uploaded twice adds nothing the second time, and says how many rows it skipped', async () => {
    const survey = await newSurvey();
    expect(await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(file)))).toMatchObject({ imported: 3, duplicates: 0 });
    const again = await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(file)));
    expect(again).toMatchObject({ imported: 0, duplicates: 3 });
    // A file with the old rows and a new one adds only the new one.
    expect(await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes([...file, 'F4,-0.99,ag-agcl-seawater,'])))).toMatchObject({ imported: 1, duplicates: 3 });
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['F1', 'F2', 'F3', 'F4']);
    expect((await auditOf('survey.readings-imported', survey.id)).map((r) => r.details?.duplicatesSkipped)).toEqual([0, 3, 3]);
  });

  it('rows already typed in by hand are recognised (same place and values, the electrode written differently)', async () => {
    const survey = await newSurvey();
    await as('inspector', (c) => addReading(c, survey.id, { location: 'F1', potentialV: '-0.95', electrode: 'ag-agcl-seawater', remainingPercent: '70' }));
    const result = await as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['location,potential_v,electrode,remaining', 'F1,-950 mV,Ag/AgCl,0.7', 'F1,-0.94,ag-agcl-seawater,70%'])));
    expect(result).toMatchObject({ imported: 1, duplicates: 1 });
  });

  it('a file with bad lines writes nothing, offers its good lines, and imports them when asked', async () => {
    const survey = await newSurvey();
    const bad = csvBytes(['location,potential_v,electrode', 'G1,-0.95,ag-agcl-seawater', 'G2,-5.2,ag-agcl-seawater', 'G3,-0.96,ag-agcl-seawater', ',-0.97,ag-agcl-seawater']);
    const refused = await failure(as('inspector', (c) => importSurveyCsv(c, survey.id, bad)));
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toBe('2 rows of the file need attention; nothing was imported.');
    expect(refused.body.error.fieldErrors?.goodLines).toEqual(['The other 2 lines are valid and can be imported on their own.']);
    expect(refused.body.error.fieldErrors?.csv?.[0]).not.toContain('mV"');
    expect(await readingsOf(survey.id)).toEqual([]);
    const partial = await as('inspector', (c) => importSurveyCsv(c, survey.id, bad, { goodLinesOnly: true }));
    expect(partial).toMatchObject({ imported: 2, badLinesSkipped: 2, duplicates: 0 });
    expect((await readingsOf(survey.id)).map((r) => r.location)).toEqual(['G1', 'G3']);
  });

  it('good lines only never imports a file whose header is wrong', async () => {
    const survey = await newSurvey();
    const refused = await failure(as('inspector', (c) => importSurveyCsv(c, survey.id, csvBytes(['place,volts', 'G1,-0.95']), { goodLinesOnly: true })));
    expect(refused.status).toBe(422);
    expect(refused.body.error.fieldErrors?.goodLines).toBeUndefined();
    expect(await readingsOf(survey.id)).toEqual([]);
  });
});
