import type { AnodePosition, HullPlace } from '@/lib/schemas/anode-position';
import { HULL_VIEW_LABELS, ZONE_KIND_LABELS } from '@/lib/labels';
import { ellipse, fillSymbol, line, polygon, r1, rect, remainingWords, spreadLabels, text, type DrawingView, type Shape, type ShapeGroup } from './shapes';

/*
 * The hull profile: frames to drawing coordinates, the zones, and each anode group at its position. Frame 0 is at
 * the aft perpendicular and frames count forward at the frame spacing (common practice). Port and starboard are two
 * views: seen from starboard the bow is to the right, seen from port to the left. Pure: no I/O, metres.
 */

export interface HullParticulars {
  lengthBppM: number;
  beamM: number;
  draughtM: number;
  blockCoefficient: number | null;
  /** Entered frame spacing, m; null: estimated from the length (frameSpacingOf). */
  frameSpacingM: number | null;
}

export interface DrawnGroup {
  id: string;
  label: string;
  quantity: number;
  position: AnodePosition;
  /** Forecast remaining fraction today (0..1); null without a forecast. */
  remainingFraction: number | null;
}

export interface DrawnReading {
  location: string;
  position: AnodePosition;
  /** The marker's text: value and word ("−0.96 V, protected"). */
  words: string;
}

/**
 * Frame spacing estimated from the length between perpendiculars: s = 0.002 L + 0.48 m, the classic rule for
 * transverse frame spacing (common practice, from memory), rounded to 10 mm.
 */
export function estimatedFrameSpacingM(lengthBppM: number): number {
  return Math.round((0.002 * lengthBppM + 0.48) * 100) / 100;
}

export function frameSpacingOf(p: HullParticulars): { spacingM: number; source: 'entered' | 'estimate' } {
  return p.frameSpacingM && p.frameSpacingM > 0 ? { spacingM: p.frameSpacingM, source: 'entered' } : { spacingM: estimatedFrameSpacingM(p.lengthBppM), source: 'estimate' };
}

export const HULL_DRAWING_WIDTH = 760;
const MARGIN_X = 36;
const MARGIN_TOP = 34;
const MARGIN_BOTTOM = 40;
/** The hull is drawn about this tall; short deep hulls are not stretched, long shallow ones are (and say so). */
const TARGET_HULL_HEIGHT = 150;
/** Drawn anode symbols per group and view; more are written as a count. */
export const MAX_SYMBOLS = 12;

/** The drawing's scales: metres to drawing units, horizontally and (exaggerated) vertically. */
export interface HullScale {
  lengthBppM: number;
  draughtM: number;
  /** Hull depth drawn (keel to the top of the drawn side), m. */
  depthM: number;
  /** Drawing units per metre along the hull. */
  sx: number;
  /** Drawing units per metre of height (sx times the exaggeration). */
  sy: number;
  exaggeration: number;
  /** Metres aft of the aft perpendicular that are drawn (the stern overhang and rudder). */
  aftM: number;
  spacingM: number;
}

export function hullScale(p: HullParticulars): HullScale {
  const L = p.lengthBppM;
  const T = p.draughtM;
  const aftM = 0.04 * L;
  const drawnLength = L * 1.08; // aft overhang and a raked bow
  const sx = (HULL_DRAWING_WIDTH - 2 * MARGIN_X) / drawnLength;
  const depthM = Math.max(T * 1.7, T + 2);
  const exaggeration = Math.max(1, Math.min(8, Math.round((TARGET_HULL_HEIGHT / (depthM * sx)) * 2) / 2));
  return { lengthBppM: L, draughtM: T, depthM, sx, sy: sx * exaggeration, exaggeration, aftM, spacingM: frameSpacingOf(p).spacingM };
}

