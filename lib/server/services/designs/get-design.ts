import { DesignSchema } from '@/entities';
import { notFound } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { uuidOrNotFound } from '../../ids';

/** A design of this organisation, with its asset and signatories loaded; 404 otherwise. */
export async function getDesignOrThrow(ctx: OrgContext, designId: string) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(designId, 'Design');
  const design = await ctx.em.findOne(DesignSchema, { id: designId, organisation: ctx.organisation }, { populate: ['asset', 'preparedBy', 'checkedBy', 'approvedBy'] });
  if (!design) throw notFound('Design');
  return design;
}
