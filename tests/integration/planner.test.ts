import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { AnodeGroupSchema, MembershipSchema, OutboxMessageSchema, RenewalSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking, updateDocking } from '@/lib/server/services/planner/dockings';
import { cancelRenewal, confirmRenewal, markRenewalFitted, markRenewalOrdered, updateRenewal } from '@/lib/server/services/planner/renewals';
import { recomputeRenewals } from '@/lib/server/services/planner/recompute-renewals';
import { anodeListPdf } from '@/lib/server/services/planner/anode-list';
import { queueDockingReminders } from '@/lib/server/services/reminders/docking-reminders';
import { queueWeeklyDigests } from '@/lib/server/services/reminders/weekly-digest';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { pdfText } from '../fixtures/pdf-text';

let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
let vesselId: string;
let groupId: string;
const dockings: Record<string, string> = {};

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Planner Test Shipping');
  const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Plannable', hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 }));
  vesselId = vessel.id;
  // Hand check (invented group): 10 x TW-AW-4020, 7.7 kg net each = 77 kg; u = 0.80 (short flush, DNV-RP-B401 (2010)
  // Table 10-8, from memory); eps = 2000 Ah/kg (DNV-RP-B401 (2010) Table 10-6, from memory); mean current 5 A.
  // Consumption I x 8760 / eps = 21.9 kg/yr (handbook practice). Renew by: 25 % of the mass left (above 1 - u = 0.20),
  // 0.75 x 77 = 57.75 kg consumed -> 2.637 years (962 days). Installed 365 days ago: renew by about today + 597 days;
  // deadline (6-month margin) about today + 414 days.
  const group = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Bottom', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
  groupId = group.id;
  for (const [name, offset] of [['D1', 200], ['D2', 400], ['D3', 600]] as const) {
    dockings[name] = (await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vesselId, kind: 'intermediate', plannedStart: day(offset), yard: `Yard ${name}` }))).id;
  }
});
afterAll(async () => (await getOrm()).close(true));

const renewalsOf = async (id = groupId) => (await getEm()).find(RenewalSchema, { group: id }, { populate: ['docking'] });

describe('renewal proposals', () => {
  it('proposes the group at the last docking before its deadline (D2), not the first or the one too late', async () => {
    const rows = await renewalsOf();
    expect(rows).toHaveLength(1);
    expect(rows[0].status).toBe('proposed');
    expect(rows[0].docking.id).toBe(dockings.D2);
    expect(rows[0].reason).toBe('forecast-depletion');
    expect(rows[0].quantity).toBe(10);
  });

  it('moves a proposal when the dockings change, but never a confirmed renewal', async () => {
    // D2 slips past the deadline: the proposal moves back to D1.
    await runAs(ctx('planner'), (c) => updateDocking(c, dockings.D2, { kind: 'intermediate', status: 'planned', plannedStart: day(520) }));
    let rows = await renewalsOf();
    expect(rows.map((r) => [r.status, r.docking.id])).toEqual([['proposed', dockings.D1]]);
    await runAs(ctx('planner'), (c) => confirmRenewal(c, rows[0].id));
    // D2 comes back before the deadline; a recompute would now pick D2, but the confirmed booking stays at D1.
    await runAs(ctx('planner'), (c) => updateDocking(c, dockings.D2, { kind: 'intermediate', status: 'planned', plannedStart: day(400) }));
    await runAs(ctx('planner'), (c) => recomputeRenewals(c, [vesselId]));
    rows = await renewalsOf();
    expect(rows.map((r) => [r.status, r.docking.id])).toEqual([['confirmed', dockings.D1]]);
  });

  it('only planners and owners change renewals', async () => {
    const [r] = await renewalsOf();
    for (const role of ['engineer', 'inspector', 'viewer'] as const) {
      const error = await runAs(ctx(role), (c) => markRenewalOrdered(c, r.id)).catch((e) => e);
      expect(error.code).toBe('forbidden');
    }
    await runAs(ctx('planner'), (c) => markRenewalOrdered(c, r.id));
    expect((await renewalsOf())[0].status).toBe('ordered');
  });

  it('fitting creates the new group and closes the old one, keeping the link', async () => {
    const [r] = await renewalsOf();
    const { newGroup } = await runAs(ctx('planner'), (c) => markRenewalFitted(c, r.id, { fittedOn: day(0) }));
    const old = await (await getEm()).findOneOrFail(AnodeGroupSchema, { id: groupId });
    expect(old.removedOn).toBe(day(0));
    const fresh = await (await getEm()).findOneOrFail(AnodeGroupSchema, { id: newGroup.id });
    expect(fresh.replacesGroupId).toBe(groupId);
    expect(fresh.installedOn).toBe(day(0));
    expect(fresh.quantity).toBe(10);
    expect(fresh.removedOn).toBeNull();
    expect((await renewalsOf())[0].status).toBe('fitted');
    // The fresh group is renewed 2.637 years from today (same 5 A): deadline about today + 779 days, so D3
    // (600 days, the last docking before it) is proposed.
    const next = await renewalsOf(newGroup.id);
    expect(next.map((x) => [x.status, x.docking.id])).toEqual([['proposed', dockings.D3]]);
    groupId = newGroup.id;
  });

  it('a proposal the planner cancels is not proposed again at the same docking', async () => {
    const [r] = await renewalsOf();
    await runAs(ctx('planner'), (c) => cancelRenewal(c, r.id));
    await runAs(ctx('planner'), (c) => recomputeRenewals(c, [vesselId]));
    const rows = await renewalsOf();
    expect(rows.map((x) => x.status)).toEqual(['cancelled']);
  });
});