/** Metres forward of the aft perpendicular (xm) and above the keel (hm) to drawing units in one view. */
export function toDrawing(scale: HullScale, view: 'port' | 'starboard', xm: number, hm: number): [number, number] {
  const fromStern = MARGIN_X + (xm + scale.aftM) * scale.sx;
  const x = view === 'starboard' ? fromStern : HULL_DRAWING_WIDTH - fromStern;
  const y = MARGIN_TOP + (scale.depthM - hm) * scale.sy;
  return [r1(x), r1(y)];
}

/** A frame number to metres forward of the aft perpendicular. */
export const frameToMetres = (scale: HullScale, frame: number) => frame * scale.spacingM;

/**
 * True when the position's frames fall outside the hull drawn (aft of the stern overhang or forward of the bow,
 * 1.04 L): the frame numbers and the frame spacing do not agree, so the group is listed, not drawn.
 */
export function beyondHull(scale: HullScale, p: AnodePosition): boolean {
  if (p.frameFrom === null) return false;
  const from = frameToMetres(scale, p.frameFrom);
  const to = frameToMetres(scale, p.frameTo ?? p.frameFrom);
  return from < -scale.aftM || to > scale.lengthBppM * 1.04;
}

/** Where a part of the hull is, in metres (along: from the aft perpendicular; up: above the keel). */
function placeBox(place: HullPlace | null, end: 'fore' | 'aft' | null, L: number, T: number): { from: number; to: number; h: number } {
  switch (place) {
    case 'rudder':
      return { from: -0.012 * L, to: 0.012 * L, h: 0.4 * T };
    case 'propeller-shaft':
      return { from: 0.03 * L, to: 0.12 * L, h: 0.4 * T };
    case 'sea-chest':
      return end === 'fore' ? { from: 0.6 * L, to: 0.64 * L, h: 0.15 * T } : { from: 0.3 * L, to: 0.34 * L, h: 0.15 * T };
    case 'thruster-tunnel':
      return end === 'aft' ? { from: 0.1 * L, to: 0.12 * L, h: 0.45 * T } : { from: 0.9 * L, to: 0.94 * L, h: 0.45 * T };
    case 'hull-bottom':
      return { from: 0.1 * L, to: 0.95 * L, h: 0.07 * T };
    case 'boot-top-sides':
      return { from: 0.1 * L, to: 0.95 * L, h: 0.6 * T };
    default:
      return { from: 0.1 * L, to: 0.95 * L, h: 0.5 * T };
  }
}

/** Whether a group or reading shows in a view: its side, or both, the centre line or an unknown side. */
export const inView = (p: AnodePosition, view: 'port' | 'starboard') => p.side === null || p.side === 'both' || p.side === 'centre' || p.side === view;

/** How many anodes of the group are on one side: half of them when they are on both sides. */
export const anodesInView = (g: { quantity: number; position: AnodePosition }) => (g.position.side === 'both' ? Math.ceil(g.quantity / 2) : g.quantity);

/** Where a group sits in metres: its frames (or the part of the hull), its height (or the part's usual height). */
export function groupSpanMetres(scale: HullScale, p: AnodePosition): { from: number; to: number; h: number } {
  const box = placeBox(p.place, p.end, scale.lengthBppM, scale.draughtM);
  const from = p.frameFrom !== null ? frameToMetres(scale, p.frameFrom) : box.from;
  const to = p.frameTo !== null ? frameToMetres(scale, p.frameTo) : p.frameFrom !== null ? from : box.to;
  const h = p.heightAboveKeelM ?? box.h;
  return { from: Math.min(from, to), to: Math.max(from, to), h: Math.min(Math.max(h, 0), scale.depthM) };
}

