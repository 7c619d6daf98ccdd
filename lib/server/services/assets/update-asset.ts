import { assetSchema } from '@/lib/schemas/assets';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from './get-asset';
import { assertAssetLimit } from '../billing/asset-limit';

export async function updateAsset(ctx: OrgContext, assetId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId);
  const data = assetSchema.parse(input);
  if (data.kind !== asset.kind) throw new AppError('invalid', 'A vessel cannot become a structure or the other way round.');
  ctx.em.assign(asset, data);
  audit(ctx, { action: 'asset.updated', targetType: 'asset', targetId: asset.id, details: { name: asset.name } });
  return asset;
}

/** Archived assets leave the lists but keep every design, group and survey; they can be restored. */
export async function setAssetArchived(ctx: OrgContext, assetId: string, archived: boolean) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId, { includeArchived: true });
  if (!archived && asset.archivedAt) await assertAssetLimit(ctx);
  asset.archivedAt = archived ? new Date() : null;
  audit(ctx, { action: archived ? 'asset.archived' : 'asset.restored', targetType: 'asset', targetId: asset.id, details: { name: asset.name } });
  return asset;
}
