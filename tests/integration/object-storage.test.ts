import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import { PutObjectCommand } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import type { OrgContext } from '@/lib/server/org-context';
import { getEm, getOrm } from '@/lib/server/db';
import { toErrorBody } from '@/lib/server/errors';
import { getStorage } from '@/lib/server/storage/object-storage';
import { attachmentObjectKey } from '@/lib/server/storage/object-keys';
import { MAX_ATTACHMENT_BYTES } from '@/lib/schemas/register';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addSurveyAttachment, deleteSurveyAttachment, purgeAttachmentBin } from '@/lib/server/services/surveys/attachments';
import { deleteSurvey, purgeDeletedSurveys, restoreSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { getSurveyDetails } from '@/lib/server/services/surveys/survey-details';
import { requestAttachmentUpload } from '@/lib/server/services/surveys/request-attachment-upload';
import { completeAttachmentUpload } from '@/lib/server/services/surveys/complete-attachment-upload';
import { sweepOrphanObjects } from '@/lib/server/services/storage/sweep-orphan-objects';
import { moveStoredFilesToObjectStorage } from '@/lib/server/storage/move-stored-files';
import { Migration20261211000000_object_storage } from '@/migrations/Migration20261211000000_object_storage';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { signInAs } from '../fixtures/entry-points';
import { atOnceSettled } from '../fixtures/at-once';
import { putToLink, requestUpload, uploadDirect } from '../fixtures/direct-upload';

vi.mock('next/headers', () => nextHeadersMock);

// Survey photos and reports in the object storage (the local S3 fake, over real HTTP): the direct upload
// (link, PUT, check, record), serving, deletes, the clean-up job and the migration out of PostgreSQL.

const JPEG = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0, 0xff, 0xd9]);
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
const PDF = new TextEncoder().encode('%PDF-1.4\n% survey report\n%%EOF\n');
const HTML = new TextEncoder().encode('<html><script>alert(1)</script></html>');

type OrgFixture = { organisation: Organisation; users: Record<Role, User> };
let home: OrgFixture;
let assetId = '';
let surveyId = '';
const member = async (role: Role = 'inspector'): Promise<OrgContext> => ctxFor(await getEm(), home.organisation, home.users[role]);
const item = () => `item-${randomUUID()}`;
const storage = () => getStorage();
const fakeControl = (state: 'down' | 'up') => fetch(`${process.env.S3_ENDPOINT}/_fake/${state}`, { method: 'POST' });

async function count(sql: string, params: unknown[] = []) {
  const [row] = await (await getEm()).execute<{ n: string }[]>(sql, params);
  return Number(row!.n);
}
const attachmentsOfDevice = (deviceId: string) => count('select count(*) as n from survey_attachment where organisation_id = ? and device_id = ?', [home.organisation.id, deviceId]);
const pendingOfDevice = (deviceId: string) => count('select count(*) as n from survey_attachment_upload where organisation_id = ? and device_id = ?', [home.organisation.id, deviceId]);

/** The status and body the route would answer for a thrown error. */
async function failure(work: Promise<unknown>) {
  try {
    await work;
  } catch (error) {
    return toErrorBody(error);
  }
  throw new Error('expected a refusal');
}

async function newSurvey() {
  return (await runAs(member(), (c) => createSurvey(c, { assetId, surveyedOn: '2026-03-04', method: 'diver', surveyor: 'Storage Divers', defaultElectrode: 'ag-agcl-seawater' }))).id;
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Storage Harbour');
  assetId = (await runAs(member('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Storage Tender', hullMaterial: 'steel' }))).id;
  surveyId = await newSurvey();
});
afterEach(async () => {
  await fakeControl('up');
});
afterAll(async () => (await getOrm()).close(true));

