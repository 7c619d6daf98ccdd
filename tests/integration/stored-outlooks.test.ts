import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { DesignSchema, DockingSchema, RenewalSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { toDateOnly } from '@/lib/dates/date-only';
import { getEm, getOrm } from '@/lib/server/db';
import type { OrgContext } from '@/lib/server/org-context';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { updateAsset } from '@/lib/server/services/assets/update-asset';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { createZone, updateZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup, removeAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { createDocking, updateDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal, cancelRenewal, confirmRenewal, updateRenewal } from '@/lib/server/services/planner/renewals';
import { computePlans } from '@/lib/server/services/planner/compute-plans';
import { forgetKeptPlans, planSummaryOf } from '@/lib/server/services/planner/stored-outlooks';
import { forgetKeptPages, getAssetPage, type AssetPage } from '@/lib/server/services/assets/get-asset-page';
import { refreshStaleOutlooks } from '@/lib/server/services/planner/refresh-outlooks';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { readDesignRecord } from '@/lib/server/services/designs/read-design-record';
import { updateOrganisationSettings } from '@/lib/server/services/accounts/update-organisation-settings';
import { createAnodeModel } from '@/lib/server/services/catalogue/manage-anode-models';
import type { ListQuery } from '@/lib/schemas/register';
import { atOnceSettled } from '../fixtures/at-once';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

// The fleet overview reads each asset's plan summary as the unit of work stored it (asset_outlook) instead of
// forecasting every group on every request. These tests hold it to the one rule that makes that safe: after any
// committed change, what the overview shows is exactly what a fresh computation from the same data gives.

let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor((await getEm()).fork(), org.organisation, org.users[role]);
const day = (offset: number) => toDateOnly(addDays(new Date(), offset));
const QUERY = { page: 1, pageSize: 50, dir: 'asc', archived: '0' } as ListQuery;
const ids: { tug: string; jetty: string; bare: string; zone: string; groups: string[]; docking: string; survey: string } = { tug: '', jetty: '', bare: '', zone: '', groups: [], docking: '', survey: '' };

/** Statements one call sends to PostgreSQL, counted on its EntityManager's connection. */
async function counting<T>(c: OrgContext, fn: () => Promise<T>): Promise<{ value: T; statements: number }> {
  const conn = c.em.getConnection();
  const execute = conn.execute.bind(conn);
  let statements = 0;
  (conn as { execute: unknown }).execute = (...args: Parameters<typeof execute>) => {
    statements++;
    return execute(...args);
  };
  try {
    return { value: await fn(), statements };
  } finally {
    (conn as { execute: unknown }).execute = execute;
  }
}

async function storedRows() {
  return (await getEm()).getConnection().execute<{ asset_id: string; computed_on: string }[]>(
    `select asset_id, to_char(computed_on, 'YYYY-MM-DD') as computed_on from asset_outlook where organisation_id = ?`,
    [org.organisation.id],
  );
}

/** The overview's rows against a fresh computation from the same data, asset by asset. */
async function expectOverviewMatchesFreshPlans() {
  const viewer = await ctx('viewer');
  const today = new Date();
  const fleet = await listFleet(viewer, QUERY, today);
  const fresh = new Map((await computePlans(await ctx('viewer'), { today })).map((p) => [p.asset.id, planSummaryOf(p)]));
  expect(fleet.rows.length).toBe(fresh.size);
  for (const row of fleet.rows) {
    const want = fresh.get(row.id)!;
    expect({ name: row.name, outlook: row.outlook, nextDocking: row.nextDocking, massDue: row.massDueAtNextDockingKg, renewBy: row.renewBy }).toEqual({
      name: row.name,
      outlook: want.outlook,
      nextDocking: want.nextDocking,
      massDue: want.massDueAtNextDockingKg,
      renewBy: want.renewBy,
    });
  }
  // The tug's asset page, as this process keeps it (the plan, and the whole page), against the same page built afresh,
  // for a member who only reads and one who may change the register (who is also offered the catalogue).
  // A page is kept only under a plan stored today (one from another day is built afresh on every request).
  const storedToday = (await storedRows()).some((r) => r.asset_id === ids.tug && r.computed_on === toDateOnly(today));
  for (const role of ['viewer', 'engineer'] as const) {
    const kept = await getAssetPage(await ctx(role), ids.tug, today);
    const again = await getAssetPage(await ctx(role), ids.tug, today);
    if (storedToday) expect(again, 'a second request with nothing changed is given the kept page').toBe(kept);
    else expect(again, 'a plan stored another day: the page is not kept').not.toBe(kept);
    forgetKeptPlans();
    forgetKeptPages();
    const afresh = await getAssetPage(await ctx(role), ids.tug, today);
    expect(afresh).not.toBe(kept);
    // Each member is given the page for their own access: the reader's is not the one offering the catalogue.
    expect({ canWrite: kept.canWrite, catalogue: kept.catalogue.length > 0 }).toEqual({ canWrite: role === 'engineer', catalogue: role === 'engineer' });
    expect(shownOf(kept)).toEqual(shownOf(afresh));
  }
  return fleet;
}

/** What the asset page shows of its data, as plain values (the entities themselves are not compared). */
function shownOf(page: AssetPage) {
  const { asset, forecasts, dockings, today, ...shown } = page;
  return JSON.parse(
    JSON.stringify({
      ...shown,
      asset: { name: asset.name, highStrengthSteel: asset.highStrengthSteel, archivedAt: asset.archivedAt ?? null },
      groups: forecasts.map((f) => ({ id: f.group.id, label: f.group.label, quantity: f.group.quantity, renewBy: f.forecast?.renewBy ?? null })),
      dockings: dockings.map((d) => ({ id: d.id, plannedStart: d.plannedStart, status: d.status })),
      today,
    }),
  );
}

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Outlook Store Marine');
  const as = (role: Role) => <T,>(work: (c: OrgContext) => Promise<T>) => runAs(ctx(role), work);
  ids.tug = (await as('engineer')((c) => createAsset(c, { kind: 'vessel', name: 'Store Tug', hullMaterial: 'steel', lengthBppM: 30, beamM: 9, draughtM: 3.5, blockCoefficient: 0.55 }))).id;
  ids.jetty = (await as('engineer')((c) => createAsset(c, { kind: 'structure', name: 'Store Jetty', structureType: 'jetty', waterType: 'seawater', designLifeYears: 20 }))).id;
  ids.bare = (await as('engineer')((c) => createAsset(c, { kind: 'vessel', name: 'Store Launch', hullMaterial: 'steel' }))).id;
  ids.zone = (
    await as('engineer')((c) =>
      createZone(c, ids.tug, { name: 'Bottom', kind: 'hull-bottom', areaM2: 300, coatingCategory: 'III', coatingAgeYears: 0, waterType: 'seawater', climate: 'temperate', depthBand: '0-30', drainsCurrent: '' }),
    )
  ).id;
  // Invented groups whose renew-by dates fall before, between and after the dockings below (10 x 7.7 kg at 5 A is spent
  // in about 3.5 years; common practice for a hand check, see planner.test.ts).
  for (const [label, installed, current] of [['Bottom P1', -365, 5], ['Bottom S1', -1100, 5], ['Rudder', -30, 1]] as const) {
    ids.groups.push((await as('engineer')((c) => createAnodeGroup(c, ids.tug, { label, zoneId: ids.zone, anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(installed), meanCurrentA: current }))).id);
  }
  await as('engineer')((c) => createAnodeGroup(c, ids.jetty, { label: 'Piles', anodeModelKey: 'builtin:TW-AW-4020', quantity: 40, installedOn: day(-2000), meanCurrentA: 12 }));
  ids.docking = (await as('planner')((c) => createDocking(c, { assetId: ids.tug, kind: 'intermediate', plannedStart: day(200), yard: 'Store Yard' }))).id;
  await as('planner')((c) => createDocking(c, { assetId: ids.tug, kind: 'intermediate', plannedStart: day(500) }));
});
afterAll(async () => (await getOrm()).close(true));

