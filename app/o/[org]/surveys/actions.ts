'use server';
import { redirect } from 'next/navigation';
import { revalidatePath } from 'next/cache';
import { orgAction, formObject } from '@/lib/server/action';
import { createSurvey, readingSchema } from '@/lib/server/services/surveys/create-survey';
import { getSurveyOrThrow } from '@/lib/server/services/surveys/survey-access';
import { addReadings, type ReadingInput } from '@/lib/server/services/surveys/record-readings';
import { requirePermission } from '@/lib/server/org-context';
import { audit } from '@/lib/server/audit';
import { kickOutbox } from '@/lib/server/mail/outbox';
import { getEm } from '@/lib/server/db';

export const createSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  const survey = await createSurvey(ctx, formObject(formData));
  redirect(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
});

/** One reading typed in by hand (a drop-cell reading at a berth, a diver's call over the radio). */
export const addReadingAction = orgAction('survey:write', async (ctx, formData) => {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, String(formData.get('surveyId') ?? ''));
  const form = formObject(formData);
  const reading = readingSchema.parse({ ...form, remainingFraction: form.remainingPercent === '' || form.remainingPercent === undefined ? null : Number(form.remainingPercent) / 100 }) as ReadingInput;
  const { under } = await addReadings(ctx, survey, [reading]);
  audit(ctx, { action: 'survey.reading-added', targetType: 'survey', targetId: survey.id, details: { location: reading.location } });
  if (under) kickOutbox(getEm);
  revalidatePath(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { ok: true, message: under ? 'Reading added: it is under-protected; the engineers have been told.' : 'Reading added.' };
});
