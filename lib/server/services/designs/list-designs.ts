import { DesignSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { readDesignResults } from './read-design-record';

export async function listDesigns(ctx: OrgContext, { assetId }: { assetId?: string } = {}) {
  requirePermission(ctx, 'org:read');
  const designs = await ctx.em.find(
    DesignSchema,
    { organisation: ctx.organisation, ...(assetId ? { asset: assetId } : {}) },
    { populate: ['asset', 'preparedBy', 'approvedBy'], orderBy: { updatedAt: 'desc' }, exclude: ['inputs', 'basis'] },
  );
  return designs.map((d) => {
    const results = readDesignResults(d);
    return {
      id: d.id,
      assetId: d.asset.id,
      assetName: d.asset.name,
      revision: d.revision,
      title: d.title,
      status: d.status,
      anodeCount: results?.anodesToFit ?? null,
      governingCriterion: results?.governingCriterion ?? null,
      installedNetMassKg: results?.installedNetMassKg ?? null,
      warningCount: results?.warnings?.length ?? 0,
      hasError: Boolean(d.resultError),
      preparedBy: d.preparedBy.name,
      approvedBy: d.approvedBy?.name ?? null,
      updatedAt: d.updatedAt.toISOString(),
    };
  });
}
export type DesignListRow = Awaited<ReturnType<typeof listDesigns>>[number];