function hullShapes(scale: HullScale, view: 'port' | 'starboard'): Shape[] {
  const L = scale.lengthBppM;
  const T = scale.draughtM;
  const D = scale.depthM;
  const at = (xm: number, hm: number) => toDrawing(scale, view, xm, hm);
  const outline = polygon('hull', [at(-0.035 * L, D), at(1.04 * L, D), at(1.0 * L, 0.45 * T), at(0.96 * L, 0), at(0.1 * L, 0), at(0.075 * L, 0.8 * T), at(-0.035 * L, 0.85 * T)]);
  const band = (role: Shape['role'], fromM: number, toM: number, h0: number, h1: number) => {
    const [xa, ya] = at(fromM, h1);
    const [xb, yb] = at(toM, h0);
    return rect(role, Math.min(xa, xb), ya, Math.abs(xb - xa), yb - ya);
  };
  const [px, py] = at(0.045 * L, 0.4 * T);
  const [tx, ty] = at(0.92 * L, 0.45 * T);
  const [wl0, wly] = at(-0.035 * L, T);
  const [wl1] = at(1.03 * L, T);
  return [
    outline,
    band('zone-sides', 0.1 * L, 0.975 * L, 0.15 * T, T),
    band('zone-bottom', 0.1 * L, 0.96 * L, 0, 0.15 * T),
    band('zone-rudder', -0.012 * L, 0.012 * L, 0.05 * T, 0.8 * T),
    ellipse('zone-propeller', px, py, Math.max(2, 0.4 * scale.sx), 0.33 * T * scale.sy),
    line('zone-propeller', px, py, at(0.16 * L, 0.4 * T)[0], py),
    band('zone-sea-chest', 0.3 * L, 0.34 * L, 0.05 * T, 0.25 * T),
    ellipse('zone-thruster', tx, ty, 0.2 * T * scale.sx, 0.2 * T * scale.sy),
    line('waterline', wl0, wly, wl1, wly),
    text('label', wl1 + (view === 'starboard' ? -2 : 2), wly - 3, `WL ${r1(T)} m`, view === 'starboard' ? 'end' : 'start'),
  ];
}

/** Frame ticks along the keel every so many frames (about ten ticks), with their numbers. */
function frameTicks(scale: HullScale, view: 'port' | 'starboard'): Shape[] {
  const last = Math.floor(scale.lengthBppM / scale.spacingM);
  const every = [5, 10, 20, 25, 50, 100].find((n) => last / n <= 12) ?? 200;
  const out: Shape[] = [];
  for (let f = 0; f <= last; f += every) {
    const [x, y] = toDrawing(scale, view, frameToMetres(scale, f), 0);
    out.push(line('grid', x, y + 4, x, y + 9), text('label', x, y + 18, `${f}`, 'middle'));
  }
  const [x0, y0] = toDrawing(scale, view, 0, 0);
  out.push(text('label', x0, y0 + 30, 'Fr', 'middle'));
  return out;
}

const SYMBOL_W = 9;
const SYMBOL_H = 7;

/**
 * How many of a group's anodes a view shows, truthfully: a group without a side is shown in both views with its
 * whole count ("side not given"); an odd count on both sides is drawn rounded up on each side and says so.
 */
function sideCountWords(g: DrawnGroup, n: number): string {
  const anodes = (k: number) => `${k} anode${k === 1 ? '' : 's'}`;
  if (g.position.side === null) return `${anodes(g.quantity)}, side not given (shown on both sides)`;
  if (g.position.side === 'both' && g.quantity % 2 === 1) return `${anodes(g.quantity)} on both sides, ${n} drawn on this side (an odd count, rounded up for symmetry)`;
  return `${anodes(n)} on this side`;
}

