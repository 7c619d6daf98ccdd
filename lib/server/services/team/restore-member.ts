import { AuditEventSchema, MembershipSchema, UserSchema } from '@/entities';
import { memberIdSchema } from '@/lib/schemas/accounts';
import { ROLES, type Role } from '@/lib/roles';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { lockRow } from '../../sql';
import { requirePermission, type OrgContext } from '../../org-context';

/** How long after a removal it can be undone (the screen offers it for a few seconds; a slow click still works). */
export const MEMBER_RESTORE_MINUTES = 10;

/**
 * Undoes a recent removal: the same membership (same id, person and role) comes back. The removal's own
 * audit row is the record of what was removed, so nobody can "restore" a person who was never a member.
 * A repeat (double click, browser retry) finds the membership back and changes nothing more.
 */
export async function restoreMember(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const { membershipId } = memberIdSchema.parse(input);
  // One restore at a time per organisation: two at once must not both insert.
  await lockRow(ctx.em, 'organisation', ctx.organisation.id);
  const existing = await ctx.em.findOne(MembershipSchema, { id: membershipId, organisation: ctx.organisation }, { populate: ['user'] });
  if (existing) return { membership: existing, restored: false };
  const removal = await ctx.em.findOne(
    AuditEventSchema,
    { organisationId: ctx.organisation.id, action: 'member.removed', targetType: 'membership', targetId: membershipId },
    { orderBy: { createdAt: 'desc' } },
  );
  if (!removal) throw notFound('Removed member');
  const details = removal.details ?? {};
  const userId = typeof details.userId === 'string' ? details.userId : null;
  const role = typeof details.role === 'string' && (ROLES as readonly string[]).includes(details.role) ? (details.role as Role) : null;
  if (!userId || !role) throw new AppError('conflict', 'This removal was recorded before it could be undone; invite the person again instead.');
  if (Date.now() - removal.createdAt.getTime() > MEMBER_RESTORE_MINUTES * 60_000) {
    throw new AppError('conflict', `The removal is more than ${MEMBER_RESTORE_MINUTES} minutes old and can no longer be undone; invite the person again instead.`);
  }
  const user = await ctx.em.findOne(UserSchema, { id: userId });
  if (!user) throw new AppError('conflict', 'That account no longer exists.');
  if (await ctx.em.findOne(MembershipSchema, { organisation: ctx.organisation, user })) {
    throw new AppError('conflict', `${user.email} is already a member again (through a new invitation).`);
  }
  const membership = ctx.em.create(MembershipSchema, { id: membershipId, organisation: ctx.organisation, user, role });
  audit(ctx, { action: 'member.restored', targetType: 'membership', targetId: membershipId, details: { email: user.email, role } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/team`);
  return { membership, restored: true };
}
