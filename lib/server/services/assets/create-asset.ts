import { AssetSchema } from '@/entities';
import { assetSchema } from '@/lib/schemas/assets';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { assertAssetLimit } from '../billing/asset-limit';
import { drawingParticularSources } from './update-asset';

export async function createAsset(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const data = assetSchema.parse(input);
  await assertAssetLimit(ctx);
  const asset = ctx.em.create(AssetSchema, { ...blankParticulars(), ...data, ...drawingParticularSources(blankParticulars(), data), organisation: ctx.organisation });
  audit(ctx, { action: 'asset.created', targetType: 'asset', targetId: asset.id, details: { name: asset.name, kind: asset.kind } });
  return asset;
}

/** Every optional particular of an asset, empty; a vessel or structure fills in its own. */
export function blankParticulars() {
  return {
    imoNumber: null,
    vesselType: null,
    lengthBppM: null,
    beamM: null,
    draughtM: null,
    blockCoefficient: null,
    hullMaterial: null,
    hasImpressedCurrent: false,
    tradingWaters: null,
    structureType: null,
    location: null,
    waterType: null,
    designLifeYears: null,
    pileCount: null,
    pileDiameterM: null,
    frameSpacingM: null,
    frameSpacingSource: null,
    pileRows: null,
    pileBents: null,
    pileGridSource: null,
    waterSalinityPsu: null,
    anaerobic: false,
    highStrengthSteel: false,
    notes: null,
    archivedAt: null,
  };
}
