import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';

export type OutboxStatus = 'pending' | 'sent' | 'failed';
export interface OutboxAttachment {
  filename: string;
  contentType: string;
  /** base64 */
  content: string;
}

// Every e-mail is written here first, in the same transaction as the change that caused it,
// and delivered afterwards with retries; so a message survives an SMTP outage.
export const OutboxMessageSchema = defineEntity({
  name: 'OutboxMessage',
  tableName: 'outbox_message',
  indexes: [{ properties: ['status', 'nextAttemptAt'] }],
  properties: {
    id: uuidPk(),
    organisationId: p.uuid().nullable(),
    toAddress: p.string().length(254),
    subject: p.string().length(250),
    textBody: p.text(),
    htmlBody: p.text().nullable(),
    attachments: p.json<OutboxAttachment[]>().nullable(),
    // Makes a reminder idempotent: the same key is never queued twice.
    dedupeKey: p.string().length(200).nullable().unique(),
    status: p.string().length(12).$type<OutboxStatus>().default('pending'),
    attempts: p.integer().default(0),
    nextAttemptAt: p.datetime().onCreate(() => new Date()),
    lastError: p.text().nullable(),
    sentAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type OutboxMessage = InferEntity<typeof OutboxMessageSchema>;
