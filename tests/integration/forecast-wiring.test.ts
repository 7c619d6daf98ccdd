import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { DesignSchema, OrganisationSchema, RenewalSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { MS_PER_YEAR, forecastGroup } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { readDesignRecord } from '@/lib/server/services/designs/read-design-record';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { getPlannerView } from '@/lib/server/services/planner/planner-view';
import { anodeListFor } from '@/lib/server/services/planner/anode-list';
import { updateOrganisationSettings } from '@/lib/server/services/accounts/update-organisation-settings';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

const day = (offset: number) => toDateOnly(addDays(new Date(), offset));
const yearsBetween = (from: string, to: Date) => (to.getTime() - new Date(`${from}T00:00:00Z`).getTime()) / MS_PER_YEAR;

afterAll(async () => (await getOrm()).close(true));

describe('a group linked to a design follows its demand profile', () => {
  let org: { organisation: Organisation; users: Record<Role, User> };
  const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
  let assetId: string;
  let groupId: string;
  // Half the design life of 10 years (of 8760 h, 365 days) after installation, before today.
  const installedOn = day(-1900);
  const halfLife = day(-1900 + 1825);

  beforeAll(async () => {
    org = await makeOrgWithRoles(await getEm(), 'Profile Piers');
    // An invented jetty: one coated immersed zone, category II (fc = 0.05 + 0.025 t, DNV-RP-B401 (2010) Table 10-4,
    // from memory), 10-year design life, harbour practice. Zinc flush plates, whose count the mass governs, so the
    // fitted mass is the mass the design sized (within a fraction of one anode).
    const jetty = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Profile Pier', structureType: 'jetty', waterType: 'seawater', designLifeYears: 10 }));
    assetId = jetty.id;
    const zone = await runAs(ctx('engineer'), (c) =>
      createZone(c, assetId, { name: 'Piles, immersed', kind: 'pile-immersed', areaM2: 5000, coatingCategory: 'II', coatingAgeYears: 0, waterType: 'seawater', climate: 'temperate', depthBand: '0-30', drainsCurrent: '' }),
    );
    const draft = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId, title: 'Piles, 10-year design' }));
    const stored = await (await getEm()).findOneOrFail(DesignSchema, { id: draft.id });
    await runAs(ctx('engineer'), (c) => saveDesign(c, draft.id, { title: 'Piles, 10-year design', inputs: { ...readDesignRecord(stored).inputs, anodeModelKey: 'builtin:TW-ZW-4020' } }));
    const record = readDesignRecord(await (await getEm()).findOneOrFail(DesignSchema, { id: draft.id }));
    expect(record.inputs.designLifeYears).toBe(10);
    expect(record.inputs.demandMethod).toBe('harbour');
    expect(record.results!.governingCriterion).toBe('mass');
    const surface = record.results!.surfaces.find((s) => s.name === 'Piles, immersed')!;
    expect(surface.breakdown.final).toBeGreaterThan(surface.breakdown.initial); // the coating breaks down
    const count = record.results!.distribution.surfaces.find((s) => s.name === 'Piles, immersed')!.count;
    const group = await runAs(ctx('engineer'), (c) =>
      createAnodeGroup(c, assetId, { label: 'Piles', zoneId: zone.id, anodeModelKey: 'builtin:TW-ZW-4020', quantity: count, installedOn, designId: draft.id }),
    );
    groupId = group.id;
  });

  const forecastOf = async () => (await getAssetPage(await ctx('viewer'), assetId)).forecasts.find((f) => f.group.id === groupId)!;

  it('the design alone: a rising profile averaging the share of the mean current, spent at the design life', async () => {
    const f = await forecastOf();
    expect(f.demandProfile).not.toBeNull();
    expect(f.demandProfile!.endA).toBeGreaterThan(f.demandProfile!.startA);
    expect((f.demandProfile!.startA + f.demandProfile!.endA) / 2).toBeCloseTo(f.group.meanCurrentA!, 9);
    expect(f.demandProfile!.overYears).toBe(10);
    expect(Math.abs(yearsBetween(installedOn, f.forecast!.endOfLife!) - 10)).toBeLessThan(0.1);
    // Hand-worked: fci 0.05, fcf 0.05 + 0.025 x 10 = 0.30, so the profile runs from 0.05 / 0.175 = 0.2857 to
    // 0.30 / 0.175 = 1.7143 times the mean current; by half life it has delivered (0.2857 x 5 + 0.14286 x 25 / 2) / 10
    // = 0.3214 of the design charge, 0.8 x 0.3214 = 0.257 of the mass (u 0.8; 0.4 on a constant mean current).
    expect(f.group.model.utilisationFactor).toBe(0.8);
    expect(1 - f.forecast!.remainingFractionAt(new Date(`${halfLife}T00:00:00Z`))).toBeCloseTo(0.2571, 3);
  });

  it('a survey on the design curve at half life keeps the end of life at the design life (within 0.1 year)', async () => {
    const predicted = (await forecastOf()).forecast!.remainingFractionAt(new Date(`${halfLife}T00:00:00Z`));
    await runAs(ctx('inspector'), (c) =>
      createSurvey(c, { assetId, surveyedOn: halfLife, method: 'diver', surveyor: 'Test divers', defaultElectrode: 'ag-agcl-seawater', readings: [{ location: 'Pile A1', potentialV: -1.0, electrode: 'ag-agcl-seawater', anodeGroupLabel: 'Piles', remainingFraction: predicted, comment: null }] }),
    );
    const f = await forecastOf();
    expect(f.forecast!.basis).toBe('survey-corrected');
    expect(f.forecast!.profileScale).toBeCloseTo(1, 6);
    expect(Math.abs(yearsBetween(installedOn, f.forecast!.endOfLife!) - 10)).toBeLessThan(0.1);
    // On a constant mean current (the forecast before the profile) the same reading reads as a slow group and
    // puts the end of life years beyond the design life.
    const constant = forecastGroup({
      installedOn: new Date(`${installedOn}T00:00:00Z`),
      quantity: f.group.quantity,
      netMassPerAnodeKg: f.group.model.netMassKg,
      utilisationFactor: f.group.model.utilisationFactor,
      capacityAhPerKg: f.group.model.capacityAhPerKg,
      currentA: f.group.meanCurrentA!,
      surveys: f.surveys,
    });
    expect(yearsBetween(installedOn, constant.endOfLife!)).toBeGreaterThan(12);
  });

  it('a later survey showing no loss falls back to the profile instead of stopping the forecast', async () => {
    const before = (await forecastOf()).forecast!;
    await runAs(ctx('inspector'), (c) =>
      createSurvey(c, { assetId, surveyedOn: day(-10), method: 'diver', surveyor: 'Test divers', defaultElectrode: 'ag-agcl-seawater', readings: [{ location: 'Pile A2', potentialV: -1.0, electrode: 'ag-agcl-seawater', anodeGroupLabel: 'Piles', remainingFraction: 1, comment: null }] }),
    );
    const after = (await forecastOf()).forecast!;
    expect(after.endOfLife).toEqual(before.endOfLife);
    expect(after.renewBy).toEqual(before.renewBy);
  });

  it('the asset page states the renewal rule and shows the renew-by date before the end of life', async () => {
    const page = await getAssetPage(await ctx('viewer'), assetId);
    const row = page.rows.find((r) => r.groupId === groupId)!;
    expect(row.basis).toMatch(/design demand profile/);
    // u 0.8 for a short flush plate (DNV-RP-B401 (2010), from memory): 25 % left comes before 20 % left.
    expect(row.renewBy! < row.endOfLife!).toBe(true);
    expect(page.renewalRule).toBe(
      // A jetty's anodes are renewed in a diving campaign: the rule says campaign, never docking.
      'Renewals are proposed at the last campaign at least 6 months before the renew-by date, when 25 % of the anode mass remains (or when the utilisation factor is used up, if that comes first); a group already inside the margin is proposed at the next campaign. Owners set both on the Team page.',
    );
  });
});

