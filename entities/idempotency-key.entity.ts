import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p } from './common';
import type { StoredResult } from '@/lib/server/idempotency';

// The first result of a write sent with an idempotency key (a form's hidden field, a request's
// Idempotency-Key header): a repeat with the same key gets this result instead of writing again.
// Written and read with raw SQL in lib/server/idempotency.ts, inside the write's own transaction.
export const IdempotencyKeySchema = defineEntity({
  name: 'IdempotencyKey',
  tableName: 'idempotency_key',
  properties: {
    owner: p.string().length(64).primary(),
    key: p.string().length(64).primary(),
    fingerprint: p.string().length(64),
    result: p.json<StoredResult>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()).index(),
  },
});
export type IdempotencyKey = InferEntity<typeof IdempotencyKeySchema>;
