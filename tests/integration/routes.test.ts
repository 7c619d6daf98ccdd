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
// A sizing every role may run (invented job: 1,000 m² of bare steel, one stand-off anode model).
const CALCULATION = {
  designLifeYears: 10,
  resistivityOhmM: 0.25,
  protectedMetal: 'steel',
  surfaces: [{ name: 'Piles', areaM2: 1000, currentDensity: { initial: 0.2, mean: 0.1, final: 0.13 }, coating: 'bare' }],
  anode: { alloy: 'al-zn-in', capacityAhPerKg: 2000, potentialV: -1.05, utilisationFactor: 0.9, netMassKg: 200, shape: { kind: 'slender-standoff', lengthM: 2, radiusM: 0.1 } },
};
type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;
const ROUTES: { path: string; method?: 'GET' | 'POST'; body?: unknown; load: () => Promise<Record<string, unknown>>; permission: (role: Role) => boolean }[] = [
  { path: 'team', load: () => import('@/app/api/orgs/[org]/team/route'), permission: (r) => r === 'owner' },
  { path: 'audit', load: () => import('@/app/api/orgs/[org]/audit/route'), permission: (r) => r === 'owner' },
  { path: 'designs', load: () => import('@/app/api/orgs/[org]/designs/route'), permission: () => true },
  { path: 'assets', load: () => import('@/app/api/orgs/[org]/assets/route'), permission: () => true },
  { path: 'anode-groups', load: () => import('@/app/api/orgs/[org]/anode-groups/route'), permission: () => true },
  { path: 'surveys', load: () => import('@/app/api/orgs/[org]/surveys/route'), permission: () => true },
  { path: 'catalogue', load: () => import('@/app/api/orgs/[org]/catalogue/route'), permission: () => true },
  { path: 'assets', method: 'POST', body: { kind: 'vessel', name: 'Route Test Boat', hullMaterial: 'steel' }, load: () => import('@/app/api/orgs/[org]/assets/route'), permission: (r) => r === 'owner' || r === 'engineer' },
  { path: 'calculations', method: 'POST', body: CALCULATION, load: () => import('@/app/api/orgs/[org]/calculations/route'), permission: () => true },
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

async function call(route: (typeof ROUTES)[number], slug: string, search = '', body = route.body) {
  const method = route.method ?? 'GET';
  const handler = (await route.load())[method] as Handler;
  const init = method === 'POST' ? { method, body: JSON.stringify(body), headers: { 'content-type': 'application/json' } } : undefined;
  const res = await handler(new NextRequest(`http://127.0.0.1/api/orgs/${slug}/${route.path}${search}`, init), { params: Promise.resolve({ org: slug }) });
  return { status: res.status, body: await res.json() };
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Home Port');
  other = await makeOrgWithRoles(await getEm(), 'Other Port');
});
afterAll(async () => (await getOrm()).close(true));

describe('organisation route handlers', () => {
  for (const route of ROUTES) {
    it(`${route.method ?? 'GET'} ${route.path}: 401 without a session`, async () => {
      await signInAs(null);
      const { status, body } = await call(route, home.organisation.slug);
      expect(status).toBe(401);
      expect(body.error.code).toBe('unauthenticated');
    });

    for (const role of ROLES) {
      it(`${route.method ?? 'GET'} ${route.path}: ${role} of the organisation gets ${route.permission(role) ? 200 : 403}`, async () => {
        await signInAs(home.users[role]);
        const { status } = await call(route, home.organisation.slug);
        expect(status).toBe(route.permission(role) ? (route.method === 'POST' && route.path !== 'calculations' ? 201 : 200) : 403);
      });

      it(`${route.method ?? 'GET'} ${route.path}: ${role} of another organisation gets 404, never the data`, async () => {
        await signInAs(other.users[role]);
        const { status, body } = await call(route, home.organisation.slug);
        expect(status).toBe(404);
        expect(JSON.stringify(body)).not.toContain(home.users.owner.email);
      });
    }

    it(`${route.method ?? 'GET'} ${route.path}: an unknown organisation is 404 too`, async () => {
      await signInAs(home.users.owner);
      expect((await call(route, 'no-such-org')).status).toBe(404);
    });
  }

  it('the team route lists members with their roles and no secrets', async () => {
    await signInAs(home.users.owner);
    const { body } = await call(ROUTES.find((r) => r.path === 'team')!, home.organisation.slug);
    expect(body.members).toHaveLength(ROLES.length);
    expect(body.members.map((m: { role: string }) => m.role).sort()).toEqual([...ROLES].sort());
    expect(JSON.stringify(body)).not.toMatch(/argon2|passwordHash|tokenHash/);
  });

  it('the stateless calculation returns the sizing; invalid input is a 422 naming the field', async () => {
    await signInAs(home.users.viewer);
    const calculations = ROUTES.find((r) => r.path === 'calculations')!;
    const ok = await call(calculations, home.organisation.slug);
    expect(ok.body.result.current.meanA).toBeCloseTo(100, 6); // 1,000 m² x 0.100 A/m² bare
    expect(ok.body.result.governingCriterion).toBeTruthy();
    const bad = await call(calculations, home.organisation.slug, '', { ...CALCULATION, surfaces: [{ ...CALCULATION.surfaces[0], areaM2: -1 }] });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fieldErrors)).toEqual(['surfaces[0].areaM2']);
  });

  it('a malformed query is a 422 with the field named', async () => {
    await signInAs(home.users.owner);
    const { status, body } = await call(ROUTES.find((r) => r.path === 'audit')!, home.organisation.slug, '?page=-3');
    expect(status).toBe(422);
    expect(body.error.fieldErrors.page).toBeTruthy();
  });
});
