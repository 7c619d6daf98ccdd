import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';

export const UserSchema = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: {
    id: uuidPk(),
    // Stored lower-cased; the unique index makes sign-up races safe.
    email: p.string().length(254).unique(),
    name: p.string().length(120),
    passwordHash: p.text().hidden(),
    emailVerifiedAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type User = InferEntity<typeof UserSchema>;
