import type { DrawingView, Shape, ShapeRole } from '@/lib/drawings/shapes';
import { labelWidth } from '@/lib/drawings/shapes';
import { escapeMarkup, svgDocument } from '@/lib/figures/markup';

export { escapeMarkup };

/*
 * One drawing view as SVG (the page's look; the PDFs draw the same shapes with @react-pdf/renderer, pdf-drawing.tsx).
 * Greys, hatches and dots only: the zones and the fill levels read in grey print, and every group has its words.
 */

type Style = { fill?: string; stroke?: string; strokeWidth?: number; strokeDasharray?: string; fontSize?: number; fontWeight?: number };

/** The look of each role; `pattern:` fills refer to the patterns defined in each SVG. */
export const ROLE_STYLES: Record<ShapeRole, Style> = {
  hull: { fill: '#ffffff', stroke: '#333333', strokeWidth: 1 },
  waterline: { stroke: '#555555', strokeWidth: 0.8, strokeDasharray: '6 3' },
  'zone-bottom': { fill: 'pattern:dots', stroke: '#777777', strokeWidth: 0.5 },
  'zone-sides': { fill: 'pattern:hatch', stroke: '#777777', strokeWidth: 0.5 },
  'zone-rudder': { fill: '#d4d4d4', stroke: '#333333', strokeWidth: 0.8 },
  'zone-propeller': { fill: '#bdbdbd', stroke: '#333333', strokeWidth: 0.8 },
  'zone-sea-chest': { fill: 'pattern:cross', stroke: '#333333', strokeWidth: 0.8 },
  'zone-thruster': { fill: '#eeeeee', stroke: '#333333', strokeWidth: 0.8, strokeDasharray: '2 1.5' },
  deck: { fill: 'none', stroke: '#333333', strokeWidth: 1 },
  grid: { stroke: '#9e9e9e', strokeWidth: 0.6 },
  anode: { fill: 'none', stroke: '#111111', strokeWidth: 0.9 },
  'anode-left': { fill: '#424242' },
  'anode-unknown': { fill: '#ffffff', stroke: '#111111', strokeWidth: 0.9, strokeDasharray: '1.5 1' },
  'anode-unknown-mark': { fill: '#111111', fontSize: 6.5, fontWeight: 700 },
  pile: { fill: '#ffffff', stroke: '#757575', strokeWidth: 0.8 },
  reading: { fill: '#ffffff', stroke: '#111111', strokeWidth: 1.2 },
  datum: { stroke: '#333333', strokeWidth: 0.8, strokeDasharray: '4 2' },
  seabed: { stroke: '#616161', strokeWidth: 1.5 },
  label: { fill: '#212121', fontSize: 8.5 },
  title: { fill: '#212121', fontSize: 11, fontWeight: 600 },
};

/** The class of a role: its look is in app/globals.css (.dw-<role>), which keeps every shape's markup short. */
const cls = (role: ShapeRole) => `dw-${role}`;

/*
 * The shapes are written as one string of SVG markup (dangerouslySetInnerHTML on the <svg>), not as React
 * elements: a drawing has hundreds of shapes, and every element a server component returns is walked twice per
 * request (the HTML and the RSC payload). On the asset page that walk was a large part of the page's cost
 * (measured). The markup is the same as the elements gave; the values come from our own geometry and are escaped.
 */
function shapeMarkup(shape: Shape, look: (role: ShapeRole) => string = (role) => `class="${cls(role)}"`): string {
  const c = look(shape.role);
  switch (shape.kind) {
    case 'rect':
      return `<rect x="${shape.x}" y="${shape.y}" width="${shape.w}" height="${shape.h}" ${c} />`;
    case 'path':
      return `<path d="${escapeMarkup(shape.d)}" ${c} />`;
    case 'ellipse':
      return `<ellipse cx="${shape.cx}" cy="${shape.cy}" rx="${shape.rx}" ry="${shape.ry}" ${c} />`;
    case 'line':
      return `<line x1="${shape.x1}" y1="${shape.y1}" x2="${shape.x2}" y2="${shape.y2}" ${c} />`;
    case 'text':
      return `<text x="${shape.x}" y="${shape.y}"${shape.anchor === 'start' ? '' : ` text-anchor="${shape.anchor}"`} ${c}>${escapeMarkup(shape.text)}</text>`;
  }
}

/**
 * A role's look as presentation attributes, from ROLE_STYLES: the drawing served as an image carries its look in
 * itself (no page CSS reaches an image, and attributes need no style-src in its Content-Security-Policy).
 */
