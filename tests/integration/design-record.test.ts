import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { DesignSchema, type Organisation, type User } from '@/entities';
import { fmt } from '@/lib/format';
import type { Role } from '@/lib/roles';
import { StoredRecordError } from '@/lib/schemas/design-record';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { getDesignDesk } from '@/lib/server/services/designs/design-view';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';
import { readDesignRecord } from '@/lib/server/services/designs/read-design-record';
import { approveDesign, checkDesign } from '@/lib/server/services/designs/sign-design';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createZone } from '@/lib/server/services/register/zones';
import { Migration20261202003500_design_record } from '@/migrations/Migration20261202003500_design_record';
import { Migration20261202011500_demand_method } from '@/migrations/Migration20261202011500_demand_method';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';
import { pdfText } from '../fixtures/pdf-text';

// Stands in for a later edition of the current-density table: the stored inputs say "DNV table" for
// their zones, so scaling the table changes what a recomputation gives without touching any row.
// `lookups` counts the table reads, so a test can tell whether the calculation ran at all.
const table = vi.hoisted(() => ({ factor: 1, lookups: 0 }));
vi.mock('@/lib/cp', async (importOriginal) => {
  const cp = await importOriginal<typeof import('@/lib/cp')>();
  return {
    ...cp,
    currentDensityFor: (...args: Parameters<typeof cp.currentDensityFor>) => {
      table.lookups += 1;
      const d = cp.currentDensityFor(...args);
      return { initial: d.initial * table.factor, mean: d.mean * table.factor, final: d.final * table.factor };
    },
  };
});

let organisation: Organisation;
let users: Record<Role, User>;
let checker: User;
let vesselId: string;

const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const stored = async (id: string) => readDesignRecord(await (await getEm()).findOneOrFail(DesignSchema, { id }));
const noteText = async (id: string) => {
  const { pdf } = await runAs(ctx('viewer'), (c) => renderCalculationNote(c, id));
  return (await pdfText(pdf)).replace(/\s+/g, ' ');
};
// The mocked table is the offshore-structure table (DNV-RP-B401): these designs are sized by that method.
const newDesign = async (title: string, assetId = vesselId) => {
  const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId, title }));
  await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title, inputs: { ...(design.inputs as object), demandMethod: 'offshore-table' } }));
  return design;
};

beforeAll(async () => {
  // Invented particulars: a 90 m ferry, default zones from Denny-Mumford, a flush Al-Zn-In anode.
  ({ organisation, users, checker, vesselId } = await makeDesignOrg({ organisationName: 'Stored Record Shipping', checkerName: 'Checking Engineer', vesselName: 'Record Ferry' }));
});
beforeEach(() => {
  table.factor = 1;
  table.lookups = 0;
});
afterAll(async () => (await getOrm()).close(true));

