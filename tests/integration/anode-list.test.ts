import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import { A4 } from '@/components/pdf/pdf-kit';
import { COLUMNS } from '@/components/pdf/anode-list/layout';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal, markRenewalFitted } from '@/lib/server/services/planner/renewals';
import { anodeListCsvFor, anodeListFor, anodeListPdf } from '@/lib/server/services/planner/anode-list';
import { listDockingRenewalRows } from '@/lib/server/services/planner/docking-renewals';
import { RenewalSchema } from '@/entities';
import type { OrgContext } from '@/lib/server/org-context';

import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { pdfPages, type PdfPage } from '../fixtures/pdf-text';

/** The reference the plain statement is held to: the same docking's renewals read through the ORM, field by field. */
async function listDockingRenewals(c: OrgContext, dockingId: string) {
  const renewals = await c.em.find(RenewalSchema, { docking: dockingId, organisation: c.organisation }, { populate: ['group', 'group.zone'], orderBy: { createdAt: 'asc' } });
  const rows = renewals
    .map((r) => ({
      id: r.id,
      status: r.status,
      reason: r.reason,
      quantity: r.quantity,
      notes: r.notes ?? null,
      rationale: r.rationale ?? null,
      confirmedBy: r.confirmedByEmail ?? null,
      fittedOn: r.fittedOn ?? null,
      groupId: r.group.id,
      groupLabel: r.group.label,
      zone: r.group.zone?.name ?? null,
      designation: r.group.model.designation,
      alloy: r.group.model.alloy,
      mounting: r.group.model.mounting,
      netMassKg: r.group.model.netMassKg,
      grossMassKg: r.group.model.grossMassKg,
      positions: r.group.positions ?? null,
      installedOn: r.group.installedOn,
    }))
    .sort((a, b) => (a.zone ?? '').localeCompare(b.zone ?? '') || a.groupLabel.localeCompare(b.groupLabel));
  return { rows };
}

let organisation: Organisation;
let users: Record<Role, User>;
const ctx = async (role: Role) => ctxFor(await getEm(), organisation, users[role]);
const textOf = (page: PdfPage) => page.items.map((i) => i.str).join(' ').replace(/\s+/g, ' ');

/** An asset with `n` groups booked (confirmed) for renewal at one planned docking or campaign. */
async function bookedList(asset: { kind: 'vessel' | 'structure'; name: string }, n: number, modelKey: string) {
  const created = await runAs(ctx('engineer'), (c) =>
    createAsset(c, asset.kind === 'vessel' ? { kind: 'vessel', name: asset.name, hullMaterial: 'steel' } : { kind: 'structure', name: asset.name, structureType: 'jetty', waterType: 'seawater', pileCount: 40, pileDiameterM: 0.61 }),
  );
  const groupIds = await runAs(ctx('engineer'), async (c) => {
    const ids: string[] = [];
    for (let i = 1; i <= n; i++) ids.push((await createAnodeGroup(c, created.id, { label: `Row ${i}`, anodeModelKey: modelKey, quantity: 4 + (i % 3), installedOn: '2020-03-01', positions: `Frames ${10 * i} to ${10 * i + 8}, both sides`, meanCurrentA: 1 })).id);
    return ids;
  });
  const docking = await runAs(ctx('planner'), (c) =>
    createDocking(c, { assetId: created.id, kind: asset.kind === 'vessel' ? 'intermediate' : 'campaign', plannedStart: '2027-05-03', plannedEnd: '2027-05-14', yard: asset.kind === 'vessel' ? 'Saltmarsh Ship Repair' : 'Deepline Diving Ltd' }),
  );
  await runAs(ctx('planner'), async (c) => {
    for (const groupId of groupIds) await addRenewal(c, docking.id, { groupId, reason: 'forecast-depletion' });
  });
  return docking.id;
}

let vesselDockingId: string;
let jettyCampaignId: string;

beforeAll(async () => {
  ({ organisation, users } = await makeOrgWithRoles(await getEm(), 'List Test Shipping'));
  // Invented assets; built-in generic models (lib/cp/builtin-anode-models.ts).
  vesselDockingId = await bookedList({ kind: 'vessel', name: 'List Test Ferry' }, 70, 'builtin:TW-AW-4020');
  jettyCampaignId = await bookedList({ kind: 'structure', name: 'List Test Jetty' }, 6, 'builtin:TW-AS-1510');
}, 120_000);
afterAll(async () => (await getOrm()).close(true));

