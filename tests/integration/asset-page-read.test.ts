import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from 'date-fns';
import { AnodeGroupChangeSchema, AnodeModelSchema, DesignSchema, SurveySchema, ZoneSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { setAssetArchived } from '@/lib/server/services/assets/update-asset';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { archiveZone, createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { createAnodeModel, setAnodeModelArchived } from '@/lib/server/services/catalogue/manage-anode-models';
import { BUILTIN_ANODE_MODELS } from '@/lib/cp';
import { AppError } from '@/lib/server/errors';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

// The asset page reads its lists in one plain statement instead of ORM queries. These tests hold that read to
// what the entities say, field by field, so the faster read cannot drift from the records.
let org: { organisation: Organisation; users: Record<Role, User> };
let other: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role, o = org) => ctxFor(await getEm(), o.organisation, o.users[role]);
const as = <T,>(role: Role, work: Parameters<typeof runAs<T>>[1]) => runAs(ctx(role), work);
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
const zoneFields = { kind: 'hull-bottom', areaM2: '120', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
const modelFields = { alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: '0.3', widthM: '0.15', thicknessM: '0.03', exposedAreaM2: '0.06', netMassKg: '8', grossMassKg: '8.5' };
let vesselId = '';

beforeAll(async () => {
  const em = await getEm();
  org = await makeOrgWithRoles(em, 'Page Read Towage');
  other = await makeOrgWithRoles(em, 'Other Page Read Marine');
  vesselId = (await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: 'Read Tug', hullMaterial: 'steel', lengthBppM: 32, beamM: 10, draughtM: 4, blockCoefficient: 0.6 }))).id;
  await as('engineer', (c) => createZone(c, vesselId, { ...zoneFields, name: 'Bottom' }));
  await as('engineer', (c) => createZone(c, vesselId, { ...zoneFields, name: 'Sides', kind: 'boot-top-sides', coatingCategory: 'bare', areaM2: '80.5' }));
  const gone = await as('engineer', (c) => createZone(c, vesselId, { ...zoneFields, name: 'Removed box cooler' }));
  await as('engineer', (c) => archiveZone(c, gone.id));
  await as('engineer', (c) => createDesign(c, { assetId: vesselId, title: 'First sizing' }));
  await as('engineer', (c) => createDesign(c, { assetId: vesselId, title: 'Second sizing' }));
  // 22 surveys: the page shows the latest 20.
  for (let i = 0; i < 22; i++) await as('inspector', (c) => createSurvey(c, { assetId: vesselId, surveyedOn: day(-10 * i - 1), method: i % 2 ? 'diver' : 'drop-cell', defaultElectrode: 'ag-agcl-seawater' }));
  await as('engineer', (c) => createAnodeModel(c, { ...modelFields, designation: 'ZZ-PLATE' }));
  const old = await as('engineer', (c) => createAnodeModel(c, { ...modelFields, designation: 'AA-OLD' }));
  await as('engineer', (c) => setAnodeModelArchived(c, old.id, true));
  const group = await as('engineer', (c) => createAnodeGroup(c, vesselId, { label: 'Bottom P/S', anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-400), meanCurrentA: 3 }));
  await as('engineer', (c) => updateAnodeGroup(c, group.id, { label: 'Bottom P/S', anodeModelKey: 'builtin:TW-AW-4020', quantity: 12, installedOn: day(-400), meanCurrentA: 3 }));
});
afterAll(async () => (await getOrm()).close(true));

