import { SurveyAttachmentSchema, SurveyAttachmentUploadSchema } from '@/entities';
import { attachmentUploadRequestSchema } from '@/lib/schemas/register';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { getStorage } from '../../storage/object-storage';
import { attachmentObjectKey } from '../../storage/object-keys';
import { getSurveyOrThrow } from './survey-access';

/** How long the browser has to send the file to its upload link. */
export const UPLOAD_URL_SECONDS = 10 * 60;

export type AttachmentUploadAnswer =
  | { status: 'upload'; deviceId: string; objectKey: string; url: string; method: 'PUT'; headers: { 'content-type': string }; expiresAt: string }
  | { status: 'done'; deviceId: string; attachment: { id: string; filename: string; contentType: string; sizeBytes: number } };

/**
 * Step 1 of a direct upload: checks the declared type (JPEG, PNG, PDF) and size (at most MAX_ATTACHMENT_BYTES),
 * records the pending upload under the device item's id and answers a presigned PUT link, short-lived and signed
 * with the content type and length, to a key under the organisation's prefix. The same device item again gets the
 * same key and a fresh link (a retry after the link expired); an item already attached answers "done".
 */
export async function requestAttachmentUpload(ctx: OrgContext, surveyId: string, input: unknown): Promise<AttachmentUploadAnswer> {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const data = attachmentUploadRequestSchema.parse(input);

  const done = await ctx.em.findOne(SurveyAttachmentSchema, { organisation: ctx.organisation, deviceId: data.deviceId });
  if (done) {
    if (done.survey.id !== survey.id) throw new AppError('conflict', 'This file from your device is already attached to another survey.');
    return { status: 'done', deviceId: data.deviceId, attachment: { id: done.id, filename: done.filename, contentType: done.contentType, sizeBytes: done.sizeBytes } };
  }

  // One pending row per device item, whoever asks first; a second request at the same moment waits for it.
  await ctx.em.execute(
    `insert into survey_attachment_upload (id, organisation_id, survey_id, device_id, object_key, filename, content_type, size_bytes, caption, uploaded_by_email, created_at)
     values (gen_random_uuid(), ?, ?, ?, ?, ?, ?, ?, ?, ?, now())
     on conflict (organisation_id, device_id) do nothing`,
    [ctx.organisation.id, survey.id, data.deviceId, attachmentObjectKey(ctx.organisation.id, survey.id), data.filename, data.contentType, data.sizeBytes, data.caption, ctx.user.email],
  );
  const [pending] = await ctx.em.execute<{ id: string; survey_id: string; object_key: string }[]>(
    'select id, survey_id, object_key from survey_attachment_upload where organisation_id = ? and device_id = ? for update',
    [ctx.organisation.id, data.deviceId],
  );
  if (!pending) throw new AppError('conflict', 'The upload was just completed by another request; reload the page.');
  if (pending.survey_id !== survey.id) throw new AppError('conflict', 'This file from your device is already being uploaded to another survey.');
  // A retry may carry what the device knows best now (a new caption, a file re-encoded to another size).
  const upload = await ctx.em.findOneOrFail(SurveyAttachmentUploadSchema, { id: pending.id });
  upload.filename = data.filename;
  upload.contentType = data.contentType;
  upload.sizeBytes = data.sizeBytes;
  upload.caption = data.caption;
  upload.uploadedByEmail = ctx.user.email;
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