describe("a ship's dry-dock anode list", () => {
  let pages: PdfPage[];
  beforeAll(async () => {
    const { pdf } = await runAs(ctx('planner'), (c) => anodeListPdf(c, vesselDockingId));
    pages = await pdfPages(pdf);
  }, 60_000);

  it('prints every page A4 landscape (841.89 x 595.28 pt), numbered "page N of M"', () => {
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => {
      expect(page.width).toBeCloseTo(A4.height, 1);
      expect(page.height).toBeCloseTo(A4.width, 1);
      expect(textOf(page)).toContain(`page ${i + 1} of ${pages.length}`);
    });
  });

  it("prints each model's dimensions and masses, and the yard's words", () => {
    const all = pages.map(textOf).join(' ');
    // TW-AW-4020: 400 x 200 x 40 mm, 7.7 kg net, 8.7 kg gross (lib/cp built-in catalogue).
    expect(all).toContain('400 × 200 × 40');
    expect(all).toMatch(/TW-AW-4020 400 × 200 × 40 Al-Zn-In Flush, weld-on \d+ 7\.7 8\.7/);
    expect(all).toContain('Dimensions, mm');
    expect(all).toContain('Dry-dock anode list');
    expect(all).toContain('Yard Saltmarsh Ship Repair');
    expect(all).toContain('Fitted by (yard)');
    expect(all).toMatch(/Mask every anode face before blasting and painting/);
  });

  it('names the planner who printed it, with their role, as the preparer, never an e-mail address', () => {
    const last = textOf(pages[pages.length - 1]);
    expect(last).toMatch(/Prepared planner person Planner/);
    expect(last).toContain('Printed');
    expect(last).toContain('by planner person');
    expect(pages.map(textOf).join(' ')).not.toMatch(/@test\.example/);
  });

  it('gives the CSV the same columns and words as the PDF: one table, labels not codes', async () => {
    const { csv } = await runAs(ctx('planner'), (c) => anodeListCsvFor(c, vesselDockingId));
    const rows = Papa.parse<string[]>(csv.trimEnd(), { newline: '\r\n' }).data;
    expect(rows[0]).toEqual(['Zone', ...COLUMNS.line.map((c) => c.label)]);
    expect(rows).toHaveLength(71);
    expect(rows.slice(1).every((r) => r.length === rows[0].length)).toBe(true);
    expect(rows[1]).toEqual(expect.arrayContaining(['No zone', 'TW-AW-4020', '400 × 200 × 40', 'Al-Zn-In', 'Flush, weld-on', '7.7', '8.7', 'Confirmed']));
    expect(csv).not.toMatch(/al-zn-in|flush-weld|ordering totals/);
  });
});

describe("a jetty's diving campaign list", () => {
  it("speaks of a contractor and diving, never of a yard, dry-docking, blasting or painting", async () => {
    const { pdf } = await runAs(ctx('planner'), (c) => anodeListPdf(c, jettyCampaignId));
    const pages = await pdfPages(pdf);
    for (const page of pages) {
      expect(page.width).toBeCloseTo(A4.height, 1);
      expect(page.height).toBeCloseTo(A4.width, 1);
    }
    const all = pages.map(textOf).join(' ');
    expect(all).toContain('Anode list, diving campaign');
    expect(all).toContain('Contractor Deepline Diving Ltd');
    expect(all).toContain('Fitted by (contractor)');
    expect(all).toMatch(/dive plan/);
    // TW-AS-1510: 1,500 mm long, Ø 190 mm (lib/cp built-in catalogue).
    expect(all).toContain('1500 × Ø190');
    expect(all).not.toMatch(/\byard\b|dry-dock|blast|paint/i);
  });
});

