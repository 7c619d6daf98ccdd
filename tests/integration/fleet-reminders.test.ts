// Several workers against one database: when two of them run the docking-reminder pass at the same moment
// (a start-up pass overlapping a scheduled one, or two workers started together), a due reminder is still
// queued once and delivered once per person. Both passes are started behind one gate, each on a connection of
// its own, and both render the anode list before either inserts, so the insert itself must hold the line.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { MembershipSchema, OutboxMessageSchema, RenewalSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal } from '@/lib/server/services/planner/renewals';
import { queueDockingReminders } from '@/lib/server/services/reminders/docking-reminders';
import { deliverDueMail } from '@/lib/server/mail/outbox';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { atOnce } from '../fixtures/at-once';

const api = process.env.FAKE_MAIL_API!;
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);

let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
let dockingId: string;
let groupId: string;
const vesselName = `Twin Run ${Date.now().toString(36)}`;

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Two Workers Shipping');
  const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: vesselName, hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
  // The group of planner.test.ts (renew by about a year and a half from now): proposed at the only docking.
  groupId = (await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vessel.id, { label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }))).id;
  // 25 days ahead: the 30-day reminder is due now.
  dockingId = (await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(25), yard: 'Twin Yard' }))).id;
});
afterAll(async () => (await getOrm()).close(true));

async function inbox(to: string) {
  const res = await fetch(`${api}/messages?to=${encodeURIComponent(to)}`);
  expect(res.ok).toBe(true);
  return ((await res.json()) as { subject: string }[]).filter((m) => m.subject.startsWith(`${vesselName} docks in 25 days`));
}

describe('two workers running the docking reminders at the same moment', () => {
  it('queue one reminder per person and docking, and the SMTP server receives each once', async () => {
    const recipients = await (await getEm()).find(MembershipSchema, { organisation: org.organisation, role: { $in: ['planner', 'owner'] } }, { populate: ['user'] });
    expect(recipients.length).toBe(2);
    for (const r of recipients) expect(await inbox(r.user.email)).toHaveLength(0);

    // Two passes at once, each with its own EntityManager (its own connection), as two worker processes would.
    const passes = await atOnce(2, async () => queueDockingReminders(await getEm()));
    expect(passes.map((p) => p.failed)).toEqual([0, 0]);
    // Between them they queued exactly one message per recipient for this docking (the other's insert found the
    // dedupe key taken). Counted in the outbox, not by the passes' totals: other test files' organisations share the
    // database, and one of their dockings may fall due today as well.
    const rows = await (await getEm()).find(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${dockingId}:%` } });
    expect(rows.map((m) => m.toAddress).sort()).toEqual(recipients.map((m) => m.user.email).sort());
    expect(rows.every((m) => m.dedupeKey!.includes(':30:'))).toBe(true);

    // Two workers' outbox loops at once: each row is claimed by one of them only.
    for (let round = 0; round < 20; round++) {
      const [a, b] = await atOnce(2, async () => deliverDueMail(await getEm(), { limit: 100 }));
      if (a.claimed + b.claimed === 0) break;
    }
    const delivered = await (await getEm()).find(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${dockingId}:%` } });
    expect(delivered.map((m) => m.status)).toEqual(['sent', 'sent']);
    expect(delivered.map((m) => m.attempts)).toEqual([1, 1]);
    for (const r of recipients) expect(await inbox(r.user.email)).toHaveLength(1);

    // The scheduler's recompute in both passes left one proposal for the group, not two.
    const proposals = await (await getEm()).find(RenewalSchema, { group: groupId });
    expect(proposals.map((p) => [p.status, p.docking.id])).toEqual([['proposed', dockingId]]);

    // A later pass (the next cron slot on either worker) queues and sends nothing more.
    await atOnce(2, async () => queueDockingReminders(await getEm()));
    expect(await (await getEm()).count(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${dockingId}:%` } })).toBe(2);
    for (const r of recipients) expect(await inbox(r.user.email)).toHaveLength(1);
  });

  it('recompute the renewal proposals one pass at a time: a proposal that falls due is made once, not once per pass', async () => {
    // As when the forecast has moved on since the last change: the group is due at the docking but has no
    // proposal yet, and both passes recompute it as of today before they render the list.
    const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: `${vesselName} II`, hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
    const group = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vessel.id, { label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(25), yard: 'Twin Yard' }));
    await (await getEm()).nativeDelete(RenewalSchema, { group: group.id });

    await atOnce(2, async () => queueDockingReminders(await getEm()));
    expect(await (await getEm()).count(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${docking.id}:%` } })).toBe(2);
    const proposals = await (await getEm()).find(RenewalSchema, { group: group.id });
    expect(proposals.map((p) => [p.status, p.docking.id])).toEqual([['proposed', docking.id]]);
  });

  it("one docking whose data cannot be read does not hold back the others' reminders, and is tried again next pass", async () => {
    const broken = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: `${vesselName} III`, hullMaterial: 'steel' }));
    const brokenGroup = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, broken.id, { label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 4, installedOn: day(-365), meanCurrentA: 5 }));
    const brokenDocking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: broken.id, kind: 'intermediate', plannedStart: day(25) }));
    const good = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: `${vesselName} IV`, hullMaterial: 'steel' }));
    await runAs(ctx('engineer'), (c) => createAnodeGroup(c, good.id, { label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
    const goodDocking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: good.id, kind: 'intermediate', plannedStart: day(25) }));
    // A renewal booked on a group whose model snapshot was then emptied behind the app's back (a bad import, a hand
    // edit): the docking's anode list cannot be drawn.
    await runAs(ctx('planner'), (c) => addRenewal(c, brokenDocking.id, { groupId: brokenGroup.id, reason: 'damage', quantity: '', notes: '' }));
    const em = await getEm();
    await em.getConnection().execute(`update anode_group set model = '{}'::jsonb where id = ?`, [brokenGroup.id]);
    try {
      const pass = await queueDockingReminders(await getEm());
      expect(pass.failed).toBeGreaterThanOrEqual(1);
      expect(await (await getEm()).count(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${goodDocking.id}:%` } })).toBe(2);
      expect(await (await getEm()).count(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${brokenDocking.id}:%` } })).toBe(0);
    } finally {
      // Leave nothing broken behind for the files that run after this one.
      await (await getEm()).getConnection().execute(`delete from docking where id = ?`, [brokenDocking.id]);
    }
  });
});
