import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AnodeGroupSchema, AuditEventSchema, RenewalSchema, ZoneSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { fitDesign } from '@/lib/server/services/designs/fit-design';
import { approveDesign, checkDesign } from '@/lib/server/services/designs/sign-design';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { readDesignRecord } from '@/lib/server/services/designs/read-design-record';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';

let organisation: Organisation;
let users: Record<Role, User>;
let checker: User;
let vesselId: string;

const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const refusal = async (p: Promise<unknown>) => (await p.then(() => null, (e) => e)) as AppError | null;

/** An approved revision of the asset's default design (prepared by the engineer, approved by the second engineer). */
async function approvedDesign(assetId: string) {
  const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId }));
  await runAs(ctx(checker), (c) => approveDesign(c, design.id));
  return design.id;
}

/** Zone name -> anodes the stored distribution gives it (zones with none left out). */
async function designCounts(designId: string) {
  const { DesignSchema } = await import('@/entities');
  const design = await (await getEm()).findOneOrFail(DesignSchema, { id: designId });
  const results = readDesignRecord(design).results!;
  return new Map(results.distribution.surfaces.filter((s) => s.count > 0).map((s) => [s.name, s.count]));
}

const liveGroups = async (assetId: string, designId?: string) =>
  (await getEm()).find(AnodeGroupSchema, { asset: assetId, removedOn: null, ...(designId ? { design: designId } : {}) }, { populate: ['zone'] });