describe('the asset page reads what the records hold', () => {
  it('zones, designs, surveys, changes and the catalogue equal the entities, in the page order', async () => {
    const page = await getAssetPage(await ctx('engineer'), vesselId);
    const em = (await getEm()).fork();
    const zones = await em.find(ZoneSchema, { asset: vesselId, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } });
    expect(page.zones).toEqual(
      zones.map((z) => ({ id: z.id, name: z.name, kind: z.kind, areaM2: z.areaM2, coatingCategory: z.coatingCategory, coatingAgeYears: z.coatingAgeYears, waterType: z.waterType, climate: z.climate, depthBand: z.depthBand, drainsCurrent: z.drainsCurrent ?? null })),
    );
    expect(page.zones.map((z) => z.name)).toEqual(['Bottom', 'Sides']); // the archived zone is not shown
    expect(page.zones[1].areaM2).toBe(80.5);

    const designs = await em.find(DesignSchema, { asset: vesselId }, { orderBy: { revision: 'desc' }, populate: ['preparedBy'], exclude: ['inputs', 'basis', 'results', 'anodeModel'] });
    expect(page.designs).toEqual(designs.map((d) => ({ id: d.id, revision: d.revision, title: d.title, status: d.status, preparedBy: { name: d.preparedBy.name } })));
    expect(page.designs.map((d) => d.title)).toEqual(['Second sizing', 'First sizing']);

    const surveys = await em.find(SurveySchema, { asset: vesselId }, { orderBy: { surveyedOn: 'desc' }, limit: 20 });
    expect(page.surveys).toEqual(surveys.map((s) => ({ id: s.id, surveyedOn: s.surveyedOn, method: s.method, surveyor: s.surveyor ?? null })));
    expect(page.surveys).toHaveLength(20);
    expect(page.surveys[0].surveyedOn).toBe(day(-1));

    const changes = await em.find(AnodeGroupChangeSchema, { group: { asset: vesselId } }, { orderBy: { createdAt: 'desc' }, populate: ['group'] });
    expect(page.changes.map((c) => ({ id: c.id, label: c.group.label, by: c.changedByEmail, changes: c.changes, at: c.createdAt.toISOString() }))).toEqual(
      changes.map((c) => ({ id: c.id, label: c.group.label, by: c.changedByEmail, changes: c.changes, at: c.createdAt.toISOString() })),
    );
    expect(page.changes[0].changes).toEqual({ quantity: [10, 12] });

    // Built-in models first, then the organisation's live ones by designation; archived ones are not offered.
    const models = await em.find(AnodeModelSchema, { organisation: org.organisation, archivedAt: null }, { orderBy: { designation: 'asc' } });
    expect(page.catalogue.map((m) => m.key)).toEqual([...BUILTIN_ANODE_MODELS.map((m) => `builtin:${m.id}`), ...models.map((m) => `org:${m.id}`)]);
    expect(page.catalogue.find((m) => m.designation === 'ZZ-PLATE')).toMatchObject({ alloy: 'zinc', netMassKg: 8 });
    expect(page.catalogue.some((m) => m.designation === 'AA-OLD')).toBe(false);
    // The asset itself is the entity, as the particulars and the edit form read it.
    expect({ name: page.asset.name, lengthBppM: page.asset.lengthBppM, blockCoefficient: page.asset.blockCoefficient, archivedAt: page.asset.archivedAt ?? null }).toEqual({
      name: 'Read Tug',
      lengthBppM: 32,
      blockCoefficient: 0.6,
      archivedAt: null,
    });
  });

  it('a viewer gets no catalogue (no group form to fill)', async () => {
    const page = await getAssetPage(await ctx('viewer'), vesselId);
    expect(page.canWrite).toBe(false);
    expect(page.catalogue).toEqual([]);
  });

  it("another organisation's asset and a malformed id are 404, and an archived asset is still shown", async () => {
    const notFound = async (p: Promise<unknown>) => {
      const error = await p.then(() => null, (e: unknown) => e);
      expect(error).toBeInstanceOf(AppError);
      expect((error as AppError).code).toBe('not-found');
    };
    await notFound(getAssetPage(await ctx('owner', other), vesselId));
    await notFound(getAssetPage(await ctx('owner'), 'not-a-uuid'));
    const spare = await as('engineer', (c) => createAsset(c, { kind: 'structure', name: 'Spare Dolphin', structureType: 'dolphin', waterType: 'seawater' }));
    await as('engineer', (c) => setAssetArchived(c, spare.id, true));
    const page = await getAssetPage(await ctx('viewer'), spare.id);
    expect(page.asset.archivedAt).toBeInstanceOf(Date);
    expect(page.outlook).toBeNull();
  });
});
