import { Font } from '@react-pdf/renderer';
import { beforeAll, describe, expect, it } from 'vitest';
import { planAnodeListPages } from '@/components/pdf/anode-list';
import { COLUMNS, textRoom } from '@/components/pdf/anode-list/layout';
import { FONT } from '@/components/pdf/measure-text';
import { loadPdfFonts } from '@/components/pdf/pdf-kit';
import { buildAnodeList, type AnodeListInput } from '@/lib/anode-list';
import { renderAnodeListPdf } from '@/lib/anode-list/render-anode-list-pdf';
import { benchAnodeListInput } from '@/tests/fixtures/bench-data';
import { pdfText } from '@/tests/fixtures/pdf-text';
import { smallInput } from './helpers';

// The table heads and rows of the list are written line by line as the plan wrapped them (pdf-kit's DrawnRows), not laid
// out by react-pdf, so nothing would notice a line wider than its cell: it would run into the next column. These tests
// measure every planned line with the fonts themselves, as the sheet writes it (calt off; tabular figures in number columns).

interface Measured {
  unitsPerEm: number;
  layout(text: string, features?: object): { advanceWidth: number };
}
let fonts: Record<400 | 600, Measured>;

beforeAll(async () => {
  await loadPdfFonts();
  const font = (fontWeight: 400 | 600) => (Font.getFont({ fontFamily: 'Inter', fontWeight }) as unknown as { data: Measured }).data;
  fonts = { 400: font(400), 600: font(600) };
}, 60_000);

/** Lists with long and awkward texts: long positions and labels, model names of many widths, dimensions in every line. */
function awkwardInput(): AnodeListInput {
  const input = benchAnodeListInput(120);
  input.renewals.forEach((r, i) => {
    if (i % 3 === 0) r.positions = `Fr ${i} port and starboard, between bilge keel and keel plating, see drawing 4410-220 sheet ${i % 7}${' for the exact spacing'.repeat(i % 5)}`;
    if (i % 5 === 0) r.groupLabel = `Bottom, aft of the engine room, WMWMWMWMWMWM ${i}`;
    if (i % 4 === 0) r.designation = `ORG-${String(i % 40).padStart(3, '0')}-MODEL-WWW`;
    r.dimensions = { lengthM: 0.4 + (i % 9) / 10, widthM: 0.2, thicknessM: 0.045 };
  });
  return input;
}

function overflows(input: AnodeListInput) {
  const found: string[] = [];
  let lines = 0;
  for (const page of planAnodeListPages(buildAnodeList(input)).pages) {
    for (const item of page) {
      if (item.kind !== 'head' && item.kind !== 'row') continue;
      const font = fonts[item.kind === 'head' || item.total ? 600 : 400];
      item.lines.forEach((cellLines, c) => {
        const column = COLUMNS[item.table][c];
        const features = column.right ? { calt: false, tnum: true } : { calt: false };
        for (const line of cellLines) {
          lines++;
          const width = (font.layout(line, features).advanceWidth / font.unitsPerEm) * FONT;
          if (width > textRoom(column)) found.push(`${item.table} "${column.label}": "${line}" is ${width.toFixed(2)} pt in ${textRoom(column).toFixed(2)} pt`);
        }
      });
    }
  }
  return { found, lines };
}

describe('the drawn tables of the anode list', () => {
  it('write no line wider than its cell, measured with Inter itself (300-line list)', () => {
    const { found, lines } = overflows(benchAnodeListInput(300));
    expect(lines).toBeGreaterThan(300 * 13);
    expect(found).toEqual([]);
  });

  it('write no line wider than its cell with long positions, labels, model names and dimensions', () => {
    const { found, lines } = overflows(awkwardInput());
    expect(lines).toBeGreaterThan(120 * 13);
    expect(found).toEqual([]);
  });

  it('keep every character of every cell in the lines they write', () => {
    for (const page of planAnodeListPages(buildAnodeList(awkwardInput())).pages) {
      for (const item of page) {
        if (item.kind !== 'row') continue;
        item.cells.forEach((cell, c) => expect(item.lines[c].join('').replace(/\s+/g, '')).toBe(cell.replace(/\s+/g, '')));
      }
    }
  });

  it('print a Greek letter in a position from the Greek fallback font, as the laid-out text does', async () => {
    const input = smallInput();
    input.renewals[0] = { ...input.renewals[0], positions: 'Fr 40-52 P, ρ 0.25 Ω·m zone' };
    const text = (await pdfText(await renderAnodeListPdf(buildAnodeList(input)))).replace(/\s+/g, ' ');
    expect(text).toContain('ρ');
    expect(text).toContain('Ω');
    expect(text).toContain('Fr 40-52 P,');
  }, 60_000);
});
