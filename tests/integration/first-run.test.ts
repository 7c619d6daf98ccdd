import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { getFirstRun } from '@/lib/server/services/onboarding/get-first-run';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

// The first-run guide's steps are read from the organisation's own records, in one statement; nothing is stored.
let organisation: Organisation;
let users: Record<Role, User>;
let other: { organisation: Organisation; users: Record<Role, User> };
const as = async <T,>(role: Role, work: Parameters<typeof runAs<T>>[1], org = { organisation, users }) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);

beforeAll(async () => {
  ({ organisation, users } = await makeOrgWithRoles(await getEm(), 'First Run Marine'));
  other = await makeOrgWithRoles(await getEm(), 'Busy Neighbour Marine');
});
afterAll(async () => (await getOrm()).close(true));

describe('getFirstRun', () => {
  it('an empty organisation has every step to do, and another organisation\'s records do not count', async () => {
    const elsewhere = await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: 'Neighbour Boat', hullMaterial: 'steel' }), other);
    await as('planner', (c) => createDocking(c, { assetId: elsewhere.id, kind: 'intermediate', plannedStart: '2027-06-01' }), other);
    const run = await as('viewer', (c) => getFirstRun(c));
    expect(run).toEqual({
      done: { asset: false, design: false, fit: false, docking: false },
      links: { assetId: null, assetKind: null, draftDesignId: null, approvedDesignId: null },
      complete: false,
    });
  });

  it('ticks the asset, the fitted group and the docking as they are recorded, and links to the first asset', async () => {
    const jetty = await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'First Run Jetty', structureType: 'jetty', waterType: 'seawater' }));
    let run = await as('viewer', (c) => getFirstRun(c));
    expect(run.done).toEqual({ asset: true, design: false, fit: false, docking: false });
    expect(run.links).toMatchObject({ assetId: jetty.id, assetKind: 'structure' });

    await as('engineer', (c) => createAnodeGroup(c, jetty.id, { label: 'Piles', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 4, installedOn: '2026-01-10', meanCurrentA: 1 }));
    await as('planner', (c) => createDocking(c, { assetId: jetty.id, kind: 'campaign', plannedStart: '2027-05-01' }));
    run = await as('viewer', (c) => getFirstRun(c));
    expect(run.done).toEqual({ asset: true, design: false, fit: true, docking: true });
    expect(run.complete).toBe(false); // no approved design yet
  });
});