describe('editing a renewal', () => {
  it('a planner moves a proposal to another docking of the asset with a new quantity; it becomes the planner\'s own', async () => {
    const boat = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Movable', hullMaterial: 'steel' }));
    const group = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, boat.id, { label: 'Hull', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 12, installedOn: day(-400), meanCurrentA: 2 }));
    const early = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'intermediate', plannedStart: day(100) }));
    const late = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'intermediate', plannedStart: day(300) }));
    const other = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vesselId, kind: 'unplanned', plannedStart: day(120) }));
    const [proposal] = await renewalsOf(group.id);
    expect(proposal.status).toBe('proposed');
    const target = proposal.docking.id === early.id ? late.id : early.id;
    const refused = await runAs(ctx('planner'), (c) => updateRenewal(c, proposal.id, { quantity: 10, dockingId: other.id })).catch((e) => e);
    expect(refused.code).toBe('invalid');
    await runAs(ctx('planner'), (c) => updateRenewal(c, proposal.id, { quantity: 10, dockingId: target, notes: 'Yard has the slot' }));
    await runAs(ctx('planner'), (c) => recomputeRenewals(c, [boat.id]));
    const rows = await renewalsOf(group.id);
    expect(rows.map((r) => [r.status, r.docking.id, r.quantity])).toEqual([['confirmed', target, 10]]);
  });
});