describe('a signed revision is shown and printed from its stored record', () => {
  it('after the defaults change, the approved revision’s page and note show the stored values; a draft shows the recomputed ones', async () => {
    const approved = await newDesign('Approved before the table changed');
    await runAs(ctx(checker), (c) => approveDesign(c, approved.id));
    const draft = await newDesign('Draft across the table change');
    const kept = (await stored(approved.id)).results!;

    table.factor = 3; // the new edition asks three times the current density
    table.lookups = 0;
    const view = await runAs(ctx('viewer'), (c) => getDesignDesk(c, approved.id));
    const note = await noteText(approved.id);
    expect(table.lookups).toBe(0); // neither the page's service nor the note ran the calculation
    expect(view.source).toBe('stored');
    expect(view.computed?.result?.anodeCount).toBe(kept.anodeCount);
    expect(view.computed?.result?.requiredNetMassKg).toBe(kept.requiredNetMassKg);
    expect(view.computed?.result?.current).toEqual(kept.current);
    expect(view.computed?.options).toEqual(kept.options);
    expect(view.computed?.model?.designation).toBe('TW-AW-4020');
    expect(note).toContain(`${kept.anodesToFit} anodes of TW-AW-4020`);
    expect(note).toContain(`Required net mass M ${fmt(kept.requiredNetMassKg, 1)} kg`);
    expect(note).toContain('not recomputed');

    const draftView = await runAs(ctx('viewer'), (c) => getDesignDesk(c, draft.id));
    expect(table.lookups).toBeGreaterThan(0);
    expect(draftView.source).toBe('recomputed');
    const recomputed = draftView.computed!.result!;
    expect(recomputed.anodeCount).toBeGreaterThan(kept.anodeCount);
    expect(recomputed.requiredNetMassKg).toBeGreaterThan(kept.requiredNetMassKg); // the propeller keeps its entered density
    expect(note).not.toContain(`${recomputed.anodesToFit} anodes of`);
    const draftNote = await noteText(draft.id);
    expect(draftNote).toContain(`${recomputed.anodesToFit} anodes of TW-AW-4020`);
    expect(draftNote).toContain(`Required net mass M ${fmt(recomputed.requiredNetMassKg, 1)} kg`);
    // Looking at a draft stores nothing: its record still holds what was saved.
    expect((await stored(draft.id)).results?.anodeCount).toBe(kept.anodeCount);
  });

  it('a checked revision is shown from its stored record too', async () => {
    const design = await newDesign('Checked before the table changed');
    await runAs(ctx(checker), (c) => checkDesign(c, design.id));
    const kept = (await stored(design.id)).results!;
    table.factor = 3;
    table.lookups = 0;
    const view = await runAs(ctx('viewer'), (c) => getDesignDesk(c, design.id));
    expect(view.design.status).toBe('checked');
    expect(view.source).toBe('stored');
    expect(view.computed?.result?.anodeCount).toBe(kept.anodeCount);
    expect(await noteText(design.id)).toContain(`${kept.anodesToFit} anodes of`);
    expect(table.lookups).toBe(0);
  });

  it('signing a draft freezes what the signer was shown: today’s calculation of its inputs', async () => {
    const design = await newDesign('Saved before the table changed, approved after');
    const saved = (await stored(design.id)).results!.anodeCount;
    table.factor = 3;
    const shownResult = (await runAs(ctx(checker), (c) => getDesignDesk(c, design.id))).computed!.result!;
    const shown = shownResult.anodeCount;
    expect(shown).toBeGreaterThan(saved);
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    expect((await stored(design.id)).results!.anodeCount).toBe(shown);
    table.factor = 1;
    expect((await runAs(ctx('viewer'), (c) => getDesignDesk(c, design.id))).computed?.result?.anodeCount).toBe(shown);
    expect(await noteText(design.id)).toContain(`${shownResult.anodesToFit} anodes of`);
  });

  it('a revision stored without a model snapshot says so on the page and the note; no model is made up', async () => {
    const design = await newDesign('Stored before snapshots were kept');
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    const kept = (await stored(design.id)).results!;
    const count = kept.anodesToFit;
    await (await getEm()).execute(`update design set anode_model = null where id = ?`, [design.id]);
    const view = await runAs(ctx('viewer'), (c) => getDesignDesk(c, design.id));
    expect(view.computed?.model).toBeNull();
    expect(view.computed?.result?.anodeCount).toBe(kept.anodeCount);
    const note = await noteText(design.id);
    expect(note).toContain('builtin:TW-AW-4020: not recorded with this revision');
    expect(note).toContain(`${count} anodes of builtin:TW-AW-4020 (model not recorded with this revision)`);
    expect(note).not.toMatch(/net 0[.,]0 kg|Al-Zn-In, Flush, weld-on/);
  });

  it('a stored record that does not parse is an error naming the field, for a signed revision and a draft alike', async () => {
    const approved = await newDesign('Corrupted after approval');
    await runAs(ctx(checker), (c) => approveDesign(c, approved.id));
    const draft = await newDesign('Corrupted draft');
    const em = await getEm();
    await em.execute(`update design set results = jsonb_set(results, '{anodeCount}', '"many"') where id in (?, ?)`, [approved.id, draft.id]);
    table.lookups = 0;
    for (const id of [approved.id, draft.id]) {
      const error = await runAs(ctx('viewer'), (c) => getDesignDesk(c, id)).catch((e) => e);
      expect(error).toBeInstanceOf(StoredRecordError);
      expect(error.message).toMatch(/results\.anodeCount: .*expected number/);
      await expect(runAs(ctx('viewer'), (c) => renderCalculationNote(c, id))).rejects.toThrow(/results\.anodeCount/);
    }
    expect(table.lookups).toBe(0); // refused, not recomputed around
  });
});

