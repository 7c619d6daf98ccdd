import { InvitationSchema, MembershipSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { inSequence } from '../../sql';

/** Members and open invitations, as plain objects for the team table. */
export async function getTeam(ctx: OrgContext) {
  requirePermission(ctx, 'team:manage');
  const [members, invitations] = await inSequence(
    () => ctx.em.find(MembershipSchema, { organisation: ctx.organisation }, { populate: ['user'], orderBy: { createdAt: 'asc' } }),
    () => ctx.em.find(InvitationSchema, { organisation: ctx.organisation, acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } }, { orderBy: { createdAt: 'desc' } }),
  );
  return {
    members: members.map((m) => ({ id: m.id, userId: m.user.id, name: m.user.name, email: m.user.email, role: m.role, since: m.createdAt.toISOString(), isYou: m.user.id === ctx.user.id })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() })),
  };
}
