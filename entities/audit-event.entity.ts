import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';

// Append-only record of who did what, when, in which organisation.
export const AuditEventSchema = defineEntity({
  name: 'AuditEvent',
  tableName: 'audit_event',
  indexes: [{ properties: ['organisationId', 'createdAt'] }],
  properties: {
    id: uuidPk(),
    organisationId: p.uuid().nullable(),
    actorUserId: p.uuid().nullable(),
    actorEmail: p.string().length(254).nullable(),
    action: p.string().length(64),
    targetType: p.string().length(64).nullable(),
    targetId: p.string().length(64).nullable(),
    details: p.json<Record<string, unknown>>().nullable(),
    ipAddress: p.string().length(64).nullable(),
    createdAt: createdAt(),
  },
});
export type AuditEvent = InferEntity<typeof AuditEventSchema>;
