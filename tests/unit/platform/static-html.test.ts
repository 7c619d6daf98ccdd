import { describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { SafeHtml, escapeMarkup, html } from '@/lib/figures/markup';
import { keySwatchMarkup } from '@/components/drawings/drawing-svg';
import { StaticHtml } from '@/components/ui/static-html';
import { changesHtml, designsHtml, drawingListHtml, forecastTableHtml, particularsHtml, surveysHtml, zonesTableHtml } from '@/components/register/asset-page-markup';
import { StatusTag } from '@/components/ui/status-tag';
import { statusTagHtml } from '@/components/ui/status-tag-markup';
import { DESIGN_STATUS_TONES, STATUS_TONES } from '@/lib/status/palette';
import { STATUS_LABELS, surveyMethodWords } from '@/lib/labels';
import { buildAssetDrawing } from '@/lib/drawings/asset-drawing';
import { parsePosition } from '@/lib/drawings/parse-position';
import type { ForecastRow } from '@/lib/server/services/assets/get-asset-page';

// The asset page's read-only parts are built as strings: every value a member typed must come out as text.

const HOSTILE = `<img src=x onerror="alert(1)"> & 'quoted'`;
const ESCAPED = '&lt;img src=x onerror=&quot;alert(1)&quot;&gt; &amp; &#x27;quoted&#x27;';

describe('html', () => {
  it('escapes every value in text and in attributes, keeps markup it built, joins arrays and leaves out empty values', () => {
    const inner = html`<b>${HOSTILE}</b>`;
    expect(inner.value).toBe(`<b>${ESCAPED}</b>`);
    expect(html`<p title="${HOSTILE}">${inner}${[html`<i>1</i>`, 2, null, false, undefined, 'x']}</p>`.value).toBe(`<p title="${ESCAPED}"><b>${ESCAPED}</b><i>1</i>2x</p>`);
    // A string that looks like markup is still text: only SafeHtml passes as it is.
    expect(html`${'<b>'}`.value).toBe('&lt;b&gt;');
    expect(html`${new SafeHtml('<b>')}`.value).toBe('<b>');
  });

  it('is rendered by StaticHtml as it is, in a wrapper that takes no box; StaticHtml takes nothing else', () => {
    expect(renderToStaticMarkup(createElement(StaticHtml, { markup: html`<p>${HOSTILE}</p>` }))).toBe(`<div class="contents"><p>${ESCAPED}</p></div>`);
    expect(() => renderToStaticMarkup(createElement(StaticHtml, { markup: { value: HOSTILE } as unknown as SafeHtml }))).toThrow('StaticHtml takes markup built by html only.');
  });
});

describe("the asset page's static parts", () => {
  const row: ForecastRow = { groupId: 'g', label: HOSTILE, installedNetKg: 92.4, ratePerYearKg: 12.25, basis: 'constant mean current', renewBy: '2031-03-07', renewByEarly: '2030-09-01', renewByLate: null, endOfLife: '2032-01-02', renewal: 'Renew at the docking of 3 Sep 2028', renewalReason: 'The deadline is near' };

  it('the forecast table: its frame, headings and a row in words, the label escaped', () => {
    const out = forecastTableHtml([row]).value;
    expect(out).toMatch(/^<div role="region" aria-label="Forecast by group" tabindex="0" class="table-frame table-frame-min table-frame-sticky table-frame-head-raised /);
    expect(out).toContain('<table class="mt-3 w-full min-w-[56rem] text-sm" aria-label="Forecast by group">');
    expect(out).toContain(`<td class="py-1">${ESCAPED}</td>`);
    expect(out).toContain('<td class="num py-1">92.4 kg</td><td class="num py-1">12.3 kg/yr</td>');
    expect(out).toContain('7 Mar 2031');
    expect(out).toContain('Sep 2030 – later');
    expect(out).toContain('Renew at the docking of 3 Sep 2028<span class="block text-xs text-ink-soft">The deadline is near</span>');
    expect(out).not.toContain('<img');
  });

  it('the zones: every row in words, the Edit and Archive buttons only for a member who may change the register, names escaped', () => {
    const zone = { id: 'z-1', name: HOSTILE, kind: 'hull-bottom', areaM2: 1107, coatingCategory: 'II', coatingAgeYears: 3, waterType: 'seawater', climate: 'temperate', depthBand: '0-30', drainsCurrent: 'copper-alloy' } as const;
    const writer = zonesTableHtml([zone], true).value;
    expect(writer).toMatch(/^<div role="region" aria-label="Zones" tabindex="0" class="table-frame table-frame-min table-frame-sticky table-frame-head-raised /);
    expect(writer).toContain('<table class="w-full text-sm" aria-label="Zones">');
    expect(writer).toContain(`<td class="py-1.5">${ESCAPED}<button type="button"`);
    expect(writer).toContain('<td class="num py-1.5">1,107.0</td>');
    expect(writer).toContain(', 3 yr old · bare copper alloy</td>');
    expect(writer).toContain('data-zone-edit="z-1" aria-expanded="false">Edit<span class="sr-only"> the zone ');
    expect(writer).toContain(`data-zone-archive="z-1" data-zone-name="${ESCAPED}">Archive<span class="sr-only"> the zone ${ESCAPED}</span></button>`);
    const reader = zonesTableHtml([zone], false).value;
    expect(reader).not.toContain('<button');
    expect(reader).toContain(`<td class="py-1.5">${ESCAPED}</td>`);
    expect(zonesTableHtml([], true).value).toContain('No zones recorded.');
  });

  it('the particulars and the history of changes', () => {
    expect(particularsHtml([['Type', HOSTILE], ['IMO number', null]]).value).toBe(
      `<dl class="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-3"><div><dt class="text-2xs uppercase tracking-wide text-ink-faint">Type</dt><dd>${ESCAPED}</dd></div><div><dt class="text-2xs uppercase tracking-wide text-ink-faint">IMO number</dt><dd>—</dd></div></dl>`,
    );
    const changes = changesHtml([{ id: 'c', createdAt: new Date(2026, 10, 3, 14, 5), changedByEmail: 'engineer@example.test', changes: { quantity: [8, 10], notes: [null, HOSTILE] }, group: { label: 'Bottom P' } }]).value;
    expect(changes).toContain('History of changes (1 latest)');
    expect(changes).toContain(`<li>3 Nov 2026 14:05 · Bottom P · engineer@example.test: quantity 8 → 10; notes — → ${ESCAPED}</li>`);
  });

  it("the drawing's key, notes and list of groups, each row the target of its group's link", () => {
    const readings = [
      { location: 'Fr 25 P', position: parsePosition('Fr 25 P'), words: '-0.98 V, protected' },
      { location: HOSTILE, position: parsePosition('Fr 90 S'), words: '-0.78 V, under-protected' },
    ];
    const drawing = buildAssetDrawing({ kind: 'vessel', name: 'Test Ferry', lengthBppM: 96, beamM: 18.6, draughtM: 4.6, blockCoefficient: 0.62, frameSpacingM: 0.6 }, [{ id: 'g1', label: HOSTILE, quantity: 4, position: parsePosition('Fr 20-30 P, clear of the log'), remainingFraction: 0.5 }], readings).drawing!;
    const out = drawingListHtml(drawing, 'drawing-groups').value;
    expect(out).toContain('<ul class="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Key to the drawing">');
    // Each swatch is drawn (its shapes as markup, not as escaped text), its words beside it.
    for (const k of drawing.key) expect(out).toContain(`class="dw inline-block shrink-0 align-middle">${keySwatchMarkup(k.role)}</svg>${escapeMarkup(k.label)}</li>`);
    expect(out).not.toContain('&lt;rect');
    for (const n of drawing.notes) expect(out).toContain(`<p class="text-xs text-ink-soft">${escapeMarkup(n)}</p>`);
    expect(out).toContain('<table id="drawing-groups" class="w-full text-sm" aria-label="Anode groups on the drawing">');
    expect(out).toContain(`<tr id="drawing-group-g1" class="scroll-mt-24 `);
    expect(out).toContain(`<th scope="row" class="py-1 text-left font-medium">${ESCAPED}</th>`);
    expect(out).toContain('<span class="block text-xs text-ink-soft">clear of the log</span>');
    expect(out).toContain('<td class="num py-1">4</td><td class="whitespace-nowrap py-1 pl-3 pr-3">50 % left</td><td class="py-1 text-xs">Fr 25 P: -0.98 V, protected</td>');
    // The reading at no group (frame 90 starboard) is drawn on the image only: it is in words under the list too.
    expect(drawing.otherReadings).toEqual([`${HOSTILE}: -0.78 V, under-protected`]);
    expect(out).toContain(`<p class="text-xs text-ink-soft">Readings of the latest survey at no group: ${ESCAPED}: -0.78 V, under-protected.</p>`);
  });
});

describe('status tags, design and survey lists as static markup', () => {
  it.each(STATUS_TONES)('the %s tag built as markup is the StatusTag element, word for word', (tone) => {
    const element = renderToStaticMarkup(createElement(StatusTag, { tone, children: HOSTILE }));
    expect(statusTagHtml(tone, HOSTILE).value).toBe(element);
    expect(element).toContain(ESCAPED);
  });

  it('the designs: each revision links to its page with who prepared it and its status in words, values escaped', () => {
    const out = designsHtml('pcl', [{ id: 'd-1', revision: 2, title: HOSTILE, status: 'approved', preparedBy: { name: 'Ines Harrow' } }], true).value;
    expect(out).toContain(`<a href="/o/pcl/designs/d-1" class="text-tide-600 hover:underline">Rev. 2: ${ESCAPED}</a>`);
    expect(out).toContain(statusTagHtml(DESIGN_STATUS_TONES.approved, STATUS_LABELS.approved).value);
    expect(out).toContain('Ines Harrow');
    expect(out).toContain('href="/o/pcl/designs"');
    expect(designsHtml('pcl', [], false).value).toBe('<p class="text-sm text-ink-faint">No designs yet.</p>');
  });

  it('the surveys: each links to its page with its day, method and surveyor, values escaped', () => {
    const out = surveysHtml('pcl', [{ id: 's-1', surveyedOn: '2027-03-14', method: 'diver', surveyor: HOSTILE }]).value;
    expect(out).toContain(`<a href="/o/pcl/surveys/s-1" class="text-tide-600 hover:underline">14 Mar 2027: ${surveyMethodWords('diver')} by ${ESCAPED}</a>`);
    expect(surveysHtml('pcl', []).value).toBe('<p class="text-sm text-ink-faint">No surveys yet.</p>');
  });
});
