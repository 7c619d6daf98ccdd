import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DesignSchema, type Organisation, type User } from '@/entities';
import { A4, PAGE_MARGIN } from '@/components/pdf/pdf-kit';
import { zoneDemand } from '@/lib/design/build-design-input';
import type { Role } from '@/lib/roles';
import type { DeskSurface } from '@/lib/schemas/design';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { readDesignRecord } from '@/lib/server/services/designs/read-design-record';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { approveDesign } from '@/lib/server/services/designs/sign-design';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';
import { pdfPages, type PdfPage } from '../fixtures/pdf-text';

let organisation: Organisation;
let users: Record<Role, User>;
let checker: User;
let vesselId: string;

const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const stored = async (id: string) => readDesignRecord(await (await getEm()).findOneOrFail(DesignSchema, { id }));
const note = async (id: string) => pdfPages((await runAs(ctx('viewer'), (c) => renderCalculationNote(c, id))).pdf);
const pageText = (page: PdfPage) => page.items.map((i) => i.str).join(' ').replace(/\s+/g, ' ');
// pdfjs splits runs unevenly ("7 .7", "Ω · m"): content is compared without any whitespace.
const squash = (s: string) => s.replace(/\s+/g, '');
const printed = (text: string) => ({ toContain: (expected: string) => expect(squash(text)).toContain(squash(expected)) });
const mA = (x: number) => (x * 1000).toLocaleString('en-GB', { maximumFractionDigits: 2 });

