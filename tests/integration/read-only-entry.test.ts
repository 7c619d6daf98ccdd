import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEventSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { audit } from '@/lib/server/audit';
import { readInOrg } from '@/lib/server/unit-of-work';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { listQuerySchema } from '@/lib/schemas/register';
import { makeOrgWithRoles, runAs, ctxFor } from '../fixtures/factories';

// The JSON lists are served by readInOrg: the same membership and permission checks as every entry point,
// no transaction. A read that records a change must fail loudly and write nothing.

let org: { organisation: Organisation; users: Record<Role, User> };
const access = (role: Role, permission: 'org:read' | 'audit:read' = 'org:read') => ({
  user: { id: org.users[role].id, email: org.users[role].email, name: org.users[role].name, emailVerified: true },
  slug: org.organisation.slug,
  permission,
  ip: '127.0.0.1',
});

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Read Only Marine');
  await runAs(ctxFor(await getEm(), org.organisation, org.users.engineer), (c) => createAsset(c, { kind: 'vessel', name: 'Read Tug', hullMaterial: 'steel' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('readInOrg', () => {
  it('reads as the member, with the permission checked', async () => {
    const fleet = await readInOrg(access('viewer'), (ctx) => listFleet(ctx, listQuerySchema.parse({})));
    expect(fleet.rows.map((r) => r.name)).toEqual(['Read Tug']);
    await expect(readInOrg(access('viewer', 'audit:read'), async () => 'never')).rejects.toMatchObject({ code: 'forbidden' });
    await expect(readInOrg({ ...access('viewer'), slug: 'no-such-organisation' }, async () => 'never')).rejects.toMatchObject({ code: 'not-found' });
  });

  it('refuses a read that records a change (an audit row, an asset to recompute), and writes nothing', async () => {
    const before = await (await getEm()).count(AuditEventSchema, { organisationId: org.organisation.id });
    await expect(
      readInOrg(access('viewer'), async (ctx) => {
        audit(ctx, { action: 'design.printed', targetType: 'design', targetId: 'x', details: {} });
        return 'answered';
      }),
    ).rejects.toThrow(/read-only entry point recorded a change/);
    await expect(
      readInOrg(access('viewer'), async (ctx) => {
        ctx.effects.assetChanged('00000000-0000-4000-8000-000000000000');
        return 'answered';
      }),
    ).rejects.toThrow(/read-only entry point recorded a change/);
    expect(await (await getEm()).count(AuditEventSchema, { organisationId: org.organisation.id })).toBe(before);
  });
});
