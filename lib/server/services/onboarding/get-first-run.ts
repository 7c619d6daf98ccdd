import { AnodeGroupSchema, AssetSchema, DesignSchema, DockingSchema } from '@/entities';
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
  const organisation = ctx.organisation;
  // One after another: the page's EntityManager runs one query at a time.
  const asset = await ctx.em.findOne(AssetSchema, { organisation, archivedAt: null }, { orderBy: { createdAt: 'asc' }, fields: ['id', 'kind'] });
  const draft = await ctx.em.findOne(DesignSchema, { organisation, status: { $ne: 'approved' } }, { orderBy: { updatedAt: 'desc' }, fields: ['id'] });
  const approved = await ctx.em.findOne(DesignSchema, { organisation, status: 'approved' }, { orderBy: { updatedAt: 'desc' }, fields: ['id'] });
  const groups = await ctx.em.count(AnodeGroupSchema, { organisation });
  const dockings = await ctx.em.count(DockingSchema, { organisation });
  const done = { asset: Boolean(asset), design: Boolean(approved), fit: groups > 0, docking: dockings > 0 };
  return {
    done,
    links: { assetId: asset?.id ?? null, assetKind: (asset?.kind as 'vessel' | 'structure' | undefined) ?? null, draftDesignId: draft?.id ?? null, approvedDesignId: approved?.id ?? null },
    complete: Object.values(done).every(Boolean),
  };
}
