import { SurveyAttachmentSchema } from '@/entities';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getStorage } from '../../storage/object-storage';
import { isOrganisationKey } from '../../storage/object-keys';
import { MAX_ATTACHMENT_BYTES } from '@/lib/schemas/register';
import { attachmentFilename, sniffContentType } from './attachments';
import { getSurveyOrThrow } from './survey-access';

const DEVICE_ID = /^[A-Za-z0-9_-]{8,64}$/;

export interface CompletedUpload {
  created: boolean;
  attachment: { id: string; filename: string; contentType: string; sizeBytes: number };
}

/**
 * Step 2 of a direct upload: the file is in the storage; check it there before anything is recorded. The key
 * must be under the organisation's prefix, the object must exist, be at most MAX_ATTACHMENT_BYTES and the size
 * declared, and its first bytes must be a JPEG, PNG or PDF (the browser's claim is not trusted). A bad object is
 * deleted and refused (422) and nothing is recorded; a storage that does not answer is a 503, nothing recorded,
 * try again later. A repeat (or two at once) finds the attachment already made and records nothing more:
 * the device item's id is unique per organisation for good.
 */
export async function completeAttachmentUpload(ctx: OrgContext, surveyId: string, deviceId: string): Promise<CompletedUpload> {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  if (!DEVICE_ID.test(deviceId)) throw notFound('Upload');
  // The pending row is locked first: a second completion at the same moment waits here, then finds it gone.
  const [pending] = await ctx.em.execute<{ id: string; survey_id: string; object_key: string; filename: string; size_bytes: number; caption: string | null; uploaded_by_email: string | null }[]>(
    `select id, survey_id, object_key, filename, size_bytes, caption, uploaded_by_email from survey_attachment_upload where organisation_id = ? and device_id = ? for update`,
    [ctx.organisation.id, deviceId],
  );
  if (!pending) {
    const done = await ctx.em.findOne(SurveyAttachmentSchema, { organisation: ctx.organisation, deviceId, survey });
    if (done) return { created: false, attachment: { id: done.id, filename: done.filename, contentType: done.contentType, sizeBytes: done.sizeBytes } };
    throw new AppError('not-found', 'No upload is waiting for this file; send it again.');
  }
  if (pending.survey_id !== survey.id) throw notFound('Upload');
  const key = pending.object_key;
  if (!isOrganisationKey(key, ctx.organisation.id)) throw new AppError('invalid', 'The file is not stored under this organisation; send it again.');

  const storage = getStorage();
  // A refused file leaves the storage at once: nothing names it, and the refusal rolls back whatever was recorded.
  const refuse = async (message: string) => {
    await storage.deleteObject(key).catch(() => undefined); // the clean-up job removes it otherwise
    throw new AppError('invalid', message, { file: [message] });
  };
  const head = await storage.headObject(key);
  if (!head) throw new AppError('invalid', 'The file did not arrive in the storage; send it again.', { file: ['The file did not arrive in the storage; send it again.'] });
  if (head.sizeBytes > MAX_ATTACHMENT_BYTES) return refuse(`The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB; reduce it and try again.`);
  if (head.sizeBytes === 0) return refuse('The file is empty.');
  if (head.sizeBytes !== Number(pending.size_bytes)) return refuse('The file that arrived is not the size announced; send it again.');
  const first = await storage.readFirstBytes(key, 16);
  if (!first) throw new AppError('invalid', 'The file did not arrive in the storage; send it again.', { file: ['The file did not arrive in the storage; send it again.'] });
  const contentType = sniffContentType(first);
  if (!contentType) return refuse('Only JPEG and PNG photos and PDF reports can be attached.');

  const attachment = ctx.em.create(SurveyAttachmentSchema, {
    organisation: ctx.organisation,
    survey,
    filename: attachmentFilename(pending.filename, contentType),
    contentType,
    sizeBytes: head.sizeBytes,
    objectKey: key,
    deviceId,
    caption: pending.caption,
    uploadedByEmail: ctx.user.email,
  });
  await ctx.em.execute('delete from survey_attachment_upload where id = ?', [pending.id]);
  audit(ctx, { action: 'survey.attachment-added', targetType: 'survey', targetId: survey.id, details: { file: attachment.filename, bytes: attachment.sizeBytes } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { created: true, attachment: { id: attachment.id, filename: attachment.filename, contentType: attachment.contentType, sizeBytes: attachment.sizeBytes } };
}
