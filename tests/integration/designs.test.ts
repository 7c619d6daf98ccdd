import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AssetSchema, AuditEventSchema, DesignSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { createDesign, defaultInputs } from '@/lib/server/services/designs/create-design';
import { computeDesk } from '@/lib/server/services/designs/compute-design';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { approveDesign, checkDesign } from '@/lib/server/services/designs/sign-design';
import { newRevision } from '@/lib/server/services/designs/new-revision';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';
import { pdfText } from '../fixtures/pdf-text';

let organisation: Organisation;
let users: Record<Role, User>;
let secondEngineer: User;
let vesselId: string;

const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const code = async (p: Promise<unknown>) => ((await p.then(() => null, (e) => e)) as AppError | null)?.code ?? 'ok';

beforeAll(async () => {
  // Invented particulars for the test: a 90 m ferry.
  ({ organisation, users, checker: secondEngineer, vesselId } = await makeDesignOrg({ organisationName: 'Design Test Shipping', checkerName: 'Second Engineer', vesselName: 'Test Ferry' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('design revisions', () => {
  it('a new design starts from Denny-Mumford zones and stores inputs, results, basis and app version together', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    const stored = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect(stored.revision).toBe(1);
    expect(stored.status).toBe('draft');
    const inputs = stored.inputs as { surfaces: { areaSource: string; areaM2: number }[] };
    // Denny-Mumford S = L(1.7T + CB·B) = 90 × (1.7 × 4.2 + 0.6 × 16) = 1,506.6 m² (published formula), split bottom/sides.
    const hull = inputs.surfaces.filter((s) => s.areaSource === 'denny-mumford').reduce((t, s) => t + s.areaM2, 0);
    expect(hull).toBeCloseTo(1506.6, 0);
    expect((stored.results as { anodeCount: number }).anodeCount).toBeGreaterThan(0);
    expect(stored.basis).toEqual(expect.arrayContaining([expect.objectContaining({ source: expect.stringContaining('DNV-RP-B401') })]));
    expect(stored.appVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('saving recomputes the results; invalid inputs are refused with the field named and nothing changes', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    const before = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    const inputs = structuredClone(before.inputs) as ReturnType<typeof defaultInputs>;
    const countBefore = (before.results as { anodeCount: number }).anodeCount;
    inputs.surfaces[0].areaM2 *= 3;
    await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Bigger bottom', inputs }));
    const after = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect((after.results as { anodeCount: number }).anodeCount).toBeGreaterThan(countBefore);

    const bad = structuredClone(inputs);
    bad.surfaces[0].areaM2 = -5;
    const error = await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Bad', inputs: bad })).catch((e) => e);
    expect(error.issues?.[0]?.path).toEqual(['inputs', 'surfaces', 0, 'areaM2']);
    const unchanged = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect(unchanged.title).toBe('Bigger bottom');
    expect(unchanged.inputs).toEqual(after.inputs);
  });

  it('the preparer never approves their own revision; a second engineer does, and the revision becomes immutable', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    expect(await code(runAs(ctx('engineer'), (c) => approveDesign(c, design.id)))).toBe('forbidden');
    expect(await code(runAs(ctx('engineer'), (c) => checkDesign(c, design.id)))).toBe('forbidden');
    await runAs(ctx(secondEngineer), (c) => checkDesign(c, design.id));
    const approved = await runAs(ctx(secondEngineer), (c) => approveDesign(c, design.id));
    expect(approved.status).toBe('approved');
    expect(approved.approvedBy?.id).toBe(secondEngineer.id);
    expect(approved.checkedBy?.id).toBe(secondEngineer.id);
    const stored = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect(await code(runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Change', inputs: stored.inputs })))).toBe('conflict');
    expect(await code(runAs(ctx('owner'), (c) => approveDesign(c, design.id)))).toBe('conflict');
    expect(await (await getEm()).count(AuditEventSchema, { organisationId: organisation.id, action: 'design.approved', targetId: design.id })).toBe(1);
  });

  it('a change to an approved design makes a new revision with the same inputs', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    await runAs(ctx(secondEngineer), (c) => approveDesign(c, design.id));
    const revised = await runAs(ctx('engineer'), (c) => newRevision(c, design.id));
    const [a, b] = await Promise.all([(await getEm()).findOneOrFail(DesignSchema, { id: design.id }), (await getEm()).findOneOrFail(DesignSchema, { id: revised.id })]);
    expect(b.revision).toBeGreaterThan(a.revision);
    expect(b.basedOnRevision).toBe(a.revision);
    expect(b.status).toBe('draft');
    expect(b.inputs).toEqual(a.inputs);
    expect(a.status).toBe('approved');
  });

  it('a checked draft that changes needs checking again', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    await runAs(ctx(secondEngineer), (c) => checkDesign(c, design.id));
    const stored = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Edited after check', inputs: stored.inputs }));
    const after = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect(after.status).toBe('draft');
    expect(after.checkedBy).toBeNull();
  });

  it('only engineers and owners write designs; only they approve', async () => {
    for (const role of ['planner', 'inspector', 'viewer'] as const) {
      expect(await code(runAs(ctx(role), (c) => createDesign(c, { assetId: vesselId })))).toBe('forbidden');
    }
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    for (const role of ['planner', 'inspector', 'viewer'] as const) {
      expect(await code(runAs(ctx(role), (c) => approveDesign(c, design.id)))).toBe('forbidden');
    }
    expect(await code(runAs(ctx('owner'), (c) => approveDesign(c, design.id)))).toBe('ok');
  });

  it('another organisation cannot see or use an asset or design (not found)', async () => {
    const other = await makeOrgWithRoles(await getEm(), 'Elsewhere Marine');
    const outsider = await ctxFor(await getEm(), other.organisation, other.users.engineer);
    expect(await code(createDesign(outsider, { assetId: vesselId }))).toBe('not-found');
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    expect(await code(approveDesign(outsider, design.id))).toBe('not-found');
    expect(await code(renderCalculationNote(outsider, design.id))).toBe('not-found');
  });
});

describe('the desk computation', () => {
  it('explains inputs that cannot be sized instead of failing, and compares every suitable model', async () => {
    const vessel = await (await getEm()).findOneOrFail(AssetSchema, { id: vesselId });
    const inputs = defaultInputs(vessel, []);
    const desk = await runAs(ctx('viewer'), (c) => computeDesk(c, inputs));
    expect(desk.result?.anodeCount).toBeGreaterThan(0);
    // Magnesium is not offered in seawater (practice: it over-protects and wastes fast).
    expect(desk.options.some((o) => o.alloy === 'magnesium')).toBe(false);
    expect(desk.options.filter((o) => o.suitable).length).toBeGreaterThan(5);

    const magnesiumOnAluminium = { ...inputs, hullMaterial: 'aluminium', protectedMetal: 'aluminium', anodeModelKey: 'builtin:TW-MB-3015' };
    const refused = await runAs(ctx('viewer'), (c) => computeDesk(c, magnesiumOnAluminium));
    expect(refused.result).toBeNull();
    expect(refused.error?.message).toMatch(/magnesium/i);
  });

  it('notes the offshore table\'s current densities used outside seawater', async () => {
    const vessel = await (await getEm()).findOneOrFail(AssetSchema, { id: vesselId });
    const desk = await runAs(ctx('viewer'), (c) => computeDesk(c, { ...defaultInputs(vessel, []), demandMethod: 'offshore-table', water: 'fresh', resistivitySource: 'measured', resistivityOhmM: 30, anodeModelKey: 'builtin:TW-MB-3015' }));
    expect(desk.notices.map((n) => n.code)).toContain('table-density-outside-seawater');
  });

  it('refuses an anode model that is not in the catalogue', async () => {
    const vessel = await (await getEm()).findOneOrFail(AssetSchema, { id: vesselId });
    const error = await runAs(ctx('viewer'), (c) => computeDesk(c, { ...defaultInputs(vessel, []), anodeModelKey: 'builtin:NOPE' })).catch((e) => e);
    expect(error.code).toBe('invalid');
    expect(error.fieldErrors.anodeModelKey).toBeTruthy();
  });
});

describe('the calculation note', () => {
  it('prints inputs, results, the governing criterion, signatures and the cautions', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId, title: 'Note test design' }));
    await runAs(ctx(secondEngineer), (c) => approveDesign(c, design.id));
    const { pdf, filename } = await runAs(ctx('viewer'), (c) => renderCalculationNote(c, design.id));
    expect(filename).toMatch(/\.pdf$/);
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
    const pages = (await pdfText(pdf)).split('\n');
    // The footer (organisation, asset, revision, who printed it) is on every page.
    for (const page of pages) expect(page).toMatch(/Printed .* by/);
    const text = pages.join(' ').replace(/\s+/g, ' ');
    expect(text).toContain('Test Ferry');
    expect(text).toContain('Note test design');
    expect(text).toMatch(/governing criterion: (Net anode mass|Initial current output|Final current output)/);
    expect(text).toContain('qualified corrosion engineer');
    expect(text).toContain('Second Engineer');
    const stored = await (await getEm()).findOneOrFail(DesignSchema, { id: design.id });
    expect(text).toContain(`${(stored.results as { anodesToFit: number }).anodesToFit} anodes of`);
  });
});
