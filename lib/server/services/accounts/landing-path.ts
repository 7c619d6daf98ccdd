import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema } from '@/entities';
import { safeNextPath } from '../../safe-redirect';

/**
 * Where a browser goes once signed in: the page it came from when that is a safe path on our site; else,
 * for a member of exactly one organisation, that organisation; else the list of organisations.
 */
export async function landingPath(em: EntityManager, userId: string, next: unknown): Promise<string> {
  const asked = safeNextPath(next, '');
  if (asked) return asked;
  const memberships = await em.find(MembershipSchema, { user: userId }, { populate: ['organisation'], limit: 2 });
  return memberships.length === 1 ? `/o/${memberships[0].organisation.slug}` : '/orgs';
}