describe('the renewal margin', () => {
  it('an owner widens the margin and the proposal moves to the earlier docking; others may not change it', async () => {
    const fleet = await makeOrgWithRoles(await getEm(), 'Margin Marine');
    const as = async (role: Role) => ctxFor(await getEm(), fleet.organisation, fleet.users[role]);
    const boat = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Margin Boat', hullMaterial: 'steel' }));
    // 12 x TW-ZW-3015 (8.4 kg, zinc 780 Ah/kg: DNV-RP-B401 (2010) Table 10-6, from memory) at 2 A: 22.46 kg/yr;
    // renew by at 25 % left: 0.75 x 100.8 = 75.6 kg -> 3.366 years (1,229 days); installed 400 days ago -> renew by
    // about today + 829 days.
    const group = await runAs(as('engineer'), (c) => createAnodeGroup(c, boat.id, { label: 'Hull', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 12, installedOn: day(-400), meanCurrentA: 2 }));
    const d420 = await runAs(as('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'intermediate', plannedStart: day(420) }));
    const d620 = await runAs(as('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'intermediate', plannedStart: day(620) }));
    // Margin 6 months: deadline about today + 646 days -> the docking at 620 days.
    expect((await renewalsOf(group.id)).map((r) => r.docking.id)).toEqual([d620.id]);
    const { updateOrganisationSettings } = await import('@/lib/server/services/accounts/update-organisation-settings');
    const refused = await runAs(as('planner'), (c) => updateOrganisationSettings(c, { name: 'Margin Marine', renewalMarginMonths: 12, renewalThresholdPercent: 25, fittingRatePerKg: '', currency: 'EUR' })).catch((e) => e);
    expect(refused.code).toBe('forbidden');
    // Margin 12 months: deadline about today + 464 days -> the docking at 420 days.
    await runAs(as('owner'), (c) => updateOrganisationSettings(c, { name: 'Margin Marine', renewalMarginMonths: 12, renewalThresholdPercent: 25, fittingRatePerKg: '14.5', currency: 'EUR' }));
    expect((await renewalsOf(group.id)).map((r) => r.docking.id)).toEqual([d420.id]);
  });
});

describe('anode list and reminders', () => {
  let soonId: string;
  beforeAll(async () => {
    const boat = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Soon Docking', hullMaterial: 'steel' }));
    await runAs(ctx('engineer'), (c) => createAnodeGroup(c, boat.id, { label: 'Hull', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 20, installedOn: day(-700), meanCurrentA: 2.5 }));
    soonId = (await runAs(ctx('planner'), (c) => createDocking(c, { assetId: boat.id, kind: 'unplanned', plannedStart: day(25), yard: 'Quayside Works' }))).id;
  });

  it('prints the anode list with the vessel, the yard and the total net mass', async () => {
    const { pdf } = await runAs(ctx('viewer'), (c) => anodeListPdf(c, soonId));
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    expect(text).toContain('Soon Docking');
    expect(text).toContain('Quayside Works');
    expect(text).toContain('TW-ZW-3015');
    // 20 anodes x 8.4 kg net (built-in TW-ZW-3015) = 168.0 kg
    expect(text).toMatch(/168\.0\s*kg/);
  });

  it('queues each docking reminder exactly once per person, with the anode list attached', async () => {
    const em = await getEm();
    await queueDockingReminders(em);
    await queueDockingReminders(await getEm());
    const recipients = await (await getEm()).find(MembershipSchema, { organisation: org.organisation, role: { $in: ['planner', 'owner'] } }, { populate: ['user'] });
    const mails = await (await getEm()).find(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${soonId}:%` } });
    expect(mails).toHaveLength(recipients.length);
    expect(mails.map((m) => m.toAddress).sort()).toEqual(recipients.map((m) => m.user.email).sort());
    expect(mails[0].dedupeKey).toContain(':30:'); // 25 days ahead: the 30-day reminder
    expect(mails[0].subject).toMatch(/Soon Docking docks in 25 days/);
    expect(mails[0].attachments?.[0].contentType).toBe('application/pdf');
    // The renewals with their renew-by dates, and the rule they follow, in the text itself.
    expect(mails[0].textBody).toMatch(/- Hull: 20 × TW-ZW-3015 \(Proposed\), renew by \d{1,2} [A-Z][a-z]{2} \d{4}\n/);
    expect(mails[0].textBody).toContain('Renewals are proposed at the last docking at least 6 months before the renew-by date');
  });

  it('sends the weekly digest once a week, listing assets whose outlook changed', async () => {
    await queueWeeklyDigests(await getEm());
    await queueWeeklyDigests(await getEm());
    const digests = await (await getEm()).find(OutboxMessageSchema, { dedupeKey: { $like: `weekly-digest:${org.organisation.id}:%` } });
    const recipients = await (await getEm()).count(MembershipSchema, { organisation: org.organisation, role: { $in: ['planner', 'owner'] } });
    expect(digests).toHaveLength(recipients);
    expect(digests[0].textBody).toContain('Soon Docking');
    expect(digests[0].textBody).toMatch(/- Soon Docking: [^\n]*\(renew by \d{1,2} [A-Z][a-z]{2} \d{4}; next docking /);
  });
});
