import { randomUUID } from 'node:crypto';
import { execFile } from 'node:child_process';
import { CAPTURE_CONFLICT_MESSAGES } from '@/lib/labels';
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
    expect(link.objectKey).toMatch(new RegExp(`^org/${home.organisation.id}/upload/[0-9a-f-]{36}/[0-9a-f-]{36}$`));
    expect(link.url.startsWith(`${process.env.S3_ENDPOINT}/`)).toBe(true);
    expect(new URL(link.url).searchParams.get('X-Amz-SignedHeaders')).toBe('content-length;content-type;host');
    expect(Number(new URL(link.url).searchParams.get('X-Amz-Expires'))).toBeLessThanOrEqual(600);
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    // The same device item again: one pending upload, a fresh link to a staging key of its own.
    const again = await requestUpload(await member(), surveyId, { deviceId, filename: 'pile 7.jpeg', contentType: 'image/jpeg', sizeBytes: JPEG.length, caption: 'Pile 7' });
    expect(again.objectKey).not.toBe(link.objectKey);
    expect(again.objectKey).toMatch(new RegExp(`^org/${home.organisation.id}/upload/[0-9a-f-]{36}/[0-9a-f-]{36}$`));
    expect(await pendingOfDevice(deviceId)).toBe(1);

    expect((await putToLink(again, JPEG)).status).toBe(200);
    const done = await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId));
    expect(done).toMatchObject({ created: true, attachment: { filename: 'pile 7.jpg', contentType: 'image/jpeg', sizeBytes: JPEG.length } });
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
    expect(await pendingOfDevice(deviceId)).toBe(0);
    const [row] = await (await getEm()).execute<{ object_key: string; caption: string }[]>('select object_key, caption from survey_attachment where id = ?', [done.attachment.id]);
    // What is recorded is a server-side copy under a key no link was ever given for; the staging object goes.
    expect(row!.caption).toBe('Pile 7');
    expect(row!.object_key).toMatch(new RegExp(`^org/${home.organisation.id}/survey/${surveyId}/[0-9a-f-]{36}$`));
    expect([link.objectKey, again.objectKey]).not.toContain(row!.object_key);
    expect(await storage().getObject(row!.object_key)).toEqual(JPEG);
    await expect.poll(() => storage().headObject(again.objectKey)).toBeNull();

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
    expect((await fetch(location.replace(row!.object_key, attachmentObjectKey(home.organisation.id, surveyId)))).status).toBe(403);

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
    // Not an outage: the app's own settings are wrong, and the user is told so (500, tell your administrator).
    expect(error?.name).toBe('StorageMisconfiguredError');
    expect((error?.cause as Error).name).toBe('SignatureDoesNotMatch');
    expect(toErrorBody(error)).toEqual({ status: 500, body: { error: { code: 'misconfigured', message: 'The file storage is misconfigured; nothing was recorded. Tell your administrator.' } } });
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

  it('two link requests at the same moment for one device item make one pending upload, each link to a staging key of its own', async () => {
    const deviceId = item();
    const outcomes = await atOnceSettled(4, async () => runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'x.png', contentType: 'image/png', sizeBytes: PNG.length })));
    const keys = outcomes.map((o) => (o.status === 'fulfilled' && o.value.status === 'upload' ? o.value.objectKey : `failed: ${o.status === 'rejected' ? o.reason : 'done'}`));
    expect(new Set(keys).size).toBe(4);
    for (const key of keys) expect(key).toMatch(new RegExp(`^org/${home.organisation.id}/upload/`));
    expect(await pendingOfDevice(deviceId)).toBe(1);
    // The pending upload names the key of the request that came last; only that one can be completed.
    const [pending] = await (await getEm()).execute<{ object_key: string }[]>('select object_key from survey_attachment_upload where organisation_id = ? and device_id = ?', [home.organisation.id, deviceId]);
    expect(keys).toContain(pending!.object_key);
  });
});

