import { z } from 'zod';
import { AssetSchema, SurveySchema, UserSchema } from '@/entities';
import { surveySchema } from '@/lib/schemas/register';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { addReadings, type ReadingInput } from './record-readings';

const readingSchema = z
  .object({
    location: z.string().trim().min(1, 'Enter where the reading was taken.').max(80),
    potentialV: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number().min(-2, 'A potential below -2.0 V is not plausible.').max(0.5, 'A potential above +0.5 V is not plausible.').nullable()),
    electrode: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.enum(['ag-agcl-seawater', 'cse', 'sce', 'zinc']).nullable()),
    anodeGroupLabel: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.string().max(60).nullable()),
    remainingFraction: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number().min(0, 'The remaining fraction is between 0 and 1.').max(1, 'The remaining fraction is between 0 and 1.').nullable()),
    comment: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.string().max(500).nullable()),
  })
  .refine((r) => r.potentialV !== null || r.remainingFraction !== null, { message: 'Enter a potential or a remaining fraction.', path: ['potentialV'] })
  .refine((r) => r.potentialV === null || r.electrode !== null, { message: 'Say which reference electrode was used.', path: ['electrode'] });

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
    notes: data.notes,
    createdBy: ctx.em.getReference(UserSchema, ctx.user.id),
  });
  const { under } = await addReadings(ctx, survey, readings);
  audit(ctx, { action: 'survey.recorded', targetType: 'survey', targetId: survey.id, details: { asset: asset.name, date: data.surveyedOn, readings: readings.length, underProtected: under } });
  // A survey can move a group's end of life: bring the renewal proposals up to date.
  ctx.effects.assetChanged(asset.id);
  return survey;
}

export { readingSchema };
