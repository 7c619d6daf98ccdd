import type { DrawingView, Shape, ShapeRole } from '@/lib/drawings/shapes';

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

/** Text and attribute values escaped for markup built as a string. */
export function escapeMarkup(value: string | number): string {
  return String(value).replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#x27;'));
}

/*
 * The shapes are written as one string of SVG markup (dangerouslySetInnerHTML on the <svg>), not as React
 * elements: a drawing has hundreds of shapes, and every element a server component returns is walked twice per
 * request (the HTML and the RSC payload). On the asset page that walk was a large part of the page's cost
 * (measured). The markup is the same as the elements gave; the values come from our own geometry and are escaped.
 */
function shapeMarkup(shape: Shape): string {
  const c = cls(shape.role);
  switch (shape.kind) {
    case 'rect':
      return `<rect x="${shape.x}" y="${shape.y}" width="${shape.w}" height="${shape.h}" class="${c}" />`;
    case 'path':
      return `<path d="${escapeMarkup(shape.d)}" class="${c}" />`;
    case 'ellipse':
      return `<ellipse cx="${shape.cx}" cy="${shape.cy}" rx="${shape.rx}" ry="${shape.ry}" class="${c}" />`;
    case 'line':
      return `<line x1="${shape.x1}" y1="${shape.y1}" x2="${shape.x2}" y2="${shape.y2}" class="${c}" />`;
    case 'text':
      return `<text x="${shape.x}" y="${shape.y}"${shape.anchor === 'start' ? '' : ` text-anchor="${shape.anchor}"`} class="${c}">${escapeMarkup(shape.text)}</text>`;
  }
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
 */
export function DrawingSvg({ view, idPrefix, describedBy, className = '' }: { view: DrawingView; idPrefix: string; describedBy?: string; className?: string }) {
  const titleId = `${idPrefix}-title`;
  return (
    <svg
      viewBox={`0 0 ${view.width} ${view.height}`}
      role={view.groups.length ? 'group' : 'img'}
      aria-labelledby={titleId}
      aria-describedby={describedBy}
      className={`dw h-auto max-w-full ${className}`}
      data-drawing-view={view.id}
      dangerouslySetInnerHTML={{ __html: drawingViewMarkup(view, titleId) }}
    />
  );
}

/** A small swatch of a role for the drawing's key (the patterns come from the page's PatternDefs). */
export function KeySwatch({ role }: { role: ShapeRole }) {
  return <svg width="22" height="12" viewBox="0 0 22 12" aria-hidden="true" className="dw inline-block shrink-0 align-middle" dangerouslySetInnerHTML={{ __html: keySwatchMarkup(role) }} />;
}

function keySwatchMarkup(role: ShapeRole): string {
  if (role === 'anode') return `<rect x="6" y="5" width="9" height="4" class="${cls('anode-left')}" /><rect x="6" y="1" width="9" height="8" class="${cls('anode')}" />`;
  if (role === 'anode-unknown') return `<rect x="6" y="1" width="9" height="8" class="${cls('anode-unknown')}" /><text x="10.5" y="7.3" text-anchor="middle" class="${cls('anode-unknown-mark')}">?</text>`;
  if (role === 'reading') return `<path d="M11 1l5 5l-5 5l-5 -5z" class="${cls('reading')}" />`;
  return `<rect x="1" y="1" width="20" height="10" class="${cls(role)}" />`;
}
