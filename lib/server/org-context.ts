import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, type Membership, type Organisation, type Role } from '@/entities';
import { AppError, notFound } from './errors';
import { can, type Permission } from './permissions';

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  emailVerified: boolean;
}

/** Everything a service needs to act for a member inside one organisation. */
export interface OrgContext {
  em: EntityManager;
  user: CurrentUser;
  organisation: Organisation;
  membership: Membership;
  role: Role;
  ip: string | null;
}

/**
 * Resolves the organisation from the URL slug and the signed-in user's membership.
 * A non-member gets "not found", never "forbidden", so the organisation's existence is not revealed.
 */
export async function getOrgContextOrThrow(em: EntityManager, user: CurrentUser, slug: string, ip: string | null = null): Promise<OrgContext> {
  const membership = await em.findOne(MembershipSchema, { user: user.id, organisation: { slug } }, { populate: ['organisation'] });
  if (!membership) throw notFound('Organisation');
  return { em, user, organisation: membership.organisation, membership, role: membership.role, ip };
}

export function requirePermission(ctx: Pick<OrgContext, 'role'>, permission: Permission) {
  if (!can(ctx.role, permission)) {
    throw new AppError('forbidden', 'Your role in this organisation does not allow that.');
  }
}

export const actorOf = (ctx: Pick<OrgContext, 'user'>) => ({ id: ctx.user.id, email: ctx.user.email });
