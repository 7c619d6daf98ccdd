import { AuditEventSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';

export async function getAuditLog(ctx: OrgContext, { page = 1, pageSize = 50 }: { page?: number; pageSize?: number } = {}) {
  requirePermission(ctx, 'audit:read');
  const [rows, total] = await ctx.em.findAndCount(
    AuditEventSchema,
    { organisationId: ctx.organisation.id },
    { orderBy: { createdAt: 'desc' }, limit: pageSize, offset: (page - 1) * pageSize },
  );
  return {
    total,
    rows: rows.map((r) => ({ id: r.id, at: r.createdAt.toISOString(), actor: r.actorEmail, action: r.action, targetType: r.targetType, details: r.details })),
  };
}
