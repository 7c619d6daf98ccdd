import { SurveyAttachmentSchema, SurveyReadingSchema } from '@/entities';
import { classifyPotential, classifyRemaining, criteriaSubject, type PotentialStatus } from '@/lib/surveys/criteria';
import { OVER_PROTECTION_LIMIT, protectionCriterionV } from '@/lib/cp';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';
import type { ListQuery } from '@/lib/schemas/register';
import { requirePermission, type OrgContext } from '../../org-context';
import { getSurveyOrThrow } from './survey-access';
import { ilikePattern, toPage, inSequence } from '../../sql';

/** A survey with its readings judged against the asset's criteria, and its attachments (without their bytes). */
export async function getSurveyDetails(ctx: OrgContext, surveyId: string) {
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const [readings, attachments] = await inSequence(
    () => ctx.em.find(SurveyReadingSchema, { survey }, { populate: ['anodeGroup'], orderBy: { line: 'asc', location: 'asc' } }),
    () => ctx.em.find(SurveyAttachmentSchema, { survey }, { orderBy: { createdAt: 'asc' } }),
  );
  const criteria = surveyCriteriaOf(survey.asset);
  const rows = readings.map((r) => {
    const potential = r.potentialAgAgClV === null || r.potentialAgAgClV === undefined ? null : classifyPotential({ potentialAgAgClV: r.potentialAgAgClV, ...criteria });
    const remaining = r.remainingFraction === null || r.remainingFraction === undefined ? null : classifyRemaining(r.remainingFraction, r.anodeGroup?.model.utilisationFactor);
    return {
      id: r.id,
      line: r.line ?? null,
      location: r.location,
      potentialV: r.potentialV ?? null,
      electrode: r.electrode ?? null,
      potentialAgAgClV: r.potentialAgAgClV ?? null,
      potentialStatus: potential?.status ?? null,
      potentialLabel: potential?.label ?? null,
      potentialMessage: potential?.message ?? null,
      potentialCriterion: potential?.criterion ?? null,
      group: r.anodeGroup ? r.anodeGroup.label : null,
      remainingFraction: r.remainingFraction ?? null,
      remainingStatus: remaining,
      comment: r.comment ?? null,
    };
  });
  const counts = rows.reduce<Record<PotentialStatus, number>>((acc, r) => (r.potentialStatus ? { ...acc, [r.potentialStatus]: acc[r.potentialStatus] + 1 } : acc), { 'under-protected': 0, protected: 0, 'over-protected': 0 });
  return {
    survey: { id: survey.id, assetId: survey.asset.id, assetName: survey.asset.name, metal: criteria.protectedMetal, criteriaFor: criteriaSubject(criteria), surveyedOn: survey.surveyedOn, method: survey.method, surveyor: survey.surveyor ?? null, defaultElectrode: survey.defaultElectrode ?? 'ag-agcl-seawater', notes: survey.notes ?? null, createdBy: survey.createdBy.name },
    readings: rows,
    counts,
    attachments: attachments.map((a) => ({ id: a.id, filename: a.filename, contentType: a.contentType, sizeBytes: a.sizeBytes, caption: a.caption ?? null, uploadedBy: a.uploadedByEmail ?? null })),
  };
}

export interface SurveyListRow {
  id: string;
  assetId: string;
  assetName: string;
  surveyedOn: string;
  method: string;
  surveyor: string | null;
  readings: number;
  underProtected: number;
  leastNegativeV: number | null;
}

/** One page of surveys, newest first unless sorted otherwise, with counts; two statements. */
export async function listSurveys(ctx: OrgContext, query: ListQuery) {
  requirePermission(ctx, 'org:read');
  const clauses = ['s.organisation_id = ?'];
  const params: unknown[] = [ctx.organisation.id];
  if (query.assetId) {
    clauses.push('s.asset_id = ?');
    params.push(query.assetId);
  }
  if (query.q) {
    clauses.push("(a.name ilike ? or coalesce(s.surveyor, '') ilike ? or s.method ilike ?)");
    const like = ilikePattern(query.q);
    params.push(like, like, like);
  }
  const sorts: Record<string, string> = { asset: 'a.name', surveyedOn: 's.surveyed_on', method: 's.method' };
  const order = query.sort && sorts[query.sort] ? `${sorts[query.sort]} ${query.dir}` : 's.surveyed_on desc';
  const where = clauses.join(' and ');
  const conn = ctx.em;
  const [countRows, rows] = await inSequence(
    () => conn.execute<{ total: string }[]>(`select count(*) as total from survey s join asset a on a.id = s.asset_id where ${where}`, params),
    () => conn.execute<Record<string, unknown>[]>(
      `select s.id, s.asset_id, a.name as asset_name, a.kind, a.hull_material, to_char(s.surveyed_on, 'YYYY-MM-DD') as surveyed_on, s.method, s.surveyor,
              count(r.id) as readings, max(r.potential_ag_ag_cl_v) as least_negative,
              count(*) filter (where r.potential_ag_ag_cl_v > case when a.kind = 'vessel' and a.hull_material = 'aluminium' then ?::float8 when a.anaerobic then ?::float8 else ?::float8 end
                                 -- anaerobic high-strength steel has no protected window: beyond its limit a reading is over-protected, not under
                                 and not (a.high_strength_steel and a.hull_material is distinct from 'aluminium' and r.potential_ag_ag_cl_v < ?::float8)) as under
         from survey s join asset a on a.id = s.asset_id left join survey_reading r on r.survey_id = s.id
        where ${where}
        group by s.id, a.id
        order by ${order}, s.created_at desc
        limit ? offset ?`,
      // Criteria from lib/cp (aluminium hull, anaerobic steel, steel; high-strength steel limit), passed in so SQL never restates them.
      [
        protectionCriterionV({ protectedMetal: 'aluminium' }),
        protectionCriterionV({ protectedMetal: 'steel', environment: { water: 'seawater', anaerobic: true } }),
        protectionCriterionV({ protectedMetal: 'steel' }),
        OVER_PROTECTION_LIMIT['high-strength-steel']!.valueV,
        ...params,
        query.pageSize,
        (query.page - 1) * query.pageSize,
      ],
    ),
  );
  return toPage(countRows, query, rows, (r): SurveyListRow => ({
        id: r.id as string,
        assetId: r.asset_id as string,
        assetName: r.asset_name as string,
        surveyedOn: r.surveyed_on as string,
        method: r.method as string,
        surveyor: (r.surveyor as string) ?? null,
        readings: Number(r.readings),
        underProtected: Number(r.under),
        leastNegativeV: r.least_negative === null ? null : Number(r.least_negative),
      }));
}
