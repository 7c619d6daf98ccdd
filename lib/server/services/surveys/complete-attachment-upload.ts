import { SurveyAttachmentSchema } from '@/entities';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getStorage } from '../../storage/object-storage';
import { attachmentObjectKey, isStagingKey } from '../../storage/object-keys';
import { deleteObjectsInBackground, deleteObjectsLater } from '../storage/delete-objects';
import { findRecordedDeviceItem } from './request-attachment-upload';
import { MAX_ATTACHMENT_BYTES } from '@/lib/schemas/register';
import { attachmentFilename, sniffContentType } from './attachments';
import { getSurveyOrThrow } from './survey-access';

const DEVICE_ID = /^[A-Za-z0-9_-]{8,64}$/;

export interface CompletedUpload {
  created: boolean;
  attachment: { id: string; filename: string; contentType: string; sizeBytes: number };
}

/** What the user reads when the object changed between the check and the copy (a link used again meanwhile). */
const CHANGED_MESSAGE = 'The file in the storage changed while it was being checked; nothing was recorded. Send it again.';

/**
 * Step 2 of a direct upload: the file is in the storage under its staging key; check it there before anything is
 * recorded. The key must be under the organisation's prefix, the object must exist, be at most
 * MAX_ATTACHMENT_BYTES and the size declared, and its first bytes must be a JPEG, PNG or PDF (the browser's claim
 * is not trusted). The checked bytes are pinned by their ETag: the first bytes are read only if the object is still
 * the one the HEAD saw, and the storage copies it (server-side) to a fresh attachment key only if it still is; that
 * copy, which no client ever has a link to, is what gets recorded. A bad object is deleted and refused (422) and
 * nothing is recorded; a storage that does not answer (or not in time) is a 503, nothing recorded.
 * The storage is asked before the pending row is locked, so a slow storage holds no lock; the row is then locked
 * and checked again (still there, still this staging key). A repeat (or two at once) finds the attachment already
 * made and records nothing more: the device item's id is used once per organisation, for good.
 */
export async function completeAttachmentUpload(ctx: OrgContext, surveyId: string, deviceId: string): Promise<CompletedUpload> {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  if (!DEVICE_ID.test(deviceId)) throw notFound('Upload');
  const already = async () => {
    const done = await findRecordedDeviceItem(ctx, deviceId);
    if (done && done.survey.id === survey.id) return { created: false, attachment: { id: done.id, filename: done.filename, contentType: done.contentType, sizeBytes: done.sizeBytes } };
    return null;
  };
  const [pending] = await ctx.em.execute<{ id: string; survey_id: string; object_key: string; filename: string; size_bytes: number; caption: string | null }[]>(
    `select id, survey_id, object_key, filename, size_bytes, caption from survey_attachment_upload where organisation_id = ? and device_id = ?`,
    [ctx.organisation.id, deviceId],
  );
  if (!pending) {
    const done = await already();
    if (done) return done;
    throw new AppError('not-found', 'No upload is waiting for this file; send it again.');
  }
  if (pending.survey_id !== survey.id) throw notFound('Upload');
  const staging = pending.object_key;
  if (!isStagingKey(staging, ctx.organisation.id)) throw new AppError('invalid', 'The file is not stored under this organisation; send it again.');

  const storage = getStorage();
  // A refused file leaves the storage at once (bounded by the storage timeouts; the clean-up job removes it if the
  // delete fails) and nothing is recorded.
  const refuse = async (message: string): Promise<never> => {
    await storage.deleteObject(staging).catch(() => undefined);
    throw new AppError('invalid', message, { file: [message] });
  };
  // The staging object gone or changed may mean that another completion of this item won meanwhile (it removes
  // the staging object once committed): then that attachment is the answer.
  const notArrived = 'The file did not arrive in the storage; send it again.';
  const missing = async () => (await already()) ?? Promise.reject(new AppError('invalid', notArrived, { file: [notArrived] }));
  const changed = async () => (await already()) ?? Promise.reject(new AppError('conflict', CHANGED_MESSAGE));
  const head = await storage.headObject(staging);
  if (!head) return missing();
  if (!head.etag) return changed();
  if (head.sizeBytes > MAX_ATTACHMENT_BYTES) return refuse(`The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB; reduce it and try again.`);
  if (head.sizeBytes === 0) return refuse('The file is empty.');
  if (head.sizeBytes !== Number(pending.size_bytes)) return refuse('The file that arrived is not the size announced; send it again.');
  const first = await storage.readFirstBytes(staging, 16, head.etag);
  if (first === 'changed') return changed();
  if (!first) return missing();
  const contentType = sniffContentType(first);
  if (!contentType) return refuse('Only JPEG and PNG photos and PDF reports can be attached.');
  const finalKey = attachmentObjectKey(ctx.organisation.id, survey.id);
  if ((await storage.copyObject(staging, finalKey, head.etag)) === 'changed') return changed();

  // Now the row: locked, and still the upload that was checked (another completion may have won meanwhile, or a
  // retry on the device may have asked for a new link).
  const [locked] = await ctx.em.execute<{ id: string; object_key: string }[]>(`select id, object_key from survey_attachment_upload where id = ? for update`, [pending.id]);
  if (!locked || locked.object_key !== staging) {
    deleteObjectsInBackground([finalKey]);
    const done = await already();
    if (done) return done;
    throw new AppError('conflict', 'A newer upload of this file was started on your device; nothing was recorded from this one. Let that one finish.');
  }

  const attachment = ctx.em.create(SurveyAttachmentSchema, {
    organisation: ctx.organisation,
    survey,
    filename: attachmentFilename(pending.filename, contentType),
    contentType,
    sizeBytes: head.sizeBytes,
    objectKey: finalKey,
    deviceId,
    caption: pending.caption,
    uploadedByEmail: ctx.user.email,
  });
  await ctx.em.execute('delete from survey_attachment_upload where id = ?', [pending.id]);
  await ctx.em.execute('insert into used_device_id (organisation_id, device_id, used_at) values (?, ?, now()) on conflict do nothing', [ctx.organisation.id, deviceId]);
  audit(ctx, { action: 'survey.attachment-added', targetType: 'survey', targetId: survey.id, details: { file: attachment.filename, bytes: attachment.sizeBytes } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  // The staging object is not needed once the copy is recorded; a link used again later recreates it, unnamed.
  deleteObjectsLater(ctx, [staging]);
  return { created: true, attachment: { id: attachment.id, filename: attachment.filename, contentType: attachment.contentType, sizeBytes: attachment.sizeBytes } };
}