describe('the renewal threshold', () => {
  let fleet: { organisation: Organisation; users: Record<Role, User> };
  const as = async (role: Role) => ctxFor(await getEm(), fleet.organisation, fleet.users[role]);
  const settings = (renewalThresholdPercent: number | string) => ({ name: 'Threshold Marine', renewalMarginMonths: 6, renewalThresholdPercent, fittingRatePerKg: '', currency: 'EUR' });
  let boatId: string;
  let groupId: string;
  let d200: string;
  let d620: string;
  const proposedAt = async () => (await (await getEm()).find(RenewalSchema, { group: groupId, status: 'proposed' }, { populate: ['docking'] })).map((r) => r.docking.id);

  beforeAll(async () => {
    fleet = await makeOrgWithRoles(await getEm(), 'Threshold Marine');
    const boat = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Threshold Boat', hullMaterial: 'steel' }));
    boatId = boat.id;
    // 12 x TW-ZW-3015 (8.4 kg, zinc 780 Ah/kg: DNV-RP-B401 (2010) Table 10-6, from memory) at 2 A: 22.46 kg/yr,
    // 0.2228 of the mass a year; installed 400 days ago (0.244 consumed).
    // 25 % left: 0.75 consumed at 3.366 years -> renew by about today + 829 days, deadline (6 months) about + 646.
    // 50 % left: 0.50 consumed at 2.244 years -> renew by about today + 419 days, deadline about + 237.
    const group = await runAs(as('engineer'), (c) => createAnodeGroup(c, boatId, { label: 'Hull', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 12, installedOn: day(-400), meanCurrentA: 2 }));
    groupId = group.id;
    d200 = (await runAs(as('planner'), (c) => createDocking(c, { assetId: boatId, kind: 'intermediate', plannedStart: day(200) }))).id;
    d620 = (await runAs(as('planner'), (c) => createDocking(c, { assetId: boatId, kind: 'intermediate', plannedStart: day(620) }))).id;
  });

  it('defaults to 25 % remaining: the proposal is at the last docking at least 6 months before the renew-by date', async () => {
    expect((await (await getEm()).findOneOrFail(OrganisationSchema, { id: fleet.organisation.id })).renewalThresholdPercent).toBe(25);
    expect(await proposedAt()).toEqual([d620]);
    const [renewal] = await (await getEm()).find(RenewalSchema, { group: groupId, status: 'proposed' });
    expect(renewal.rationale).toMatch(/\(renew by \d{1,2} \w{3} \d{4} less 6 months\)/);
  });

  it('only an owner changes it, within 5 to 60 %', async () => {
    for (const role of ['engineer', 'planner', 'inspector', 'viewer'] as const) {
      const refused = await runAs(as(role), (c) => updateOrganisationSettings(c, settings(50))).catch((e) => e);
      expect(refused.code).toBe('forbidden');
    }
    for (const bad of [4, 61, 12.5, '']) {
      const error = await runAs(as('owner'), (c) => updateOrganisationSettings(c, settings(bad))).catch((e) => e);
      expect(error.issues?.[0]?.path).toEqual(['renewalThresholdPercent']);
    }
    expect((await (await getEm()).findOneOrFail(OrganisationSchema, { id: fleet.organisation.id })).renewalThresholdPercent).toBe(25);
    expect(await proposedAt()).toEqual([d620]);
  });

  it('an owner raises it to 50 % and the proposal moves to the earlier docking', async () => {
    await runAs(as('owner'), (c) => updateOrganisationSettings(c, settings('50')));
    expect((await (await getEm()).findOneOrFail(OrganisationSchema, { id: fleet.organisation.id })).renewalThresholdPercent).toBe(50);
    expect(await proposedAt()).toEqual([d200]);
    const page = await getAssetPage(await as('viewer'), boatId);
    expect(page.renewalRule).toContain('when 50 % of the anode mass remains');
  });

  it('the planner, the asset page and the anode list show the same renew-by date under the same words', async () => {
    const viewer = await as('viewer');
    const planner = await getPlannerView(viewer);
    const page = await getAssetPage(viewer, boatId);
    const onPlanner = planner.renewBy.find((r) => r.groupId === groupId)!;
    const onPage = page.rows.find((r) => r.groupId === groupId)!;
    expect(onPlanner.renewBy).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(onPlanner.renewBy).toBe(onPage.renewBy);
    expect(onPlanner).toMatchObject({ status: 'proposed', dockingId: d200, dockingDate: day(200) });
    // The same rule; the planner lists vessels and structures together, so it says "docking or campaign" where a vessel's page says "docking".
    expect(planner.renewalRule).toContain('docking or campaign');
    expect(planner.renewalRule.replaceAll('docking or campaign', 'docking')).toBe(page.renewalRule);
    // 50 % left at 2.244 years of 365 days = 819 days after installation, 400 days ago.
    expect(Math.abs(new Date(`${onPage.renewBy}T00:00:00Z`).getTime() - new Date(`${day(419)}T00:00:00Z`).getTime())).toBeLessThanOrEqual(2 * 86_400_000);
    const { list } = await anodeListFor(viewer, d200);
    expect(list.zones.flatMap((z) => z.lines).find((l) => l.groupLabel === 'Hull')?.renewBy).toBe(onPage.renewBy);
  });
});
