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

function ShapeEl({ shape }: { shape: Shape }) {
  switch (shape.kind) {
    case 'rect':
      return <rect x={shape.x} y={shape.y} width={shape.w} height={shape.h} className={cls(shape.role)} />;
    case 'path':
      return <path d={shape.d} className={cls(shape.role)} />;
    case 'ellipse':
      return <ellipse cx={shape.cx} cy={shape.cy} rx={shape.rx} ry={shape.ry} className={cls(shape.role)} />;
    case 'line':
      return <line x1={shape.x1} y1={shape.y1} x2={shape.x2} y2={shape.y2} className={cls(shape.role)} />;
    case 'text':
      return (
        <text x={shape.x} y={shape.y} textAnchor={shape.anchor === 'start' ? undefined : shape.anchor} className={cls(shape.role)}>
          {shape.text}
        </text>
      );
  }
}

/** The hatch, dot and cross patterns of the zones (referred to by the classes as url(#dw-…)): once per page. */
export function PatternDefs() {
  return (
    <svg width="0" height="0" aria-hidden="true" focusable="false" className="absolute">
    <defs>
      <pattern id="dw-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill="#fafafa" />
        <line x1="0" y1="0" x2="0" y2="6" stroke="#b0b0b0" strokeWidth="1" />
      </pattern>
      <pattern id="dw-dots" width="5" height="5" patternUnits="userSpaceOnUse">
        <rect width="5" height="5" fill="#f2f2f2" />
        <circle cx="2.5" cy="2.5" r="0.9" fill="#8a8a8a" />
      </pattern>
      <pattern id="dw-cross" width="5" height="5" patternUnits="userSpaceOnUse">
        <rect width="5" height="5" fill="#ffffff" />
        <path d="M0 0L5 5M5 0L0 5" stroke="#8a8a8a" strokeWidth="0.7" />
      </pattern>
    </defs>
    </svg>
  );
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
    >
      <title id={titleId}>{view.title}</title>
      {view.shapes.map((shape, i) => (
        <ShapeEl key={i} shape={shape} />
      ))}
      {view.groups.map((g) => (
        <a key={g.target} href={`#${g.target}`} aria-label={g.title}>
          {/* The tooltip on hover (aria-label gives none). */}
          <title>{g.title}</title>
          {g.shapes.map((shape, i) => (
            <ShapeEl key={i} shape={shape} />
          ))}
        </a>
      ))}
    </svg>
  );
}

/** A small swatch of a role for the drawing's key (the patterns come from the page's PatternDefs). */
export function KeySwatch({ role }: { role: ShapeRole }) {
  return (
    <svg width="22" height="12" viewBox="0 0 22 12" aria-hidden="true" className="dw inline-block shrink-0 align-middle">
      {role === 'anode' ? (
        <>
          <rect x="6" y="5" width="9" height="4" className={cls('anode-left')} />
          <rect x="6" y="1" width="9" height="8" className={cls('anode')} />
        </>
      ) : role === 'anode-unknown' ? (
        <>
          <rect x="6" y="1" width="9" height="8" className={cls('anode-unknown')} />
          <text x="10.5" y="7.3" textAnchor="middle" className={cls('anode-unknown-mark')}>
            ?
          </text>
        </>
      ) : role === 'reading' ? (
        <path d="M11 1l5 5l-5 5l-5 -5z" className={cls('reading')} />
      ) : (
        <rect x="1" y="1" width="20" height="10" className={cls(role)} />
      )}
    </svg>
  );
}
