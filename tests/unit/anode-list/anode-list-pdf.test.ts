import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { describe, expect, it } from 'vitest';
import { AnodeListDocument, kgText, lineCount, planAnodeListPages } from '@/components/pdf/anode-list';
import { A4, CAUTION_TEXT, registerPdfFonts } from '@/components/pdf/pdf-kit';
import { buildAnodeList, type AnodeList } from '@/lib/anode-list';
import { renderAnodeListPdf } from '@/lib/anode-list/render-anode-list-pdf';
import { benchAnodeListInput } from '@/tests/fixtures/bench-data';
import { pdfPages, pdfText } from '@/tests/fixtures/pdf-text';
import { smallInput } from './helpers';

async function pageCount(bytes: Uint8Array): Promise<number> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 }).promise;
  const n = doc.numPages;
  await doc.destroy();
  return n;
}

async function renderChecked(list: AnodeList): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(createElement(AnodeListDocument, { list, pagination: 'checked' }) as unknown as ReactElement<DocumentProps>);
}

describe('renderAnodeListPdf', () => {
  it('prints the vessel, the yard, the models, the grand total, the signature lines and the cautions', async () => {
    const input = smallInput();
    input.revision = { ...input.revision, preparedByRole: 'Planner' };
    input.renewals = input.renewals.map((r) => (r.designation === 'TW-AW-4020' ? { ...r, dimensions: { lengthM: 0.4, widthM: 0.2, thicknessM: 0.04 } } : r));
    const bytes = await renderAnodeListPdf(buildAnodeList(input));
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    // pdfjs splits runs at spaces unevenly; compare with single spaces, as the calculation-note tests do.
    const text = (await pdfText(bytes)).replace(/\s+/g, ' ');
    expect(text).toContain('Dry-dock anode list');
    expect(text).toContain('Morwenna Tide');
    expect(text).toContain('Saltmarsh Ship Repair, Dock 1');
    expect(text).toContain('TW-AW-4020');
    expect(text).toContain('TW-ZB-2510');
    expect(text).toContain('294.8 kg'); // grand total net mass (hand-checked in build-anode-list.test.ts)
    expect(text).toContain('329.4 kg'); // grand total gross mass
    expect(text).toContain('3 May 2027 to 10 May 2027');
    expect(text).toContain('Fitted by (yard)');
    expect(text).toContain('Accepted by (owner)');
    expect(text).toContain('Ada Rennick');
    expect(text).toContain(CAUTION_TEXT.slice(0, 40));
    expect(text).toMatch(/page 1 of \d+/);
    expect(text).toContain('Hull bottom · 30 anodes');
    // Each model's dimensions beside its masses (TW-AW-4020: 400 x 200 x 40 mm, lib/cp built-in catalogue), and the preparer's role.
    expect(text).toContain('Dimensions, mm');
    expect(text).toContain('TW-AW-4020 400 × 200 × 40 Al-Zn-In Flush, weld-on 22 7.7 8.7 169.4 191.4');
    expect(text).toContain('Prepared Ada Rennick Planner');
  }, 60_000); // the first render of a process loads the fonts

  it("prints each line's renew-by date under the forecast's label", async () => {
    const input = smallInput();
    input.renewals[0] = { ...input.renewals[0], renewBy: '2027-11-09' };
    const text = (await pdfText(await renderAnodeListPdf(buildAnodeList(input)))).replace(/\s+/g, ' ');
    expect(text).toContain('Renew by');
    expect(text).toContain('9 Nov 2027');
  });

  it('prints an empty list without failing', async () => {
    const text = (await pdfText(await renderAnodeListPdf(buildAnodeList(smallInput({ renewals: [] }))))).replace(/\s+/g, ' ');
    expect(text).toContain('No renewals are booked for this docking.');
  });
});