describe('the stored plan summary (asset_outlook)', () => {
  it('is written by the unit of work for every asset a change touched, dated today', async () => {
    const rows = await storedRows();
    const today = day(0);
    expect(new Map(rows.map((r) => [r.asset_id, r.computed_on]))).toEqual(new Map([[ids.tug, today], [ids.jetty, today]]));
    await expectOverviewMatchesFreshPlans();
  });

  it('follows every kind of change that feeds a plan', async () => {
    const as = (role: Role) => <T,>(work: (c: OrgContext) => Promise<T>) => runAs(ctx(role), work);
    const steps: [string, () => Promise<unknown>][] = [
      ['a docking moves', () => as('planner')((c) => updateDocking(c, ids.docking, { kind: 'intermediate', status: 'planned', plannedStart: day(90) }))],
      ['a renewal is confirmed', async () => {
        const proposed = await (await getEm()).fork().find(RenewalSchema, { group: { asset: ids.tug }, status: 'proposed' });
        expect(proposed.length).toBeGreaterThan(0);
        return as('planner')((c) => confirmRenewal(c, proposed[0].id));
      }],
      ['a survey reads a group nearly spent', async () => {
        ids.survey = (await as('inspector')((c) => createSurvey(c, { assetId: ids.tug, surveyedOn: day(-1), method: 'diver', surveyor: 'Store Divers', defaultElectrode: 'ag-agcl-seawater' }))).id;
        return as('inspector')((c) => addReading(c, ids.survey, { location: 'Rudder', anodeGroupLabel: 'Rudder', remainingPercent: '22', potentialV: '-0.78', electrode: 'ag-agcl-seawater' }));
      }],
      ['the asset becomes high-strength steel', () => as('engineer')((c) => updateAsset(c, ids.tug, { kind: 'vessel', name: 'Store Tug', hullMaterial: 'steel', lengthBppM: 30, beamM: 9, draughtM: 3.5, blockCoefficient: 0.55, highStrengthSteel: 'on' }))],
      ['a group is enlarged', () => as('engineer')((c) => updateAnodeGroup(c, ids.groups[1], { label: 'Bottom S1', zoneId: ids.zone, anodeModelKey: 'builtin:TW-AW-4020', quantity: 30, installedOn: day(-1100), meanCurrentA: 5 }))],
      ['the renewal margin changes for the whole organisation', () => as('owner')((c) => updateOrganisationSettings(c, { name: 'Outlook Store Marine', renewalMarginMonths: 18, renewalThresholdPercent: 30, fittingRatePerKg: '', currency: 'EUR' }))],
      ['a booked renewal moves to another docking', async () => {
        const booked = await (await getEm()).fork().find(RenewalSchema, { group: { asset: ids.tug }, status: 'confirmed' }, { populate: ['docking'] });
        const other = await (await getEm()).fork().find(DockingSchema, { asset: ids.tug, id: { $ne: booked[0].docking.id }, status: 'planned' });
        return as('planner')((c) => updateRenewal(c, booked[0].id, { dockingId: other[0].id, quantity: 10, notes: '' }));
      }],
      ['a booked renewal is cancelled', async () => {
        const booked = await (await getEm()).fork().find(RenewalSchema, { group: { asset: ids.tug }, status: 'confirmed' });
        return as('planner')((c) => cancelRenewal(c, booked[0].id));
      }],
      ['a renewal is booked by hand', () => as('planner')((c) => addRenewal(c, ids.docking, { groupId: ids.groups[2], reason: 'damage', quantity: '', notes: 'Bent by a fender' }))],
      ['a group is removed', () => as('engineer')((c) => removeAnodeGroup(c, ids.groups[0], { removedOn: day(0), reason: 'Renewed in service' }))],
    ];
    const outlooks = new Set<string | null>();
    // Booking the proposed renewal keeps the same docking, mass and outlook: the row must stay as it was.
    const expectedUnchanged = ['a renewal is confirmed'];
    const unchanged: string[] = [];
    let previous = JSON.stringify((await listFleet(await ctx('viewer'), QUERY)).rows.find((r) => r.id === ids.tug));
    for (const [what, step] of steps) {
      await step();
      const fleet = await expectOverviewMatchesFreshPlans().catch((error) => {
        throw new Error(`after "${what}": ${error instanceof Error ? error.message : error}`);
      });
      const tug = fleet.rows.find((r) => r.id === ids.tug)!;
      outlooks.add(tug.outlook);
      const now = JSON.stringify({ ...tug });
      if (now === previous) unchanged.push(what);
      previous = now;
      // Both live assets with anodes were read from a summary stored today, not computed on the spot.
      const stored = await storedRows();
      expect(stored.every((r) => r.computed_on === day(0))).toBe(true);
      expect(stored.map((r) => r.asset_id)).toEqual(expect.arrayContaining([ids.tug, ids.jetty]));
    }
    // Every other step moved what the overview shows of the tug, so each comparison above compared something that changed.
    expect(unchanged).toEqual(expectedUnchanged);
    expect(outlooks.size).toBeGreaterThan(1);
  });

  it('a renamed zone and a saved design mark their asset changed (a linked design shares its current out by zone name)', async () => {
    const marked = await runAs(ctx('engineer'), async (c) => {
      await updateZone(c, ids.zone, { name: 'Flat bottom', kind: 'hull-bottom', areaM2: 300, coatingCategory: 'III', coatingAgeYears: 0, waterType: 'seawater', climate: 'temperate', depthBand: '0-30', drainsCurrent: '' });
      return [...c.effects.assetIds];
    });
    expect(marked).toEqual([ids.tug]);
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: ids.tug, title: 'Store Tug hull' }));
    const saved = await runAs(ctx('engineer'), async (c) => {
      const record = readDesignRecord(await c.em.findOneOrFail(DesignSchema, { id: design.id }));
      await saveDesign(c, design.id, { title: 'Store Tug hull, saved', inputs: record.inputs });
      return [...c.effects.assetIds];
    });
    expect(saved).toEqual([ids.tug]);
    await expectOverviewMatchesFreshPlans();
  });

  it('is read with the asset list: the overview costs the same two statements for 3 assets or 23', async () => {
    const viewer = await ctx('viewer');
    const few = await counting(viewer, () => listFleet(viewer, QUERY));
    expect(few.value.rows.length).toBe(3);
    for (let i = 0; i < 20; i++) {
      await runAs(ctx('engineer'), async (c) => {
        const a = await createAsset(c, { kind: 'vessel', name: `Store Barge ${String(i).padStart(2, '0')}`, hullMaterial: 'steel' });
        await createAnodeGroup(c, a.id, { label: 'Bottom', anodeModelKey: 'builtin:TW-ZB-2510', quantity: 4 + i, installedOn: day(-100 * i), meanCurrentA: 0.5 });
      });
    }
    const many = await counting(viewer, () => listFleet(viewer, QUERY));
    expect(many.value.rows.length).toBe(23);
    expect({ few: few.statements, many: many.statements }).toEqual({ few: 2, many: 2 });
    await expectOverviewMatchesFreshPlans();
  });

  it('a summary from another day is not shown: the overview computes it on the spot, and the worker brings it to today', async () => {
    const em = (await getEm()).fork();
    await em.getConnection().execute(`update asset_outlook set computed_on = computed_on - 1, outlook = 'sound', next_docking_id = null, mass_due_next_kg = 0, renew_by = null where asset_id = ?`, [ids.tug]);
    const viewer = await ctx('viewer');
    const stale = await counting(viewer, () => expectOverviewMatchesFreshPlans());
    expect(stale.value.rows.find((r) => r.id === ids.tug)!.outlook).not.toBe('sound');
    // Only the stale asset is computed: a fresh organisation-wide plan would cost the same, so check the store instead.
    expect((await storedRows()).find((r) => r.asset_id === ids.tug)!.computed_on).toBe(day(-1));
    // The worker's refresh of every organisation: this one's stale asset (other test files' organisations may have some too).
    expect(await refreshStaleOutlooks((await getEm()).fork())).toBeGreaterThanOrEqual(1);
    expect((await storedRows()).every((r) => r.computed_on === day(0))).toBe(true);
    expect(await refreshStaleOutlooks((await getEm()).fork())).toBe(0);
    await expectOverviewMatchesFreshPlans();
  });

  it('the kept asset page follows what it shows beside the plan, even a change that stores no new plan', async () => {
    // A kept page under today's stored plan.
    await runAs(ctx('engineer'), (c) => updateAsset(c, ids.tug, { kind: 'vessel', name: 'Store Tug', hullMaterial: 'steel', lengthBppM: 30, beamM: 9, draughtM: 3.5, blockCoefficient: 0.55 }));
    const today = new Date();
    const before = await getAssetPage(await ctx('engineer'), ids.tug, today);
    expect(await getAssetPage(await ctx('engineer'), ids.tug, today)).toBe(before);
    const em = (await getEm()).fork();
    const version = async () => (await em.getConnection().execute<{ version: string }[]>(`select version from asset_outlook where asset_id = ?`, [ids.tug]))[0]!.version;
    const stored = await version();
    // Written past the unit of work (as a change that feeds no plan would be): the particulars and a survey's surveyor.
    await em.getConnection().execute(`update asset set imo_number = '9000001', trading_waters = 'Kept-page test waters' where id = ?`, [ids.tug]);
    const particulars = await getAssetPage(await ctx('engineer'), ids.tug, today);
    expect(particulars).not.toBe(before);
    expect({ imo: particulars.asset.imoNumber, waters: particulars.asset.tradingWaters }).toEqual({ imo: '9000001', waters: 'Kept-page test waters' });
    await em.getConnection().execute(`update survey set surveyor = 'Kept-page Divers' where asset_id = ?`, [ids.tug]);
    const surveys = await getAssetPage(await ctx('engineer'), ids.tug, today);
    expect(surveys).not.toBe(particulars);
    expect(surveys.surveys.map((s) => s.surveyor)).toContain('Kept-page Divers');
    // The organisation's own anode model joins the catalogue the group forms offer.
    await runAs(ctx('engineer'), (c) => createAnodeModel(c, { alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: 0.3, widthM: 0.15, thicknessM: 0.03, exposedAreaM2: 0.06, netMassKg: 8, grossMassKg: 8.5, designation: 'KEPT-1' }));
    const catalogue = await getAssetPage(await ctx('engineer'), ids.tug, today);
    expect(catalogue).not.toBe(surveys);
    expect(catalogue.catalogue.map((m) => m.designation)).toContain('KEPT-1');
    // None of these stored a new plan: the page followed them through its own key, not the plan's version.
    expect(await version()).toBe(stored);
    expect(await getAssetPage(await ctx('engineer'), ids.tug, today)).toBe(catalogue);
  });

  it('an archived asset shows no outlook, and its summary is not refreshed', async () => {
    await runAs(ctx('engineer'), (c) => updateAsset(c, ids.bare, { kind: 'vessel', name: 'Store Launch', hullMaterial: 'steel' }));
    const { setAssetArchived } = await import('@/lib/server/services/assets/update-asset');
    await runAs(ctx('engineer'), (c) => setAssetArchived(c, ids.jetty, true));
    const archived = await listFleet(await ctx('viewer'), { ...QUERY, archived: '1' });
    expect(archived.rows.map((r) => [r.name, r.outlook, r.nextDocking])).toEqual([['Store Jetty', null, null]]);
    await (await getEm()).fork().getConnection().execute(`update asset_outlook set computed_on = computed_on - 3 where asset_id = ?`, [ids.jetty]);
    expect(await refreshStaleOutlooks((await getEm()).fork())).toBe(0);
    await expectOverviewMatchesFreshPlans();
    // While archived, the organisation's settings move every plan; restored, the jetty shows its plan as it is now.
    await runAs(ctx('owner'), (c) => updateOrganisationSettings(c, { name: 'Outlook Store Marine', renewalMarginMonths: 3, renewalThresholdPercent: 20, fittingRatePerKg: '', currency: 'EUR' }));
    await runAs(ctx('engineer'), (c) => setAssetArchived(c, ids.jetty, false));
    expect((await storedRows()).find((r) => r.asset_id === ids.jetty)!.computed_on).toBe(day(0));
    await expectOverviewMatchesFreshPlans();
  });

  it('two changes to one asset at once both commit, and the summary is the one the data gives', async () => {
    const as = (role: Role) => <T,>(work: (c: OrgContext) => Promise<T>) => runAs(ctx(role), work);
    const outcomes = await atOnceSettled(2, (i): Promise<unknown> =>
      i === 0
        ? as('planner')((c) => updateDocking(c, ids.docking, { kind: 'intermediate', status: 'planned', plannedStart: day(60) }))
        : as('engineer')((c) => updateAnodeGroup(c, ids.groups[2], { label: 'Rudder', zoneId: ids.zone, anodeModelKey: 'builtin:TW-AW-4020', quantity: 12, installedOn: day(-30), meanCurrentA: 1 })),
    );
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'fulfilled']);
    await expectOverviewMatchesFreshPlans();
  });

  it("the asset page keeps its plan while the stored version stands, and computes it again after any change or on another day", async () => {
    forgetKeptPlans();
    const page = async () => getAssetPage(await ctx('viewer'), ids.tug);
    const first = await page();
    const second = await page();
    // Nothing changed: the same forecasts (the very objects) are shown, not computed again.
    expect(second.forecasts).toBe(first.forecasts);
    expect(second.rows).toEqual(first.rows);
    // A group grows: the page shows the new quantity's forecast at once.
    await runAs(ctx('engineer'), (c) => updateAnodeGroup(c, ids.groups[2], { label: 'Rudder', zoneId: ids.zone, anodeModelKey: 'builtin:TW-AW-4020', quantity: 16, installedOn: day(-30), meanCurrentA: 1 }));
    const third = await page();
    expect(third.forecasts).not.toBe(first.forecasts);
    expect(third.rows.find((r) => r.label === 'Rudder')!.installedNetKg).toBeCloseTo(16 * 7.7, 9); // TW-AW-4020: 7.7 kg net (catalogue)
    const fresh = (await computePlans(await ctx('viewer'), { assetIds: [ids.tug] }))[0];
    expect(third.rows.map((r) => [r.label, r.renewBy, r.renewal])).toEqual(fresh.groups.map((g) => [g.group.label, g.forecast?.renewBy ? toDateOnly(g.forecast.renewBy) : null, third.rows.find((r) => r.groupId === g.group.id)!.renewal]));
    expect(third.outlook).toBe(fresh.outlook);
    // A stored version from another day is not trusted: computed afresh each time until the worker refreshes it.
    await (await getEm()).fork().getConnection().execute(`update asset_outlook set computed_on = computed_on - 1 where asset_id = ?`, [ids.tug]);
    const fourth = await page();
    const fifth = await page();
    expect(fifth.forecasts).not.toBe(fourth.forecasts);
    expect(fifth.rows).toEqual(fourth.rows);
    await refreshStaleOutlooks((await getEm()).fork());
  });

  it('a change that rolls back leaves the stored summary as it was', async () => {
    const before = await (await getEm()).fork().getConnection().execute(`select * from asset_outlook where asset_id = ?`, [ids.tug]);
    const failed = await runAs(ctx('planner'), async (c) => {
      await updateDocking(c, ids.docking, { kind: 'intermediate', status: 'cancelled', plannedStart: day(60) });
      await c.effects.settle(c.em);
      throw new Error('a later step fails');
    }).catch((e) => e);
    expect(failed).toBeInstanceOf(Error);
    expect(await (await getEm()).fork().getConnection().execute(`select * from asset_outlook where asset_id = ?`, [ids.tug])).toEqual(before);
  });
});
