import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';

// Kept for rate limiting sign-ins per account and per client address.
export const SignInAttemptSchema = defineEntity({
  name: 'SignInAttempt',
  tableName: 'sign_in_attempt',
  indexes: [{ properties: ['email', 'createdAt'] }, { properties: ['ipAddress', 'createdAt'] }],
  properties: {
    id: uuidPk(),
    email: p.string().length(254),
    ipAddress: p.string().length(64),
    succeeded: p.boolean(),
    createdAt: createdAt(),
  },
});
export type SignInAttempt = InferEntity<typeof SignInAttemptSchema>;