/** One group's symbols in one view: up to MAX_SYMBOLS anodes spread over its span, each filled to its remaining fraction. */
export function groupSymbols(scale: HullScale, view: 'port' | 'starboard', g: DrawnGroup): ShapeGroup {
  const n = anodesInView(g);
  const drawn = Math.min(n, MAX_SYMBOLS);
  const span = groupSpanMetres(scale, g.position);
  const shapes: Shape[] = [];
  const [xa, y] = toDrawing(scale, view, span.from, span.h);
  const [xb] = toDrawing(scale, view, span.to, span.h);
  const left = Math.min(xa, xb);
  const width = Math.abs(xb - xa);
  const step = drawn > 1 ? Math.max(width / (drawn - 1), SYMBOL_W + 1) : 0;
  const start = drawn > 1 && step * (drawn - 1) > width ? left + width / 2 - (step * (drawn - 1)) / 2 : left + (drawn > 1 ? 0 : width / 2);
  for (let i = 0; i < drawn; i++) shapes.push(...fillSymbol(start + i * step - SYMBOL_W / 2, y - SYMBOL_H / 2, SYMBOL_W, SYMBOL_H, g.remainingFraction));
  const countText = `${g.label} · ${n}${drawn < n ? ` (${drawn} drawn)` : ''} · ${remainingWords(g.remainingFraction)}`;
  shapes.push(text('label', start + ((drawn - 1) * step) / 2, y - SYMBOL_H / 2 - 3, countText, 'middle'));
  return { target: `drawing-group-${g.id}`, title: `${g.label}: ${sideCountWords(g, n)}, ${remainingWords(g.remainingFraction)}`, shapes };
}

/** A reading's marker: a diamond with its value and word. */
export function readingMarker(scale: HullScale, view: 'port' | 'starboard', reading: DrawnReading): Shape[] {
  const span = groupSpanMetres(scale, reading.position);
  const [x, y] = toDrawing(scale, view, (span.from + span.to) / 2, span.h);
  const d = 4.5;
  return [
    polygon('reading', [[x, y - d], [x + d, y], [x, y + d], [x - d, y]]),
    text('label', x, y + d + 9, reading.words, 'middle'),
  ];
}

/** The hull profile seen from one side, with the zones, the groups on that side and the readings taken there. */
export function hullView(p: HullParticulars, view: 'port' | 'starboard', groups: readonly DrawnGroup[], readings: readonly DrawnReading[]): DrawingView {
  const scale = hullScale(p);
  const height = Math.round(MARGIN_TOP + scale.depthM * scale.sy + MARGIN_BOTTOM);
  const shapes: Shape[] = [text('title', view === 'starboard' ? MARGIN_X : HULL_DRAWING_WIDTH - MARGIN_X, 16, `${HULL_VIEW_LABELS[view]} (bow ${view === 'starboard' ? 'right' : 'left'})`, view === 'starboard' ? 'start' : 'end')];
  shapes.push(...hullShapes(scale, view), ...frameTicks(scale, view));
  const placed = groups.filter((g) => inView(g.position, view) && !beyondHull(scale, g.position) && (g.position.frameFrom !== null || g.position.place !== null || g.position.heightAboveKeelM !== null));
  const shown = placed.map((g) => groupSymbols(scale, view, g));
  const markers = readings.filter((r) => inView(r.position, view) && !beyondHull(scale, r.position) && (r.position.frameFrom !== null || r.position.place !== null)).flatMap((r) => readingMarker(scale, view, r));
  shapes.push(...markers);
  // Group and reading texts close together (the stern) are moved apart.
  const isText = (s: Shape): s is Extract<Shape, { kind: 'text' }> => s.kind === 'text';
  spreadLabels([...shown.flatMap((g) => g.shapes.filter(isText)), ...markers.filter(isText)]);
  return { id: view, title: HULL_VIEW_LABELS[view], width: HULL_DRAWING_WIDTH, height, shapes, groups: shown };
}

/** The zones drawn, in words (the drawing's key). */
export const HULL_ZONE_KEY: [Shape['role'], string][] = [
  ['zone-bottom', ZONE_KIND_LABELS['hull-bottom']!],
  ['zone-sides', ZONE_KIND_LABELS['boot-top-sides']!],
  ['zone-rudder', ZONE_KIND_LABELS.rudder!],
  ['zone-propeller', ZONE_KIND_LABELS['propeller-shaft']!],
  ['zone-sea-chest', ZONE_KIND_LABELS['sea-chest']!],
  ['zone-thruster', ZONE_KIND_LABELS['thruster-tunnel']!],
];
