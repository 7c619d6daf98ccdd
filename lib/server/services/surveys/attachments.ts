import type { EntityManager } from '@mikro-orm/postgresql';
import { SurveyAttachmentSchema } from '@/entities';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getSurveyOrThrow } from './survey-access';
import { uuidOrNotFound } from '../../ids';
import { attachmentCaptionSchema, MAX_ATTACHMENT_BYTES } from '@/lib/schemas/register';
import { getStorage } from '../../storage/object-storage';
import { attachmentObjectKey } from '../../storage/object-keys';
import { deleteObjectsLater, deleteObjectsNow } from '../storage/delete-objects';

export { MAX_ATTACHMENT_BYTES };

/** The content type from the file's first bytes; the name and the browser's claim are not trusted. */
export function sniffContentType(bytes: Uint8Array): 'image/jpeg' | 'image/png' | 'application/pdf' | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  if (bytes.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => bytes[i] === b)) return 'image/png';
  if (bytes.length >= 5 && String.fromCharCode(...bytes.subarray(0, 5)) === '%PDF-') return 'application/pdf';
  return null;
}

const EXTENSION = { 'image/jpeg': 'jpg', 'image/png': 'png', 'application/pdf': 'pdf' } as const;

/** The stored file name: the user's name without its extension, tidied, with the extension of the sniffed type. */
export function attachmentFilename(name: string, contentType: keyof typeof EXTENSION): string {
  const base = name.replace(/\.[^.]*$/, '').replace(/[^\w.\- ]+/g, '_').slice(0, 120) || 'attachment';
  return `${base}.${EXTENSION[contentType]}`;
}

/**
 * A file sent through the app server (the multipart route, for API clients): checked, written to the object
 * storage under a fresh key, then recorded. If the unit of work rolls back after the write, the object has no
 * row and the storage clean-up job removes it; if the storage is down, nothing is recorded (503).
 */
export async function addSurveyAttachment(ctx: OrgContext, surveyId: string, file: { name: string; bytes: Uint8Array }, caption: string | null) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const { caption: checkedCaption } = attachmentCaptionSchema.parse({ caption });
  if (file.bytes.length === 0) throw new AppError('invalid', 'The file is empty.');
  if (file.bytes.length > MAX_ATTACHMENT_BYTES) throw new AppError('payload-too-large', `The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB; reduce it and try again.`);
  const contentType = sniffContentType(file.bytes);
  if (!contentType) throw new AppError('unsupported', 'Only JPEG and PNG photos and PDF reports can be attached.');
  const objectKey = attachmentObjectKey(ctx.organisation.id, survey.id);
  await getStorage().putObject(objectKey, file.bytes, contentType);
  const attachment = ctx.em.create(SurveyAttachmentSchema, {
    organisation: ctx.organisation,
    survey,
    filename: attachmentFilename(file.name, contentType),
    contentType,
    sizeBytes: file.bytes.length,
    objectKey,
    caption: checkedCaption,
    uploadedByEmail: ctx.user.email,
  });
  audit(ctx, { action: 'survey.attachment-added', targetType: 'survey', targetId: survey.id, details: { file: attachment.filename, bytes: attachment.sizeBytes } });
  return attachment;
}

export async function getSurveyAttachment(ctx: OrgContext, surveyId: string, attachmentId: string) {
  const survey = await getSurveyOrThrow(ctx, surveyId);
  uuidOrNotFound(attachmentId, 'Attachment');
  const attachment = await ctx.em.findOne(SurveyAttachmentSchema, { id: attachmentId, survey });
  if (!attachment) throw notFound('Attachment');
  return attachment;
}

/** How long a link to a stored file works; the page asks for a fresh one each time it is shown or clicked. */
export const DOWNLOAD_URL_SECONDS = 5 * 60;

/**
 * A short-lived link that serves the file straight from the storage, with its sniffed type and its name
 * (a PDF is offered as a download, a photo is shown). Signing is local: it works even while the storage is down.
 */
export async function attachmentDownloadUrl(attachment: { objectKey?: string | null; contentType: string; filename: string }) {
  // A file from before the object storage whose bytes the mover has not reached yet (move-stored-files.ts).
  if (!attachment.objectKey) throw new AppError('unavailable', 'This file is still being moved into the file storage; try again in a few minutes.');
  const disposition = `${attachment.contentType === 'application/pdf' ? 'attachment' : 'inline'}; filename="${attachment.filename.replace(/["\\\r\n]/g, '_')}"`;
  return getStorage().presignGet(attachment.objectKey, { contentType: attachment.contentType, contentDisposition: disposition }, DOWNLOAD_URL_SECONDS);
}

async function attachmentForWrite(ctx: OrgContext, surveyId: string, attachmentId: string) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  uuidOrNotFound(attachmentId, 'Attachment');
  const attachment = await ctx.em.findOne(SurveyAttachmentSchema, { id: attachmentId, survey });
  if (!attachment) throw notFound('Attachment');
  return { survey, attachment };
}

