'use server';
import { redirect } from 'next/navigation';
import { orgAction, formId, formObject } from '@/lib/server/action';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { setAssetArchived, updateAsset } from '@/lib/server/services/assets/update-asset';
import { archiveZone, createZone, updateZone } from '@/lib/server/services/register/zones';
import { restoreAnodeGroup } from '@/lib/server/services/register/restore-anode-group';
import { restoreZone } from '@/lib/server/services/register/restore-zone';
import { createAnodeGroup, removeAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';

const assetInput = (formData: FormData) => ({ ...formObject(formData), hasImpressedCurrent: formData.get('hasImpressedCurrent') === 'on' });

export const createAssetAction = orgAction('asset:write', async (ctx, formData) => {
  const asset = await createAsset(ctx, assetInput(formData));
  redirect(`/o/${ctx.organisation.slug}/assets/${asset.id}`);
});

export const updateAssetAction = orgAction('asset:write', async (ctx, formData) => {
  const asset = await updateAsset(ctx, formId(formData, 'assetId'), assetInput(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${asset.id}`);
  return { ok: true, message: 'Particulars saved.' };
});

export const archiveAssetAction = orgAction('asset:write', async (ctx, formData) => {
  const archive = formData.get('archive') === '1';
  const asset = await setAssetArchived(ctx, formId(formData, 'assetId'), archive);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${asset.id}`);
  return { ok: true, message: archive ? `${asset.name} is archived; restore it at any time.` : `${asset.name} is restored.` };
});

export const createZoneAction = orgAction('asset:write', async (ctx, formData) => {
  const assetId = formId(formData, 'assetId');
  const zone = await createZone(ctx, assetId, formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${assetId}`);
  return { ok: true, message: `Zone "${zone.name}" added.` };
});

export const updateZoneAction = orgAction('asset:write', async (ctx, formData) => {
  const zone = await updateZone(ctx, formId(formData, 'zoneId'), formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${zone.asset.id}`);
  return { ok: true, message: `Zone "${zone.name}" saved.` };
});

export const archiveZoneAction = orgAction('asset:write', async (ctx, formData) => {
  const zone = await archiveZone(ctx, formId(formData, 'zoneId'));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${zone.asset.id}`);
  return { ok: true, message: `Zone "${zone.name}" archived.`, data: { undoZoneId: zone.id } };
});

/** Undo of "Archive" beside a zone, a moment ago (restoreZone). */
export const restoreZoneAction = orgAction('asset:write', async (ctx, formData) => {
  const { zone } = await restoreZone(ctx, formId(formData, 'zoneId'));
  return { ok: true, message: `Zone "${zone.name}" restored.` };
});

export const createAnodeGroupAction = orgAction('asset:write', async (ctx, formData) => {
  const assetId = formId(formData, 'assetId');
  const group = await createAnodeGroup(ctx, assetId, formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${assetId}`);
  return { ok: true, message: `${group.quantity} × ${group.model.designation} recorded as "${group.label}".` };
});

export const updateAnodeGroupAction = orgAction('asset:write', async (ctx, formData) => {
  const group = await updateAnodeGroup(ctx, formId(formData, 'groupId'), formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${group.asset.id}`);
  return { ok: true, message: `Group "${group.label}" saved; the change is in its history.` };
});

export const removeAnodeGroupAction = orgAction('asset:write', async (ctx, formData) => {
  const group = await removeAnodeGroup(ctx, formId(formData, 'groupId'), formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${group.asset.id}`);
  return { ok: true, message: `Group "${group.label}" closed as removed on ${group.removedOn}.`, data: { undoGroupId: group.id, label: group.label } };
});

/** Undo of "Close the group", a moment ago (restoreAnodeGroup). */
export const restoreAnodeGroupAction = orgAction('asset:write', async (ctx, formData) => {
  const { group, restored } = await restoreAnodeGroup(ctx, formId(formData, 'groupId'));
  return { ok: true, message: restored ? `Group "${group.label}" is fitted again.` : `Group "${group.label}" is already fitted.` };
});
