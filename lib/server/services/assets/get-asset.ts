import { AssetSchema } from '@/entities';
import { notFound } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { uuidOrNotFound } from '../../ids';

/** An asset of this organisation (archived ones only when asked); 404 for anything else. */
export async function getAssetOrThrow(ctx: OrgContext, assetId: string, { includeArchived = false } = {}) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(assetId, 'Asset');
  const asset = await ctx.em.findOne(AssetSchema, { id: assetId, organisation: ctx.organisation, ...(includeArchived ? {} : { archivedAt: null }) });
  if (!asset) throw notFound('Asset');
  return asset;
}