beforeAll(async () => {
  // Invented particulars: a 90 m steel ferry (default zones from Denny-Mumford, ship-hull practice, a flush Al-Zn-In anode).
  ({ organisation, users, checker, vesselId } = await makeDesignOrg({ organisationName: 'Note Print Shipping', checkerName: 'Class Surveyor', vesselName: 'Print Ferry' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('the calculation note prints every input needed to reproduce it', () => {
  it('an approved ship-hull design: anode data, dimensions, densities per zone, sources, caution and page numbers on A4', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId, title: 'Docking anodes' }));
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    const record = await stored(design.id);
    const results = record.results!;
    const pages = await note(design.id);
    const text = pages.map(pageText).join(' ');

    for (const page of pages) {
      expect(page.width).toBeCloseTo(A4.width, 1);
      expect(page.height).toBeCloseTo(A4.height, 1);
    }
    printed(pageText(pages[0])).toContain(`page 1 of ${pages.length}`);
    printed(text).toContain(`${results.anodesToFit} anodes of TW-AW-4020 to fit`);

    // The anode: the alloy table's capacity and potential, the utilisation factor of a short flush plate, its dimensions.
    printed(text).toContain('Electrochemical capacity ε 2,000 Ah/kg'); // DNV-RP-B401 (2010) Table 10-6, from memory
    printed(text).toContain('Closed-circuit potential Ea -1.050 V vs Ag/AgCl/seawater'); // same table, from memory
    printed(text).toContain('Utilisation factor u 0.80'); // short flush, DNV-RP-B401 Table 10-8, from memory
    printed(text).toContain('Length L 400 mm');
    printed(text).toContain('Width W 200 mm');
    printed(text).toContain('Thickness 40 mm');
    // Exposed area of the plate: face plus edges, 0.4 × 0.2 + 2 × (0.4 + 0.2) × 0.04 = 0.128 m².
    printed(text).toContain('Exposed area A 0.128 m²');
    printed(text).toContain('Net / gross mass per anode 7.7 / 8.7 kg');

    // Inputs: the resistivity with the sentence saying where it comes from, the potential with its criterion, the method.
    const resistivity = results.notices.find((n) => n.code === 'resistivity-source')!.message;
    expect(resistivity).toMatch(/estimated from the water: PSS-78/);
    printed(text).toContain(`Source of the resistivity ${resistivity.slice(resistivity.indexOf(': ') + 2).replace(/\.$/, '')}`);
    printed(text).toContain('Criterion for Ec criterion for steel');
    printed(text).toContain('Current demand method Ship-hull practice');
    printed(text).toContain('Hull coating condition Good (about 15 mA/m²)');

    // Zones: the densities the calculation used, in mA/m², and the coating constants (fc = 1 under ship-hull practice).
    // Hand check, ship-hull practice, good paint: 15 mA/m² × 1.10 = 16.5 mA/m² (common practice, from memory).
    printed(text).toContain('Hull bottom 16.5 / 16.5 / 16.5');
    // Rudder, high flow: the next worse condition, fair 20 mA/m² × 1.10 = 22 mA/m² (common practice, from memory).
    printed(text).toContain('Rudder 22 / 22 / 22');
    for (const surface of record.inputs.surfaces) {
      const d = zoneDemand(surface, record.inputs).currentDensity;
      printed(text).toContain(`${surface.name} ${mA(d.initial)} / ${mA(d.mean)} / ${mA(d.final)}`);
    }
    printed(text).toContain('fc = 1 (painted-hull density)');
    printed(text).toContain('bare, fc = 1');

    // Sources: a memory-flagged entry says it is to be confirmed.
    const memory = results.basis.find((b) => b.flag === 'memory')!;
    printed(text).toContain(`${memory.topic} ${memory.source} to be confirmed against the licensed edition`);
    const practice = results.basis.find((b) => b.flag === 'practice')!;
    printed(text).toContain(`${practice.source} common practice`);

    // The caution on the results page, with the headline.
    const resultsPage = pages.find((p) => pageText(p).includes('6. Results'))!;
    printed(pageText(resultsPage)).toContain('qualified corrosion engineer must review them');
    printed(pageText(resultsPage)).toContain(`${results.anodesToFit} anodes of TW-AW-4020`);
  });

  it('a coated harbour design prints its coating constants and the mud zones served from the water', async () => {
    const em = await getEm();
    const jetty = await runAs(ctxFor(em, organisation, users.engineer), (c) =>
      createAsset(c, { kind: 'structure', name: 'Print Jetty', structureType: 'jetty', waterType: 'seawater', designLifeYears: 20, pileCount: 12, pileDiameterM: 0.6 }),
    );
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: jetty.id, title: 'Jetty anodes' }));
    const inputs = (await stored(design.id)).inputs;
    inputs.surfaces[0] = { ...inputs.surfaces[0], coatingCategory: 'II' };
    await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Jetty anodes', inputs }));
    const text = (await note(design.id)).map(pageText).join(' ');
    // Cat. II, 0-30 m: a = 0.05, b = 0.025 (DNV-RP-B401 (2010) Table 10-4, from memory).
    printed(text).toContain('a 0.05, b 0.025');
    printed(text).toContain('0 — in the mud, served from the water');
  });

  it('a note of 60 zones runs over several A4 sheets, each numbered "page k of N", with nothing of the body in the footer band', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId, title: 'Sixty zones' }));
    const base = (await stored(design.id)).inputs;
    const surfaces: DeskSurface[] = Array.from({ length: 60 }, (_, i) => ({
      ...base.surfaces[i % 5],
      name: `Zone ${i + 1} ${base.surfaces[i % 5].name}`,
      areaM2: 10 + i,
      areaSource: 'entered',
    }));
    await runAs(ctx('engineer'), (c) => saveDesign(c, design.id, { title: 'Sixty zones', inputs: { ...base, surfaces } }));
    const pages = await note(design.id);
    expect(pages.length).toBeGreaterThan(3);
    const text = pages.map(pageText).join(' ');
    for (let i = 1; i <= 60; i++) printed(text).toContain(`Zone ${i} ${base.surfaces[(i - 1) % 5].name}`);
    printed(text).toContain('Areas and coatings (continued)');
    pages.forEach((page, k) => {
      expect(page.width).toBeCloseTo(A4.width, 1);
      expect(page.height).toBeCloseTo(A4.height, 1);
      // The bottom margin holds the footer and nothing else; the footer stays well inside it.
      const band = page.items.filter((i) => i.y < PAGE_MARGIN.bottom && i.str.trim());
      expect(squash(band.map((i) => i.str).join(''))).toMatch(new RegExp(`^NotePrintShipping·PrintFerry·Sixtyzones·revision\\d+\\(Draft\\)Printed.*by.*·page${k + 1}of${pages.length}$`));
      expect(Math.max(...band.map((i) => i.y))).toBeLessThan(PAGE_MARGIN.bottom - 8);
      expect(Math.min(...page.items.filter((i) => i.y >= PAGE_MARGIN.bottom && i.str.trim()).map((i) => i.y))).toBeGreaterThan(PAGE_MARGIN.bottom);
    });
  });
});
