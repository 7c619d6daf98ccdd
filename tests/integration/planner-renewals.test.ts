import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { formatDateOnly } from '@/lib/dates/date-only';
import { AssetSchema, MembershipSchema, OutboxMessageSchema, RenewalSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { computePlans } from '@/lib/server/services/planner/compute-plans';
import { getPlannerView } from '@/lib/server/services/planner/planner-view';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { listQuerySchema } from '@/lib/schemas/register';
import { queueDockingReminders } from '@/lib/server/services/reminders/docking-reminders';
import { queueWeeklyDigests } from '@/lib/server/services/reminders/weekly-digest';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

// Dates are relative to the day the test runs, in the shapes of the findings (written for today = 2 Dec 2026): a hull
// group due about 48 days ago (October 2026) with its docking about 70 days ahead (February 2027), and a jetty group
// whose renew-by date is ahead but whose margin has begun, with a diving campaign planned.
//
// Hand check of the group used throughout (invented): 10 x TW-AW-4020, 7.7 kg net each = 77 kg; u = 0.80 (DNV-RP-B401
// (2010) Table 10-8, from memory); eps = 2000 Ah/kg (DNV-RP-B401 (2010) Table 10-6, from memory); mean current 5 A.
// Consumption I x 8760 / eps = 21.9 kg/yr (handbook practice). Renew by at 25 % of the mass left (above 1 - u = 0.20):
// 0.75 x 77 = 57.75 kg consumed -> 2.637 years, about 962 days after installation. The renewal margin is 6 months.
const LIFE_DAYS = 962;
let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
const group = (assetId: string, label: string, installedDaysAgo: number, meanCurrentA = 5) =>
  runAs(ctx('engineer'), (c) => createAnodeGroup(c, assetId, { label, anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-installedDaysAgo), meanCurrentA }));
const renewalsOf = async (groupId: string) => (await getEm()).find(RenewalSchema, { group: groupId }, { populate: ['docking'] });
const planOf = async (assetId: string) => (await computePlans(await ctx('viewer'), { assetIds: [assetId] }))[0];

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Renewal Reach Shipping');
});
afterAll(async () => (await getOrm()).close(true));

describe('a group that is overdue is proposed at the very next docking or campaign', () => {
  it('an overdue hull group gets its renewal at the next docking, and an unplanned docking as soon as possible is suggested', async () => {
    const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Overdue Hull', hullMaterial: 'steel' }));
    // Renew by about 48 days ago; the docking 70 days ahead is after it, a later one 900 days ahead.
    const hull = await group(vessel.id, 'Bottom', LIFE_DAYS + 48);
    const next = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(70), yard: 'Next Yard' }));
    await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'renewal-survey', plannedStart: day(900), yard: 'Later Yard' }));

    const plan = await planOf(vessel.id);
    const g = plan.groups.find((x) => x.group.id === hull.id)!;
    expect(g.forecast!.renewBy!.getTime()).toBeLessThan(Date.now()); // the shape of the finding: already past its renew-by date
    expect(g.proposal).toMatchObject({ status: 'proposed', dockingId: next.id, overdue: true });
    expect(plan.outlook).toBe('overdue');
    // Stored as a proposal on that docking's list (before the fix: no renewal at any docking).
    expect((await renewalsOf(hull.id)).map((r) => [r.status, r.docking.id])).toEqual([['proposed', next.id]]);

    // The planner shows the earlier unplanned docking, dated today, and turning it into a planned docking moves the proposal there.
    const view = await getPlannerView(await ctx('planner'));
    const suggestion = view.suggestions.find((s) => s.assetId === vessel.id && s.source === 'renewal');
    expect(suggestion).toMatchObject({ kind: 'unplanned', date: day(0) });
    expect(suggestion!.reason).toMatch(/^No planned docking renews Bottom \(renew by \d{1,2} [A-Z][a-z]{2} \d{4}\) in time: plan one as soon as possible/);
    expect(view.needsDocking.filter((n) => n.assetId === vessel.id)).toMatchObject([{ group: 'Bottom', overdue: true, earlierDockingBy: day(0) }]);
    const row = view.renewBy.find((r) => r.groupId === hull.id)!;
    expect(row).toMatchObject({ status: 'proposed', dockingId: next.id, overdue: true });
    expect(row.words).toMatch(/^Proposed at the docking of \d{1,2} [A-Z][a-z]{2} \d{4} \(overdue; plan an earlier docking by /);

    const soon = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: suggestion!.kind, plannedStart: suggestion!.date }));
    expect((await renewalsOf(hull.id)).map((r) => [r.status, r.docking.id])).toEqual([['proposed', soon.id]]);
  });

  it('an overdue jetty group gets its renewal at the planned diving campaign', async () => {
    const jetty = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Overdue Jetty', structureType: 'jetty', waterType: 'seawater', designLifeYears: 25 }));
    // Renew by about 100 days ahead: its 6-month margin began about 80 days ago. The campaign 60 days ahead comes before the renew-by date.
    const bents = await group(jetty.id, 'Bents 1-6', LIFE_DAYS - 100);
    const campaign = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: jetty.id, kind: 'campaign', plannedStart: day(60), yard: 'Test Divers' }));
    const g = (await planOf(jetty.id)).groups[0];
    expect(g.proposal).toMatchObject({ status: 'proposed', dockingId: campaign.id, overdue: true, withinMargin: true });
    expect(g.proposal!.earlierDocking).toBeUndefined();
    expect((await renewalsOf(bents.id)).map((r) => [r.status, r.docking.id])).toEqual([['proposed', campaign.id]]);
  });
});

