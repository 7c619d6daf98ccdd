import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema } from '@/entities';
import type { CurrentUser } from '../../org-context';

/** The signed-in user's memberships with their organisations, by organisation name. */
export async function listMyOrganisations(em: EntityManager, user: CurrentUser) {
  return em.find(MembershipSchema, { user: user.id }, { populate: ['organisation'], orderBy: { organisation: { name: 'asc' } } });
}
