import { SurveyReadingSchema, type Survey, type SurveyReading } from '@/entities';
import { notFound } from '../../errors';
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
  ctx.em.remove(reading);
  if (alerted) await mailCorrections(ctx, survey, [{ location: before.location, before: words, after: null }]);
  audit(ctx, { action: 'survey.reading-deleted', targetType: 'survey', targetId: survey.id, details: { readingId, before, after: null, correctionMailed: alerted } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { location: before.location, correctionMailed: alerted };
}
