import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { OrganisationSchema } from './organisation.entity';
import { UserSchema } from './user.entity';

import type { Role } from '@/lib/roles';
export { ROLES, type Role } from '@/lib/roles';

export const MembershipSchema = defineEntity({
  name: 'Membership',
  tableName: 'membership',
  uniques: [{ properties: ['organisation', 'user'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    user: p.manyToOne(UserSchema).deleteRule('cascade').index(),
    role: p.string().length(16).$type<Role>(),
    createdAt: createdAt(),
  },
});
export type Membership = InferEntity<typeof MembershipSchema>;
