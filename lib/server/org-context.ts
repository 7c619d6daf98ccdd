import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, OrganisationSchema, type Membership, type Organisation, type Role } from '@/entities';
import { AppError, notFound } from './errors';
import { slugOrNotFound } from './ids';
import { can, type Permission } from './permissions';
import { readOnlyReason } from '@/lib/billing/plans';
import type { Effects } from './unit-of-work';

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  emailVerified: boolean;
  /** The user's memberships as read with the session (this request), for entry points that only read. */
  memberships?: readonly MembershipRow[];
}

/** A membership with its organisation as rows (row_to_json), keyed by the organisation's slug. */
export interface MembershipRow {
  slug: string;
  membership: Record<string, unknown>;
  organisation: Record<string, unknown>;
}

/** Everything a service needs to act for a member inside one organisation. */
export interface OrgContext {
  em: EntityManager;
  user: CurrentUser;
  organisation: Organisation;
  membership: Membership;
  role: Role;
  ip: string | null;
  /** What this change asks to happen because of it (recompute, mail, revalidation); see unit-of-work.ts. */
  effects: Effects;
}

/**
 * Resolves the organisation from the URL slug and the signed-in user's membership.
 * A non-member gets "not found", never "forbidden", so the organisation's existence is not revealed.
 */
export async function getOrgContextOrThrow(
  em: EntityManager,
  user: CurrentUser,
  slug: string,
  ip: string | null,
  effects: Effects,
  /** Take the membership read with the session (user.memberships) when there is one: for entry points that only read. A change reads it again, inside its transaction. */
  readWithSession = false,
): Promise<OrgContext> {
  // Every page and API call resolves its membership here, so it is one plain statement (the ORM's query building
  // for the same join cost more than the statement itself), or none when it came with the session; the rows are
  // mapped to managed entities as find would.
  const wanted = slugOrNotFound(slug);
  let row: { membership: Record<string, unknown>; organisation: Record<string, unknown> } | undefined;
  if (readWithSession && user.memberships) {
    row = user.memberships.find((m) => m.slug === wanted);
  } else {
    const [found] = await em.execute<(Record<string, unknown> & { tw_organisation: Record<string, unknown> })[]>(
      `select m.*, row_to_json(o) as tw_organisation from membership m join organisation o on o.id = m.organisation_id where m.user_id = ? and o.slug = ?`,
      [user.id, wanted],
    );
    if (found) {
      const { tw_organisation, ...membership } = found;
      row = { membership, organisation: tw_organisation };
    }
  }
  if (!row) throw notFound('Organisation');
  em.map(OrganisationSchema, row.organisation);
  const membership = em.map(MembershipSchema, row.membership);
  const ctx: OrgContext = { em, user, organisation: membership.organisation, membership, role: membership.role, ip, effects };
  effects.ctx = ctx;
  return ctx;
}

// What stays possible while the organisation is read-only (lapsed subscription): reading, printing,
// exports, and the owner's way back (billing, team).
const ALLOWED_WHEN_READ_ONLY: ReadonlySet<Permission> = new Set(['org:read', 'org:print', 'audit:read', 'billing:manage', 'team:manage']);

export function requirePermission(ctx: Pick<OrgContext, 'role'> & { organisation?: Organisation }, permission: Permission) {
  if (!can(ctx.role, permission)) {
    throw new AppError('forbidden', 'Your role in this organisation does not allow that.');
  }
  const reason = ctx.organisation && !ALLOWED_WHEN_READ_ONLY.has(permission) ? organisationReadOnlyReason(ctx.organisation) : null;
  if (reason) {
    throw new AppError('read-only', `${reason} The organisation is read-only until the subscription is renewed; nothing has been deleted.${can(ctx.role, 'billing:manage') ? ' Renew it on the Billing page.' : ' Ask an owner to renew it.'}`);
  }
}

export function organisationReadOnlyReason(organisation: Organisation): string | null {
  return readOnlyReason({
    plan: organisation.plan ?? null,
    subscriptionStatus: organisation.subscriptionStatus,
    trialEndsAt: organisation.trialEndsAt ?? null,
    stripeSubscriptionId: organisation.stripeSubscriptionId ?? null,
    pastDueSince: organisation.pastDueSince ?? null,
  });
}

/** For screens: may this member do this now (role and read-only mode together)? */
export function allowed(ctx: Pick<OrgContext, 'role' | 'organisation'>, permission: Permission): boolean {
  return can(ctx.role, permission) && (ALLOWED_WHEN_READ_ONLY.has(permission) || !organisationReadOnlyReason(ctx.organisation));
}