describe('a group no planned docking reaches before its renew-by date', () => {
  it('is not proposed anywhere; the planner suggests an unplanned docking by its deadline, and planning it books the renewal', async () => {
    const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Too Late Docking', hullMaterial: 'steel' }));
    // Renew by about 300 days ahead (deadline about 118 days ahead); the only docking is 400 days ahead.
    const hull = await group(vessel.id, 'Sides', LIFE_DAYS - 300);
    await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(400) }));
    const g = (await planOf(vessel.id)).groups[0];
    expect(g.proposal).toMatchObject({ status: 'no-docking', overdue: false });
    const deadline = g.proposal!.deadline!.toISOString().slice(0, 10);
    expect(await renewalsOf(hull.id)).toEqual([]);

    const view = await getPlannerView(await ctx('planner'));
    const suggestion = view.suggestions.find((s) => s.assetId === vessel.id && s.source === 'renewal');
    expect(suggestion).toMatchObject({ kind: 'unplanned', date: deadline });
    expect(suggestion!.reason).toContain(`plan one by `);
    const earlier = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'unplanned', plannedStart: suggestion!.date }));
    expect((await renewalsOf(hull.id)).map((r) => [r.status, r.docking.id])).toEqual([['proposed', earlier.id]]);
  });
});

describe('one date with one name', () => {
  it('the planner and the asset page give the same renew-by date and the same words for the same group, with the margin in words', async () => {
    const vessel = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Same Date', hullMaterial: 'steel' }));
    const hull = await group(vessel.id, 'Bottom', 365);
    const d = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(300) }));
    const view = await getPlannerView(await ctx('planner'));
    const page = await getAssetPage(await ctx('viewer'), vessel.id);
    const inPlanner = view.renewBy.find((r) => r.groupId === hull.id)!;
    const onPage = page.rows.find((r) => r.groupId === hull.id)!;
    expect(inPlanner.dockingId).toBe(d.id);
    expect(onPage.renewBy).toBe(inPlanner.renewBy);
    expect(onPage.renewal).toBe(inPlanner.words);
    expect(onPage.renewalReason).toBe(inPlanner.reason);
    // The reason names the renew-by date and the margin, in words.
    expect(inPlanner.reason).toMatch(/\(renew by \d{1,2} [A-Z][a-z]{2} \d{4} less 6 months\)/);
    // The same margin; the words follow the asset: the vessel's page says docking, the planner (vessels and structures) both.
    expect(view.marginWords).toBe(page.marginWords.replace(/^The docking /, 'The docking or campaign '));
    expect(page.marginWords).toMatch(/^The docking is booked at least 6 months before the renew-by date/);
  });
});