describe('the register reads the typed stored results', () => {
  it('a group fitted to a design takes its share of the stored mean current of its zone', async () => {
    const boat = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Zoned Ferry', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.55, hullMaterial: 'steel' }));
    const zone = await runAs(ctx('engineer'), (c) => createZone(c, boat.id, { name: 'Hull bottom', kind: 'hull-bottom', areaM2: 700, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }));
    const design = await newDesign('Zoned design', boat.id);
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    const kept = (await stored(design.id)).results!;
    const surface = kept.surfaces.find((s) => s.name === 'Hull bottom')!;
    const row = kept.distribution.surfaces.find((s) => s.name === 'Hull bottom')!;
    table.factor = 3; // the register uses what the design stored, not a recomputation
    const group = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, boat.id, { label: 'Bottom', zoneId: zone.id, designId: design.id, anodeModelKey: 'builtin:TW-AW-4020', quantity: 4, installedOn: '2026-01-15' }));
    expect(group.meanCurrentA).toBeCloseTo((surface.meanA / row.count) * 4, 9);
  });
});

describe('the design-record migration', () => {
  class Rollback extends Error {}

  it('moves the snapshot of rows written the old way into its column and back, keeping every stored value', async () => {
    // Rows as the demo seed makes them: an approved revision and drafts, one without a snapshot.
    const approved = await newDesign('Seeded approved');
    await runAs(ctx(checker), (c) => approveDesign(c, approved.id));
    const draft = await newDesign('Seeded draft');
    const bare = await newDesign('Seeded draft without a snapshot');
    const before = { approved: await stored(approved.id), draft: await stored(draft.id), bare: await stored(bare.id) };

    const orm = await getOrm();
    const migration = new Migration20261202003500_design_record(orm.em.getDriver(), orm.config);
    const later = new Migration20261202011500_demand_method(orm.em.getDriver(), orm.config);
    // Everything runs in one transaction that is rolled back, so the other tests' schema is untouched.
    await (await getEm())
      .transactional(async (tx) => {
        const run = async (step: 'up' | 'down', which: typeof migration | typeof later = migration) => {
          which.reset();
          await which[step]();
          for (const sql of which.getQueries()) await tx.execute(sql as string);
        };
        await run('down', later);
        await run('down');
        const legacy = await tx.execute(`select id, inputs -> 'anodeModelSnapshot' ->> 'designation' as designation from design where id in (?, ?)`, [approved.id, draft.id]);
        expect(legacy.map((r) => r.designation)).toEqual(['TW-AW-4020', 'TW-AW-4020']);
        expect(await tx.execute(`select 1 from information_schema.columns where table_name = 'design' and column_name in ('anode_model', 'schema_version')`)).toHaveLength(0);
        await tx.execute(`update design set inputs = inputs - 'anodeModelSnapshot' where id = ?`, [bare.id]);

        await run('up');
        const rows = await tx.execute(`select id, schema_version, (inputs -> 'anodeModelSnapshot') is not null as nested from design where id in (?, ?, ?)`, [approved.id, draft.id, bare.id]);
        expect(rows.every((r) => r.schema_version === 2 && r.nested === false)).toBe(true);
        await run('up', later);
        expect((await tx.execute(`select schema_version from design where id in (?, ?, ?)`, [approved.id, draft.id, bare.id])).every((r) => r.schema_version === 3)).toBe(true);
        const read = async (id: string) => readDesignRecord(await tx.findOneOrFail(DesignSchema, { id }));
        // Version-2 rows were all sized by the offshore table with entered values: version 3 says so.
        const asVersion2 = (r: typeof before.approved) => ({ ...r, inputs: { ...r.inputs, demandMethod: 'offshore-table', hullCoatingCondition: 'good', serviceSpeedKnots: null, salinityPsu: null, resistivitySource: 'measured', potentialSource: 'entered' } });
        expect(await read(approved.id)).toEqual(asVersion2(before.approved));
        expect(await read(draft.id)).toEqual(asVersion2(before.draft));
        expect(await read(bare.id)).toEqual({ ...asVersion2(before.bare), anodeModel: null });
        const viewer = await ctxFor(tx, organisation, users.viewer);
        const view = await getDesignDesk(viewer, approved.id);
        expect(view.source).toBe('stored');
        expect(view.computed?.result?.anodeCount).toBe(before.approved.results?.anodeCount);
        throw new Rollback();
      })
      .catch((error) => {
        if (!(error instanceof Rollback)) throw error;
      });
    const columns = await (await getEm()).execute(`select column_name from information_schema.columns where table_name = 'design' and column_name in ('anode_model', 'schema_version')`);
    expect(columns).toHaveLength(2);
  });
});
