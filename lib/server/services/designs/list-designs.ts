import type { DesignStatus } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';

const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/**
 * Every design revision of the organisation (or of one asset), newest first, with the few figures the list shows.
 * One plain statement: the figures are read out of the stored results in PostgreSQL (a value of the wrong type
 * reads as absent) instead of loading and validating each whole record; the design's own page validates it.
 */
export async function listDesigns(ctx: OrgContext, { assetId }: { assetId?: string } = {}) {
  requirePermission(ctx, 'org:read');
  const rows = await ctx.em.execute<Record<string, unknown>[]>(
    `select d.id, d.asset_id, a.name as asset_name, d.revision, d.title, d.status,
            case when jsonb_typeof(d.results->'anodesToFit') = 'number' then (d.results->>'anodesToFit')::float8 end as anodes_to_fit,
            case when jsonb_typeof(d.results->'governingCriterion') = 'string' then d.results->>'governingCriterion' end as governing_criterion,
            case when jsonb_typeof(d.results->'installedNetMassKg') = 'number' then (d.results->>'installedNetMassKg')::float8 end as installed_net_mass_kg,
            case when jsonb_typeof(d.results->'warnings') = 'array' then jsonb_array_length(d.results->'warnings') else 0 end as warning_count,
            d.result_error is not null as has_error, p.name as prepared_by, ap.name as approved_by, d.updated_at
       from design d
       join asset a on a.id = d.asset_id
       join app_user p on p.id = d.prepared_by_id
       left join app_user ap on ap.id = d.approved_by_id
      where d.organisation_id = ? ${assetId ? 'and d.asset_id = ?' : ''}
      order by d.updated_at desc, d.id`,
    assetId ? [ctx.organisation.id, assetId] : [ctx.organisation.id],
  );
  return rows.map((d) => ({
    id: d.id as string,
    assetId: d.asset_id as string,
    assetName: d.asset_name as string,
    revision: Number(d.revision),
    title: d.title as string,
    status: d.status as DesignStatus,
    anodeCount: num(d.anodes_to_fit),
    governingCriterion: (d.governing_criterion as string | null) ?? null,
    installedNetMassKg: num(d.installed_net_mass_kg),
    warningCount: Number(d.warning_count ?? 0),
    hasError: Boolean(d.has_error),
    preparedBy: d.prepared_by as string,
    approvedBy: (d.approved_by as string | null) ?? null,
    updatedAt: new Date(d.updated_at as string).toISOString(),
  }));
}
export type DesignListRow = Awaited<ReturnType<typeof listDesigns>>[number];
