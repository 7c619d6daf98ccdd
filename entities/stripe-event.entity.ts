import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p } from './common';

// Every webhook event applied or ignored, by its id: a replayed event is recognised and applied only once.
export const StripeEventSchema = defineEntity({
  name: 'StripeEvent',
  tableName: 'stripe_event',
  properties: {
    id: p.string().length(80).primary(),
    type: p.string().length(80),
    organisationId: p.uuid().nullable(),
    outcome: p.string().length(16),
    detail: p.text().nullable(),
    receivedAt: p.datetime().onCreate(() => new Date()),
  },
});
export type StripeEvent = InferEntity<typeof StripeEventSchema>;
