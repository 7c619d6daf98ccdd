import { requirePermission, type OrgContext } from '../../org-context';
import { createAsset } from '../assets/create-asset';
import { createDesign } from './create-design';

/**
 * The desk's "new design" form: a design for an existing asset, or for a new asset whose particulars
 * come in the same form (fields prefixed "asset."). Asset and design commit together or not at all.
 */
export async function startDesign(ctx: OrgContext, form: Record<string, unknown>) {
  requirePermission(ctx, 'design:write');
  let assetId = String(form.assetId ?? '');
  if (assetId === 'new') {
    const particulars = Object.fromEntries(Object.entries(form).filter(([key]) => key.startsWith('asset.')).map(([key, value]) => [key.slice('asset.'.length), value]));
    const asset = await createAsset(ctx, { ...particulars, hasImpressedCurrent: form['asset.hasImpressedCurrent'] === 'on' });
    assetId = asset.id;
  }
  return createDesign(ctx, { assetId, title: form.title || undefined });
}