describe('direct upload to the object storage', () => {
  it('link, PUT over HTTP, complete: checked in the storage, recorded once with the sniffed type, served back by a presigned GET', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'pile 7.jpeg', contentType: 'image/jpeg', sizeBytes: JPEG.length, caption: 'Pile 7' });
    expect(link.objectKey).toMatch(new RegExp(`^org/${home.organisation.id}/survey/${surveyId}/[0-9a-f-]{36}$`));
    expect(link.url.startsWith(`${process.env.S3_ENDPOINT}/`)).toBe(true);
    expect(new URL(link.url).searchParams.get('X-Amz-SignedHeaders')).toBe('content-length;content-type;host');
    expect(Number(new URL(link.url).searchParams.get('X-Amz-Expires'))).toBeLessThanOrEqual(600);
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    // The same device item again: the same key, a fresh link.
    const again = await requestUpload(await member(), surveyId, { deviceId, filename: 'pile 7.jpeg', contentType: 'image/jpeg', sizeBytes: JPEG.length, caption: 'Pile 7' });
    expect(again.objectKey).toBe(link.objectKey);
    expect(await pendingOfDevice(deviceId)).toBe(1);

    expect((await putToLink(again, JPEG)).status).toBe(200);
    const done = await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId));
    expect(done).toMatchObject({ created: true, attachment: { filename: 'pile 7.jpg', contentType: 'image/jpeg', sizeBytes: JPEG.length } });
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
    expect(await pendingOfDevice(deviceId)).toBe(0);
    const [row] = await (await getEm()).execute<{ object_key: string; caption: string }[]>('select object_key, caption from survey_attachment where id = ?', [done.attachment.id]);
    expect(row).toEqual({ object_key: link.objectKey, caption: 'Pile 7' });

    // Served: the app checks the permission and redirects to a short-lived link with the type and the name.
    const { GET } = await import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/[attachmentId]/route');
    await signInAs(home.users.viewer);
    const res = await GET(new NextRequest('http://127.0.0.1/x'), { params: Promise.resolve({ org: home.organisation.slug, surveyId, attachmentId: done.attachment.id }) });
    expect(res.status).toBe(302);
    const location = res.headers.get('location')!;
    expect(Number(new URL(location).searchParams.get('X-Amz-Expires'))).toBeLessThanOrEqual(300);
    const served = await fetch(location);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/jpeg');
    expect(served.headers.get('content-disposition')).toBe('inline; filename="pile 7.jpg"');
    expect(new Uint8Array(await served.arrayBuffer())).toEqual(JPEG);
    // The link cannot be bent to another object: the signature covers the path.
    expect((await fetch(location.replace(link.objectKey, attachmentObjectKey(home.organisation.id, surveyId)))).status).toBe(403);

    // A repeat of either step, later, records nothing more: the device item is accepted once.
    const repeat = await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId));
    expect(repeat).toEqual({ created: false, attachment: done.attachment });
    const asked = await runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'pile 7.jpeg', contentType: 'image/jpeg', sizeBytes: JPEG.length }));
    expect(asked).toEqual({ status: 'done', deviceId, attachment: done.attachment });
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
  });

  it('a PDF report is offered as a download with its name', async () => {
    const { completed } = await uploadDirect(await member(), surveyId, item(), { name: 'CP report.pdf', bytes: PDF, contentType: 'application/pdf' });
    const [row] = await (await getEm()).execute<{ object_key: string }[]>('select object_key from survey_attachment where id = ?', [completed.attachment.id]);
    const { attachmentDownloadUrl } = await import('@/lib/server/services/surveys/attachments');
    const served = await fetch(await attachmentDownloadUrl({ objectKey: row.object_key, contentType: 'application/pdf', filename: 'CP report.pdf' }));
    expect(served.headers.get('content-type')).toBe('application/pdf');
    expect(served.headers.get('content-disposition')).toBe('attachment; filename="CP report.pdf"');
  });

  it('the storage refuses a body of another type or length than the link was signed for, and a link past its expiry', async () => {
    const link = await requestUpload(await member(), surveyId, { deviceId: item(), filename: 'a.png', contentType: 'image/png', sizeBytes: PNG.length });
    const otherType = await putToLink(link, PNG, { 'content-type': 'text/html' });
    expect(otherType.status).toBe(403);
    expect(await otherType.text()).toContain('<Code>SignatureDoesNotMatch</Code>');
    const longer = await putToLink(link, new Uint8Array([...PNG, 0]));
    expect(longer.status).toBe(403);
    expect(await storage().headObject(link.objectKey)).toBeNull();

    // A link signed a minute ago for one second.
    const expired = await getSignedUrl(storage().client, new PutObjectCommand({ Bucket: storage().bucket, Key: link.objectKey, ContentType: 'image/png', ContentLength: PNG.length }), {
      expiresIn: 1,
      signingDate: new Date(Date.now() - 60_000),
      signableHeaders: new Set(['content-type', 'content-length']),
    });
    const late = await putToLink({ url: expired, headers: { 'content-type': 'image/png' } }, PNG);
    expect(late.status).toBe(403);
    const body = await late.text();
    expect(body).toContain('<Code>AccessDenied</Code>');
    expect(body).toContain('Request has expired');
    expect(await storage().headObject(link.objectKey)).toBeNull();
  });

  it('the storage checks the signature of the app\'s own requests too: a wrong key is refused, and listing pages by continuation', async () => {
    const key = attachmentObjectKey(home.organisation.id, surveyId);
    await storage().putObject(key, PNG, 'image/png');
    const { parseEnv } = await import('@/lib/server/env');
    const { ObjectStorage } = await import('@/lib/server/storage/object-storage');
    const wrongKey = new ObjectStorage({ ...parseEnv(process.env), S3_SECRET_ACCESS_KEY: 'not-the-secret' });
    const error = await wrongKey.getObject(key).then(() => null, (e: Error) => e);
    expect(error?.name).toBe('StorageUnavailableError');
    expect((error?.cause as Error).name).toBe('SignatureDoesNotMatch');
    expect(await storage().getObject(key)).toEqual(PNG);

    const prefix = `org/${home.organisation.id}/survey/listing-${randomUUID()}/`;
    for (let i = 0; i < 5; i++) await storage().putObject(`${prefix}${i}`, PNG, 'image/png');
    const seen: string[] = [];
    let token: string | undefined;
    do {
      const page = await storage().listObjects(prefix, token, 2);
      expect(page.objects.length).toBeLessThanOrEqual(2);
      seen.push(...page.objects.map((o) => o.key));
      token = page.nextToken ?? undefined;
    } while (token);
    expect(seen).toEqual([0, 1, 2, 3, 4].map((i) => `${prefix}${i}`));
  });

  it('a file that is not a photo or a PDF is refused (422), deleted from the storage, and nothing is recorded', async () => {
    const deviceId = item();
    // The browser claims a PNG; the bytes are a web page.
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'hull.png', contentType: 'image/png', sizeBytes: HTML.length });
    expect((await putToLink(link, HTML)).status).toBe(200);
    const auditBefore = await count(`select count(*) as n from audit_event where organisation_id = ?`, [home.organisation.id]);
    const refused = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toBe('Only JPEG and PNG photos and PDF reports can be attached.');
    expect(await storage().headObject(link.objectKey)).toBeNull();
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    expect(await count(`select count(*) as n from audit_event where organisation_id = ?`, [home.organisation.id])).toBe(auditBefore);
  });

  it('a file over 10 MB is refused when the link is asked for, and again if one reaches the storage', async () => {
    const tooBig = await failure(runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId: item(), filename: 'big.jpg', contentType: 'image/jpeg', sizeBytes: MAX_ATTACHMENT_BYTES + 1 })));
    expect(tooBig.status).toBe(422);
    expect(tooBig.body.error.fieldErrors?.sizeBytes).toEqual(['The file is larger than 10 MB; reduce it and try again.']);
    const wrongType = await failure(runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId: item(), filename: 'page.html', contentType: 'text/html', sizeBytes: 10 })));
    expect(wrongType.status).toBe(422);
    expect(wrongType.body.error.fieldErrors?.contentType).toEqual(['Only JPEG and PNG photos and PDF reports can be attached.']);

    // A store that does not hold the signed length (or a key written another way): the check at completion.
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'big.jpg', contentType: 'image/jpeg', sizeBytes: 1000 });
    const big = new Uint8Array(MAX_ATTACHMENT_BYTES + 1);
    big.set(JPEG);
    await storage().putObject(link.objectKey, big, 'image/jpeg');
    const refused = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toBe('The file is larger than 10 MB; reduce it and try again.');
    expect(await storage().headObject(link.objectKey)).toBeNull();
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
  });

  it('completing before the file arrived is a clear 422 and records nothing', async () => {
    const deviceId = item();
    await requestUpload(await member(), surveyId, { deviceId, filename: 'late.png', contentType: 'image/png', sizeBytes: PNG.length });
    const refused = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toBe('The file did not arrive in the storage; send it again.');
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    // Another organisation cannot complete it, nor see that it exists.
    const other = await makeOrgWithRoles(await getEm(), 'Storage Outsiders');
    const foreign = await failure(runAs(ctxFor(await getEm(), other.organisation, other.users.owner), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(foreign.status).toBe(404);
  });

  it('storage down: readings and pages still read, completing is a 503 with a clear message and records nothing; later it goes through', async () => {
    const existing = await runAs(member(), (c) => addSurveyAttachment(c, surveyId, { name: 'before.png', bytes: PNG }, 'Before the outage'));
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'during.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    const rowsBefore = await count('select count(*) as n from survey_attachment where survey_id = ?', [surveyId]);

    expect((await fakeControl('down')).status).toBe(200);
    const details = await getSurveyDetails(await member('viewer'), surveyId);
    expect(details.attachments.map((a) => a.id)).toContain(existing.id);
    const down = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(down.status).toBe(503);
    expect(down.body.error).toEqual({ code: 'unavailable', message: 'The file storage cannot be reached just now; nothing was recorded. Try again in a few minutes.' });
    const serverSide = await failure(runAs(member(), (c) => addSurveyAttachment(c, surveyId, { name: 'during.png', bytes: PNG }, null)));
    expect(serverSide.status).toBe(503);
    expect(await count('select count(*) as n from survey_attachment where survey_id = ?', [surveyId])).toBe(rowsBefore);
    expect(await pendingOfDevice(deviceId)).toBe(1);

    await fakeControl('up');
    const later = await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId));
    expect(later.created).toBe(true);
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
  });

  it('two completions at the same moment make one attachment, and both callers get it', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'twice.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    const outcomes = await atOnceSettled(4, async () => runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    const answers = outcomes.map((o) => {
      if (o.status === 'rejected') throw o.reason;
      return o.value;
    });
    expect(answers.filter((a) => a.created)).toHaveLength(1);
    expect(new Set(answers.map((a) => a.attachment.id)).size).toBe(1);
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
    expect(await count(`select count(*) as n from audit_event where action = 'survey.attachment-added' and target_id = ? and details->>'file' = 'twice.png'`, [surveyId])).toBe(1);
  });

  it('two link requests at the same moment for one device item make one pending upload with one key', async () => {
    const deviceId = item();
    const outcomes = await atOnceSettled(4, async () => runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'x.png', contentType: 'image/png', sizeBytes: PNG.length })));
    const keys = outcomes.map((o) => (o.status === 'fulfilled' && o.value.status === 'upload' ? o.value.objectKey : `failed: ${o.status === 'rejected' ? o.reason : 'done'}`));
    expect(new Set(keys).size).toBe(1);
    expect(keys[0]).toMatch(/^org\//);
    expect(await pendingOfDevice(deviceId)).toBe(1);
  });
});

