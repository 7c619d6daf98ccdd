import { requirePermission, type OrgContext } from '../../org-context';

export type FirstRunStep = 'asset' | 'design' | 'fit' | 'docking';

export interface FirstRun {
  /** Each step, done or not, read from the organisation's own records (nothing is stored about the guide). */
  done: Record<FirstRunStep, boolean>;
  /** Where the next click should go: the first asset, the newest draft or approved revision. */
  links: { assetId: string | null; assetKind: 'vessel' | 'structure' | null; draftDesignId: string | null; approvedDesignId: string | null };
  /** True once every step is done: the guide is no longer shown. */
  complete: boolean;
}

/** The first-run guide's progress: add an asset, size it, fit the approved design, plan a docking or campaign. */
export async function getFirstRun(ctx: OrgContext): Promise<FirstRun> {
  requirePermission(ctx, 'org:read');
  // One statement (the fleet overview is the home page, opened far more often than the guide is needed).
  const [row] = await ctx.em.execute<{ asset_id: string | null; asset_kind: string | null; draft_id: string | null; approved_id: string | null; has_groups: boolean; has_dockings: boolean }[]>(
    `select
       (select id from asset where organisation_id = o.id and archived_at is null order by created_at limit 1) as asset_id,
       (select kind from asset where organisation_id = o.id and archived_at is null order by created_at limit 1) as asset_kind,
       (select id from design where organisation_id = o.id and status <> 'approved' order by updated_at desc limit 1) as draft_id,
       (select id from design where organisation_id = o.id and status = 'approved' order by updated_at desc limit 1) as approved_id,
       exists (select 1 from anode_group where organisation_id = o.id) as has_groups,
       exists (select 1 from docking where organisation_id = o.id) as has_dockings
     from organisation o where o.id = ?`,
    [ctx.organisation.id],
  );
  const done = { asset: Boolean(row?.asset_id), design: Boolean(row?.approved_id), fit: Boolean(row?.has_groups), docking: Boolean(row?.has_dockings) };
  return {
    done,
    links: { assetId: row?.asset_id ?? null, assetKind: (row?.asset_kind as 'vessel' | 'structure' | null) ?? null, draftDesignId: row?.draft_id ?? null, approvedDesignId: row?.approved_id ?? null },
    complete: Object.values(done).every(Boolean),
  };
}
