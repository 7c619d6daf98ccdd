import { AnodeGroupSchema, DockingSchema, RenewalSchema } from '@/entities';
import { fittedSchema, manualRenewalSchema, renewalUpdateSchema } from '@/lib/schemas/planner';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getDockingOrThrow } from './dockings';
import { isUuid, uuidOrNotFound } from '../../ids';
import { compareDateOnly, todayDateOnly } from '@/lib/dates/date-only';
import { lockRow } from '../../sql';

// Every step locks the renewal first: two steps at the same moment (a double click on "fitted") run one
// after the other, and the second sees the status the first left.
async function getRenewalOrThrow(ctx: OrgContext, renewalId: string) {
  uuidOrNotFound(renewalId, 'Renewal');
  await lockRow(ctx.em, 'renewal', renewalId);
  const renewal = await ctx.em.findOne(RenewalSchema, { id: renewalId, organisation: ctx.organisation }, { populate: ['group', 'group.zone', 'docking', 'docking.asset'] });
  if (!renewal) throw notFound('Renewal');
  return renewal;
}

const log = (ctx: OrgContext, action: string, r: { id: string; group: { label: string }; docking: { asset: { name: string } } }, details: Record<string, unknown> = {}) =>
  audit(ctx, { action, targetType: 'renewal', targetId: r.id, details: { asset: r.docking.asset.name, group: r.group.label, ...details } });

/** The planner accepts the scheduler's proposal: from now on it is never changed by a recompute. */
export async function confirmRenewal(ctx: OrgContext, renewalId: string) {
  requirePermission(ctx, 'renewal:write');
  const r = await getRenewalOrThrow(ctx, renewalId);
  if (r.status !== 'proposed') throw new AppError('conflict', `This renewal is already ${r.status}.`);
  r.status = 'confirmed';
  r.confirmedByEmail = ctx.user.email;
  r.confirmedAt = new Date();
  log(ctx, 'renewal.confirmed', r);
  // A booked renewal is 'kept' by the scheduler: the outlook, the mass due and the asset page's words follow it.
  ctx.effects.assetChanged(r.docking.asset.id);
  return r;
}

/** Changes quantity, notes or docking; an edited proposal becomes the planner's own (confirmed). */
export async function updateRenewal(ctx: OrgContext, renewalId: string, input: unknown) {
  requirePermission(ctx, 'renewal:write');
  const r = await getRenewalOrThrow(ctx, renewalId);
  if (r.status === 'fitted' || r.status === 'cancelled') throw new AppError('conflict', `A ${r.status} renewal can no longer change.`);
  const data = renewalUpdateSchema.parse(input);
  const docking = await ctx.em.findOne(DockingSchema, { id: data.dockingId, asset: r.docking.asset, status: 'planned' });
  if (!docking) throw new AppError('invalid', 'Choose a planned docking of the same asset.', { dockingId: ['Choose a planned docking of the same asset.'] });
  r.quantity = data.quantity;
  r.notes = data.notes;
  r.docking = docking;
  if (r.status === 'proposed') {
    r.status = 'confirmed';
    r.confirmedByEmail = ctx.user.email;
    r.confirmedAt = new Date();
  }
  log(ctx, 'renewal.updated', r, { quantity: data.quantity });
  ctx.effects.assetChanged(docking.asset.id);
  return r;
}

export async function markRenewalOrdered(ctx: OrgContext, renewalId: string) {
  requirePermission(ctx, 'renewal:write');
  const r = await getRenewalOrThrow(ctx, renewalId);
  if (r.status !== 'confirmed') throw new AppError('conflict', r.status === 'proposed' ? 'Confirm the renewal before ordering.' : `This renewal is ${r.status}.`);
  r.status = 'ordered';
  log(ctx, 'renewal.ordered', r);
  return r;
}

/**
 * The anodes were fitted: a new installed group takes the old one's place (same zone, model and
 * positions, the renewal's quantity), the old one is closed, and the history links them.
 */