describe('files leave the storage only when their rows are gone for good', () => {
  it('a singly deleted attachment keeps its file for the undo; the sweep of its bin deletes it', async () => {
    const { completed, link } = await uploadDirect(await member(), surveyId, item(), { name: 'gone.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, completed.attachment.id));
    expect(await storage().headObject(link.objectKey)).not.toBeNull();
    await purgeAttachmentBin((await getEm()).fork(), new Date(Date.now() + 11 * 60_000));
    expect(await storage().headObject(link.objectKey)).toBeNull();
  });

  it('a deleted survey keeps its files while it can be restored; the purge of the bin deletes them', async () => {
    const doomed = await newSurvey();
    const { link } = await uploadDirect(await member(), doomed, item(), { name: 'survey-gone.png', bytes: PNG, contentType: 'image/png' });
    const kept = await newSurvey();
    const { link: keptLink } = await uploadDirect(await member(), kept, item(), { name: 'restored.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurvey(c, doomed));
    await runAs(member(), (c) => deleteSurvey(c, kept));
    await runAs(member('engineer'), (c) => restoreSurvey(c, kept));
    expect(await storage().headObject(link.objectKey)).not.toBeNull();
    await (await getEm()).execute(`update survey_bin set deleted_at = now() - interval '31 days' where id = ?`, [doomed]);
    await purgeDeletedSurveys((await getEm()).fork());
    expect(await storage().headObject(link.objectKey)).toBeNull();
    expect(await storage().getObject(keptLink.objectKey)).toEqual(PNG);
  });
});

describe('the nightly storage clean-up', () => {
  it('removes objects no row names (paging through the listing) and keeps live, binned and young pending ones', async () => {
    const em = await getEm();
    const live = (await uploadDirect(await member(), surveyId, item(), { name: 'live.png', bytes: PNG, contentType: 'image/png' })).link.objectKey;
    const inAttachmentBin = await uploadDirect(await member(), surveyId, item(), { name: 'binned.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, inAttachmentBin.completed.attachment.id));
    const binnedSurvey = await newSurvey();
    const inSurveyBin = (await uploadDirect(await member(), binnedSurvey, item(), { name: 'survey-binned.png', bytes: PNG, contentType: 'image/png' })).link.objectKey;
    await runAs(member(), (c) => deleteSurvey(c, binnedSurvey));
    const young = await requestUpload(await member(), surveyId, { deviceId: item(), filename: 'young.png', contentType: 'image/png', sizeBytes: PNG.length });
    await putToLink(young, PNG);
    const oldDevice = item();
    const old = await requestUpload(await member(), surveyId, { deviceId: oldDevice, filename: 'old.png', contentType: 'image/png', sizeBytes: PNG.length });
    await putToLink(old, PNG);
    await em.execute(`update survey_attachment_upload set created_at = now() - interval '30 hours' where object_key = ?`, [old.objectKey]);
    const orphan = attachmentObjectKey(home.organisation.id, surveyId);
    await storage().putObject(orphan, PNG, 'image/png');

    // Just written: within the grace period nothing is touched (its row may not be committed yet).
    await sweepOrphanObjects(em.fork(), { pageSize: 3 });
    expect(await storage().headObject(orphan)).not.toBeNull();

    const result = await sweepOrphanObjects(em.fork(), { now: new Date(Date.now() + 2 * 3600_000), pageSize: 3 });
    expect(result.listed).toBeGreaterThanOrEqual(6);
    expect(await storage().headObject(orphan)).toBeNull();
    expect(await storage().headObject(old.objectKey)).toBeNull();
    expect(await pendingOfDevice(oldDevice)).toBe(0);
    for (const key of [live, inAttachmentBin.link.objectKey, inSurveyBin, young.objectKey]) expect(await storage().headObject(key), key).not.toBeNull();
  });
});

describe('the migration out of PostgreSQL', () => {
  it('moves the bytes of a live attachment, an attachment in its bin and one in a deleted survey; a rerun after a crash loses nothing', async () => {
    const em = await getEm();
    const orgId = home.organisation.id;
    // The schema as it was: the bytes in survey_attachment.data, copies in the bins' payloads.
    await em.execute(`alter table survey_attachment add column data bytea null`);
    await em.execute(`alter table survey_attachment alter column object_key drop not null`);
    try {
      const ids = { live: randomUUID(), second: randomUUID(), binned: randomUUID(), inSurveyBin: randomUUID(), binnedSurvey: randomUUID() };
      for (const [id, bytes, type] of [[ids.live, JPEG, 'image/jpeg'], [ids.second, PDF, 'application/pdf']] as const) {
        await em.execute(`insert into survey_attachment (id, organisation_id, survey_id, filename, content_type, size_bytes, data, created_at) values (?, ?, ?, 'old', ?, ?, ?, now())`, [id, orgId, surveyId, type, bytes.length, Buffer.from(bytes)]);
      }
      const oldRow = (id: string, bytes: Uint8Array, type: string) => ({ id, organisation_id: orgId, survey_id: surveyId, filename: 'old', content_type: type, size_bytes: bytes.length, data: `\\x${Buffer.from(bytes).toString('hex')}`, caption: null });
      await em.execute(`insert into survey_attachment_bin (id, organisation_id, survey_id, deleted_at, payload) values (?, ?, ?, now(), ?::jsonb)`, [ids.binned, orgId, surveyId, JSON.stringify(oldRow(ids.binned, PNG, 'image/png'))]);
      await em.execute(
        `insert into survey_bin (id, organisation_id, asset_id, surveyed_on, method, readings, attachments, deleted_at, payload) values (?, ?, ?, '2026-01-01', 'diver', 0, 1, now(), ?::jsonb)`,
        [ids.binnedSurvey, orgId, assetId, JSON.stringify({ survey: {}, readings: [], attachments: [{ ...oldRow(ids.inSurveyBin, PDF, 'application/pdf'), survey_id: ids.binnedSurvey }] })],
      );
      const execute = (sql: string, params?: unknown[]) => em.execute<Record<string, unknown>[]>(sql, params ?? []);

      // A crash half-way: the storage fails on the second file.
      let puts = 0;
      const failing = {
        ensureBucket: () => storage().ensureBucket(),
        putObject: async (key: string, bytes: Uint8Array, type: string) => {
          if (++puts === 2) throw new Error('simulated crash');
          return storage().putObject(key, bytes, type);
        },
      };
      await expect(moveStoredFilesToObjectStorage(execute, () => failing)).rejects.toThrow('simulated crash');
      const [stillThere] = await em.execute<{ n: string }[]>(`select count(*) as n from survey_attachment where id in (?, ?) and data is not null`, [ids.live, ids.second]);
      expect(Number(stillThere.n)).toBeGreaterThanOrEqual(1); // what was not written yet still has its bytes

      // The rerun finishes; a third run finds nothing to do.
      const counts = await moveStoredFilesToObjectStorage(execute, () => storage());
      expect(counts.attachmentBin).toBe(1);
      expect(counts.surveyBin).toBe(1);
      expect(await moveStoredFilesToObjectStorage(execute, () => storage())).toEqual({ attachments: 0, attachmentBin: 0, surveyBin: 0 });

      const keyOf = (id: string, survey = surveyId) => attachmentObjectKey(orgId, survey, id);
      const rows = await em.execute<{ id: string; object_key: string; data: Buffer | null }[]>(`select id, object_key, data from survey_attachment where id in (?, ?)`, [ids.live, ids.second]);
      for (const row of rows) expect(row).toEqual({ id: row.id, object_key: keyOf(row.id), data: null });
      expect(await storage().getObject(keyOf(ids.live))).toEqual(JPEG);
      expect(await storage().getObject(keyOf(ids.second))).toEqual(PDF);
      expect(await storage().getObject(keyOf(ids.binned))).toEqual(PNG);
      expect(await storage().getObject(keyOf(ids.inSurveyBin, ids.binnedSurvey))).toEqual(PDF);
      const [bin] = await em.execute<{ payload: Record<string, unknown> }[]>(`select payload from survey_attachment_bin where id = ?`, [ids.binned]);
      expect(bin.payload).not.toHaveProperty('data');
      expect(bin.payload.object_key).toBe(keyOf(ids.binned));
      const [surveyBin] = await em.execute<{ payload: { attachments: Record<string, unknown>[] } }[]>(`select payload from survey_bin where id = ?`, [ids.binnedSurvey]);
      expect(surveyBin.payload.attachments).toHaveLength(1);
      expect(surveyBin.payload.attachments[0]).not.toHaveProperty('data');
      expect(surveyBin.payload.attachments[0].object_key).toBe(keyOf(ids.inSurveyBin, ids.binnedSurvey));
    } finally {
      // The migration itself, run again over this schema: it drops the column and holds the key required.
      const orm = await getOrm();
      await new Migration20261211000000_object_storage(orm.em.getDriver(), orm.config).up();
    }
    expect(await count(`select count(*) as n from information_schema.columns where table_name = 'survey_attachment' and column_name = 'data'`)).toBe(0);
    expect(await count(`select count(*) as n from information_schema.columns where table_name = 'survey_attachment' and column_name = 'object_key' and is_nullable = 'NO'`)).toBe(1);
  });
});
