import { AuditEventSchema, SurveyReadingSchema, type Survey, type SurveyReading } from '@/entities';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { uuidOrNotFound } from '../../ids';
import { requirePermission, type OrgContext } from '../../org-context';
import { readingFormSchema } from '@/lib/schemas/surveys';
import { getSurveyOrThrow } from './survey-access';
import { agAgClOf, groupByLabel, surveyElectrodeOf } from './record-readings';
import { alertUnderProtection, describeReading, lockSurvey, mailCorrections, potentialStatusOf } from './reading-alerts';

/** What an audit row keeps of a reading: its values as the user gave them, and the converted potential. */
export function readingRecord(r: SurveyReading) {
  return {
    location: r.location,
    potentialV: r.potentialV ?? null,
    electrode: r.electrode ?? null,
    potentialAgAgClV: r.potentialAgAgClV ?? null,
    anodeGroup: r.anodeGroup ? r.anodeGroup.label : null,
    remainingFraction: r.remainingFraction ?? null,
    comment: r.comment ?? null,
  };
}

async function readingOrThrow(ctx: OrgContext, survey: Survey, readingId: string) {
  uuidOrNotFound(readingId, 'Reading');
  const reading = await ctx.em.findOne(SurveyReadingSchema, { id: readingId, survey }, { populate: ['anodeGroup'] });
  if (!reading) throw notFound('Reading');
  return reading;
}

/**
 * Corrects one reading (a mistyped value, the wrong electrode). The audit row keeps the values before and
 * after; the forecast follows. If an under-protection message named the reading and its value changed,
 * a correction goes to the same people; a reading that becomes under-protected is told as a new one is.
 */
