'use server';
import { redirect } from 'next/navigation';
import { orgAction, formObject } from '@/lib/server/action';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';

export const createSurveyAction = orgAction('survey:write', async (ctx, formData) => {
  const survey = await createSurvey(ctx, formObject(formData));
  redirect(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
});

/** One reading typed in by hand (a drop-cell reading at a berth, a diver's call over the radio). */
export const addReadingAction = orgAction('survey:write', async (ctx, formData) => {
  const { under } = await addReading(ctx, String(formData.get('surveyId') ?? ''), formObject(formData));
  return { ok: true, message: under ? 'Reading added: it is under-protected; the engineers have been told.' : 'Reading added.' };
});
