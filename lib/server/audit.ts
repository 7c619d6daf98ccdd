import type { EntityManager } from '@mikro-orm/postgresql';
import { AuditEventSchema } from '@/entities';
import type { OrgContext } from './org-context';

export interface AuditInput {
  organisationId?: string | null;
  actor?: { id: string | null; email: string } | null;
  action: string;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
  ipAddress?: string | null;
}

/** Adds an audit row to the caller's unit of work (outside an organisation: sign-ins, password resets). */
export function auditEvent(em: EntityManager, input: AuditInput) {
  em.create(AuditEventSchema, {
    organisationId: input.organisationId ?? null,
    actorUserId: input.actor?.id ?? null,
    actorEmail: input.actor?.email ?? null,
    action: input.action,
    targetType: input.targetType ?? null,
    targetId: input.targetId ?? null,
    details: input.details ?? null,
    ipAddress: input.ipAddress ?? null,
  });
}

/** Records what a member did in their organisation; it commits with the change or not at all. */
export function audit(ctx: Pick<OrgContext, 'em' | 'organisation' | 'user' | 'ip'>, input: Pick<AuditInput, 'action' | 'targetType' | 'targetId' | 'details'>) {
  auditEvent(ctx.em, { ...input, organisationId: ctx.organisation.id, actor: { id: ctx.user.id, email: ctx.user.email }, ipAddress: ctx.ip });
}
