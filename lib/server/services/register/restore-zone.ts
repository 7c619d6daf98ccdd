import { ZoneSchema } from '@/entities';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { uuidOrNotFound } from '../../ids';
import { requirePermission, type OrgContext } from '../../org-context';

/**
 * Undo of "Archive zone": the zone is live again, as it was (archiving only stamped archivedAt). A zone
 * that is live already is left alone and nothing is audited, so a repeat of the undo changes nothing.
 */
export async function restoreZone(ctx: OrgContext, zoneId: string) {
  requirePermission(ctx, 'asset:write');
  uuidOrNotFound(zoneId, 'Zone');
  const zone = await ctx.em.findOne(ZoneSchema, { id: zoneId, asset: { organisation: ctx.organisation } }, { populate: ['asset'] });
  if (!zone) throw notFound('Zone');
  if (!zone.archivedAt) return { zone, restored: false };
  zone.archivedAt = null;
  audit(ctx, { action: 'zone.restored', targetType: 'zone', targetId: zone.id, details: { asset: zone.asset.name, zone: zone.name } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${zone.asset.id}`);
  return { zone, restored: true };
}
