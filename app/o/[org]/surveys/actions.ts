'use server';
import { redirect } from 'next/navigation';
import { orgAction, formObject, formId } from '@/lib/server/action';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { deleteReading, restoreReading, updateReading } from '@/lib/server/services/surveys/correct-readings';
import { deleteSurvey, restoreSurvey, undoDeleteSurvey, updateSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { deleteSurveyAttachment, restoreSurveyAttachment, updateSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { describeReading, underProtectionWords } from '@/lib/server/services/surveys/reading-alerts';
import { formatDateOnly } from '@/lib/dates/date-only';

export const createSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  const survey = await createSurvey(ctx, formObject(formData));
  redirect(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
});

/** One reading typed in by hand (a drop-cell reading at a berth, a diver's call over the radio). */
export const addReadingAction = orgAction('survey:write', async (ctx, formData) => {
  const result = await addReading(ctx, formId(formData, 'surveyId'), formObject(formData));
  // The confirmation says what was stored, in the survey's words: "Reading added at Fr 22 P: -0.920 V against Ag/AgCl (seawater): protected."
  const saved = `at ${result.reading.location}: ${describeReading(result.survey, result.reading)}`;
  return { ok: true, message: result.under ? `Reading added: it is under-protected; ${underProtectionWords(result)}. Saved ${saved}.` : `Reading added ${saved}.` };
});

/** A corrected reading (a mistyped value, the wrong electrode). */
export const updateReadingAction = orgAction('survey:write', async (ctx, formData) => {
  const { reading, correctionMailed, alertMailed, isUnder } = await updateReading(ctx, formId(formData, 'surveyId'), formId(formData, 'readingId'), formObject(formData));
  const mail = correctionMailed ? ' A correction has been sent to the engineers who were told about it.' : alertMailed ? ' It is under-protected; the engineers have been told.' : '';
  return { ok: true, message: `Reading at ${reading.location} corrected${isUnder ? ' (under-protected)' : ''}.${mail}` };
});

export const deleteReadingAction = orgAction('survey:write', async (ctx, formData) => {
  const { location, correctionMailed, readingId } = await deleteReading(ctx, formId(formData, 'surveyId'), formId(formData, 'readingId'));
  return { ok: true, message: `Reading at ${location} deleted.${correctionMailed ? ' A correction has been sent to the engineers who were told about it.' : ''}`, data: { undoReadingId: readingId, location } };
});

/** Undo of "Delete" beside a reading, a moment ago (restoreReading). */
export const restoreReadingAction = orgAction('survey:write', async (ctx, formData) => {
  const { reading, survey, restored, correctionWasMailed, isUnder, alertMailed, groupLost } = await restoreReading(ctx, formId(formData, 'surveyId'), formId(formData, 'readingId'));
  if (!restored) return { ok: true, message: `The reading at ${reading.location} is already back.` };
  const parts = [`Reading at ${reading.location} put back: ${describeReading(survey, reading)}.`];
  if (groupLost) parts.push('The anode group it named has since been taken off, so it has no group now.');
  if (correctionWasMailed) parts.push('The engineers were sent a correction saying it was deleted; that e-mail is not withdrawn.');
  if (isUnder) parts.push(alertMailed ? 'It is under-protected; the engineers have been told again.' : 'It is under-protected; it joins the alert already open on this survey, shown on its page.');
  return { ok: true, message: parts.join(' ') };
});

export const updateSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  await updateSurvey(ctx, formId(formData, 'surveyId'), formObject(formData));
  return { ok: true, message: 'Survey saved.' };
});

/** Deletes a survey (kept 30 days for an engineer to restore) and goes back to the list. */
export const deleteSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  const surveyId = formId(formData, 'surveyId');
  await deleteSurvey(ctx, surveyId);
  // The list names the deleted survey, so its notice can offer the Undo.
  redirect(`/o/${ctx.organisation.slug}/surveys?deleted=${surveyId}`);
});

/** Undo of "Delete the survey", from the notice on the list a moment after (undoDeleteSurvey). */
export const undoDeleteSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  const { survey, restored } = await undoDeleteSurvey(ctx, formId(formData, 'surveyId'));
  const what = `Survey of ${survey.asset.name} on ${formatDateOnly(survey.surveyedOn)}`;
  return { ok: true, message: restored ? `${what} put back.` : `${what} is already back.`, data: { surveyId: survey.id } };
});

export const restoreSurveyAction = orgAction('survey:restore', async (ctx, formData) => {
  const survey = await restoreSurvey(ctx, formId(formData, 'surveyId'));
  return { ok: true, message: `Survey of ${survey.asset.name} on ${formatDateOnly(survey.surveyedOn)} restored.` };
});

export const updateAttachmentAction = orgAction('survey:write', async (ctx, formData) => {
  const attachment = await updateSurveyAttachment(ctx, formId(formData, 'surveyId'), formId(formData, 'attachmentId'), formObject(formData));
  return { ok: true, message: `Caption of ${attachment.filename} saved.` };
});

export const deleteAttachmentAction = orgAction('survey:write', async (ctx, formData) => {
  const attachmentId = formId(formData, 'attachmentId');
  const { file } = await deleteSurveyAttachment(ctx, formId(formData, 'surveyId'), attachmentId);
  return { ok: true, message: `${file} deleted.`, data: { undoAttachmentId: attachmentId, file } };
});

/** Undo of "Delete" beside an attachment, a moment ago (restoreSurveyAttachment). */
export const restoreAttachmentAction = orgAction('survey:write', async (ctx, formData) => {
  const { file, restored } = await restoreSurveyAttachment(ctx, formId(formData, 'surveyId'), formId(formData, 'attachmentId'));
  return { ok: true, message: restored ? `${file} put back.` : `${file} is already back.` };
});
