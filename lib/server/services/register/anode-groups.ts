import { AnodeGroupChangeSchema, AnodeGroupSchema, DesignSchema, ZoneSchema, type AnodeGroupModelSnapshot } from '@/entities';
import { ALLOYS, utilisationFactorFor } from '@/lib/cp';
import { anodeGroupSchema, removeGroupSchema } from '@/lib/schemas/register';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from '../assets/get-asset';
import type { StoredResults } from '@/lib/schemas/design-record';
import { resolveAnodeModel, type CatalogueModel } from '../catalogue/anode-models';
import { uuidOrNotFound } from '../../ids';
import { lockRow } from '../../sql';
import { readDesignResults } from '../designs/read-design-record';
import { storedPosition } from '@/lib/drawings/position-of';

export function modelSnapshot(model: CatalogueModel): AnodeGroupModelSnapshot {
  const alloy = ALLOYS[model.alloy];
  return {
    key: model.key,
    designation: model.designation,
    alloy: model.alloy,
    mounting: model.mounting,
    netMassKg: model.netMassKg,
    grossMassKg: model.grossMassKg,
    capacityAhPerKg: model.capacityAhPerKg ?? alloy.capacityAhPerKg.seawater,
    utilisationFactor: model.utilisationFactor ?? utilisationFactorFor(model.shape),
    potentialV: model.potentialV ?? alloy.closedCircuitPotentialV.seawater,
  };
}

/**
 * A group's share of its design's mean current: the zone's mean demand divided among the anodes the
 * design gives that zone (DNV-RP-B401 distribution in proportion to demand), times the group's quantity.
 */
export function shareOfDesignCurrent(results: StoredResults | null, zoneName: string | null, quantity: number): number | null {
  if (!results) return null;
  const surface = zoneName ? results.surfaces.find((s) => s.name === zoneName) : null;
  const row = zoneName ? results.distribution.surfaces.find((s) => s.name === zoneName) : null;
  if (surface && row && row.count > 0) return (surface.meanA / row.count) * quantity;
  if (results.anodeCount) return (results.current.meanA / results.anodeCount) * quantity;
  return null;
}

async function assertLabelFree(ctx: OrgContext, assetId: string, label: string, exceptId?: string) {
  const clash = await ctx.em.findOne(AnodeGroupSchema, { asset: assetId, label, removedOn: null, ...(exceptId ? { id: { $ne: exceptId } } : {}) });
  if (clash) throw new AppError('conflict', 'Another group on this asset has that label.', { label: ['Another fitted group on this asset has that label; labels identify groups in surveys.'] });
}

export async function createAnodeGroup(ctx: OrgContext, assetId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId);
  const data = anodeGroupSchema.parse(input);
  const zone = data.zoneId ? await ctx.em.findOne(ZoneSchema, { id: data.zoneId, asset }) : null;
  if (data.zoneId && !zone) throw new AppError('invalid', 'That zone is not on this asset.', { zoneId: ['Choose a zone of this asset.'] });
  const design = data.designId ? await ctx.em.findOne(DesignSchema, { id: data.designId, asset }) : null;
  if (data.designId && !design) throw new AppError('invalid', 'That design is not for this asset.', { designId: ['Choose a design of this asset.'] });
  // Groups are added to one asset one request at a time, so two at the same moment cannot both find the label free.
  // A position that cannot be stored refuses the write before anything is written.
  const position = storedPosition(data.positions, asset.kind);
  await lockRow(ctx.em, 'asset', asset.id);
  await assertLabelFree(ctx, asset.id, data.label);
  const model = await resolveAnodeModel(ctx, data.anodeModelKey);
  const meanCurrentA = data.meanCurrentA ?? (design ? shareOfDesignCurrent(readDesignResults(design), zone?.name ?? null, data.quantity) : null);
  const group = ctx.em.create(AnodeGroupSchema, {
    organisation: ctx.organisation,
    asset,
    zone,
    label: data.label,
    model: modelSnapshot(model),
    quantity: data.quantity,
    positions: data.positions,
    ...position,
    installedOn: data.installedOn,
    design,
    meanCurrentA,
    removedOn: null,
    removalReason: null,
    replacesGroupId: null,
    notes: data.notes,
  });
  audit(ctx, { action: 'anode-group.fitted', targetType: 'anode-group', targetId: group.id, details: { asset: asset.name, label: group.label, quantity: group.quantity, model: model.designation } });
  ctx.effects.assetChanged(asset.id);
  return group;
}

