import { MembershipSchema } from '@/entities';
import { memberIdSchema } from '@/lib/schemas/accounts';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { assertNotLastOwner } from './change-member-role';

export async function removeMember(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const { membershipId } = memberIdSchema.parse(input);
  const membership = await ctx.em.findOne(MembershipSchema, { id: membershipId, organisation: ctx.organisation }, { populate: ['user'] });
  if (!membership) throw notFound('Member');
  await assertNotLastOwner(ctx, membership);
  audit(ctx, { action: 'member.removed', targetType: 'membership', targetId: membership.id, details: { email: membership.user.email, userId: membership.user.id, role: membership.role } });
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/team`);
  ctx.em.remove(membership);
  return { id: membership.id, name: membership.user.name, email: membership.user.email };
}
