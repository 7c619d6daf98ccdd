import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import type { Organisation, User } from '@/entities';
import { ROLES, type Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { getLucia } from '@/lib/server/auth/lucia';
import { makeOrgWithRoles } from '../fixtures/factories';
import { cookieJar, nextHeadersMock } from '../fixtures/next-headers-mock';

vi.mock('next/headers', () => nextHeadersMock);

// Every organisation route handler with the permission it needs; later features add theirs here.
const ROUTES: { path: string; load: () => Promise<{ GET: Function }>; permission: (role: Role) => boolean }[] = [
  { path: 'team', load: () => import('@/app/api/orgs/[org]/team/route'), permission: (r) => r === 'owner' },
  { path: 'audit', load: () => import('@/app/api/orgs/[org]/audit/route'), permission: (r) => r === 'owner' },
];

let home: { organisation: Organisation; users: Record<Role, User> };
let other: { organisation: Organisation; users: Record<Role, User> };

async function signInAs(user: User | null) {
  cookieJar.clear();
  if (!user) return;
  const lucia = getLucia();
  const session = await lucia.createSession(user.id, {});
  cookieJar.set(lucia.sessionCookieName, session.id);
}

async function call(route: (typeof ROUTES)[number], slug: string, search = '') {
  const { GET } = await route.load();
  const res: Response = await GET(new NextRequest(`http://127.0.0.1/api/orgs/${slug}/${route.path}${search}`), { params: Promise.resolve({ org: slug }) });
  return { status: res.status, body: await res.json() };
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Home Port');
  other = await makeOrgWithRoles(await getEm(), 'Other Port');
});
afterAll(async () => (await getOrm()).close(true));

describe('organisation route handlers', () => {
  for (const route of ROUTES) {
    it(`${route.path}: 401 without a session`, async () => {
      await signInAs(null);
      const { status, body } = await call(route, home.organisation.slug);
      expect(status).toBe(401);
      expect(body.error.code).toBe('unauthenticated');
    });

    for (const role of ROLES) {
      it(`${route.path}: ${role} of the organisation gets ${route.permission(role) ? 200 : 403}`, async () => {
        await signInAs(home.users[role]);
        const { status } = await call(route, home.organisation.slug);
        expect(status).toBe(route.permission(role) ? 200 : 403);
      });

      it(`${route.path}: ${role} of another organisation gets 404, never the data`, async () => {
        await signInAs(other.users[role]);
        const { status, body } = await call(route, home.organisation.slug);
        expect(status).toBe(404);
        expect(JSON.stringify(body)).not.toContain(home.users.owner.email);
      });
    }

    it(`${route.path}: an unknown organisation is 404 too`, async () => {
      await signInAs(home.users.owner);
      expect((await call(route, 'no-such-org')).status).toBe(404);
    });
  }

  it('the team route lists members with their roles and no secrets', async () => {
    await signInAs(home.users.owner);
    const { body } = await call(ROUTES[0], home.organisation.slug);
    expect(body.members).toHaveLength(ROLES.length);
    expect(body.members.map((m: { role: string }) => m.role).sort()).toEqual([...ROLES].sort());
    expect(JSON.stringify(body)).not.toMatch(/argon2|passwordHash|tokenHash/);
  });

  it('a malformed query is a 422 with the field named', async () => {
    await signInAs(home.users.owner);
    const { status, body } = await call(ROUTES[1], home.organisation.slug, '?page=-3');
    expect(status).toBe(422);
    expect(body.error.fieldErrors.page).toBeTruthy();
  });
});
