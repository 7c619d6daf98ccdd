import { z } from 'zod';
import { AssetSchema, SurveySchema, UserSchema } from '@/entities';
import { readingSchema, surveySchema } from '@/lib/schemas/register';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { addReadings, type ReadingInput } from './record-readings';

export async function createSurvey(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'survey:write');
  const { readings: rawReadings, ...rest } = z.object({ readings: z.array(z.unknown()).max(5000).default([]) }).passthrough().parse(input);
  const data = surveySchema.parse(rest);
  const readings = z.array(readingSchema).parse(rawReadings) as ReadingInput[];
  const asset = await ctx.em.findOne(AssetSchema, { id: data.assetId, organisation: ctx.organisation, archivedAt: null });
  if (!asset) throw notFound('Asset');
  const survey = ctx.em.create(SurveySchema, {
    organisation: ctx.organisation,
    asset,
    surveyedOn: data.surveyedOn,
    method: data.method,
    surveyor: data.surveyor,
    defaultElectrode: data.defaultElectrode,
    notes: data.notes,
    createdBy: ctx.em.getReference(UserSchema, ctx.user.id),
  });
  const { under } = await addReadings(ctx, survey, readings);
  audit(ctx, { action: 'survey.recorded', targetType: 'survey', targetId: survey.id, details: { asset: asset.name, date: data.surveyedOn, readings: readings.length, underProtected: under } });
  // A survey can move a group's end of life: bring the renewal proposals up to date.
  ctx.effects.assetChanged(asset.id);
  return survey;
}

