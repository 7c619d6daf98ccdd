import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AnodeGroupSchema, AssetSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { updateAsset } from '@/lib/server/services/assets/update-asset';
import { createAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { exportAnodeRegisterCsv } from '@/lib/server/services/register/list-anode-groups';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { Migration20261214000000_structured_positions } from '@/migrations/Migration20261214000000_structured_positions';
import { EMPTY_POSITION } from '@/lib/schemas/anode-position';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal } from '@/lib/server/services/planner/renewals';
import { anodeListCsvFor, anodeListPdf } from '@/lib/server/services/planner/anode-list';
import { A4 } from '@/components/pdf/pdf-kit';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { pdfPages, type PdfPage } from '../fixtures/pdf-text';

let home: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor(await getEm(), home.organisation, home.users[role]);
const model = 'builtin:TW-AW-4020';
const stored = async (id: string) => (await (await getEm()).fork().findOneOrFail(AnodeGroupSchema, { id })).position;

let vesselId: string;
let jettyId: string;

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Drawing Harbour');
  // An invented coaster and an invented jetty of 2 rows by 6 bents.
  vesselId = (await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Test Coaster', hullMaterial: 'steel', lengthBppM: 80, beamM: 13, draughtM: 5, blockCoefficient: 0.7, frameSpacingM: 0.6 }))).id;
  jettyId = (await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Test Pier', structureType: 'jetty', waterType: 'seawater', pileCount: 12, pileRows: 2, pileBents: 6 }))).id;
});
afterAll(async () => (await getOrm()).close(true));

describe('structured positions on write', () => {
  it('stores the parsed position with the text, and follows an edit of the text', async () => {
    const group = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Bottom P', anodeModelKey: model, quantity: 8, installedOn: '2024-05-01', meanCurrentA: 2, positions: 'Fr 22–30 P, 1.2 m above keel, clear of the log' }));
    expect(await stored(group.id)).toEqual({ ...EMPTY_POSITION, frameFrom: 22, frameTo: 30, side: 'port', heightAboveKeelM: 1.2, note: 'clear of the log' });
    await runAs(ctx('engineer'), (c) => updateAnodeGroup(c, group.id, { label: 'Bottom P', anodeModelKey: model, quantity: 8, installedOn: '2024-05-01', meanCurrentA: 2, positions: 'frames 40 to 48 stbd' }));
    expect(await stored(group.id)).toEqual({ ...EMPTY_POSITION, frameFrom: 40, frameTo: 48, side: 'starboard' });
    await runAs(ctx('engineer'), (c) => updateAnodeGroup(c, group.id, { label: 'Bottom P', anodeModelKey: model, quantity: 8, installedOn: '2024-05-01', meanCurrentA: 2, positions: '' }));
    expect(await stored(group.id)).toBeNull();
  });

  it('keeps an estimated particular estimated when it comes back unchanged, and marks a changed one entered', async () => {
    const em = (await getEm()).fork();
    await em.nativeUpdate(AssetSchema, { id: vesselId }, { frameSpacingM: 0.61, frameSpacingSource: 'estimate' });
    const base = { kind: 'vessel', name: 'Test Coaster', hullMaterial: 'steel', lengthBppM: 80, beamM: 13, draughtM: 5, blockCoefficient: 0.7 };
    await runAs(ctx('engineer'), (c) => updateAsset(c, vesselId, { ...base, frameSpacingM: '0.61' }));
    expect((await (await getEm()).fork().findOneOrFail(AssetSchema, { id: vesselId })).frameSpacingSource).toBe('estimate');
    await runAs(ctx('engineer'), (c) => updateAsset(c, vesselId, base));
    expect((await (await getEm()).fork().findOneOrFail(AssetSchema, { id: vesselId })).frameSpacingM).toBe(0.61);
    await runAs(ctx('engineer'), (c) => updateAsset(c, vesselId, { ...base, frameSpacingM: '0.6' }));
    const after = await (await getEm()).fork().findOneOrFail(AssetSchema, { id: vesselId });
    expect([after.frameSpacingM, after.frameSpacingSource]).toEqual([0.6, 'entered']);
    expect((await (await getEm()).fork().findOneOrFail(AssetSchema, { id: jettyId })).pileGridSource).toBe('entered');
  });
});