beforeAll(async () => {
  // Invented particulars for the test: a 90 m ferry (tests/fixtures/design-org.ts).
  ({ organisation, users, checker, vesselId } = await makeDesignOrg({ organisationName: 'Fit Design Shipping', checkerName: 'Second Engineer', vesselName: 'Fit Test Ferry' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('fit this design', () => {
  it('refuses a draft or a checked revision, and writes nothing', async () => {
    const draft = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    const e1 = await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, draft.id, { mode: 'installed', fittedOn: '2026-01-10' })));
    expect(e1?.code).toBe('conflict');
    expect(e1?.message).toMatch(/draft: only an approved revision can be fitted/);
    await runAs(ctx(checker), (c) => checkDesign(c, draft.id));
    const e2 = await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, draft.id, { mode: 'installed', fittedOn: '2026-01-10' })));
    expect(e2?.message).toMatch(/checked but not approved/);
    expect(await liveGroups(vesselId)).toHaveLength(0);
  });

  it('fits an approved revision as installed groups: one per zone with anodes, its quantity and model, on the date entered, audited', async () => {
    const designId = await approvedDesign(vesselId);
    const counts = await designCounts(designId);
    expect(counts.size).toBeGreaterThan(0);
    const result = await runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2026-01-10', idempotencyKey: crypto.randomUUID() }));
    expect(result.mode).toBe('installed');

    const groups = await liveGroups(vesselId, designId);
    expect(groups).toHaveLength(counts.size);
    for (const g of groups) {
      expect(g.zone?.name).toBeDefined();
      expect(g.quantity).toBe(counts.get(g.zone!.name));
      expect(g.installedOn).toBe('2026-01-10');
      expect(g.model.designation).toBe(result.lines[0].designation);
      expect(g.meanCurrentA).toBeGreaterThan(0);
    }
    const total = [...counts.values()].reduce((a, b) => a + b, 0);
    expect(result.message).toContain(`${total} × ${result.lines[0].designation} recorded as fitted on 10 Jan 2026`);
    const em = await getEm();
    expect(await em.count(AuditEventSchema, { organisationId: organisation.id, action: 'design.fitted', targetId: designId })).toBe(1);
    expect(await em.count(AuditEventSchema, { organisationId: organisation.id, action: 'anode-group.fitted' })).toBeGreaterThanOrEqual(counts.size);
  });

  it('is not doubled by a second submit; a confirmed second fit adds a second set under labels of its own', async () => {
    const designId = (await liveGroups(vesselId)).find((g) => g.design)!.design!.id;
    const before = await liveGroups(vesselId, designId);
    const again = await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2026-01-10' })));
    expect(again?.code).toBe('conflict');
    expect(again?.message).toMatch(/already fitted on Fit Test Ferry/);
    expect(again?.fieldErrors?.confirmSecondFit).toBeDefined();
    expect(await liveGroups(vesselId, designId)).toHaveLength(before.length);

    await runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2026-01-11', confirmSecondFit: 'on' }));
    const after = await liveGroups(vesselId, designId);
    expect(after).toHaveLength(2 * before.length);
    expect(new Set(after.map((g) => g.label)).size).toBe(after.length);
  });

  it('books the design as confirmed renewals at a chosen docking, once, by a planner', async () => {
    const designId = (await liveGroups(vesselId)).find((g) => g.design)!.design!.id;
    const counts = await designCounts(designId);
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: vesselId, kind: 'intermediate', plannedStart: '2027-06-01', plannedEnd: '2027-06-10', yard: 'Test Yard' }));
    // An engineer records installations; booking renewals is the planner's.
    expect((await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'renewal', dockingId: docking.id }))))?.code).toBe('forbidden');
    const result = await runAs(ctx('planner'), (c) => fitDesign(c, designId, { mode: 'renewal', dockingId: docking.id }));
    expect(result.message).toMatch(/booked as renewals in \d+ zones? at the docking from 1 Jun 2027/);
    const renewals = await (await getEm()).find(RenewalSchema, { docking: docking.id, status: 'confirmed' }, { populate: ['group', 'group.zone'] });
    expect(renewals).toHaveLength(counts.size);
    for (const r of renewals) expect(r.quantity).toBe(counts.get(r.group.zone!.name));

    const twice = await refusal(runAs(ctx('planner'), (c) => fitDesign(c, designId, { mode: 'renewal', dockingId: docking.id })));
    expect(twice?.message).toMatch(/already booked for renewal; nothing was booked/);
    expect(await (await getEm()).count(RenewalSchema, { docking: docking.id, status: 'confirmed' })).toBe(counts.size);
  });

  it('refuses renewals where the asset has no fitted group of the model, naming the zones, and a planner cannot fit as installed', async () => {
    const other = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Bare Test Ferry', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6, hullMaterial: 'steel' }));
    const designId = await approvedDesign(other.id);
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: other.id, kind: 'intermediate', plannedStart: '2027-07-01' }));
    const e = await refusal(runAs(ctx('planner'), (c) => fitDesign(c, designId, { mode: 'renewal', dockingId: docking.id })));
    expect(e?.message).toMatch(/no fitted group of .* to renew\. Fit the design as installed/);
    expect((await refusal(runAs(ctx('planner'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2026-01-10' }))))?.code).toBe('forbidden');
    expect(await (await getEm()).count(RenewalSchema, { docking: docking.id })).toBe(0);
  });

  it('refuses a fitting date in the future with the field named', async () => {
    const designId = (await liveGroups(vesselId)).find((g) => g.design)!.design!.id;
    const e = await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2999-01-01', confirmSecondFit: true })));
    expect(JSON.stringify(e)).toMatch(/fitting date cannot be in the future|fittedOn/);
  });

  it('creates a zone the asset no longer has from the revision, so every group sits in its zone', async () => {
    const other = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Zone Test Ferry', lengthBppM: 70, beamM: 13, draughtM: 3.8, blockCoefficient: 0.6, hullMaterial: 'steel' }));
    const designId = await approvedDesign(other.id);
    const counts = await designCounts(designId);
    const [gone] = [...counts.keys()];
    const em = await getEm();
    await em.nativeUpdate(ZoneSchema, { asset: other.id, name: gone }, { archivedAt: new Date() });
    await runAs(ctx('engineer'), (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: '2026-02-01' }));
    const zones = await (await getEm()).find(ZoneSchema, { asset: other.id, archivedAt: null });
    expect(zones.filter((z) => z.name === gone)).toHaveLength(1);
    const groups = await liveGroups(other.id, designId);
    expect(groups).toHaveLength(counts.size);
    for (const g of groups) expect(zones.map((z) => z.id)).toContain(g.zone!.id);
  });
});
