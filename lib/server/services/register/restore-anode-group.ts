import { AnodeGroupChangeSchema, AnodeGroupSchema, AuditEventSchema } from '@/entities';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { lockRow } from '../../sql';
import { requirePermission, type OrgContext } from '../../org-context';
import { getAnodeGroupOrThrow } from './anode-groups';

/** How long after "Close the group" it can be undone (the screen offers it for a few seconds; a slow click still works). */
export const GROUP_RESTORE_MINUTES = 10;

/**
 * Undo of "Close the group", a moment ago: the group is fitted again, as it was (closing only stamped the
 * removal date and reason), and its history records the undo. A group that is open already is left alone
 * and nothing is audited, so a repeat changes nothing. Later, a closed group stays closed (a record of
 * anodes taken off); a mistaken date is corrected by fitting the group again.
 */
export async function restoreAnodeGroup(ctx: OrgContext, groupId: string) {
  requirePermission(ctx, 'asset:write');
  const found = await getAnodeGroupOrThrow(ctx, groupId);
  await lockRow(ctx.em, 'anode_group', found.id);
  const group = await ctx.em.findOneOrFail(AnodeGroupSchema, { id: found.id }, { populate: ['asset'], refresh: true });
  if (!group.removedOn) return { group, restored: false };
  const removal = await ctx.em.findOne(AuditEventSchema, { organisationId: ctx.organisation.id, action: 'anode-group.removed', targetType: 'anode-group', targetId: group.id }, { orderBy: { createdAt: 'desc' } });
  if (!removal || Date.now() - removal.createdAt.getTime() > GROUP_RESTORE_MINUTES * 60_000) {
    throw new AppError('conflict', `The group was closed more than ${GROUP_RESTORE_MINUTES} minutes ago and can no longer be reopened with Undo; record the anodes as a new group instead.`);
  }
  if (await ctx.em.findOne(AnodeGroupSchema, { replacesGroupId: group.id })) throw new AppError('conflict', `Group "${group.label}" has been renewed since; the new anodes are its own group.`);
  const clash = await ctx.em.findOne(AnodeGroupSchema, { asset: group.asset, label: group.label, removedOn: null, id: { $ne: group.id } });
  if (clash) throw new AppError('conflict', `Another fitted group on ${group.asset.name} is labelled "${group.label}" now; rename it first.`);
  const before = { removedOn: group.removedOn, removalReason: group.removalReason ?? null };
  group.removedOn = null;
  group.removalReason = null;
  ctx.em.create(AnodeGroupChangeSchema, { group, changedByEmail: ctx.user.email, changes: { removedOn: [before.removedOn, null], removalReason: [before.removalReason, null] } });
  audit(ctx, { action: 'anode-group.restored', targetType: 'anode-group', targetId: group.id, details: { asset: group.asset.name, label: group.label, before, after: { removedOn: null, removalReason: null } } });
  ctx.effects.assetChanged(group.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/assets/${group.asset.id}`);
  return { group, restored: true };
}
