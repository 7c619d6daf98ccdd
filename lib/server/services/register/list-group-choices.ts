import { AnodeGroupSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { uuidOrNotFound } from '../../ids';

/** The fitted groups of one asset for a picker (a manual renewal, a survey reading), by label. */
export async function listGroupChoices(ctx: OrgContext, assetId: string) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(assetId, 'Asset');
  const groups = await ctx.em.find(AnodeGroupSchema, { asset: assetId, organisation: ctx.organisation, removedOn: null }, { orderBy: { label: 'asc' }, fields: ['id', 'label'] });
  return groups.map((g) => ({ id: g.id, label: g.label }));
}
