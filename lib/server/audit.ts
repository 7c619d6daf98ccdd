import type { EntityManager } from '@mikro-orm/postgresql';
import { AuditEventSchema } from '@/entities';

export interface AuditInput {
  organisationId?: string | null;
  actor?: { id: string | null; email: string } | null;
  action: string;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
  ipAddress?: string | null;
}

/** Adds an audit row to the caller's unit of work; it is written by the caller's flush. */
export function audit(em: EntityManager, input: AuditInput) {
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
