import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p } from './common';
import { UserSchema } from './user.entity';

// Lucia session rows: the id is the session token's identifier, never shown elsewhere.
export const SessionSchema = defineEntity({
  name: 'Session',
  tableName: 'auth_session',
  properties: {
    id: p.string().length(64).primary(),
    user: p.manyToOne(UserSchema).deleteRule('cascade').index(),
    expiresAt: p.datetime(),
  },
});
export type Session = InferEntity<typeof SessionSchema>;
