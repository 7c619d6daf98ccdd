import { assetSchema } from '@/lib/schemas/assets';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from './get-asset';
import { assertAssetLimit } from '../billing/asset-limit';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';

// What decides how a stored reading is classified (readings are stored already converted, so the salinity is not among them).
type Criteria = ReturnType<typeof surveyCriteriaOf>;
const sameCriteria = (a: Criteria, b: Criteria) => a.protectedMetal === b.protectedMetal && a.anaerobic === b.anaerobic && a.highStrengthSteel === b.highStrengthSteel;

export async function updateAsset(ctx: OrgContext, assetId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId);
  const data = assetSchema.parse(input);
  if (data.kind !== asset.kind) throw new AppError('invalid', 'A vessel cannot become a structure or the other way round.');
  const criteriaBefore = surveyCriteriaOf(asset);
  const sources = drawingParticularSources(asset, data);
  ctx.em.assign(asset, { ...data, ...sources });
  const criteria = surveyCriteriaOf(asset);
  const criteriaChanged = !sameCriteria(criteria, criteriaBefore);
  audit(ctx, { action: 'asset.updated', targetType: 'asset', targetId: asset.id, details: { name: asset.name, ...(criteriaChanged ? { surveyCriteria: criteria } : {}) } });
  // The outlook judges the latest survey against the asset's criteria: recompute it when they change.
  if (criteriaChanged) ctx.effects.assetChanged(asset.id);
  return asset;
}

/**
 * Where the drawing's particulars come from after an edit: a value sent back unchanged keeps its source (an
 * estimate stays an estimate), a changed one is entered, a blank one is unknown; one left out stays as it is.
 */
export function drawingParticularSources(
  before: { frameSpacingM?: number | null; frameSpacingSource?: 'entered' | 'estimate' | null; pileRows?: number | null; pileBents?: number | null; pileGridSource?: 'entered' | 'estimate' | null },
  data: { frameSpacingM?: number | null; pileRows?: number | null; pileBents?: number | null },
): { frameSpacingSource?: 'entered' | 'estimate' | null; pileGridSource?: 'entered' | 'estimate' | null } {
  const out: { frameSpacingSource?: 'entered' | 'estimate' | null; pileGridSource?: 'entered' | 'estimate' | null } = {};
  if ('frameSpacingM' in data && data.frameSpacingM !== undefined) {
    out.frameSpacingSource = data.frameSpacingM === null ? null : data.frameSpacingM === before.frameSpacingM ? (before.frameSpacingSource ?? 'entered') : 'entered';
  }
  if ((data.pileRows !== undefined || data.pileBents !== undefined)) {
    const rows = data.pileRows === undefined ? before.pileRows ?? null : data.pileRows;
    const bents = data.pileBents === undefined ? before.pileBents ?? null : data.pileBents;
    out.pileGridSource = rows === null && bents === null ? null : rows === (before.pileRows ?? null) && bents === (before.pileBents ?? null) ? (before.pileGridSource ?? 'entered') : 'entered';
  }
  return out;
}

/** Archived assets leave the lists but keep every design, group and survey; they can be restored. */
export async function setAssetArchived(ctx: OrgContext, assetId: string, archived: boolean) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId, { includeArchived: true });
  if (!archived && asset.archivedAt) await assertAssetLimit(ctx);
  asset.archivedAt = archived ? new Date() : null;
  audit(ctx, { action: archived ? 'asset.archived' : 'asset.restored', targetType: 'asset', targetId: asset.id, details: { name: asset.name } });
  // A restored asset's plan may have moved while it was archived (settings, dockings): store it afresh.
  if (!archived) ctx.effects.assetChanged(asset.id);
  return asset;
}