export async function getAnodeGroupOrThrow(ctx: OrgContext, groupId: string) {
  uuidOrNotFound(groupId, 'Anode group');
  const group = await ctx.em.findOne(AnodeGroupSchema, { id: groupId, organisation: ctx.organisation }, { populate: ['asset', 'zone'] });
  if (!group) throw notFound('Anode group');
  return group;
}

/** Edits keep the history: each change is recorded with who made it and the values before and after. */
export async function updateAnodeGroup(ctx: OrgContext, groupId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const group = await getAnodeGroupOrThrow(ctx, groupId);
  if (group.removedOn) throw new AppError('conflict', 'This group was removed; its record can no longer change.');
  const data = anodeGroupSchema.parse(input);
  if (data.label !== group.label) await assertLabelFree(ctx, group.asset.id, data.label, group.id);
  const zone = data.zoneId ? await ctx.em.findOne(ZoneSchema, { id: data.zoneId, asset: group.asset }) : null;
  if (data.zoneId && !zone) throw new AppError('invalid', 'That zone is not on this asset.', { zoneId: ['Choose a zone of this asset.'] });
  const model = data.anodeModelKey === group.model.key ? group.model : modelSnapshot(await resolveAnodeModel(ctx, data.anodeModelKey));
  const next = { label: data.label, zone: zone?.id ?? null, model: model.designation, quantity: data.quantity, positions: data.positions, installedOn: data.installedOn, meanCurrentA: data.meanCurrentA ?? group.meanCurrentA ?? null, notes: data.notes };
  const before = { label: group.label, zone: group.zone?.id ?? null, model: group.model.designation, quantity: group.quantity, positions: group.positions ?? null, installedOn: group.installedOn, meanCurrentA: group.meanCurrentA ?? null, notes: group.notes ?? null };
  const changes = Object.fromEntries(Object.entries(next).filter(([k, v]) => before[k as keyof typeof before] !== v).map(([k, v]) => [k, [before[k as keyof typeof before], v]])) as Record<string, [unknown, unknown]>;
  if (!Object.keys(changes).length) return group;
  ctx.em.assign(group, { label: data.label, zone, model, quantity: data.quantity, positions: data.positions, ...storedPosition(data.positions, group.asset.kind), installedOn: data.installedOn, meanCurrentA: next.meanCurrentA, notes: data.notes });
  ctx.em.create(AnodeGroupChangeSchema, { group, changedByEmail: ctx.user.email, changes });
  audit(ctx, { action: 'anode-group.updated', targetType: 'anode-group', targetId: group.id, details: { asset: group.asset.name, label: group.label, fields: Object.keys(changes).join(', ') } });
  ctx.effects.assetChanged(group.asset.id);
  return group;
}

/** Closes a group (anodes taken off or lost); the record and its surveys stay. */
export async function removeAnodeGroup(ctx: OrgContext, groupId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const group = await getAnodeGroupOrThrow(ctx, groupId);
  if (group.removedOn) throw new AppError('conflict', 'This group was already removed.');
  const { removedOn, reason } = removeGroupSchema.parse(input);
  if (removedOn < group.installedOn) throw new AppError('invalid', 'The removal date is before the installation date.', { removedOn: ['The removal date is before the installation date.'] });
  group.removedOn = removedOn;
  group.removalReason = reason;
  ctx.em.create(AnodeGroupChangeSchema, { group, changedByEmail: ctx.user.email, changes: { removedOn: [null, removedOn], removalReason: [null, reason] } });
  audit(ctx, { action: 'anode-group.removed', targetType: 'anode-group', targetId: group.id, details: { asset: group.asset.name, label: group.label, reason } });
  ctx.effects.assetChanged(group.asset.id);
  return group;
}