describe('page plan', () => {
  it('formats masses with a unit, one decimal unless a second is needed', () => {
    expect(kgText(13262.1)).toBe('13,262.1 kg');
    expect(kgText(5)).toBe('5.0 kg');
    expect(kgText(0.25)).toBe('0.25 kg');
  });

  it('estimates wrapped lines by words', () => {
    expect(lineCount('Fr 8-14 S', 150)).toBe(1);
    expect(lineCount('one two three four five six seven eight nine ten eleven twelve', 60)).toBeGreaterThanOrEqual(4);
    expect(lineCount('first\nsecond', 500)).toBe(2);
  });

  // The plan decides the page breaks; if it ever under-estimated a block, react-pdf (in 'checked'
  // mode, free to split) would need more sheets than the plan. Same count = the plan is safe.
  it('never runs short: react-pdf needs no more sheets than planned for a 300-line list', async () => {
    const list = buildAnodeList(benchAnodeListInput(300));
    const plan = planAnodeListPages(list);
    expect(plan.fits).toBe(true);
    expect(await pageCount(await renderChecked(list))).toBe(plan.pages.length);
    const planned = await renderAnodeListPdf(list);
    expect(await pageCount(planned)).toBe(plan.pages.length);
    expect((await pdfText(planned)).replace(/\s+/g, ' ')).toContain(`page ${plan.pages.length} of ${plan.pages.length}`);
    // Every sheet is A4 landscape, the last, part-filled one too (react-pdf sizes a non-wrapping page to its content unless held).
    for (const page of await pdfPages(planned)) {
      expect(page.width).toBeCloseTo(A4.height, 1);
      expect(page.height).toBeCloseTo(A4.width, 1);
    }
  }, 60_000);

  it('never runs short with long positions, long labels, many models and warnings', async () => {
    const input = benchAnodeListInput(120);
    input.renewals.forEach((r, i) => {
      if (i % 3 === 0) r.positions = `Fr ${i} port and starboard, between bilge keel and keel plating, see drawing 4410-220 sheet ${i % 7}${' for the exact spacing'.repeat(i % 5)}`;
      if (i % 5 === 0) r.groupLabel = `Bottom, aft of the engine room, WMWMWMWMWMWM ${i}`;
      if (i % 4 === 0) r.designation = `ORG-${String(i % 40).padStart(3, '0')}-MODEL`;
    });
    const list = buildAnodeList(input);
    const plan = planAnodeListPages(list);
    expect(plan.fits).toBe(true);
    expect(await pageCount(await renderChecked(list))).toBe(plan.pages.length);
  }, 60_000);

  it('cuts a line taller than a sheet into parts, losing no text and keeping the page numbers', async () => {
    const input = smallInput();
    input.renewals[0] = { ...input.renewals[0], positions: 'Anode at frame 40, port side, 1.0 m above keel. '.repeat(120) };
    const list = buildAnodeList(input);
    const plan = planAnodeListPages(list);
    expect(plan.fits).toBe(true);
    expect(plan.pages.length).toBeGreaterThan(2);
    expect(await pageCount(await renderChecked(list))).toBe(plan.pages.length);
    const text = (await pdfText(await renderAnodeListPdf(list))).replace(/\s+/g, ' ');
    // Parts are cut at line breaks, never inside a word; a sentence may continue on the next sheet, so count its first and last words.
    expect(text.match(/\bAnode\b/g)).toHaveLength(120);
    expect(text.match(/\bkeel\./g)).toHaveLength(120);
    expect(text).toContain(`page ${plan.pages.length} of ${plan.pages.length}`);
  }, 60_000);

  it('stacks the particulars tables when they are too tall side by side, and continues them', async () => {
    const input = smallInput();
    input.asset.particulars = Array.from({ length: 40 }, (_, i): [string, string] => [`Particular ${i + 1}`, `value ${i + 1}`]);
    const list = buildAnodeList(input);
    const plan = planAnodeListPages(list);
    expect(plan.pages[0].some((item) => item.kind === 'header-tables')).toBe(false);
    expect(plan.pages[1]).toContainEqual({ kind: 'section', title: 'Vessel (continued)' });
    expect(await pageCount(await renderChecked(list))).toBe(plan.pages.length);
    expect((await pdfText(await renderAnodeListPdf(list))).replace(/\s+/g, ' ')).toContain('Particular 40 value 40');
  }, 60_000);
});