describe('the migration', () => {
  it('parses the texts of groups without a position, keeps the rest, and changes nothing on a second run', async () => {
    const a = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Mig A', anodeModelKey: model, quantity: 2, installedOn: '2024-05-01', meanCurrentA: 1, positions: 'sea chest SB aft' }));
    const b = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Mig B', anodeModelKey: model, quantity: 2, installedOn: '2024-05-01', meanCurrentA: 1, positions: 'wherever the diver finds room' }));
    const kept = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Mig C', anodeModelKey: model, quantity: 2, installedOn: '2024-05-01', meanCurrentA: 1, positions: 'rudder' }));
    const orm = await getOrm();
    const migration = new Migration20261214000000_structured_positions(orm.em.getDriver(), orm.config);
    // In one transaction that is rolled back, so the other tests' rows are untouched.
    await (await getEm())
      .transactional(async (tx) => {
        await tx.execute(`update anode_group set position = null where id in (?, ?)`, [a.id, b.id]);
        // A position already stored is not parsed again (here one that differs from its text, to tell).
        await tx.execute(`update anode_group set position = ?::jsonb where id = ?`, [JSON.stringify({ ...EMPTY_POSITION, place: 'sea-chest' }), kept.id]);
        const read = async () => Object.fromEntries((await tx.execute(`select id, position from anode_group where id in (?, ?, ?)`, [a.id, b.id, kept.id])).map((r) => [r.id, r.position]));
        const run = async () => {
          migration.reset();
          migration.setTransactionContext(tx.getTransactionContext());
          await migration.up();
          for (const sql of migration.getQueries()) await tx.execute(sql as string);
        };
        await run();
        const first = await read();
        expect(first[a.id]).toEqual({ ...EMPTY_POSITION, place: 'sea-chest', side: 'starboard', end: 'aft' });
        expect(first[b.id]).toEqual({ ...EMPTY_POSITION, note: 'wherever the diver finds room' });
        expect(first[kept.id]).toEqual({ ...EMPTY_POSITION, place: 'sea-chest' });
        await run();
        expect(await read()).toEqual(first);
        throw new Error('rollback');
      })
      .catch((e: Error) => {
        if (e.message !== 'rollback') throw e;
      });
    expect(await stored(a.id)).toEqual({ ...EMPTY_POSITION, place: 'sea-chest', side: 'starboard', end: 'aft' });
  });
});

describe('the asset page draws the asset', () => {
  it('draws the hull from both sides with each group, its remaining fraction and the latest readings in words', async () => {
    await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Rudder', anodeModelKey: model, quantity: 2, installedOn: '2024-05-01', meanCurrentA: 0.5, positions: 'rudder P/S' }));
    await runAs(ctx('inspector'), (c) =>
      createSurvey(c, { assetId: vesselId, surveyedOn: '2025-06-01', method: 'diver', defaultElectrode: 'ag-agcl-seawater', readings: [
        { location: 'Rudder P', potentialV: -0.95, electrode: 'ag-agcl-seawater', anodeGroupLabel: null, remainingFraction: null, comment: null },
        { location: 'Fr 44 S', potentialV: -0.7, electrode: 'ag-agcl-seawater', anodeGroupLabel: null, remainingFraction: null, comment: null },
      ] }),
    );
    const page = await getAssetPage(await ctx('viewer'), vesselId, new Date('2025-07-01T00:00:00Z'));
    const d = page.drawing.drawing!;
    expect(d.kind).toBe('hull');
    expect(d.views.map((v) => v.id)).toEqual(['starboard', 'port']);
    const rudder = d.rows.find((r) => r.label === 'Rudder')!;
    expect(rudder.where).toBe('Rudder, port and starboard');
    expect(rudder.readings).toBe('Rudder P: -0.95 V, protected');
    expect(rudder.remaining).toMatch(/^\d+ % left$/);
    const port = d.views[1]!;
    expect(port.groups.some((g) => g.target === `drawing-group-${rudder.id}`)).toBe(true);
    const markers = (v: typeof port) => v.shapes.filter((s) => s.kind === 'text' && / V, /.test(s.text)).map((s) => (s as { text: string }).text);
    expect(markers(port)).toEqual(['-0.95 V, protected']);
    expect(markers(d.views[0]!)).toEqual(['-0.70 V, under-protected']);
  });

  it('draws a structure as its pile plan with the groups over their piles', async () => {
    await runAs(ctx('engineer'), (c) => createAnodeGroup(c, jettyId, { label: 'Bents 1-3', anodeModelKey: 'builtin:TW-AS-1510', quantity: 6, installedOn: '2020-06-01', meanCurrentA: 3, positions: 'B1-A to B3-B, one per pile at -4 m CD' }));
    await runAs(ctx('engineer'), (c) => createAnodeGroup(c, jettyId, { label: 'Loose', anodeModelKey: 'builtin:TW-AS-1510', quantity: 2, installedOn: '2020-06-01', meanCurrentA: 1, positions: 'spares in the store' }));
    const page = await getAssetPage(await ctx('viewer'), jettyId, new Date('2025-07-01T00:00:00Z'));
    const d = page.drawing.drawing!;
    expect(d.kind).toBe('piles');
    expect(d.grid).toEqual({ rows: 2, bents: 6 });
    expect(d.views[0]!.groups).toHaveLength(12);
    expect(d.views[0]!.groups.find((g) => g.target === 'pile-2-B')!.title).toMatch(/^Pile bent 2 row B: 1 anode, \d+ % left$/);
    expect(d.views[0]!.groups.find((g) => g.target === 'pile-4-A')!.title).toBe('Pile bent 4 row A: no anodes recorded');
    expect(d.rows.find((r) => r.label === 'Loose')).toMatchObject({ drawn: false, where: 'Position not given', note: 'spares in the store' });
  });

  it('says what is missing when a hull cannot be drawn', async () => {
    const bare = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'No particulars', hullMaterial: 'steel' }));
    const page = await getAssetPage(await ctx('viewer'), bare.id);
    expect(page.drawing).toEqual({ drawing: null, missing: 'Enter the length between perpendiculars and the draught in the particulars to draw the hull.' });
  });
});

