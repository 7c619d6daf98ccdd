import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getEm, getOrm } from '@/lib/server/db';
import { seedDemo } from '@/lib/server/demo/seed-demo';
import { Migration20261204100000_exactly_once } from '@/migrations/Migration20261204100000_exactly_once';
import { makeOrgWithRoles } from '../fixtures/factories';

// The constraints that keep writes unique arrive on databases that may already hold duplicates (made by the
// double submits they prevent): the migration repairs them without deleting a row, then adds the indexes.

async function runMigration(orm: MikroORM, direction: 'up' | 'down') {
  const migration = new Migration20261204100000_exactly_once(orm.em.getDriver(), orm.config);
  await migration[direction]();
  const em = orm.em.fork();
  for (const sql of migration.getQueries()) await em.execute(String(sql));
}

// A whole model snapshot, as the app writes one (TW-AW-4020: 7.7 kg net, the built-in catalogue), so that nothing else
// reading the shared test database (the docking reminders scan every organisation) trips over this test's rows.
const MODEL = JSON.stringify({ key: 'builtin:TW-AW-4020', designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', netMassKg: 7.7, grossMassKg: 8.7, capacityAhPerKg: 2000, utilisationFactor: 0.8, potentialV: -1.05 });

const insertGroup = (id: string, org: string, asset: string, label: string, extra: { replaces?: string; removedOn?: string; createdAt?: string } = {}) =>
  `insert into anode_group (id, organisation_id, asset_id, label, model, quantity, installed_on, removed_on, replaces_group_id, created_at, updated_at)
   values ('${id}', '${org}', '${asset}', '${label}', '${MODEL}', 4, '2025-01-01', ${extra.removedOn ? `'${extra.removedOn}'` : 'null'}, ${extra.replaces ? `'${extra.replaces}'` : 'null'}, ${extra.createdAt ? `'${extra.createdAt}'` : 'now()'}, now())`;

afterAll(async () => (await getOrm()).close(true));

describe('the exactly-once migration', () => {
  it('repairs existing duplicates without deleting a row, then holds the rules', async () => {
    const orm = await getOrm();
    const em = await getEm();
    const { organisation, users } = await makeOrgWithRoles(em, 'Duplicate Harbour');
    const org = organisation.id;
    const asset = randomUUID();
    const docking = randomUUID();
    await runMigration(orm, 'down');
    try {
      await em.execute(`insert into asset (id, organisation_id, kind, name, has_impressed_current, anaerobic, high_strength_steel, created_at, updated_at) values ('${asset}', '${org}', 'vessel', 'Duplicate Vessel', false, false, false, now(), now())`);
      await em.execute(`insert into docking (id, organisation_id, asset_id, kind, status, planned_start, created_at, updated_at) values ('${docking}', '${org}', '${asset}', 'intermediate', 'planned', '2021-01-01', now(), now())`);
      const [old, copyA, copyB, twinA, twinB] = [randomUUID(), randomUUID(), randomUUID(), randomUUID(), randomUUID()];
      // A renewal recorded as fitted twice: two new groups replacing one.
      await em.execute(insertGroup(old, org, asset, 'Bottom P1', { removedOn: '2026-06-01' }));
      await em.execute(insertGroup(copyA, org, asset, 'Bottom P1', { replaces: old, createdAt: '2026-06-01T10:00:00Z' }));
      await em.execute(insertGroup(copyB, org, asset, 'Bottom P1', { replaces: old, createdAt: '2026-06-01T10:00:01Z' }));
      // Two fitted groups with one label, from a double submit.
      await em.execute(insertGroup(twinA, org, asset, 'Rudder', { createdAt: '2026-01-01T10:00:00Z' }));
      await em.execute(insertGroup(twinB, org, asset, 'Rudder', { createdAt: '2026-01-01T10:00:01Z' }));
      // One group booked twice.
      const [bookA, bookB] = [randomUUID(), randomUUID()];
      for (const [id, at] of [[bookA, '2026-02-01T10:00:00Z'], [bookB, '2026-02-01T10:00:01Z']]) {
        await em.execute(`insert into renewal (id, organisation_id, docking_id, group_id, status, reason, quantity, created_at, updated_at) values ('${id}', '${org}', '${docking}', '${twinA}', 'confirmed', 'damage', 2, '${at}', now())`);
      }
      // One address invited twice.
      const [inviteOld, inviteNew] = [randomUUID(), randomUUID()];
      for (const [id, at] of [[inviteOld, '2026-03-01T10:00:00Z'], [inviteNew, '2026-03-02T10:00:00Z']]) {
        await em.execute(`insert into invitation (id, organisation_id, email, role, token_hash, invited_by_id, expires_at, created_at) values ('${id}', '${org}', 'twice@test.example', 'planner', '${randomUUID().replace(/-/g, '')}${randomUUID().replace(/-/g, '')}', '${users.owner.id}', now() + interval '7 days', '${at}')`);
      }
      const before = await em.execute<{ n: string }[]>(`select (select count(*) from anode_group where organisation_id = '${org}') + (select count(*) from renewal where organisation_id = '${org}') + (select count(*) from invitation where organisation_id = '${org}') as n`);

      await runMigration(orm, 'up');

      const after = await em.execute<{ n: string }[]>(`select (select count(*) from anode_group where organisation_id = '${org}') + (select count(*) from renewal where organisation_id = '${org}') + (select count(*) from invitation where organisation_id = '${org}') as n`);
      expect(after[0]!.n, 'no row deleted').toBe(before[0]!.n);
      const groups = Object.fromEntries((await em.execute<{ id: string; label: string; removed_on: string | null; replaces_group_id: string | null; notes: string | null }[]>(`select id, label, removed_on, replaces_group_id, notes from anode_group where asset_id = '${asset}'`)).map((g) => [g.id, g]));
      expect(groups[copyA]).toMatchObject({ label: 'Bottom P1', removed_on: null, replaces_group_id: old });
      expect(groups[copyB]).toMatchObject({ replaces_group_id: null, notes: `Duplicate record of the renewal of group ${old}` });
      expect(groups[copyB]!.removed_on).not.toBeNull();
      expect(groups[twinA]).toMatchObject({ label: 'Rudder', removed_on: null });
      expect(groups[twinB]).toMatchObject({ label: 'Rudder (copy 2)', removed_on: null });
      const renewals = Object.fromEntries((await em.execute<{ id: string; status: string }[]>(`select id, status from renewal where group_id = '${twinA}'`)).map((r) => [r.id, r.status]));
      expect(renewals).toEqual({ [bookA]: 'confirmed', [bookB]: 'cancelled' });
      const invitations = Object.fromEntries((await em.execute<{ id: string; revoked_at: string | null }[]>(`select id, revoked_at from invitation where organisation_id = '${org}'`)).map((i) => [i.id, i.revoked_at !== null]));
      expect(invitations).toEqual({ [inviteOld]: true, [inviteNew]: false });

      // The rules now hold in the database itself.
      await expect(em.execute(insertGroup(randomUUID(), org, asset, 'Rudder'))).rejects.toThrow(/anode_group_live_label_unique/);
      await expect(em.execute(insertGroup(randomUUID(), org, asset, 'Another', { replaces: old }))).rejects.toThrow(/anode_group_replaces_group_id_unique/);
      await expect(em.execute(`insert into renewal (id, organisation_id, docking_id, group_id, status, reason, quantity, created_at, updated_at) values ('${randomUUID()}', '${org}', '${docking}', '${twinA}', 'ordered', 'damage', 2, now(), now())`)).rejects.toThrow(/renewal_booked_group_unique/);
    } finally {
      const [table] = await em.execute<{ n: string }[]>(`select count(*) as n from pg_tables where tablename = 'idempotency_key'`);
      if (Number(table!.n) === 0) await runMigration(orm, 'up');
    }
  });

  it('the demo scenario seeds under the new rules', async () => {
    const em = await getEm();
    await seedDemo(em);
    const [dupes] = await em.execute<{ n: string }[]>(`select count(*) as n from (select asset_id, label from anode_group where removed_on is null group by 1, 2 having count(*) > 1) d`);
    expect(Number(dupes!.n)).toBe(0);
  });
});
