import { SurveySchema } from '@/entities';
import { notFound } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { uuidOrNotFound } from '../../ids';

/** A survey of this organisation with its asset; 404 for anything else. */
export async function getSurveyOrThrow(ctx: OrgContext, surveyId: string) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(surveyId, 'Survey');
  const survey = await ctx.em.findOne(SurveySchema, { id: surveyId, organisation: ctx.organisation }, { populate: ['asset', 'createdBy'] });
  if (!survey) throw notFound('Survey');
  return survey;
}
