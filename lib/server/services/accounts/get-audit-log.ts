import { AuditEventSchema, MembershipSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';

export async function getAuditLog(ctx: OrgContext, { page = 1, pageSize = 50 }: { page?: number; pageSize?: number } = {}) {
  requirePermission(ctx, 'audit:read');
  // The organisation's own events, plus its members' account events (sign-ins, lock-outs, password
  // changes), which belong to no organisation.
  const members = await ctx.em.find(MembershipSchema, { organisation: ctx.organisation }, { populate: ['user'], fields: ['user.id', 'user.email'] });
  const [rows, total] = await ctx.em.findAndCount(
    AuditEventSchema,
    {
      $or: [
        { organisationId: ctx.organisation.id },
        { organisationId: null, actorUserId: { $in: members.map((m) => m.user.id) } },
        { organisationId: null, action: 'user.sign-in-locked', actorEmail: { $in: members.map((m) => m.user.email) } },
      ],
    },
    { orderBy: { createdAt: 'desc' }, limit: pageSize, offset: (page - 1) * pageSize },
  );
  return {
    total,
    rows: rows.map((r) => ({ id: r.id, at: r.createdAt.toISOString(), actor: r.actorEmail, action: r.action, targetType: r.targetType, details: r.details })),
  };
}
