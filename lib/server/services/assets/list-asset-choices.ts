import { AssetSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';

/** The organisation's active assets for a picker (new design, new survey), by name. */
export async function listAssetChoices(ctx: OrgContext) {
  requirePermission(ctx, 'org:read');
  const assets = await ctx.em.find(AssetSchema, { organisation: ctx.organisation, archivedAt: null }, { orderBy: { name: 'asc' }, fields: ['id', 'name', 'kind'] });
  return assets.map((a) => ({ id: a.id, name: a.name, kind: a.kind }));
}

/** How many active assets the organisation has (what the plan's limit counts). */
export async function countActiveAssets(ctx: OrgContext) {
  requirePermission(ctx, 'org:read');
  return ctx.em.count(AssetSchema, { organisation: ctx.organisation, archivedAt: null });
}