/** Changes what the attachment's caption says; the audit row keeps the old and the new caption. */
export async function updateSurveyAttachment(ctx: OrgContext, surveyId: string, attachmentId: string, input: { caption?: unknown }) {
  const { survey, attachment } = await attachmentForWrite(ctx, surveyId, attachmentId);
  // The same check as a new attachment's caption: at most 200 characters, no control characters.
  const { caption } = attachmentCaptionSchema.parse({ caption: input.caption ?? null });
  const before = { file: attachment.filename, caption: attachment.caption ?? null };
  attachment.caption = caption;
  audit(ctx, { action: 'survey.attachment-updated', targetType: 'survey', targetId: survey.id, details: { attachmentId, before, after: { file: attachment.filename, caption: attachment.caption } } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return attachment;
}

/** Deletes a photo or report of a survey; the audit row names the file that went. */
export async function deleteSurveyAttachment(ctx: OrgContext, surveyId: string, attachmentId: string) {
  const { survey, attachment } = await attachmentForWrite(ctx, surveyId, attachmentId);
  const before = { file: attachment.filename, caption: attachment.caption ?? null, bytes: attachment.sizeBytes, uploadedBy: attachment.uploadedByEmail ?? null };
  // The whole row (with its object key; the file stays in the storage) waits ATTACHMENT_UNDO_MINUTES in the
  // bin for an undo; older ones go now, and their files once this change is committed.
  const expired = await ctx.em.execute<{ object_key: string | null }[]>(
    `delete from survey_attachment_bin where deleted_at <= now() - ? * interval '1 minute' returning payload->>'object_key' as object_key`,
    [ATTACHMENT_UNDO_MINUTES],
  );
  deleteObjectsLater(ctx, expired.map((r) => r.object_key));
  await ctx.em.execute(
    `insert into survey_attachment_bin (id, organisation_id, survey_id, deleted_at, payload)
     select a.id, a.organisation_id, a.survey_id, now(), to_jsonb(a) from survey_attachment a where a.id = ?
     on conflict (id) do update set deleted_at = excluded.deleted_at, payload = excluded.payload`,
    [attachment.id],
  );
  ctx.em.remove(attachment);
  audit(ctx, { action: 'survey.attachment-deleted', targetType: 'survey', targetId: survey.id, details: { attachmentId, before, after: null } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return before;
}

/** How long a deleted attachment can be put back (the screen offers it for a few seconds; a slow click still works). */
export const ATTACHMENT_UNDO_MINUTES = 10;

/**
 * The housekeeping job's sweep: files deleted more than ATTACHMENT_UNDO_MINUTES ago leave the bin for good,
 * and then leave the storage. The delete commits on its own (no transaction here) before the objects go;
 * an object whose delete fails has no row any more, so the storage clean-up job removes it later.
 */
export async function purgeAttachmentBin(em: EntityManager, now = new Date()) {
  const rows = await em.execute<{ id: string; object_key: string | null }[]>(
    `delete from survey_attachment_bin where deleted_at <= ?::timestamptz - ? * interval '1 minute' returning id, payload->>'object_key' as object_key`,
    [now.toISOString(), ATTACHMENT_UNDO_MINUTES],
  );
  await deleteObjectsNow(rows.map((r) => r.object_key));
  return rows.length;
}

/**
 * Undo of "Delete" beside an attachment: the same file (same id, bytes, caption, uploader) comes back from
 * the bin. A repeat finds it back and changes nothing; after ATTACHMENT_UNDO_MINUTES it is gone for good.
 */
export async function restoreSurveyAttachment(ctx: OrgContext, surveyId: string, attachmentId: string) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  uuidOrNotFound(attachmentId, 'Deleted attachment');
  const live = await ctx.em.findOne(SurveyAttachmentSchema, { id: attachmentId, survey, organisation: ctx.organisation });
  if (live) return { file: live.filename, restored: false };
  const [bin] = await ctx.em.execute<{ recent: boolean; filename: string }[]>(
    `select deleted_at > now() - ? * interval '1 minute' as recent, payload->>'filename' as filename
       from survey_attachment_bin where id = ? and survey_id = ? and organisation_id = ? for update`,
    [ATTACHMENT_UNDO_MINUTES, attachmentId, survey.id, ctx.organisation.id],
  );
  if (!bin) throw notFound('Deleted attachment');
  if (!bin.recent) throw new AppError('conflict', `${bin.filename} was deleted more than ${ATTACHMENT_UNDO_MINUTES} minutes ago and can no longer be put back; upload it again instead.`);
  await ctx.em.execute(
    `insert into survey_attachment select (jsonb_populate_record(null::survey_attachment, b.payload)).* from survey_attachment_bin b where b.id = ?`,
    [attachmentId],
  );
  await ctx.em.execute('delete from survey_attachment_bin where id = ?', [attachmentId]);
  audit(ctx, { action: 'survey.attachment-restored', targetType: 'survey', targetId: survey.id, details: { attachmentId, before: null, after: { file: bin.filename } } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { file: bin.filename, restored: true };
}
