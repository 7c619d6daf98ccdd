import { MembershipSchema } from '@/entities';
import { changeRoleSchema } from '@/lib/schemas/accounts';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';

export async function assertNotLastOwner(ctx: OrgContext, membership: { role: string; id: string }) {
  if (membership.role !== 'owner') return;
  const owners = await ctx.em.count(MembershipSchema, { organisation: ctx.organisation, role: 'owner' });
  if (owners <= 1) throw new AppError('conflict', 'An organisation must keep at least one owner. Make someone else owner first.');
}

export async function changeMemberRole(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const { membershipId, role } = changeRoleSchema.parse(input);
  const membership = await ctx.em.findOne(MembershipSchema, { id: membershipId, organisation: ctx.organisation }, { populate: ['user'] });
  if (!membership) throw notFound('Member');
  if (membership.role === role) return membership;
  if (role !== 'owner') await assertNotLastOwner(ctx, membership);
  const from = membership.role;
  membership.role = role;
  audit(ctx, { action: 'member.role-changed', targetType: 'membership', targetId: membership.id, details: { email: membership.user.email, from, to: role } });
  return membership;
}