describe('the anode list prints the drawing', () => {
  const textOf = (page: PdfPage) => page.items.map((i) => i.str).join(' ').replace(/\s+/g, ' ');

  it('adds a sheet with the hull drawn and the groups on the list at their positions, in words', async () => {
    const ship = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'List Coaster', hullMaterial: 'steel', lengthBppM: 80, beamM: 13, draughtM: 5, blockCoefficient: 0.7 }));
    const g = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, ship.id, { label: 'Bottom S', anodeModelKey: model, quantity: 6, installedOn: '2024-05-01', meanCurrentA: 2, positions: 'frames 118 to 124 stbd, 1.2 m above keel' }));
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: ship.id, kind: 'intermediate', plannedStart: '2027-05-03', plannedEnd: '2027-05-14', yard: 'Saltmarsh Ship Repair' }));
    await runAs(ctx('planner'), (c) => addRenewal(c, docking.id, { groupId: g.id, reason: 'forecast-depletion' }));
    const { pdf } = await runAs(ctx('planner'), (c) => anodeListPdf(c, docking.id));
    const pages = await pdfPages(pdf);
    const last = textOf(pages[pages.length - 1]!);
    expect(last).toContain('Where the anodes go: List Coaster');
    expect(last).toContain('Starboard side (bow right)');
    expect(last).toContain('Port side (bow left)');
    expect(last).toMatch(/Bottom S · 6 · \d+ % left/);
    expect(last).toContain('Frames 118–124, starboard, 1.2 m above keel');
    pages.forEach((page, i) => {
      expect(page.width).toBeCloseTo(A4.height, 1);
      expect(textOf(page)).toContain(`page ${i + 1} of ${pages.length}`);
    });
    // The list's positions column gives the engineer's text exactly as written (the yard works from it); the PDF
    // adds the structured reading under it.
    expect(last.length).toBeGreaterThan(0);
    expect(pages.map(textOf).join(' ')).toContain('Read as: Frames 118–124, starboard, 1.2 m above keel');
    const { csv } = await runAs(ctx('planner'), (c) => anodeListCsvFor(c, docking.id));
    expect(csv).toContain('"frames 118 to 124 stbd, 1.2 m above keel"');
    expect(csv).not.toContain('Frames 118–124');
  });
});

describe('the calculation note prints the drawing', () => {
  const textOf = (page: PdfPage) => page.items.map((i) => i.str).join(' ').replace(/\s+/g, ' ');

  it('ends with a portrait sheet drawing the asset with its groups and readings', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId, title: 'Coaster hull' }));
    const { pdf } = await runAs(ctx('viewer'), (c) => renderCalculationNote(c, design.id));
    const pages = await pdfPages(pdf);
    const last = textOf(pages[pages.length - 1]!);
    expect(last).toContain('Where the anodes are: Test Coaster');
    expect(last).toContain('The groups fitted on the asset (none from this revision yet)');
    expect(last).toContain('Rudder, port and starboard');
    expect(last).toContain('-0.95 V, protected');
    expect(last).toContain(`page ${pages.length} of ${pages.length}`);
    for (const page of pages) expect(page.width).toBeCloseTo(A4.width, 1);
  });
});

describe('the register export', () => {
  it('gives the position as data in columns of words besides the text', async () => {
    const csv = await runAs(ctx('viewer'), (c) => exportAnodeRegisterCsv(c));
    const header = csv.split('\r\n')[0]!.split(',');
    const line = csv.split('\r\n').find((l) => l.includes(',List Coaster,') || l.startsWith('List Coaster,'))!;
    expect(header.slice(-8)).toEqual(['Frames', 'Side', 'Height above keel (m)', 'Part of the hull', 'Piles', 'Depth below datum (m)', 'Datum', 'Position note']);
    expect(line).toContain('"frames 118 to 124 stbd, 1.2 m above keel"');
    expect(line.endsWith(',118–124,starboard,1.2,,,,,')).toBe(true);
    const pier = csv.split('\r\n').find((l) => l.includes(',Bents 1-3,'))!;
    expect(pier.endsWith(',,,,,bent 1 row A to bent 3 row B,4,chart datum (CD),one per pile')).toBe(true);
  });
});