export async function updateReading(ctx: OrgContext, surveyId: string, readingId: string, form: Record<string, unknown>) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  await lockSurvey(ctx, survey);
  const reading = await readingOrThrow(ctx, survey, readingId);
  const input = readingFormSchema(surveyElectrodeOf(survey)).parse(form);
  const group = await groupByLabel(ctx, survey, input.anodeGroupLabel);
  const before = readingRecord(reading);
  const beforeWords = describeReading(survey, reading);
  const wasUnder = potentialStatusOf(survey, reading) === 'under-protected';
  const electrode = input.potentialV === null ? null : input.electrode;
  reading.location = input.location;
  reading.potentialV = input.potentialV;
  reading.electrode = electrode;
  reading.potentialAgAgClV = agAgClOf(survey, input.potentialV, electrode);
  reading.anodeGroup = group;
  reading.remainingFraction = input.remainingFraction;
  reading.comment = input.comment;
  const after = readingRecord(reading);
  const valueChanged = before.location !== after.location || before.potentialV !== after.potentialV || before.electrode !== after.electrode || before.remainingFraction !== after.remainingFraction;
  const isUnder = potentialStatusOf(survey, reading) === 'under-protected';
  let correctionMailed = false;
  let alertMailed = false;
  if (reading.alertedAt && valueChanged) {
    await mailCorrections(ctx, survey, [{ location: before.location, before: beforeWords, after: describeReading(survey, reading) }]);
    correctionMailed = true;
    // Still under-protected: the alert stays open on it; otherwise the message about it is closed by the correction.
    if (!isUnder) reading.alertedAt = null;
  } else if (!reading.alertedAt && isUnder && !wasUnder) {
    alertMailed = (await alertUnderProtection(ctx, survey, [reading])).mailed;
  }
  audit(ctx, { action: 'survey.reading-updated', targetType: 'survey', targetId: survey.id, details: { readingId: reading.id, before, after, correctionMailed, alertMailed } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { reading, correctionMailed, alertMailed, isUnder };
}

/** Deletes one reading; the audit row keeps what it was, and a message that named it is followed by a correction. */
export async function deleteReading(ctx: OrgContext, surveyId: string, readingId: string) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  await lockSurvey(ctx, survey);
  const reading = await readingOrThrow(ctx, survey, readingId);
  const before = readingRecord(reading);
  const words = describeReading(survey, reading);
  const alerted = Boolean(reading.alertedAt);
  // The whole row as the database has it (every column, by name), so an undo puts back exactly this reading.
  const [{ row }] = await ctx.em.execute<{ row: Record<string, unknown> }[]>('select to_jsonb(r) as row from survey_reading r where r.id = ?', [reading.id]);
  ctx.em.remove(reading);
  if (alerted) await mailCorrections(ctx, survey, [{ location: before.location, before: words, after: null }]);
  audit(ctx, { action: 'survey.reading-deleted', targetType: 'survey', targetId: survey.id, details: { readingId, before, after: null, correctionMailed: alerted, row } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { location: before.location, correctionMailed: alerted, readingId: reading.id };
}

/** How long after a delete a reading can be put back (the screen offers it for a few seconds; a slow click still works). */
export const READING_RESTORE_MINUTES = 10;

/**
 * Undo of "Delete" beside a reading: the same reading (same id, line, values, electrode and group) comes
 * back from the row the delete's audit record kept, column for column, so nothing typed is lost. A repeat
 * finds it back and changes nothing. If the group it named has since gone, it comes back without a group.
 *
 * Mail follows the house rules in reading-alerts.ts: if the delete closed an alert with a correction, that
 * alert stays closed (the reading comes back unflagged), and a restored reading that is under-protected is
 * told as a newly recorded one is (mailed if no alert is open on the survey, else it joins the open one).
 */
export async function restoreReading(ctx: OrgContext, surveyId: string, readingId: string) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  await lockSurvey(ctx, survey);
  uuidOrNotFound(readingId, 'Deleted reading');
  const existing = await ctx.em.findOne(SurveyReadingSchema, { id: readingId, survey }, { populate: ['anodeGroup'] });
  if (existing) return { reading: existing, survey, restored: false, correctionWasMailed: false, isUnder: potentialStatusOf(survey, existing) === 'under-protected', alertMailed: false, groupLost: false };
  const deletions = await ctx.em.find(
    AuditEventSchema,
    { organisationId: ctx.organisation.id, action: 'survey.reading-deleted', targetType: 'survey', targetId: survey.id },
    { orderBy: { createdAt: 'desc' }, limit: 500 },
  );
  const deletion = deletions.find((d) => d.details?.readingId === readingId);
  if (!deletion) throw notFound('Deleted reading');
  const row = deletion.details?.row;
  if (!row || typeof row !== 'object' || (row as Record<string, unknown>).survey_id !== survey.id) {
    throw new AppError('conflict', 'This delete was recorded before it could be undone; add the reading again instead.');
  }
  if (Date.now() - deletion.createdAt.getTime() > READING_RESTORE_MINUTES * 60_000) {
    throw new AppError('conflict', `The reading was deleted more than ${READING_RESTORE_MINUTES} minutes ago and can no longer be put back; add it again instead.`);
  }
  const groupId = (row as Record<string, unknown>).anode_group_id;
  const [{ present }] = await ctx.em.execute<{ present: boolean }[]>('select exists (select 1 from anode_group g where g.id::text = ?) as present', [typeof groupId === 'string' ? groupId : '']);
  const groupLost = typeof groupId === 'string' && !present;
  const restoredRow = { ...(row as Record<string, unknown>), alerted_at: null, ...(groupLost ? { anode_group_id: null } : {}) };
  await ctx.em.execute('insert into survey_reading select (jsonb_populate_record(null::survey_reading, ?::jsonb)).*', [JSON.stringify(restoredRow)]);
  const reading = await ctx.em.findOneOrFail(SurveyReadingSchema, { id: readingId, survey }, { populate: ['anodeGroup'] });
  const isUnder = potentialStatusOf(survey, reading) === 'under-protected';
  const alertMailed = isUnder ? (await alertUnderProtection(ctx, survey, [reading])).mailed : false;
  const correctionWasMailed = deletion.details?.correctionMailed === true;
  audit(ctx, { action: 'survey.reading-restored', targetType: 'survey', targetId: survey.id, details: { readingId, after: readingRecord(reading), correctionWasMailed, alertMailed, groupLost } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { reading, survey, restored: true, correctionWasMailed, isUnder, alertMailed, groupLost };
}
