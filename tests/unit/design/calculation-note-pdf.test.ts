import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { describe, expect, it } from 'vitest';
import { CalculationNote, planCalculationNote, zoneDensitiesMaPerM2, type CalculationNoteData } from '@/components/pdf/calculation-note';
import { A4, PAGE_MARGIN, registerPdfFonts } from '@/components/pdf/pdf-kit';
import { BUILTIN_ANODE_MODELS, designAnodeSystem } from '@/lib/cp';
import { buildDesignInput, deskNotices, zoneDemand } from '@/lib/design/build-design-input';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { pdfPages } from '@/tests/fixtures/pdf-text';
import { ferryInputs, ferryRecord } from './record-fixture';

async function render(data: CalculationNoteData, pagination: 'planned' | 'checked' = 'planned'): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(createElement(CalculationNote, { data, pagination }) as unknown as ReactElement<DocumentProps>);
}

function noteData(inputs: DeskInputs, modelId: string, extra: Partial<CalculationNoteData> = {}): CalculationNoteData {
  const model = { ...BUILTIN_ANODE_MODELS.find((m) => m.id === modelId)!, key: `builtin:${modelId}`, source: 'built-in' as const };
  return {
    organisation: 'Note Test Harbour Board',
    asset: { name: 'Invented Jetty', kind: 'structure', particulars: [['Structure', 'Invented Jetty, jetty']] },
    design: { title: 'Pile anodes', revision: 2, status: 'checked', appVersion: '0.1.0', basedOnRevision: 1 },
    inputs,
    model,
    source: 'stored',
    result: designAnodeSystem(buildDesignInput(inputs, model)),
    resultError: null,
    notices: deskNotices(inputs),
    signatures: [
      { role: 'Prepared', name: 'Ada Rennick', at: new Date(Date.UTC(2026, 0, 5, 9)) },
      { role: 'Checked', name: 'Bo Checker', at: new Date(Date.UTC(2026, 0, 6, 9)) },
      { role: 'Approved', name: null, at: null },
    ],
    printedAt: new Date(Date.UTC(2026, 0, 7, 9)),
    printedBy: 'Viewer Person',
    ...extra,
  };
}

/** 60 zones of a piled structure: immersed zones with aged paint (long names), mud zones, two with entered densities. */
function manyZones(): DeskInputs {
  const surfaces: DeskSurface[] = Array.from({ length: 60 }, (_, i) => {
    const mud = i % 2 === 1;
    return {
      name: `${mud ? 'Mud zone' : 'Immersed zone'} of pile row ${Math.floor(i / 2) + 1}${i % 7 === 0 ? ', between the fender line and the berthing face, drawing 4410-220' : ''}`,
      kind: mud ? 'pile-mud' : 'pile-immersed',
      areaM2: 40 + i,
      areaSource: i % 5 === 0 ? 'estimate' : 'entered',
      depthBand: mud ? 'sediment' : '0-30',
      coatingCategory: mud ? 'bare' : 'II',
      coatingAgeYears: mud ? 0 : i % 4,
      currentDensityOverride: i === 10 || i === 20 ? { initial: 120, mean: 60, final: 80 } : null,
      drainsCurrent: null,
      temperatureC: null,
    };
  });
  return { ...ferryInputs(), hullMaterial: null, nextDockingYears: null, demandMethod: 'harbour', designLifeYears: 20, anodeModelKey: 'builtin:TW-AS-2018', surfaces };
}

async function expectPlannedSheets(data: CalculationNoteData) {
  const plan = planCalculationNote(data);
  expect(plan.fits).toBe(true);
  // Rendered with wrapping pages, react-pdf needs no more sheets than planned: the estimate never runs short.
  expect((await pdfPages(await render(data, 'checked'))).length).toBe(plan.pages.length);
  const pages = await pdfPages(await render(data));
  expect(pages).toHaveLength(plan.pages.length);
  return pages;
}

describe('the calculation note PDF', () => {
  it('is planned on A4 portrait sheets, never runs short, and numbers every page', async () => {
    const record = ferryRecord();
    const data = noteData(record.inputs, 'TW-AW-4020');
    const pages = await expectPlannedSheets(data);
    pages.forEach((page, k) => {
      expect(page.width).toBeCloseTo(A4.width, 1);
      expect(page.height).toBeCloseTo(A4.height, 1);
      expect(page.items.map((i) => i.str).join(' ').replace(/\s+/g, ' ')).toContain(`page ${k + 1} of ${pages.length}`);
    });
  }, 60_000);

  it('plans 60 zones over several sheets with long names, mud zones and aged coatings, keeping every row and the footer band clear', async () => {
    const data = noteData(manyZones(), 'TW-AS-2018');
    const pages = await expectPlannedSheets(data);
    expect(pages.length).toBeGreaterThan(4);
    const text = pages.map((p) => p.items.map((i) => i.str).join(' ')).join(' ').replace(/\s+/g, ' ');
    for (let row = 1; row <= 30; row++) expect(text).toContain(`Mud zone of pile row ${row}`);
    expect(text).toContain('Areas and coatings (continued)');
    expect(text).toContain('0 — in the mud, served from the water');
    for (const page of pages) {
      expect(page.height).toBeCloseTo(A4.height, 1);
      // Only the footer is drawn in the bottom margin.
      const band = page.items.filter((i) => i.y < PAGE_MARGIN.bottom && i.str.trim());
      expect(band.map((i) => i.str).join('').replace(/\s+/g, '')).toMatch(/^NoteTestHarbourBoard·InventedJetty·Pileanodes·revision2\(Checked\)Printed.*byViewerPerson·page\d+of\d+$/);
    }
  }, 60_000);

  it('prints the densities the calculation used, the same as the method gives for the stored inputs', () => {
    const data = noteData(ferryInputs(), 'TW-AW-4020');
    data.inputs.surfaces.forEach((surface, i) => {
      const expected = zoneDemand(surface, data.inputs).currentDensity;
      const printed = zoneDensitiesMaPerM2(surface, data.result!.surfaces[i], data.inputs);
      expect(printed[0]).toBeCloseTo(expected.initial * 1000, 9);
      expect(printed[1]).toBeCloseTo(expected.mean * 1000, 9);
      expect(printed[2]).toBeCloseTo(expected.final * 1000, 9);
    });
    // Ship-hull practice, good paint: 15 mA/m² × 1.10 = 16.5 mA/m² (common practice, from memory).
    expect(zoneDensitiesMaPerM2(data.inputs.surfaces[0], data.result!.surfaces[0], data.inputs)[0]).toBeCloseTo(16.5, 9);
  });
});
