import { InvitationSchema, MembershipSchema, OutboxMessageSchema } from '@/entities';
import { invitationMailKey, mailDelivery } from '@/lib/labels';
import { requirePermission, type OrgContext } from '../../org-context';
import { inSequence } from '../../sql';

/** Members and open invitations, as plain objects for the team table. */
export async function getTeam(ctx: OrgContext) {
  requirePermission(ctx, 'team:manage');
  const [members, invitations] = await inSequence(
    () => ctx.em.find(MembershipSchema, { organisation: ctx.organisation }, { populate: ['user'], orderBy: { createdAt: 'asc' } }),
    () => ctx.em.find(InvitationSchema, { organisation: ctx.organisation, acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } }, { orderBy: { createdAt: 'desc' } }),
  );
  // Each invitation's e-mail, so the table says "queued" until the mail server has taken it.
  const mails = invitations.length
    ? await ctx.em.find(OutboxMessageSchema, { dedupeKey: { $in: invitations.map((i) => invitationMailKey(i.id)) } }, { fields: ['dedupeKey', 'status', 'attempts'] })
    : [];
  const mailByKey = new Map(mails.map((m) => [m.dedupeKey, mailDelivery(m.status, m.attempts)]));
  return {
    members: members.map((m) => ({ id: m.id, userId: m.user.id, name: m.user.name, email: m.user.email, role: m.role, since: m.createdAt.toISOString(), isYou: m.user.id === ctx.user.id })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString(), mail: mailByKey.get(invitationMailKey(i.id)) ?? null })),
  };
}