describe('an asset with no anodes recorded', () => {
  it('says so on the fleet, the asset page and the planner, and in the weekly digest, instead of Sound', async () => {
    const bare = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Nothing Fitted', hullMaterial: 'steel' }));
    const fleet = await listFleet(await ctx('viewer'), listQuerySchema.parse({ q: 'Nothing Fitted' }));
    expect(fleet.rows.map((r) => [r.name, r.outlook, r.outlookWords])).toEqual([['Nothing Fitted', 'no-anodes', 'No anodes recorded']]);
    expect((await getAssetPage(await ctx('viewer'), bare.id)).outlook).toBe('no-anodes');
    expect((await getPlannerView(await ctx('viewer'))).assets.find((a) => a.id === bare.id)?.outlook).toBe('no-anodes');
    // The digest's recompute stores it, and lists the asset with those words.
    await queueWeeklyDigests(await getEm());
    expect((await (await getEm()).findOneOrFail(AssetSchema, { id: bare.id })).outlook).toBe('no-anodes');
    const digest = await (await getEm()).findOneOrFail(OutboxMessageSchema, { dedupeKey: { $like: `weekly-digest:${org.organisation.id}:%` } });
    expect(digest.textBody).toContain('- Nothing Fitted: No anodes recorded');
  });
});

describe('docking reminders', () => {
  it('never attach an empty anode list: the e-mail says what is missing instead, still once per person', async () => {
    const bare = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Empty List Boat', hullMaterial: 'steel' }));
    const emptyDocking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: bare.id, kind: 'unplanned', plannedStart: day(20), yard: 'Empty Yard' }));
    // A vessel with a young group at 1 A (renew by about 4,800 days ahead): nothing due at its docking by the forecast.
    const young = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Young Anodes', hullMaterial: 'steel' }));
    await group(young.id, 'Bottom', 10, 1);
    const youngDocking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: young.id, kind: 'intermediate', plannedStart: day(80) }));
    // And one whose overdue group makes the list: the reminder recomputes first and attaches it.
    const late = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Reminded Overdue', hullMaterial: 'steel' }));
    await group(late.id, 'Bottom', LIFE_DAYS + 30);
    const lateDocking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: late.id, kind: 'intermediate', plannedStart: day(75) }));

    await queueDockingReminders(await getEm());
    await queueDockingReminders(await getEm());
    const recipients = await (await getEm()).count(MembershipSchema, { organisation: org.organisation, role: { $in: ['planner', 'owner'] } });
    const mailsOf = async (id: string) => (await getEm()).find(OutboxMessageSchema, { dedupeKey: { $like: `docking-reminder:${id}:%` } });

    const empty = await mailsOf(emptyDocking.id);
    expect(empty).toHaveLength(recipients);
    expect(empty[0].subject).toBe(`Empty List Boat docks in 20 days (${formatDateOnly(day(20))}): no anode renewals booked yet`);
    expect((empty[0].attachments ?? []).map((a) => a.filename)).toEqual([]);
    expect(empty[0].textBody).toContain('No renewals are proposed or confirmed for this docking yet, so no anode list is attached.');
    expect(empty[0].textBody).toContain('No anodes are recorded for Empty List Boat: record its fitted anode groups on the asset page');
    expect(empty[0].textBody).toContain(`/dockings/${emptyDocking.id}`);

    const sound = await mailsOf(youngDocking.id);
    expect(sound).toHaveLength(recipients);
    expect((sound[0].attachments ?? []).map((a) => a.filename)).toEqual([]);
    expect(sound[0].textBody).toContain('By the forecast, none of the 1 anode group of Young Anodes is due for renewal at this docking.');

    const listed = await mailsOf(lateDocking.id);
    expect(listed).toHaveLength(recipients);
    expect(listed[0].subject).toMatch(/: anode list attached$/);
    expect(listed[0].attachments?.[0].contentType).toBe('application/pdf');
    expect(listed[0].textBody).toMatch(/- Bottom: 10 × TW-AW-4020 \(Proposed\), renew by \d{1,2} [A-Z][a-z]{2} \d{4}\n/);
    // Rendering the anode lists is the slow part on a busy machine.
  }, 120_000);
});