describe("the engineer's position words on the list", () => {
  // Texts a yard writes; the structured reading says them in other words ("Hull bottom", "Propeller and shaft").
  const texts = ['Fr 60-90 P, bilge strakes, 1.0 m above keel', 'Stern frame and shaft brackets P/S, clear of propeller tips', 'Rudder stocks P and S'];
  let dockingId: string;
  let renewalIds: string[] = [];
  beforeAll(async () => {
    const created = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'List Words Tug', hullMaterial: 'steel', lengthBppM: 30, beamM: 9, draughtM: 3.5 }));
    const ids = await runAs(ctx('engineer'), async (c) => {
      const out: string[] = [];
      for (const [i, positions] of texts.entries()) out.push((await createAnodeGroup(c, created.id, { label: `Words ${i + 1}`, anodeModelKey: 'builtin:TW-AW-4020', quantity: 4, installedOn: '2020-03-01', positions, meanCurrentA: 1 })).id);
      return out;
    });
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: created.id, kind: 'intermediate', plannedStart: '2027-06-07', yard: 'Saltmarsh Ship Repair' }));
    await runAs(ctx('planner'), async (c) => {
      for (const groupId of ids) renewalIds.push((await addRenewal(c, docking.id, { groupId, reason: 'forecast-depletion' })).id);
    });
    dockingId = docking.id;
  }, 60_000);

  it('prints each position in the CSV exactly as written', async () => {
    const { csv } = await runAs(ctx('planner'), (c) => anodeListCsvFor(c, dockingId));
    const rows = Papa.parse<string[]>(csv.trimEnd(), { newline: '\r\n' }).data;
    const column = rows[0].indexOf('Positions');
    expect(column).toBeGreaterThan(0);
    expect(rows.slice(1).map((r) => r[column]).sort()).toEqual([...texts].sort());
  });

  it('prints the text as written in the PDF, with the structured reading after it as "Read as: …"', async () => {
    const { pdf, list } = await runAs(ctx('planner'), (c) => anodeListPdf(c, dockingId));
    const lines = list.zones.flatMap((z) => z.lines);
    expect(lines.map((l) => l.positions).sort()).toEqual([...texts].sort());
    const rudder = lines.find((l) => l.positions === 'Rudder stocks P and S')!;
    expect(rudder.positionReadAs).toMatch(/^Rudder/);
    const all = (await pdfPages(pdf)).map(textOf).join(' ');
    expect(all).toContain('Stern frame and shaft brackets P/S, clear of propeller tips');
    expect(all).toContain('Read as:');
  });

  it('draws a fitted renewal as new (full), never as used up', async () => {
    await runAs(ctx('planner'), (c) => markRenewalFitted(c, renewalIds[0]!, { fittedOn: '2026-11-30' }));
    const { list, drawing } = await runAs(ctx('planner'), (c) => anodeListFor(c, dockingId));
    const fitted = list.zones.flatMap((z) => z.lines).find((l) => l.status === 'fitted')!;
    const group = drawing!.groups.find((g) => g.label === fitted.groupLabel)!;
    expect(group.remainingFraction).toBe(1);
    const row = drawing!.rows.find((r) => r.label === fitted.groupLabel)!;
    expect(row.remaining).toBe('100 % left');
  });
});

describe('the renewals JSON API (listDockingRenewalRows, one plain statement)', () => {
  it('answers the same rows as the ORM reads: fields, dates, zones and order', async () => {
    // The ship's list has 70 groups (several per sort key) and the words tug's list a fitted renewal with its date.
    for (const id of [vesselDockingId, jettyCampaignId]) {
      const viaOrm = await runAs(ctx('viewer'), (c) => listDockingRenewals(c, id));
      const viaSql = await runAs(ctx('viewer'), (c) => listDockingRenewalRows(c, id));
      expect(viaSql.length).toBeGreaterThan(0);
      expect(viaSql).toEqual(viaOrm.rows);
    }
    const created = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Rows Test Tug', hullMaterial: 'steel' }));
    const groupId = await runAs(ctx('engineer'), async (c) => (await createAnodeGroup(c, created.id, { label: 'Only row', anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: '2021-04-09', meanCurrentA: 1 })).id);
    const docking = await runAs(ctx('planner'), (c) => createDocking(c, { assetId: created.id, kind: 'intermediate', plannedStart: '2027-08-02', yard: 'Saltmarsh Ship Repair' }));
    const renewal = await runAs(ctx('planner'), (c) => addRenewal(c, docking.id, { groupId, reason: 'damage' }));
    await runAs(ctx('planner'), (c) => markRenewalFitted(c, renewal.id, { fittedOn: '2026-11-30' }));
    // The scheduler may book a proposal of its own at the new docking as well: the fitted one is found by its id.
    const rows = await runAs(ctx('viewer'), (c) => listDockingRenewalRows(c, docking.id));
    expect(rows.find((r) => r.id === renewal.id)).toMatchObject({ status: 'fitted', reason: 'damage', fittedOn: '2026-11-30', installedOn: '2021-04-09', groupLabel: 'Only row', zone: null, designation: 'TW-AW-4020' });
    expect(rows).toEqual((await runAs(ctx('viewer'), (c) => listDockingRenewals(c, docking.id))).rows);
  }, 60_000);

  it("does not answer another organisation's docking, nor one that does not exist", async () => {
    const other = await makeOrgWithRoles(await getEm(), 'Rows Other Shipping');
    const otherCtx = async () => ctxFor(await getEm(), other.organisation, other.users.owner);
    await expect(runAs(otherCtx(), (c) => listDockingRenewalRows(c, vesselDockingId))).rejects.toMatchObject({ code: 'not-found' });
    await expect(runAs(ctx('viewer'), (c) => listDockingRenewalRows(c, '6f1c1c0e-0000-4000-8000-000000000000'))).rejects.toMatchObject({ code: 'not-found' });
    await expect(runAs(ctx('viewer'), (c) => listDockingRenewalRows(c, 'not-a-uuid'))).rejects.toMatchObject({ code: 'not-found' });
  });
});
