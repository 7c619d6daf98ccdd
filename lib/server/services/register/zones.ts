import { ZoneSchema } from '@/entities';
import { zoneSchema } from '@/lib/schemas/register';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from '../assets/get-asset';
import { uuidOrNotFound } from '../../ids';

// Zones store their design current density in A/m2 (the desk shows mA/m2).

export async function createZone(ctx: OrgContext, assetId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const asset = await getAssetOrThrow(ctx, assetId);
  const data = zoneSchema.parse(input);
  const count = await ctx.em.count(ZoneSchema, { asset });
  const zone = ctx.em.create(ZoneSchema, { ...data, asset, areaSource: 'entered', temperatureC: null, currentDensityOverride: null, sortOrder: count, archivedAt: null });
  audit(ctx, { action: 'zone.created', targetType: 'zone', targetId: zone.id, details: { asset: asset.name, zone: zone.name } });
  return zone;
}

async function getZoneOrThrow(ctx: OrgContext, zoneId: string) {
  uuidOrNotFound(zoneId, 'Zone');
  const zone = await ctx.em.findOne(ZoneSchema, { id: zoneId, asset: { organisation: ctx.organisation } }, { populate: ['asset'] });
  if (!zone) throw notFound('Zone');
  return zone;
}

export async function updateZone(ctx: OrgContext, zoneId: string, input: unknown) {
  requirePermission(ctx, 'asset:write');
  const zone = await getZoneOrThrow(ctx, zoneId);
  ctx.em.assign(zone, { ...zoneSchema.parse(input), areaSource: 'entered' });
  // A linked design's current is shared out by zone name, so a renamed zone can move its groups' forecasts.
  ctx.effects.assetChanged(zone.asset.id);
  audit(ctx, { action: 'zone.updated', targetType: 'zone', targetId: zone.id, details: { asset: zone.asset.name, zone: zone.name } });
  return zone;
}

export async function archiveZone(ctx: OrgContext, zoneId: string) {
  requirePermission(ctx, 'asset:write');
  const zone = await getZoneOrThrow(ctx, zoneId);
  zone.archivedAt = new Date();
  audit(ctx, { action: 'zone.archived', targetType: 'zone', targetId: zone.id, details: { asset: zone.asset.name, zone: zone.name } });
  return zone;
}
