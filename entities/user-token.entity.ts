import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { UserSchema } from './user.entity';

export const USER_TOKEN_KINDS = ['verify-email', 'reset-password'] as const;
export type UserTokenKind = (typeof USER_TOKEN_KINDS)[number];

// Single-use tokens for e-mail verification and password reset, stored hashed.
export const UserTokenSchema = defineEntity({
  name: 'UserToken',
  tableName: 'user_token',
  properties: {
    id: uuidPk(),
    user: p.manyToOne(UserSchema).deleteRule('cascade').index(),
    kind: p.string().length(32).$type<UserTokenKind>(),
    tokenHash: p.string().length(64).unique().hidden(),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type UserToken = InferEntity<typeof UserTokenSchema>;