const ROLE_ATTRIBUTES = Object.fromEntries(
  Object.entries(ROLE_STYLES).map(([role, s]) => {
    const fill = s.fill?.startsWith('pattern:') ? `url(#dw-${s.fill.slice(8)})` : (s.fill ?? 'none');
    let attrs = `fill="${fill}"`;
    if (s.stroke) attrs += ` stroke="${s.stroke}"`;
    if (s.strokeWidth !== undefined) attrs += ` stroke-width="${s.strokeWidth}"`;
    if (s.strokeDasharray) attrs += ` stroke-dasharray="${s.strokeDasharray}"`;
    if (s.fontSize !== undefined) attrs += ` font-size="${s.fontSize}"`;
    if (s.fontWeight !== undefined) attrs += ` font-weight="${s.fontWeight}"`;
    return [role, attrs];
  }),
) as Record<ShapeRole, string>;
const roleAttributes = (role: ShapeRole) => ROLE_ATTRIBUTES[role];

/**
 * A view as a standalone SVG document (served at its own address and drawn by the page as an image): the patterns,
 * every shape and every group's shapes, each with its look. The links and their titles stay in the page
 * (drawingOverlayMarkup), so the page carries a few hundred bytes a group instead of the whole drawing.
 */
export function drawingImageMarkup(view: DrawingView): string {
  let out = `<title>${escapeMarkup(view.title)}</title>${PATTERN_DEFS}<rect width="${view.width}" height="${view.height}" fill="#ffffff" />`;
  for (const shape of view.shapes) out += shapeMarkup(shape, roleAttributes);
  for (const g of view.groups) for (const shape of g.shapes) out += shapeMarkup(shape, roleAttributes);
  return svgDocument(view.width, view.height, out);
}

/** Rounds to a tenth of a drawing unit, as the shapes are. */
const tenth = (v: number) => Math.round(v * 10) / 10;

/**
 * Where a group takes clicks, as one path of rectangles: each symbol's box and each text's estimated box (a
 * symbol's fill level is inside its outline, so only outlines count), and the marker paths as they are.
 */
export function hitPathOf(shapes: readonly Shape[]): string {
  const box = (x: number, y: number, w: number, h: number) => `M${tenth(x)} ${tenth(y)}h${tenth(w)}v${tenth(h)}h${tenth(-w)}z`;
  let d = '';
  for (const s of shapes) {
    if (s.role === 'anode-left' || s.role === 'anode-unknown-mark') continue;
    if (s.kind === 'rect') d += box(s.x, s.y, s.w, s.h);
    else if (s.kind === 'ellipse') d += box(s.cx - s.rx, s.cy - s.ry, 2 * s.rx, 2 * s.ry);
    else if (s.kind === 'path') d += s.d;
    else if (s.kind === 'line') d += box(Math.min(s.x1, s.x2) - 2, Math.min(s.y1, s.y2) - 2, Math.abs(s.x2 - s.x1) + 4, Math.abs(s.y2 - s.y1) + 4);
    else {
      const size = ROLE_STYLES[s.role].fontSize ?? 8.5;
      const w = labelWidth(s.text, size);
      const x0 = s.anchor === 'start' ? s.x : s.anchor === 'end' ? s.x - w : s.x - w / 2;
      d += box(x0, s.y - size * 0.8, w, size * 1.05);
    }
  }
  return d;
}

/** Said where a figure's image did not load (no signal, session ended): the lists beside it still say it all. */
export const FIGURE_NOT_LOADED = 'The drawing did not load: the list below gives every group and reading in words.';

/**
 * What goes inside a view's <svg> on the page when the view is drawn from its image: its title, the image, and
 * each group as a titled link over the group's symbols and words (transparent; outlined on hover and on focus).
 */
export function drawingOverlayMarkup(view: DrawingView, titleId: string, imageHref: string): string {
  let out = `<title id="${escapeMarkup(titleId)}">${escapeMarkup(view.title)}</title>`;
  // Under the image (its white sheet covers it): what shows when the image cannot be loaded.
  out += `<text x="16" y="40" font-size="12" fill="#5f6872">${escapeMarkup(FIGURE_NOT_LOADED)}</text>`;
  out += `<image href="${escapeMarkup(imageHref)}" width="${view.width}" height="${view.height}" aria-hidden="true" />`;
  for (const g of view.groups) {
    out += `<a href="#${escapeMarkup(g.target)}" aria-label="${escapeMarkup(g.title)}"><title>${escapeMarkup(g.title)}</title><path d="${escapeMarkup(hitPathOf(g.shapes))}" fill="transparent" class="dw-hit" /></a>`;
  }
  return out;
}

