import type { ListQuery } from '@/lib/schemas/register';
import { requirePermission, type OrgContext } from '../../org-context';
import { ilikePattern, toPage, inSequence } from '../../sql';
import { storedSummary, type PlanSummary } from '../planner/stored-outlooks';

const SORTS: Record<string, string> = {
  name: 'a.name',
  kind: 'a.kind',
  anodes: 'g.anodes',
  netMass: 'g.net_mass',
  lastSurvey: 's.surveyed_on',
  updatedAt: 'a.updated_at',
};

export interface AssetRow {
  id: string;
  name: string;
  kind: 'vessel' | 'structure';
  type: string | null;
  hullMaterial: string | null;
  hasImpressedCurrent: boolean;
  /** Survey criteria: anaerobic conditions (steel -0.90 V) and high-strength steel (limit about -0.83 V). */
  anaerobic: boolean;
  highStrengthSteel: boolean;
  zones: number;
  groups: number;
  anodes: number;
  netMassKg: number;
  lastSurveyedOn: string | null;
  /** The least negative potential of the latest survey, V vs Ag/AgCl/seawater (worst for under-protection). */
  lastSurveyLeastNegativeV: number | null;
  /** The most negative potential of the latest survey (worst for over-protection). */
  lastSurveyMostNegativeV: number | null;
  archived: boolean;
}

/**
 * One page of the organisation's assets with register and survey summaries, in two statements. Each row
 * also has the live asset's stored plan summary (asset_outlook) in `stored` when it is from `today`'s UTC day.
 */
export async function listAssets(ctx: OrgContext, query: ListQuery, today = new Date()) {
  requirePermission(ctx, 'org:read');
  const clauses = ['a.organisation_id = ?', query.archived === '1' ? 'a.archived_at is not null' : 'a.archived_at is null'];
  const params: unknown[] = [ctx.organisation.id];
  if (query.q) {
    clauses.push("(a.name ilike ? or coalesce(a.vessel_type, '') ilike ? or coalesce(a.structure_type, '') ilike ? or coalesce(a.location, '') ilike ?)");
    const like = ilikePattern(query.q);
    params.push(like, like, like, like);
  }
  const where = clauses.join(' and ');
  const order = `${SORTS[query.sort ?? ''] ?? 'a.name'} ${query.dir === 'desc' ? 'desc' : 'asc'} nulls last, a.name asc, a.id asc`;
  const conn = ctx.em;
  const [countRows, rows] = await inSequence(
    () => conn.execute<{ total: string }[]>(`select count(*) as total from asset a where ${where}`, params),
    () => conn.execute<Record<string, unknown>[]>(
      `select a.id, a.name, a.kind, coalesce(a.vessel_type, a.structure_type) as type, a.hull_material, a.has_impressed_current, a.anaerobic, a.high_strength_steel, a.archived_at,
              (select count(*) from zone z where z.asset_id = a.id and z.archived_at is null) as zones,
              coalesce(g.groups, 0) as groups, coalesce(g.anodes, 0) as anodes, coalesce(g.net_mass, 0) as net_mass,
              to_char(s.surveyed_on, 'YYYY-MM-DD') as surveyed_on, s.least_negative, s.most_negative,
              to_char(o.computed_on, 'YYYY-MM-DD') as outlook_on, o.outlook as stored_outlook, o.next_docking_id, o.mass_due_next_kg,
              to_char(o.renew_by, 'YYYY-MM-DD') as renew_by, d.kind as next_docking_kind, to_char(coalesce(d.actual_start, d.planned_start), 'YYYY-MM-DD') as next_docking_on
         from asset a
         left join asset_outlook o on o.asset_id = a.id and a.archived_at is null
         left join docking d on d.id = o.next_docking_id
         left join lateral (
           select count(*) as groups, sum(quantity) as anodes, sum(quantity * (model->>'netMassKg')::float8) as net_mass
             from anode_group where asset_id = a.id and removed_on is null) g on true
         left join lateral (
           select sv.surveyed_on, max(r.potential_ag_ag_cl_v) as least_negative, min(r.potential_ag_ag_cl_v) as most_negative
             from survey sv left join survey_reading r on r.survey_id = sv.id
            where sv.asset_id = a.id
            group by sv.id, sv.surveyed_on order by sv.surveyed_on desc, sv.created_at desc limit 1) s on true
        where ${where}
        order by ${order}
        limit ? offset ?`,
      [...params, query.pageSize, (query.page - 1) * query.pageSize],
    ),
  );
  const stored = new Map<string, PlanSummary>();
  for (const r of rows) {
    const summary = storedSummary(r, today);
    if (summary) stored.set(r.id as string, summary);
  }
  const page = toPage(countRows, query, rows, (r): AssetRow => ({
        id: r.id as string,
        name: r.name as string,
        kind: r.kind as AssetRow['kind'],
        type: (r.type as string) ?? null,
        hullMaterial: (r.hull_material as string) ?? null,
        hasImpressedCurrent: Boolean(r.has_impressed_current),
        anaerobic: Boolean(r.anaerobic),
        highStrengthSteel: Boolean(r.high_strength_steel),
        zones: Number(r.zones),
        groups: Number(r.groups),
        anodes: Number(r.anodes),
        netMassKg: Number(r.net_mass),
        lastSurveyedOn: (r.surveyed_on as string) ?? null,
        lastSurveyLeastNegativeV: r.least_negative === null || r.least_negative === undefined ? null : Number(r.least_negative),
        lastSurveyMostNegativeV: r.most_negative === null || r.most_negative === undefined ? null : Number(r.most_negative),
        archived: r.archived_at !== null,
      }));
  return { ...page, stored };
}
