import { randomUUID } from 'node:crypto';
import { SurveyAttachmentSchema, SurveyAttachmentUploadSchema } from '@/entities';
import { attachmentUploadRequestSchema } from '@/lib/schemas/register';
import { CAPTURE_CONFLICT_MESSAGES } from '@/lib/labels';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { getStorage } from '../../storage/object-storage';
import { stagingObjectKey } from '../../storage/object-keys';
import { getSurveyOrThrow } from './survey-access';
import { PENDING_UPLOAD_HOURS } from '../storage/sweep-orphan-objects';

/** How long the browser has to send the file to its upload link. */
export const UPLOAD_URL_SECONDS = 10 * 60;

/** How many uploads one member may have asked for and not completed, at once, in one organisation. */
export const MAX_PENDING_UPLOADS_PER_MEMBER = 50;

export type AttachmentUploadAnswer =
  | { status: 'upload'; deviceId: string; objectKey: string; url: string; method: 'PUT'; headers: { 'content-type': string }; expiresAt: string }
  | { status: 'done'; deviceId: string; attachment: { id: string; filename: string; contentType: string; sizeBytes: number } };

/** The answer when a device item was recorded once and the attachment has since been deleted: it does not come back. */
export const DEVICE_ITEM_DELETED_MESSAGE = 'This file from your device was already recorded and later deleted; it is not added again. Upload it as a new file if you want it back.';

/** The attachment already made from this device item, or a refusal if it was made and deleted (device ids are used once). */
export async function findRecordedDeviceItem(ctx: OrgContext, deviceId: string) {
  const done = await ctx.em.findOne(SurveyAttachmentSchema, { organisation: ctx.organisation, deviceId });
  if (done) return done;
  const [used] = await ctx.em.execute<{ device_id: string }[]>('select device_id from used_device_id where organisation_id = ? and device_id = ?', [ctx.organisation.id, deviceId]);
  if (used) throw new AppError('conflict', DEVICE_ITEM_DELETED_MESSAGE);
  return null;
}

const doneAnswer = (deviceId: string, done: { id: string; filename: string; contentType: string; sizeBytes: number }): AttachmentUploadAnswer => ({
  status: 'done',
  deviceId,
  attachment: { id: done.id, filename: done.filename, contentType: done.contentType, sizeBytes: done.sizeBytes },
});

/**
 * Step 1 of a direct upload: checks the declared type (JPEG, PNG, PDF) and size (at most MAX_ATTACHMENT_BYTES),
 * records the pending upload under the device item's id and answers a presigned PUT link, short-lived and signed
 * with the content type and length, to a staging key that is new for every request (so a link handed out earlier
 * never writes to what a later check saw, nor to what gets recorded). A repeat for the same device item gets a new
 * staging key and link and keeps the pending upload alive for another day; an item already attached answers
 * "done"; an item attached and later deleted is refused (it does not come back). At most
 * MAX_PENDING_UPLOADS_PER_MEMBER uploads waiting per member.
 */
export async function requestAttachmentUpload(ctx: OrgContext, surveyId: string, input: unknown): Promise<AttachmentUploadAnswer> {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const data = attachmentUploadRequestSchema.parse(input);
  // A photo queued on a shared phone by another member (their session ended, someone else signed in) is never
  // attached as this member's: it waits on the phone until its own member sends it. Nothing is written.
  if (data.capturedBy !== undefined && data.capturedBy !== ctx.user.id) throw new AppError('forbidden', CAPTURE_CONFLICT_MESSAGES.otherMember);

  const done = await findRecordedDeviceItem(ctx, data.deviceId);
  if (done) {
    if (done.survey.id !== survey.id) throw new AppError('conflict', 'This file from your device is already attached to another survey.');
    return doneAnswer(data.deviceId, done);
  }

  const [waiting] = await ctx.em.execute<{ n: string }[]>(
    // Uploads older than a day are forgotten by the clean-up job (their links expired long ago): they do not count.
    `select count(*) as n from survey_attachment_upload where organisation_id = ? and uploaded_by_email = ? and device_id <> ? and created_at > now() - ? * interval '1 hour'`,
    [ctx.organisation.id, ctx.user.email, data.deviceId, PENDING_UPLOAD_HOURS],
  );
  if (Number(waiting?.n ?? 0) >= MAX_PENDING_UPLOADS_PER_MEMBER) {
    throw new AppError('rate-limited', `You have ${MAX_PENDING_UPLOADS_PER_MEMBER} uploads waiting to be finished; let them finish (or wait a day) before starting more. Nothing was recorded.`);
  }

  // One pending row per device item, whoever asks first; a second request at the same moment waits for it.
  const newId = randomUUID();
  await ctx.em.execute(
    `insert into survey_attachment_upload (id, organisation_id, survey_id, device_id, object_key, filename, content_type, size_bytes, caption, uploaded_by_email, created_at)
     values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, now())
     on conflict (organisation_id, device_id) do nothing`,
    [newId, ctx.organisation.id, survey.id, data.deviceId, stagingObjectKey(ctx.organisation.id, newId), data.filename, data.contentType, data.sizeBytes, data.caption, ctx.user.email],
  );
  const [pending] = await ctx.em.execute<{ id: string; survey_id: string }[]>(
    'select id, survey_id from survey_attachment_upload where organisation_id = ? and device_id = ? for update',
    [ctx.organisation.id, data.deviceId],
  );
  // A completion may have committed while this request waited for the lock (or just before the insert): look
  // again now that nothing else can change this device item, so a retry answers "done" and leaves no stray row.
  const recorded = await findRecordedDeviceItem(ctx, data.deviceId);
  if (recorded) {
    await ctx.em.execute('delete from survey_attachment_upload where organisation_id = ? and device_id = ?', [ctx.organisation.id, data.deviceId]);
    if (recorded.survey.id !== survey.id) throw new AppError('conflict', 'This file from your device is already attached to another survey.');
    return doneAnswer(data.deviceId, recorded);
  }
  if (!pending) throw new AppError('conflict', 'The upload was just finished or cancelled by another request; reload the page and check the attachments.');
  if (pending.survey_id !== survey.id) throw new AppError('conflict', 'This file from your device is already being uploaded to another survey.');
  // A retry may carry what the device knows best now (a new caption, a file re-encoded to another size); it gets
  // a staging key of its own, and the pending upload counts from now.
  const upload = await ctx.em.findOneOrFail(SurveyAttachmentUploadSchema, { id: pending.id });
  upload.objectKey = pending.id === newId ? upload.objectKey : stagingObjectKey(ctx.organisation.id, pending.id);
  upload.filename = data.filename;
  upload.contentType = data.contentType;
  upload.sizeBytes = data.sizeBytes;
  upload.caption = data.caption;
  upload.uploadedByEmail = ctx.user.email;
  upload.createdAt = new Date();
  const url = await getStorage().presignPut(upload.objectKey, data.contentType, data.sizeBytes, UPLOAD_URL_SECONDS);
  return {
    status: 'upload',
    deviceId: data.deviceId,
    objectKey: upload.objectKey,
    url,
    method: 'PUT',
    headers: { 'content-type': data.contentType },
    expiresAt: new Date(Date.now() + UPLOAD_URL_SECONDS * 1000).toISOString(),
  };
}