describe('what a link can write, and what gets recorded', () => {
  it('a link used again after complete does not change the served file; nor does an older link of the same item', async () => {
    const deviceId = item();
    // A first link for a 100-byte file, then a retry for a 200-byte one: two links, two staging keys.
    const small = new Uint8Array(100);
    small.set(JPEG);
    const large = new Uint8Array(200);
    large.set(PNG);
    const first = await requestUpload(await member(), surveyId, { deviceId, filename: 'hull.jpg', contentType: 'image/jpeg', sizeBytes: small.length });
    const second = await requestUpload(await member(), surveyId, { deviceId, filename: 'hull.png', contentType: 'image/png', sizeBytes: large.length });
    expect((await putToLink(second, large)).status).toBe(200);
    const done = await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId));
    expect(done.attachment).toMatchObject({ contentType: 'image/png', sizeBytes: 200 });

    // Both links still work at the storage (they are valid 10 minutes), but they write to staging keys nothing names.
    const web = new Uint8Array(200);
    web.set(HTML);
    expect((await putToLink(second, web)).status).toBe(200);
    expect((await putToLink(first, small)).status).toBe(200);

    const { GET } = await import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/[attachmentId]/route');
    await signInAs(home.users.viewer);
    const res = await GET(new NextRequest('http://127.0.0.1/x'), { params: Promise.resolve({ org: home.organisation.slug, surveyId, attachmentId: done.attachment.id }) });
    const served = await fetch(res.headers.get('location')!);
    expect(served.headers.get('content-type')).toBe('image/png');
    expect(new Uint8Array(await served.arrayBuffer())).toEqual(large);
    // Completing again changes nothing either.
    expect(await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId))).toEqual({ created: false, attachment: done.attachment });
  });

  it('the checked bytes are pinned: a read or copy with the ETag of other bytes is refused by the storage', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'swap.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    const head = await storage().headObject(link.objectKey);
    const other = new Uint8Array(PNG.length);
    other.set(HTML.subarray(0, PNG.length));
    expect((await putToLink(link, other)).status).toBe(200);
    expect(await storage().readFirstBytes(link.objectKey, 16, head!.etag!)).toBe('changed');
    expect(await storage().copyObject(link.objectKey, attachmentObjectKey(home.organisation.id, surveyId), head!.etag!)).toBe('changed');
    const fresh = await storage().headObject(link.objectKey);
    expect(await storage().readFirstBytes(link.objectKey, 4, fresh!.etag!)).toEqual(other.subarray(0, 4));
    const target = attachmentObjectKey(home.organisation.id, surveyId);
    expect(await storage().copyObject(link.objectKey, target, fresh!.etag!)).toBe('copied');
    expect(await storage().getObject(target)).toEqual(other);
  });

  it('a retry of the link request while a completion commits answers "done" and leaves no pending upload', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'race.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let completedInside!: () => void;
    const inside = new Promise<void>((resolve) => (completedInside = resolve));
    // The completion has recorded the attachment and removed the pending row, and has not committed yet.
    const completing = runAs(member(), async (c) => {
      const result = await completeAttachmentUpload(c, surveyId, deviceId);
      await c.em.flush();
      completedInside();
      await gate;
      return result;
    });
    await inside;
    const retry = runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'race.png', contentType: 'image/png', sizeBytes: PNG.length }));
    await new Promise((resolve) => setTimeout(resolve, 300));
    release();
    const done = await completing;
    expect(await retry).toEqual({ status: 'done', deviceId, attachment: done.attachment });
    expect(await pendingOfDevice(deviceId)).toBe(0);
    expect(await attachmentsOfDevice(deviceId)).toBe(1);
  });

  it('a device item is used once for good: after its attachment is deleted, a late retry is refused and the photo does not come back; undo still works', async () => {
    const deviceId = item();
    const { completed } = await uploadDirect(await member(), surveyId, deviceId, { name: 'once.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, completed.attachment.id));
    // Within the undo window the same attachment comes back (no conflict on its device id).
    const { restoreSurveyAttachment } = await import('@/lib/server/services/surveys/attachments');
    expect(await runAs(member(), (c) => restoreSurveyAttachment(c, surveyId, completed.attachment.id))).toEqual({ file: 'once.png', restored: true });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, completed.attachment.id));
    await purgeAttachmentBin((await getEm()).fork(), new Date(Date.now() + 11 * 60_000));

    const message = 'This file from your device was already recorded and later deleted; it is not added again. Upload it as a new file if you want it back.';
    const late = await failure(runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'once.png', contentType: 'image/png', sizeBytes: PNG.length })));
    expect(late).toEqual({ status: 409, body: { error: { code: 'conflict', message } } });
    const lateComplete = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
    expect(lateComplete).toEqual({ status: 409, body: { error: { code: 'conflict', message } } });
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    expect(await pendingOfDevice(deviceId)).toBe(0);
  });

  it('a photo queued on a shared phone by another member is refused (403, nothing written); its own member sends it', async () => {
    const deviceId = item();
    const asker = await member();
    const other = home.users.engineer.id;
    const refused = await failure(runAs(asker, (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'shared.png', contentType: 'image/png', sizeBytes: PNG.length, capturedBy: other })));
    expect(refused).toEqual({ status: 403, body: { error: { code: 'forbidden', message: CAPTURE_CONFLICT_MESSAGES.otherMember } } });
    expect(await pendingOfDevice(deviceId)).toBe(0);
    const own = await runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'shared.png', contentType: 'image/png', sizeBytes: PNG.length, capturedBy: home.users.inspector.id }));
    expect(own.status).toBe('upload');
    expect(await pendingOfDevice(deviceId)).toBe(1);
  });

  it('a repeat link request keeps the pending upload alive; a member with 50 uploads waiting is told to let them finish', async () => {
    const em = await getEm();
    const deviceId = item();
    await requestUpload(await member(), surveyId, { deviceId, filename: 'slow.png', contentType: 'image/png', sizeBytes: PNG.length });
    await em.execute(`update survey_attachment_upload set created_at = now() - interval '23 hours' where organisation_id = ? and device_id = ?`, [home.organisation.id, deviceId]);
    await requestUpload(await member(), surveyId, { deviceId, filename: 'slow.png', contentType: 'image/png', sizeBytes: PNG.length });
    const [row] = await em.execute<{ age: number }[]>(`select extract(epoch from now() - created_at) as age from survey_attachment_upload where organisation_id = ? and device_id = ?`, [home.organisation.id, deviceId]);
    expect(Number(row!.age)).toBeLessThan(60);

    const engineer = await member('engineer');
    await em.execute(`delete from survey_attachment_upload where organisation_id = ? and uploaded_by_email = ?`, [home.organisation.id, engineer.user.email]);
    for (let i = 0; i < 50; i++) await requestUpload(await member('engineer'), surveyId, { deviceId: item(), filename: `many-${i}.png`, contentType: 'image/png', sizeBytes: PNG.length });
    const over = item();
    const refused = await failure(runAs(member('engineer'), (c) => requestAttachmentUpload(c, surveyId, { deviceId: over, filename: 'one-more.png', contentType: 'image/png', sizeBytes: PNG.length })));
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toBe('You have 50 uploads waiting to be finished; let them finish (or wait a day) before starting more. Nothing was recorded.');
    expect(await pendingOfDevice(over)).toBe(0);
    // Another member is not held back by them.
    await requestUpload(await member(), surveyId, { deviceId: item(), filename: 'other.png', contentType: 'image/png', sizeBytes: PNG.length });
    await em.execute(`delete from survey_attachment_upload where organisation_id = ? and uploaded_by_email = ?`, [home.organisation.id, engineer.user.email]);
  });

  it('a bucket that does not exist is a misconfiguration (500, tell your administrator), not a file that did not arrive', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'lost.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    const { parseEnv } = await import('@/lib/server/env');
    const { ObjectStorage } = await import('@/lib/server/storage/object-storage');
    const holder = globalThis as unknown as { tidewardenStorage?: InstanceType<typeof ObjectStorage> };
    const real = holder.tidewardenStorage;
    holder.tidewardenStorage = new ObjectStorage({ ...parseEnv(process.env), S3_BUCKET: 'no-such-bucket-here' });
    try {
      const refused = await failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));
      expect(refused).toEqual({ status: 500, body: { error: { code: 'misconfigured', message: 'The file storage is misconfigured; nothing was recorded. Tell your administrator.' } } });
    } finally {
      holder.tidewardenStorage = real;
    }
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    expect((await runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId))).created).toBe(true);
  });
});

