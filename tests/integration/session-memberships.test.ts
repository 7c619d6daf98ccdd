// A signed-in request reads the user's memberships with the session (one statement): a page, or a list that only
// reads, then resolves its organisation without a statement of its own. A change reads the membership again inside
// its transaction, so a role taken away a moment ago is refused there even though the session still carries it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MembershipSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm, queryCounter } from '@/lib/server/db';
import { getLucia } from '@/lib/server/auth/lucia';
import { toCurrentUser } from '@/lib/server/auth/session';
import { getOrgContextOrThrow, type CurrentUser } from '@/lib/server/org-context';
import { Effects, readInOrg, runInOrg } from '@/lib/server/unit-of-work';
import { makeOrgWithRoles } from '../fixtures/factories';

let org: { organisation: Organisation; users: Record<Role, User> };
let other: { organisation: Organisation; users: Record<Role, User> };

/** The user as a request sees them: through a real session, validated by Lucia and its adapter. */
async function sessionUser(user: User): Promise<CurrentUser> {
  const lucia = getLucia();
  const session = await lucia.createSession(user.id, {});
  const { user: validated } = await lucia.validateSession(session.id);
  return toCurrentUser(validated!);
}

const fork = async () => (await getOrm()).em.fork();

async function statements<T>(work: () => Promise<T>): Promise<{ value: T; count: number }> {
  const before = queryCounter.count;
  const value = await work();
  return { value, count: queryCounter.count - before };
}

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Session Membership Marine');
  other = await makeOrgWithRoles(await getEm(), 'Other Membership Harbour');
});
afterAll(async () => (await getOrm()).close(true));

describe('memberships read with the session', () => {
  it('come with the session: every organisation of the user with its role, and nothing of anyone else', async () => {
    const user = await sessionUser(org.users.engineer);
    expect(user.memberships!.map((m) => [m.slug, m.membership.role])).toEqual([[org.organisation.slug, 'engineer']]);
  });

  it('resolve a read without a statement, with the role and organisation a statement would give', async () => {
    const user = await sessionUser(org.users.planner);
    const [a, b] = [await fork(), await fork()];
    const read = await statements(() => getOrgContextOrThrow(a, user, org.organisation.slug, null, new Effects(), true));
    const queried = await statements(() => getOrgContextOrThrow(b, user, org.organisation.slug, null, new Effects()));
    expect(read.count).toBe(0);
    expect(queried.count).toBe(1);
    for (const ctx of [read.value, queried.value]) {
      expect({ role: ctx.role, org: ctx.organisation.id, name: ctx.organisation.name, member: ctx.membership.id, createdAt: ctx.membership.createdAt instanceof Date }).toEqual({
        role: 'planner',
        org: org.organisation.id,
        name: 'Session Membership Marine',
        member: queried.value.membership.id,
        createdAt: true,
      });
    }
  });

  it("another organisation's slug is not found, as it is with a statement", async () => {
    const user = await sessionUser(org.users.owner);
    await expect(getOrgContextOrThrow(await fork(), user, other.organisation.slug, null, new Effects(), true)).rejects.toMatchObject({ code: 'not-found' });
    await expect(readInOrg({ user, slug: other.organisation.slug, permission: 'org:read' }, async () => 'read')).rejects.toMatchObject({ code: 'not-found' });
  });

  it('a change reads the membership again in its transaction: a role taken away after the session was read is refused', async () => {
    const user = await sessionUser(org.users.inspector);
    expect(user.memberships![0]!.membership.role).toBe('inspector');
    const em = (await getEm()).fork();
    await em.nativeUpdate(MembershipSchema, { organisation: org.organisation.id, user: org.users.inspector.id }, { role: 'viewer' });
    await expect(runInOrg({ user, slug: org.organisation.slug, permission: 'survey:write' }, async () => 'written')).rejects.toMatchObject({ code: 'forbidden' });
    // The next request's session carries the new role.
    expect((await sessionUser(org.users.inspector)).memberships![0]!.membership.role).toBe('viewer');
  });
});
