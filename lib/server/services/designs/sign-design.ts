import { UserSchema } from '@/entities';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getDesignOrThrow } from './get-design';
import { assertEditable, storeResults } from './store-results';
import { readDesignRecord } from './read-design-record';

async function assertSignable(ctx: OrgContext, design: Awaited<ReturnType<typeof getDesignOrThrow>>, what: string) {
  assertEditable(design);
  if (design.preparedBy.id === ctx.user.id) {
    throw new AppError('forbidden', `You prepared revision ${design.revision}; a second engineer must ${what} it.`);
  }
  // A draft's page shows its inputs recomputed, so the signer saw today's calculation: that is what gets
  // stored and frozen. A checked revision is already shown from its stored record and keeps it.
  if (design.status === 'draft') await storeResults(ctx, design, readDesignRecord(design).inputs);
  const { results, resultError } = readDesignRecord(design);
  if (!results || resultError) {
    throw new AppError('conflict', `Revision ${design.revision} has no valid results to ${what}; correct its inputs first.`);
  }
}

/** The revision's page and the desk's list show the new status at once (no reload). */
function revalidateDesign(ctx: OrgContext, designId: string) {
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/designs/${designId}`);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/designs`);
}

/** The checker's signature: any engineer other than the preparer. */
export async function checkDesign(ctx: OrgContext, designId: string) {
  requirePermission(ctx, 'design:write');
  const design = await getDesignOrThrow(ctx, designId);
  await assertSignable(ctx, design, 'check');
  design.status = 'checked';
  design.checkedBy = ctx.em.getReference(UserSchema, ctx.user.id);
  design.checkedAt = new Date();
  audit(ctx, { action: 'design.checked', targetType: 'design', targetId: design.id, details: { revision: design.revision, asset: design.asset.name } });
  revalidateDesign(ctx, design.id);
  return design;
}

/** Approval: an engineer other than the preparer; the revision becomes immutable. */
export async function approveDesign(ctx: OrgContext, designId: string) {
  requirePermission(ctx, 'design:approve');
  const design = await getDesignOrThrow(ctx, designId);
  await assertSignable(ctx, design, 'approve');
  const now = new Date();
  if (!design.checkedBy) {
    design.checkedBy = ctx.em.getReference(UserSchema, ctx.user.id);
    design.checkedAt = now;
  }
  design.status = 'approved';
  design.approvedBy = ctx.em.getReference(UserSchema, ctx.user.id);
  design.approvedAt = now;
  audit(ctx, { action: 'design.approved', targetType: 'design', targetId: design.id, details: { revision: design.revision, asset: design.asset.name } });
  revalidateDesign(ctx, design.id);
  return design;
}
