import { AnodeGroupSchema, SurveyReadingSchema, type Survey, type SurveyReading } from '@/entities';
import { AG_AGCL_SEAWATER_SALINITY_RANGE_PSU, convertPotential } from '@/lib/cp';
import { waterSalinityOf } from '@/lib/register/protected-metal';
import type { Electrode, ParsedReading } from '@/lib/surveys/survey-csv';
import { readingFormSchema } from '@/lib/schemas/surveys';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { audit } from '../../audit';
import { getSurveyOrThrow } from './survey-access';
import { alertUnderProtection, lockSurvey } from './reading-alerts';

export type ReadingInput = Omit<ParsedReading, 'line' | 'potentialAgAgClV'> & { line?: number | null };

/** The electrode every reading of the survey defaults to. */
export const surveyElectrodeOf = (survey: Survey) => (survey.defaultElectrode ?? 'ag-agcl-seawater') as Electrode;

/**
 * A potential on the Ag/AgCl/seawater scale (a reading against an Ag/AgCl/seawater electrode corrected for
 * the chloride of the asset's water, Nernst), rounded to the microvolt; null without a potential.
 */
export function agAgClOf(survey: Survey, potentialV: number | null, electrode: Electrode | null) {
  if (potentialV === null || !electrode) return null;
  const salinityPsu = waterSalinityOf(survey.asset);
  if (electrode === 'ag-agcl-seawater') assertAgAgClSeawaterUsable(salinityPsu);
  const v = convertPotential({ valueV: potentialV, from: electrode, to: 'ag-agcl-seawater', salinityPsu: electrode === 'ag-agcl-seawater' ? (salinityPsu ?? undefined) : undefined });
  return Math.round(v * 1e6) / 1e6;
}

/** The asset's fitted group of that label (null when none is named). */
export async function groupByLabel(ctx: OrgContext, survey: Survey, label: string | null) {
  if (!label) return null;
  const group = await ctx.em.findOne(AnodeGroupSchema, { asset: survey.asset, removedOn: null, label });
  if (!group) throw new AppError('invalid', `No anode group "${label}" is fitted to ${survey.asset.name}.`, { anodeGroupLabel: ['Choose one of the asset\'s anode groups.'] });
  return group;
}

/**
 * Adds readings to a survey in the caller's unit of work: potentials converted to Ag/AgCl/seawater and
 * classified with the asset's criteria (metal, anaerobic, high-strength steel); a potential without an
 * electrode is read against the survey's electrode; group labels resolved to the asset's fitted groups.
 * Under-protected readings are told to the engineers and owners once per survey and condition
 * (`alertUnderProtection`); any number of them can be recorded.
 */
export async function addReadings(ctx: OrgContext, survey: Survey, readings: ReadingInput[]) {
  await lockSurvey(ctx, survey);
  const labels = [...new Set(readings.map((r) => r.anodeGroupLabel).filter((l): l is string => Boolean(l)))];
  const groups = labels.length ? await ctx.em.find(AnodeGroupSchema, { asset: survey.asset, removedOn: null, label: { $in: labels } }) : [];
  const byLabel = new Map(groups.map((g) => [g.label, g]));
  const created: SurveyReading[] = [];
  for (const r of readings) {
    const electrode = r.potentialV === null ? null : (r.electrode ?? surveyElectrodeOf(survey));
    created.push(
      ctx.em.create(SurveyReadingSchema, {
        survey,
        line: r.line ?? null,
        location: r.location,
        potentialV: r.potentialV,
        electrode,
        potentialAgAgClV: agAgClOf(survey, r.potentialV, electrode),
        anodeGroup: r.anodeGroupLabel ? (byLabel.get(r.anodeGroupLabel) ?? null) : null,
        remainingFraction: r.remainingFraction,
        comment: r.comment,
      }),
    );
  }
  const { under, mailed } = await alertUnderProtection(ctx, survey, created);
  return { under, mailed, readings: created };
}

/**
 * An Ag/AgCl/seawater electrode reads against the chloride of the water it stands in: without the
 * asset's salinity (brackish or fresh water not measured) the reading cannot be put on the seawater
 * scale, and below 0.5 PSU the electrode has no stable potential at all (lib/cp/potentials.ts).
 */
function assertAgAgClSeawaterUsable(salinityPsu: number | null) {
  const { min, max } = AG_AGCL_SEAWATER_SALINITY_RANGE_PSU;
  const message =
    salinityPsu === null
      ? "The asset's water salinity is not recorded, so readings against an Ag/AgCl/seawater electrode cannot be corrected for the chloride of brackish or fresh water. Enter the salinity in the asset's particulars, or record against a CSE."
      : salinityPsu < min || salinityPsu > max
        ? `At ${salinityPsu} PSU a reading against an Ag/AgCl/seawater electrode cannot be corrected (only from ${min} to ${max} PSU; in fresh water the electrode has no stable potential); record against a CSE.`
        : null;
  if (message) throw new AppError('invalid', message, { electrode: [message] });
}

/** One reading typed in by hand (a drop-cell reading at a berth, a diver's call over the radio). */
export async function addReading(ctx: OrgContext, surveyId: string, form: Record<string, unknown>) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const reading = readingFormSchema(surveyElectrodeOf(survey)).parse(form) as ReadingInput;
  await groupByLabel(ctx, survey, reading.anodeGroupLabel);
  const { under, mailed, readings } = await addReadings(ctx, survey, [reading]);
  audit(ctx, { action: 'survey.reading-added', targetType: 'survey', targetId: survey.id, details: { readingId: readings[0].id, location: reading.location } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { survey, under, mailed, reading: readings[0] };
}
