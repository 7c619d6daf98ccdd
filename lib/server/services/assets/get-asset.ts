import { AssetSchema } from '@/entities';
import { notFound } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An asset of this organisation (archived ones only when asked); 404 for anything else. */
export async function getAssetOrThrow(ctx: OrgContext, assetId: string, { includeArchived = false } = {}) {
  requirePermission(ctx, 'org:read');
  if (!UUID.test(assetId)) throw notFound('Asset');
  const asset = await ctx.em.findOne(AssetSchema, { id: assetId, organisation: ctx.organisation, ...(includeArchived ? {} : { archivedAt: null }) });
  if (!asset) throw notFound('Asset');
  return asset;
}