describe('a storage that accepts and never answers', () => {
  it('completing answers 503 within the timeout, holds no lock meanwhile, and the app goes on answering; deletes do not wait on it', async () => {
    const deviceId = item();
    const link = await requestUpload(await member(), surveyId, { deviceId, filename: 'stall.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect((await putToLink(link, PNG)).status).toBe(200);
    const binned = await uploadDirect(await member(), surveyId, item(), { name: 'old-binned.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, binned.completed.attachment.id));
    await (await getEm()).execute(`update survey_attachment_bin set deleted_at = now() - interval '1 hour' where id = ?`, [binned.completed.attachment.id]);
    const doomed = await uploadDirect(await member(), surveyId, item(), { name: 'doomed.png', bytes: PNG, contentType: 'image/png' });

    expect((await fetch(`${process.env.S3_ENDPOINT}/_fake/hang`, { method: 'POST' })).status).toBe(200);
    const started = Date.now();
    const stalled = failure(runAs(member(), (c) => completeAttachmentUpload(c, surveyId, deviceId)));

    // Meanwhile: pages read, the same item's link can be asked for again (no row lock held), and a delete that
    // sends an expired file out of the storage answers at once.
    await new Promise((resolve) => setTimeout(resolve, 500));
    let t = Date.now();
    const details = await getSurveyDetails(await member('viewer'), surveyId);
    expect(details.attachments.length).toBeGreaterThan(0);
    const again = await requestUpload(await member(), surveyId, { deviceId: item(), filename: 'meanwhile.png', contentType: 'image/png', sizeBytes: PNG.length });
    expect(again.url).toContain('X-Amz-Signature');
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, doomed.completed.attachment.id));
    expect(Date.now() - t).toBeLessThan(3_000);
    t = Date.now();
    const relink = await runAs(member(), (c) => requestAttachmentUpload(c, surveyId, { deviceId, filename: 'stall.png', contentType: 'image/png', sizeBytes: PNG.length }));
    expect(relink.status).toBe('upload');
    expect(Date.now() - t).toBeLessThan(3_000);

    const answer = await stalled;
    const took = Date.now() - started;
    expect(answer.status).toBe(503);
    expect(answer.body.error.message).toBe('The file storage cannot be reached just now; nothing was recorded. Try again in a few minutes.');
    expect(took).toBeLessThan(30_000);
    expect(await attachmentsOfDevice(deviceId)).toBe(0);
    expect(await count('select count(*) as n from survey_attachment_bin where id = ?', [binned.completed.attachment.id])).toBe(0);
  }, 60_000);
});

describe('files leave the storage only when their rows are gone for good', () => {
  it('a singly deleted attachment keeps its file for the undo; the sweep of its bin deletes it', async () => {
    const { completed, objectKey } = await uploadDirect(await member(), surveyId, item(), { name: 'gone.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, completed.attachment.id));
    expect(await storage().headObject(objectKey)).not.toBeNull();
    await purgeAttachmentBin((await getEm()).fork(), new Date(Date.now() + 11 * 60_000));
    expect(await storage().headObject(objectKey)).toBeNull();
  });

  it('a deleted survey keeps its files while it can be restored; the purge of the bin deletes them', async () => {
    const doomed = await newSurvey();
    const { objectKey: doomedKey } = await uploadDirect(await member(), doomed, item(), { name: 'survey-gone.png', bytes: PNG, contentType: 'image/png' });
    const kept = await newSurvey();
    const { objectKey: keptKey } = await uploadDirect(await member(), kept, item(), { name: 'restored.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurvey(c, doomed));
    await runAs(member(), (c) => deleteSurvey(c, kept));
    await runAs(member('engineer'), (c) => restoreSurvey(c, kept));
    expect(await storage().headObject(doomedKey)).not.toBeNull();
    await (await getEm()).execute(`update survey_bin set deleted_at = now() - interval '31 days' where id = ?`, [doomed]);
    await purgeDeletedSurveys((await getEm()).fork());
    expect(await storage().headObject(doomedKey)).toBeNull();
    expect(await storage().getObject(keptKey)).toEqual(PNG);
  });
});

describe('the nightly storage clean-up', () => {
  it('removes objects no row names (paging through the listing) and keeps live, binned and young pending ones', async () => {
    const em = await getEm();
    const live = (await uploadDirect(await member(), surveyId, item(), { name: 'live.png', bytes: PNG, contentType: 'image/png' })).objectKey;
    const inAttachmentBin = await uploadDirect(await member(), surveyId, item(), { name: 'binned.png', bytes: PNG, contentType: 'image/png' });
    await runAs(member(), (c) => deleteSurveyAttachment(c, surveyId, inAttachmentBin.completed.attachment.id));
    const binnedSurvey = await newSurvey();
    const inSurveyBin = (await uploadDirect(await member(), binnedSurvey, item(), { name: 'survey-binned.png', bytes: PNG, contentType: 'image/png' })).objectKey;
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
    for (const key of [live, inAttachmentBin.objectKey, inSurveyBin, young.objectKey]) expect(await storage().headObject(key), key).not.toBeNull();
  });
});

describe('the migration out of PostgreSQL, through `tsx scripts/migrate.ts up`', () => {
  it('the schema step commits; the bytes move row by row; a storage failure half-way loses nothing, the clean-up waits, and a rerun finishes', async () => {
    const base = new URL(process.env.TIDEWARDEN_IT_DATABASE_URL ?? process.env.DATABASE_URL!);
    const database = `${base.pathname.slice(1)}_move`;
    const url = new URL(base.toString());
    url.pathname = `/${database}`;
    const admin = await getEm();
    await admin.execute(`drop database if exists "${database}" with (force)`);
    await admin.execute(`create database "${database}"`);
    const { MikroORM } = await import('@mikro-orm/postgresql');
    const { ormConfig } = await import('@/mikro-orm.config');
    const { migrationsList } = await import('@/migrations');
    const orm = await MikroORM.init(ormConfig(url.toString()));
    try {
      // The database as the release before this one left it: the bytes in survey_attachment.data and in the bins.
      const before = migrationsList[migrationsList.findIndex((m) => m.name === 'Migration20261211000000_object_storage') - 1]!.name;
      await orm.getMigrator().up({ to: before });
      const orgId = randomUUID();
      const survey = randomUUID();
      const binnedSurvey = randomUUID();
      const live = [randomUUID(), randomUUID(), randomUUID()].sort();
      const [binned, inSurveyBin1, inSurveyBin2] = [randomUUID(), randomUUID(), randomUUID()];
      const files: Record<string, { bytes: Uint8Array; key: string }> = {
        [live[0]!]: { bytes: JPEG, key: attachmentObjectKey(orgId, survey, live[0]) },
        [live[1]!]: { bytes: PDF, key: attachmentObjectKey(orgId, survey, live[1]) },
        [live[2]!]: { bytes: PNG, key: attachmentObjectKey(orgId, survey, live[2]) },
        [binned]: { bytes: PNG, key: attachmentObjectKey(orgId, survey, binned) },
        [inSurveyBin1]: { bytes: PDF, key: attachmentObjectKey(orgId, binnedSurvey, inSurveyBin1) },
        [inSurveyBin2]: { bytes: JPEG, key: attachmentObjectKey(orgId, binnedSurvey, inSurveyBin2) },
      };
      const oldRow = (id: string, surveyOf: string) => ({ id, organisation_id: orgId, survey_id: surveyOf, filename: 'old', content_type: 'image/png', size_bytes: files[id]!.bytes.length, data: `\\x${Buffer.from(files[id]!.bytes).toString('hex')}`, caption: null });
      await orm.em.fork().transactional(async (tx) => {
        // Rows only (the organisation and survey they belong to do not matter to the move): this throwaway
        // database drops the bins' and attachments' foreign keys.
        const fks = await tx.execute<{ table_name: string; name: string }[]>(
          `select conrelid::regclass::text as table_name, conname as name from pg_constraint where contype = 'f' and conrelid::regclass::text in ('survey_attachment', 'survey_attachment_bin', 'survey_bin')`,
        );
        for (const fk of fks) await tx.execute(`alter table ${fk.table_name} drop constraint "${fk.name}"`);
        for (const id of live) {
          await tx.execute(`insert into survey_attachment (id, organisation_id, survey_id, filename, content_type, size_bytes, data, created_at) values (?, ?, ?, 'old', 'image/png', ?, ?, now())`, [id, orgId, survey, files[id]!.bytes.length, Buffer.from(files[id]!.bytes)]);
        }
        await tx.execute(`insert into survey_attachment_bin (id, organisation_id, survey_id, deleted_at, payload) values (?, ?, ?, now(), ?::jsonb)`, [binned, orgId, survey, JSON.stringify(oldRow(binned, survey))]);
        await tx.execute(
          `insert into survey_bin (id, organisation_id, asset_id, surveyed_on, method, readings, attachments, deleted_at, payload) values (?, ?, ?, '2026-01-01', 'diver', 0, 2, now(), ?::jsonb)`,
          [binnedSurvey, orgId, randomUUID(), JSON.stringify({ survey: {}, readings: [], attachments: [oldRow(inSurveyBin1, binnedSurvey), oldRow(inSurveyBin2, binnedSurvey)] })],
        );
      });
      const em = () => orm.em.fork();
      const migrate = () =>
        new Promise<{ code: number; out: string }>((resolve) => {
          execFile(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'scripts/migrate.ts', 'up'], { env: { ...process.env, DATABASE_URL: url.toString() }, timeout: 120_000 }, (error, stdout, stderr) =>
            resolve({ code: error ? Number((error as { code?: number }).code ?? 1) : 0, out: `${stdout}${stderr}` }),
          );
        });

      // The storage fails after two files: the script stops with the cause, the schema step stays committed.
      expect((await fetch(`${process.env.S3_ENDPOINT}/_fake/down-after/2`, { method: 'POST' })).status).toBe(200);
      const first = await migrate();
      expect(first.code, first.out).not.toBe(0);
      // The object storage migration first; the release's later migrations (if any) follow it in the same run.
      expect(first.out).toMatch(/Applied \d+ migration\(s\): Migration20261211000000_object_storage(, |\n|$)/);
      expect(first.out).toContain('Migration failed');
      expect(first.out).toContain('ServiceUnavailable');
      const rows = () => em().execute<{ id: string; object_key: string | null; has_data: boolean }[]>(`select id, object_key, data is not null as has_data from survey_attachment order by id`);
      expect(await rows()).toEqual([
        { id: live[0], object_key: files[live[0]!]!.key, has_data: false },
        { id: live[1], object_key: files[live[1]!]!.key, has_data: false },
        { id: live[2], object_key: null, has_data: true },
      ]);
      await fakeControl('up');
      expect(await storage().getObject(files[live[0]!]!.key)).toEqual(JPEG);
      expect(await storage().getObject(files[live[1]!]!.key)).toEqual(PDF);
      expect(await storage().headObject(files[live[2]!]!.key)).toBeNull();
      // The clean-up job, even hours later, touches nothing while rows still hold bytes.
      const sweep = await sweepOrphanObjects(em(), { now: new Date(Date.now() + 3 * 3600_000) });
      expect(sweep).toEqual({ skipped: true, listed: 0, deleted: 0, staleUploads: 0 });
      expect(await storage().getObject(files[live[0]!]!.key)).toEqual(JPEG);

      // The rerun carries on from where it stopped; a third finds nothing to do.
      const second = await migrate();
      expect(second.code, second.out).toBe(0);
      expect(second.out).toContain('Database schema is up to date.');
      expect(second.out).toContain('Moved 4 stored file(s) into the object storage (1 attachments, 1 in the attachment bin, 2 in deleted surveys).');
      const third = await migrate();
      expect(third.code, third.out).toBe(0);
      expect(third.out).not.toContain('Moved');

      for (const row of await rows()) expect(row).toEqual({ id: row.id, object_key: files[row.id]!.key, has_data: false });
      for (const file of Object.values(files)) expect(await storage().getObject(file.key)).toEqual(file.bytes);
      const [bin] = await em().execute<{ payload: Record<string, unknown> }[]>(`select payload from survey_attachment_bin where id = ?`, [binned]);
      expect(bin!.payload).not.toHaveProperty('data');
      expect(bin!.payload.object_key).toBe(files[binned]!.key);
      const [surveyBin] = await em().execute<{ payload: { attachments: Record<string, unknown>[] } }[]>(`select payload from survey_bin where id = ?`, [binnedSurvey]);
      expect(surveyBin!.payload.attachments.map((a) => [a.id, a.object_key, 'data' in a])).toEqual([
        [inSurveyBin1, files[inSurveyBin1]!.key, false],
        [inSurveyBin2, files[inSurveyBin2]!.key, false],
      ]);

      // Bytes that cannot be read stop the move with the row named; the row keeps what it had.
      const broken = randomUUID();
      await em().transactional(async (tx) => {
        await tx.execute(`insert into survey_attachment_bin (id, organisation_id, survey_id, deleted_at, payload) values (?, ?, ?, now(), ?::jsonb)`, [broken, orgId, survey, JSON.stringify({ ...oldRow(binned, survey), id: broken, data: 'ÿØÿ escaped' })]);
      });
      const execute = (sql: string, params?: unknown[]) => em().execute<Record<string, unknown>[]>(sql, params ?? []);
      await expect(moveStoredFilesToObjectStorage(execute, () => storage())).rejects.toThrow(`The stored bytes of the deleted attachment ${broken} (survey_attachment_bin) cannot be read`);
      const [kept] = await em().execute<{ data: string }[]>(`select payload->>'data' as data from survey_attachment_bin where id = ?`, [broken]);
      expect(kept!.data).toBe('ÿØÿ escaped');
      expect((await sweepOrphanObjects(em(), { now: new Date(Date.now() + 3 * 3600_000) })).skipped).toBe(true);

      // There is no way back that keeps the files: down() says so and changes nothing.
      await expect(new Migration20261211000000_object_storage(orm.em.getDriver(), orm.config).down()).rejects.toThrow('irreversible');
    } finally {
      await fakeControl('up');
      await orm.close(true);
      await admin.execute(`drop database if exists "${database}" with (force)`);
    }
  }, 180_000);
});
