import { AssetSchema, DockingSchema } from '@/entities';
import { dockingSchema, dockingUpdateSchema } from '@/lib/schemas/planner';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { uuidOrNotFound } from '../../ids';

export async function getDockingOrThrow(ctx: OrgContext, dockingId: string) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(dockingId, 'Docking');
  const docking = await ctx.em.findOne(DockingSchema, { id: dockingId, organisation: ctx.organisation }, { populate: ['asset'] });
  if (!docking) throw notFound('Docking');
  return docking;
}

export async function createDocking(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'docking:write');
  const data = dockingSchema.parse(input);
  const asset = await ctx.em.findOne(AssetSchema, { id: data.assetId, organisation: ctx.organisation, archivedAt: null });
  if (!asset) throw notFound('Asset');
  if (asset.kind === 'structure' && data.kind !== 'campaign') throw new AppError('invalid', 'A structure has diving or works campaigns, not dockings.', { kind: ['Choose "campaign" for a structure.'] });
  if (asset.kind === 'vessel' && data.kind === 'campaign') throw new AppError('invalid', 'A vessel is dry-docked: choose intermediate, renewal survey or unplanned.', { kind: ['Choose a docking kind for a vessel.'] });
  const { assetId: _assetId, ...fields } = data;
  const docking = ctx.em.create(DockingSchema, { ...fields, organisation: ctx.organisation, asset, status: 'planned', actualStart: null, actualEnd: null });
  audit(ctx, { action: 'docking.planned', targetType: 'docking', targetId: docking.id, details: { asset: asset.name, start: data.plannedStart, kind: data.kind } });
  ctx.effects.assetChanged(asset.id);
  return docking;
}

export async function updateDocking(ctx: OrgContext, dockingId: string, input: unknown) {
  requirePermission(ctx, 'docking:write');
  const docking = await getDockingOrThrow(ctx, dockingId);
  const data = dockingUpdateSchema.parse(input);
  const before = { start: docking.plannedStart, status: docking.status };
  ctx.em.assign(docking, data);
  audit(ctx, { action: 'docking.updated', targetType: 'docking', targetId: docking.id, details: { asset: docking.asset.name, from: before, to: { start: data.plannedStart, status: data.status } } });
  ctx.effects.assetChanged(docking.asset.id);
  return docking;
}

/** An asset's planned dockings or campaigns, soonest first (where a renewal may be moved to). */
export async function listPlannedDockings(ctx: OrgContext, assetId: string) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(assetId, 'Asset');
  return ctx.em.find(DockingSchema, { asset: assetId, organisation: ctx.organisation, status: 'planned' }, { orderBy: { plannedStart: 'asc' } });
}
