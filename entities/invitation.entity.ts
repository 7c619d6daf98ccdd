import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { OrganisationSchema } from './organisation.entity';
import { UserSchema } from './user.entity';
import type { Role } from './membership.entity';

export const InvitationSchema = defineEntity({
  name: 'Invitation',
  tableName: 'invitation',
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    email: p.string().length(254),
    role: p.string().length(16).$type<Role>(),
    // SHA-256 of the single-use token; the token itself exists only in the e-mail.
    tokenHash: p.string().length(64).unique().hidden(),
    invitedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type Invitation = InferEntity<typeof InvitationSchema>;
