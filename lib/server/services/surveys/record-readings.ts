import { AnodeGroupSchema, MembershipSchema, SurveyReadingSchema, type Survey } from '@/entities';
import { AG_AGCL_SEAWATER_SALINITY_RANGE_PSU, convertPotential } from '@/lib/cp';
import { classifyPotential } from '@/lib/surveys/criteria';
import { surveyCriteriaOf, waterSalinityOf } from '@/lib/register/protected-metal';
import type { ParsedReading } from '@/lib/surveys/survey-csv';
import { enqueueMail } from '../../mail/outbox';
import { getEnv } from '../../env';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { audit } from '../../audit';
import { getSurveyOrThrow } from './survey-access';
import { readingSchema } from '@/lib/schemas/register';

export type ReadingInput = Omit<ParsedReading, 'line' | 'potentialAgAgClV'> & { line?: number | null };

/**
 * Adds readings to a survey in the caller's unit of work: potentials converted to Ag/AgCl/seawater
 * (a reading against an Ag/AgCl/seawater electrode corrected for the chloride of the asset's water,
 * Nernst) and classified with the asset's criteria (metal, anaerobic, high-strength steel); group
 * labels resolved to the asset's fitted groups. When a reading is under-protected, the organisation's
 * engineers and owners are told once per survey (through the outbox).
 */
export async function addReadings(ctx: OrgContext, survey: Survey, readings: ReadingInput[]) {
  const labels = [...new Set(readings.map((r) => r.anodeGroupLabel).filter((l): l is string => Boolean(l)))];
  const groups = labels.length ? await ctx.em.find(AnodeGroupSchema, { asset: survey.asset, removedOn: null, label: { $in: labels } }) : [];
  const byLabel = new Map(groups.map((g) => [g.label, g]));
  const criteria = surveyCriteriaOf(survey.asset);
  const salinityPsu = waterSalinityOf(survey.asset);
  if (readings.some((r) => r.potentialV !== null && r.electrode === 'ag-agcl-seawater')) assertAgAgClSeawaterUsable(salinityPsu);
  let under = 0;
  for (const r of readings) {
    const agAgCl =
      r.potentialV !== null && r.electrode
        ? convertPotential({ valueV: r.potentialV, from: r.electrode, to: 'ag-agcl-seawater', salinityPsu: r.electrode === 'ag-agcl-seawater' ? (salinityPsu ?? undefined) : undefined })
        : null;
    if (agAgCl !== null && classifyPotential({ potentialAgAgClV: agAgCl, ...criteria }).status === 'under-protected') under++;
    ctx.em.create(SurveyReadingSchema, {
      survey,
      line: r.line ?? null,
      location: r.location,
      potentialV: r.potentialV,
      electrode: r.electrode,
      potentialAgAgClV: agAgCl === null ? null : Math.round(agAgCl * 1e6) / 1e6,
      anodeGroup: r.anodeGroupLabel ? (byLabel.get(r.anodeGroupLabel) ?? null) : null,
      remainingFraction: r.remainingFraction,
      comment: r.comment,
    });
  }
  if (under) {
    const recipients = await ctx.em.find(MembershipSchema, { organisation: ctx.organisation, role: { $in: ['engineer', 'owner'] } }, { populate: ['user'] });
    const url = `${getEnv().APP_URL}/o/${ctx.organisation.slug}/surveys/${survey.id}`;
    for (const m of recipients) {
      enqueueMail(ctx, {
        to: m.user.email,
        organisationId: ctx.organisation.id,
        dedupeKey: `survey-under-protection:${survey.id}:${m.user.id}`,
        subject: `Under-protection found on ${survey.asset.name} (survey of ${survey.surveyedOn})`,
        text: `${under} reading(s) of the ${survey.method} survey of ${survey.asset.name} on ${survey.surveyedOn} are less negative than the protection criterion.\n\nSee the readings: ${url}\n\nCheck the anodes and their electrical continuity; verify against the governing standard before acting.\n\n— Tidewarden`,
      });
    }
  }
  return { under };
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
  // The form asks for the remaining anode mass in per cent; the register keeps a fraction.
  const percent = form.remainingPercent;
  const reading = readingSchema.parse({ ...form, remainingFraction: percent === '' || percent === undefined || percent === null ? null : Number(percent) / 100 }) as ReadingInput;
  const { under } = await addReadings(ctx, survey, [reading]);
  audit(ctx, { action: 'survey.reading-added', targetType: 'survey', targetId: survey.id, details: { location: reading.location } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return { survey, under };
}
