import { describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { DrawingSvg, FIGURE_NOT_LOADED, ROLE_STYLES, drawingImageMarkup, drawingOverlayMarkup, hitPathOf } from '@/components/drawings/drawing-svg';
import { hullView, type DrawnGroup, type DrawnReading } from '@/lib/drawings/hull-drawing';
import { pilePlanView, pileStates } from '@/lib/drawings/pile-plan';
import { parsePosition } from '@/lib/drawings/parse-position';
import type { Shape } from '@/lib/drawings/shapes';
import { markupVersion } from '@/lib/figures/markup';

// The asset page draws each view from its own SVG image and lays the groups' links over it: the image has every
// shape and word with its look, the page the links with their titles over each group's symbols and words.

// An invented ro-pax ferry: Lpp 96 m, B 18.6 m, T 4.6 m.
const ferry = { lengthBppM: 96, beamM: 18.6, draughtM: 4.6, blockCoefficient: 0.62, frameSpacingM: 0.6 };
const group = (id: string, label: string, quantity: number, position: string, remainingFraction: number | null): DrawnGroup => ({ id, label, quantity, position: parsePosition(position), remainingFraction });
const groups = [group('g1', 'Bottom P/S', 16, 'Fr 20-130 P/S, 0.4 m above keel', 0.62), group('g2', 'Sea chest <aft>', 1, 'sea chest aft port', null)];
const readings: DrawnReading[] = [{ location: 'Fr 60 P', position: parsePosition('Fr 60 P'), words: '-0.96 V, protected' }];
const port = hullView(ferry, 'port', groups, readings);
const texts = (shapes: Shape[]) => shapes.filter((s): s is Extract<Shape, { kind: 'text' }> => s.kind === 'text');

describe('a view as an image', () => {
  const image = drawingImageMarkup(port);

  it('is a standalone SVG document of the view size, with its patterns and no page classes', () => {
    expect(image.startsWith(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${port.width} ${port.height}" width="${port.width}" height="${port.height}"`)).toBe(true);
    expect(image.endsWith('</svg>')).toBe(true);
    for (const id of ['dw-hatch', 'dw-dots', 'dw-cross']) expect(image).toContain(`<pattern id="${id}"`);
    expect(image).not.toContain('class=');
    expect(image).not.toMatch(/<script|<a |href=/);
  });

  it('draws every shape and every word of the view, the groups and the readings, each with its role look', () => {
    const shapes = [...port.shapes, ...port.groups.flatMap((g) => g.shapes)];
    const count = (tag: string) => image.split(`<${tag} `).length - 1;
    // The white sheet under the drawing is the one rectangle more; the patterns add their own rectangles and lines.
    expect(count('rect')).toBe(shapes.filter((s) => s.kind === 'rect').length + 1 + 3);
    for (const t of texts(shapes)) expect(image).toContain(`>${t.text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')}</text>`);
    expect(image).toContain('>-0.96 V, protected</text>');
    expect(image).toContain('Sea chest &lt;aft&gt;');
    // The zones' looks come from ROLE_STYLES (as the PDFs draw them): hatch for the sides, dots for the bottom.
    expect(image).toContain(`fill="url(#dw-hatch)" stroke="${ROLE_STYLES['zone-sides'].stroke}" stroke-width="${ROLE_STYLES['zone-sides'].strokeWidth}"`);
    expect(image).toContain(`fill="${ROLE_STYLES['anode-left'].fill}"`);
    expect(image).toContain(`font-size="${ROLE_STYLES.label.fontSize}"`);
  });

  it('has a version that follows its markup', () => {
    const again = drawingImageMarkup(hullView(ferry, 'port', groups, readings));
    expect(markupVersion(again)).toBe(markupVersion(image));
    expect(markupVersion(image)).toMatch(/^[0-9a-f]{14}$/);
    const emptier = drawingImageMarkup(hullView(ferry, 'port', [{ ...groups[0]!, remainingFraction: 0.61 }, groups[1]!], readings));
    expect(markupVersion(emptier)).not.toBe(markupVersion(image));
  });
});

describe('the links over the image', () => {
  const overlay = drawingOverlayMarkup(port, 'drawing-port-title', '/api/orgs/o/assets/a/figures/port?v=1&x="2"');

  it('names the view, draws its image (escaped address) and carries no shape of the drawing itself', () => {
    expect(overlay.startsWith(`<title id="drawing-port-title">Port side</title><text x="16" y="40" font-size="12" fill="#5f6872">${FIGURE_NOT_LOADED}</text><image `)).toBe(true);
    expect(overlay).toContain(`<image href="/api/orgs/o/assets/a/figures/port?v=1&amp;x=&quot;2&quot;" width="${port.width}" height="${port.height}" aria-hidden="true" />`);
    // Only the words for an image that did not load (drawn under it, covered by its white sheet).
    expect(overlay).not.toMatch(/<rect |<line /);
    expect(overlay.match(/<text /g)).toHaveLength(1);
    expect(drawingImageMarkup(port)).toContain(`<rect width="${port.width}" height="${port.height}" fill="#ffffff" />`);
    expect(overlay.length).toBeLessThan(drawingImageMarkup(port).length / 2);
  });

  it('gives each group one link to its row with its title, over every symbol outline and its words', () => {
    const links = [...overlay.matchAll(/<a href="#([^"]+)" aria-label="([^"]+)"><title>([^<]+)<\/title><path d="([^"]+)" fill="transparent" class="dw-hit" \/><\/a>/g)];
    expect(links.map((l) => l[1])).toEqual(port.groups.map((g) => g.target));
    for (const [i, l] of links.entries()) {
      const g = port.groups[i]!;
      expect(l[2]).toBe(l[3]);
      expect(l[3]).toBe(g.title.replace(/</g, '&lt;').replace(/>/g, '&gt;'));
      // Every outline (a known fraction's, or the dashed one of an unknown fraction) is a box of the link's area.
      for (const s of g.shapes) if (s.kind === 'rect' && (s.role === 'anode' || s.role === 'anode-unknown')) expect(l[4]).toContain(`M${s.x} ${s.y}h${s.w}v${s.h}h${-s.w}z`);
    }
  });

  it("covers a label's estimated width (0.56 em a character at its size), centred on a middle anchor", () => {
    const label: Shape = { kind: 'text', role: 'label', x: 100, y: 50, text: 'ABCDEFGHIJ', anchor: 'middle' };
    // 10 characters × 8.5 × 0.56 = 47.6 units wide; 8.5 × 0.8 = 6.8 above the baseline, 8.925 high.
    expect(hitPathOf([label])).toBe('M76.2 43.2h47.6v8.9h-47.6z');
    // A symbol's fill level lies inside its outline: only the outline counts.
    expect(hitPathOf([{ kind: 'rect', role: 'anode-left', x: 1, y: 2, w: 3, h: 4 }])).toBe('');
  });

  it('is what the page renders inside the view with an image address, with the title and the group role for a view with links', () => {
    const html = renderToStaticMarkup(createElement(DrawingSvg, { view: port, imageHref: '/x.svg', idPrefix: 'drawing-port', describedBy: 'drawing-groups' }));
    expect(html).toMatch(/^<svg viewBox="0 0 \d+ \d+" role="group" aria-labelledby="drawing-port-title" aria-describedby="drawing-groups" class="dw /);
    expect(html).toContain(drawingOverlayMarkup(port, 'drawing-port-title', '/x.svg'));
    expect(html).not.toContain('class="dw-hull"');
    // Without an image address (the pile elevation, drawn on the phone) the view carries its shapes itself.
    const inline = renderToStaticMarkup(createElement(DrawingSvg, { view: port, idPrefix: 'drawing-port' }));
    expect(inline).toContain('class="dw-hull"');
    expect(inline).toContain('>-0.96 V, protected</text>');
    expect(inline).not.toContain('<image ');
  });

  it('keeps the markup of a view drawn from its image for that view, title and address only', () => {
    const render = (imageHref: string, idPrefix = 'drawing-port') => renderToStaticMarkup(createElement(DrawingSvg, { view: port, imageHref, idPrefix }));
    const first = render('/a.svg?v=1');
    expect(render('/a.svg?v=1')).toBe(first);
    // A new version of the image, or another title id: its own markup, never the one kept before.
    const next = render('/a.svg?v=2');
    expect(next).toContain('href="/a.svg?v=2"');
    expect(next).not.toContain('v=1');
    expect(render('/a.svg?v=1', 'drawing-other')).toContain('id="drawing-other-title"');
    // Another view object (the data changed): drawn from that view.
    const renamed = { ...port, title: 'Port side, redrawn' };
    expect(renderToStaticMarkup(createElement(DrawingSvg, { view: renamed, imageHref: '/a.svg?v=1', idPrefix: 'drawing-port' }))).toContain('>Port side, redrawn</title>');
    expect(render('/a.svg?v=1')).toBe(first);
  });

  it('links each pile of a plan to its elevation, over its symbol and its reading marker', () => {
    const grid = { rows: 2, bents: 3 };
    const plan = pilePlanView('Plan', grid, pileStates(grid, [{ id: 'p', label: 'P', quantity: 2, position: parsePosition('bent 2 row B', 'structure'), remainingFraction: 0.5 }], [{ location: 'B2-B', position: parsePosition('bent 2 row B', 'structure'), words: '-0.80 V, protected' }]));
    const overlay = drawingOverlayMarkup(plan, 't', '/plan.svg');
    expect(overlay.match(/<a href="#pile-/g)).toHaveLength(6);
    const pile = plan.groups.find((g) => g.target === 'pile-2-B')!;
    const marker = pile.shapes.find((s) => s.role === 'reading');
    expect(marker?.kind).toBe('path');
    expect(overlay).toContain((marker as Extract<Shape, { kind: 'path' }>).d);
  });
});