export async function markRenewalFitted(ctx: OrgContext, renewalId: string, input: unknown) {
  requirePermission(ctx, 'renewal:write');
  const r = await getRenewalOrThrow(ctx, renewalId);
  if (r.status !== 'confirmed' && r.status !== 'ordered') throw new AppError('conflict', r.status === 'proposed' ? 'Confirm the renewal before recording it as fitted.' : `This renewal is ${r.status}.`);
  const { fittedOn } = fittedSchema.parse(input);
  if (fittedOn < r.group.installedOn) throw new AppError('invalid', 'The fitting date is before the old anodes were installed.', { fittedOn: ['The fitting date is before the old anodes were installed.'] });
  if (compareDateOnly(fittedOn, todayDateOnly()) > 0) throw new AppError('invalid', 'The fitting date cannot be in the future.', { fittedOn: ['The fitting date cannot be in the future.'] });
  const old = r.group;
  // The old group is closed in the database before the new one (same label) is inserted at the flush:
  // a label names one fitted group per asset.
  old.removedOn = fittedOn;
  old.removalReason = `Renewed at the docking of ${r.docking.actualStart ?? r.docking.plannedStart}`;
  await ctx.em.nativeUpdate(AnodeGroupSchema, { id: old.id }, { removedOn: old.removedOn, removalReason: old.removalReason });
  const fresh = ctx.em.create(AnodeGroupSchema, {
    organisation: ctx.organisation,
    asset: old.asset,
    zone: old.zone ?? null,
    label: old.label,
    model: old.model,
    quantity: r.quantity,
    positions: old.positions ?? null,
    position: old.position ?? null,
    positionParserVersion: old.positionParserVersion ?? null,
    installedOn: fittedOn,
    design: old.design ?? null,
    meanCurrentA: old.meanCurrentA !== null && old.meanCurrentA !== undefined ? (old.meanCurrentA * r.quantity) / old.quantity : null,
    removedOn: null,
    removalReason: null,
    replacesGroupId: old.id,
    notes: r.notes ?? null,
  });
  r.status = 'fitted';
  r.fittedOn = fittedOn;
  r.newGroupId = fresh.id;
  log(ctx, 'renewal.fitted', r, { fittedOn, quantity: r.quantity });
  ctx.effects.assetChanged(r.docking.asset.id);
  return { renewal: r, newGroup: fresh };
}

export async function cancelRenewal(ctx: OrgContext, renewalId: string) {
  requirePermission(ctx, 'renewal:write');
  const r = await getRenewalOrThrow(ctx, renewalId);
  if (r.status === 'fitted' || r.status === 'cancelled') throw new AppError('conflict', `This renewal is already ${r.status}.`);
  r.status = 'cancelled';
  log(ctx, 'renewal.cancelled', r);
  ctx.effects.assetChanged(r.docking.asset.id);
  return r;
}

/** A renewal the scheduler did not propose (damage, a survey finding), booked by the planner. */
export async function addRenewal(ctx: OrgContext, dockingId: string, input: unknown) {
  requirePermission(ctx, 'renewal:write');
  const docking = await getDockingOrThrow(ctx, dockingId);
  if (docking.status !== 'planned') throw new AppError('conflict', 'Renewals are booked on planned dockings.');
  const data = manualRenewalSchema.parse(input);
  // One booking per group: a second booking at the same moment waits here and then finds the first.
  if (isUuid(data.groupId)) await lockRow(ctx.em, 'anode_group', data.groupId);
  const group = await ctx.em.findOne(AnodeGroupSchema, { id: data.groupId, asset: docking.asset, removedOn: null });
  if (!group) throw new AppError('invalid', 'Choose a fitted group of this asset.', { groupId: ['Choose a fitted group of this asset.'] });
  const open = await ctx.em.findOne(RenewalSchema, { group, status: { $in: ['confirmed', 'ordered'] } });
  if (open) throw new AppError('conflict', `Group "${group.label}" is already booked for renewal.`);
  await ctx.em.nativeDelete(RenewalSchema, { group, status: 'proposed' });
  const r = ctx.em.create(RenewalSchema, { organisation: ctx.organisation, docking, group, status: 'confirmed', reason: data.reason, quantity: data.quantity ?? group.quantity, notes: data.notes, rationale: null, confirmedByEmail: ctx.user.email, confirmedAt: new Date(), fittedOn: null, newGroupId: null });
  audit(ctx, { action: 'renewal.booked', targetType: 'renewal', targetId: r.id, details: { asset: docking.asset.name, group: group.label, reason: data.reason } });
  ctx.effects.assetChanged(docking.asset.id);
  return r;
}