/**
 * drawingOverlayMarkup once per view object, title id and image address: the asset page's views belong to the page
 * kept while its data stand (getAssetPage), so each request after the first reads the markup made for it.
 */
const overlays = new WeakMap<DrawingView, Map<string, string>>();
function keptOverlayMarkup(view: DrawingView, titleId: string, imageHref: string): string {
  let byKey = overlays.get(view);
  if (!byKey) overlays.set(view, (byKey = new Map()));
  const key = `${titleId} ${imageHref}`;
  let markup = byKey.get(key);
  if (markup === undefined) byKey.set(key, (markup = drawingOverlayMarkup(view, titleId, imageHref)));
  return markup;
}

/** What goes inside a view's <svg>: its title, the shapes, and each group as a titled link. */
export function drawingViewMarkup(view: DrawingView, titleId: string): string {
  let out = `<title id="${escapeMarkup(titleId)}">${escapeMarkup(view.title)}</title>`;
  for (const shape of view.shapes) out += shapeMarkup(shape);
  for (const g of view.groups) {
    // The <title> is the tooltip on hover (aria-label gives none).
    out += `<a href="#${escapeMarkup(g.target)}" aria-label="${escapeMarkup(g.title)}"><title>${escapeMarkup(g.title)}</title>`;
    for (const shape of g.shapes) out += shapeMarkup(shape);
    out += '</a>';
  }
  return out;
}

/** The hatch, dot and cross patterns of the zones (referred to by the classes as url(#dw-…)): once per page. */
const PATTERN_DEFS =
  '<defs>' +
  '<pattern id="dw-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="6" height="6" fill="#fafafa" /><line x1="0" y1="0" x2="0" y2="6" stroke="#b0b0b0" stroke-width="1" /></pattern>' +
  '<pattern id="dw-dots" width="5" height="5" patternUnits="userSpaceOnUse"><rect width="5" height="5" fill="#f2f2f2" /><circle cx="2.5" cy="2.5" r="0.9" fill="#8a8a8a" /></pattern>' +
  '<pattern id="dw-cross" width="5" height="5" patternUnits="userSpaceOnUse"><rect width="5" height="5" fill="#ffffff" /><path d="M0 0L5 5M5 0L0 5" stroke="#8a8a8a" stroke-width="0.7" /></pattern>' +
  '</defs>';

export function PatternDefs() {
  return <svg width="0" height="0" aria-hidden="true" focusable="false" className="absolute" dangerouslySetInnerHTML={{ __html: PATTERN_DEFS }} />;
}

/**
 * A view as an accessible drawing: a title and a description naming the list it summarises, each group a link to
 * its row in that list (or its pile) with its own title. A drawing with links is a group (an image's children are
 * presentational, so links inside one would be hidden from assistive technology); one without links is an image.
 * With `imageHref` the shapes come from the view's image and the page carries only the links: its markup stays
 * small however many shapes the view has.
 */
export function DrawingSvg({ view, imageHref, idPrefix, describedBy, className = '' }: { view: DrawingView; /** Draw the view from its image (drawingImageMarkup served at this address), the links over it. */ imageHref?: string; idPrefix: string; describedBy?: string; className?: string }) {
  const titleId = `${idPrefix}-title`;
  return (
    <svg
      viewBox={`0 0 ${view.width} ${view.height}`}
      role={view.groups.length ? 'group' : 'img'}
      aria-labelledby={titleId}
      aria-describedby={describedBy}
      className={`dw h-auto max-w-full ${className}`}
      data-drawing-view={view.id}
      dangerouslySetInnerHTML={{ __html: imageHref === undefined ? drawingViewMarkup(view, titleId) : keptOverlayMarkup(view, titleId, imageHref) }}
    />
  );
}

/** A small swatch of a role for the drawing's key, as markup for a 22 × 12 <svg> (the patterns come from the page's PatternDefs). */
export function keySwatchMarkup(role: ShapeRole): string {
  if (role === 'anode') return `<rect x="6" y="5" width="9" height="4" class="${cls('anode-left')}" /><rect x="6" y="1" width="9" height="8" class="${cls('anode')}" />`;
  if (role === 'anode-unknown') return `<rect x="6" y="1" width="9" height="8" class="${cls('anode-unknown')}" /><text x="10.5" y="7.3" text-anchor="middle" class="${cls('anode-unknown-mark')}">?</text>`;
  if (role === 'reading') return `<path d="M11 1l5 5l-5 5l-5 -5z" class="${cls('reading')}" />`;
  return `<rect x="1" y="1" width="20" height="10" class="${cls(role)}" />`;
}
