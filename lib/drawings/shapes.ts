/*
 * A drawing as plain shapes in drawing units (one unit a point on paper, a CSS pixel on screen), rounded to one
 * decimal, so the page (SVG in React) and the PDFs (@react-pdf/renderer) draw the same thing from one geometry.
 * A shape's `role` names its look (grey fill, hatch, outline); each renderer maps roles to its own styles.
 */

export type ShapeRole =
  | 'hull' // the hull or structure outline
  | 'waterline'
  | 'zone-bottom'
  | 'zone-sides'
  | 'zone-rudder'
  | 'zone-propeller'
  | 'zone-sea-chest'
  | 'zone-thruster'
  | 'deck' // a jetty's deck outline
  | 'grid' // frame ticks, bents and rows
  | 'anode' // the outline of an anode (or pile) symbol
  | 'anode-left' // the part of the symbol filled by the remaining fraction
  | 'anode-unknown' // the dashed outline of a symbol whose remaining fraction is not known
  | 'anode-unknown-mark' // the "?" inside it
  | 'pile' // a pile without anodes
  | 'reading' // a survey reading's marker
  | 'datum'
  | 'seabed'
  | 'label' // small text
  | 'title'; // larger text

export type Shape =
  | { kind: 'rect'; role: ShapeRole; x: number; y: number; w: number; h: number }
  | { kind: 'path'; role: ShapeRole; d: string }
  | { kind: 'ellipse'; role: ShapeRole; cx: number; cy: number; rx: number; ry: number }
  | { kind: 'line'; role: ShapeRole; x1: number; y1: number; x2: number; y2: number }
  | { kind: 'text'; role: ShapeRole; x: number; y: number; text: string; anchor: 'start' | 'middle' | 'end' };

/** Shapes that belong to one anode group (or one pile): linked and titled together on the page. */
export interface ShapeGroup {
  /** The anchor the group links to (the group's row in the text alternative, or the pile). */
  target: string;
  /** Its title, read out and shown on hover: label, count, remaining fraction. */
  title: string;
  shapes: Shape[];
}

export interface DrawingView {
  /** A stable id for the view (used for element ids). */
  id: string;
  title: string;
  width: number;
  height: number;
  /** Background and zones, then the groups, then the readings. */
  shapes: Shape[];
  groups: ShapeGroup[];
}

/** Rounds to one decimal: small SVG, the same numbers on screen and on paper. */
export const r1 = (x: number) => Math.round(x * 10) / 10;

export function rect(role: ShapeRole, x: number, y: number, w: number, h: number): Shape {
  return { kind: 'rect', role, x: r1(x), y: r1(y), w: r1(Math.max(0, w)), h: r1(Math.max(0, h)) };
}
export function line(role: ShapeRole, x1: number, y1: number, x2: number, y2: number): Shape {
  return { kind: 'line', role, x1: r1(x1), y1: r1(y1), x2: r1(x2), y2: r1(y2) };
}
export function text(role: ShapeRole, x: number, y: number, value: string, anchor: 'start' | 'middle' | 'end' = 'start'): Shape {
  return { kind: 'text', role, x: r1(x), y: r1(y), text: value, anchor };
}
export function ellipse(role: ShapeRole, cx: number, cy: number, rx: number, ry: number): Shape {
  return { kind: 'ellipse', role, cx: r1(cx), cy: r1(cy), rx: r1(rx), ry: r1(ry) };
}
/** A closed polygon through the points. */
export function polygon(role: ShapeRole, points: [number, number][]): Shape {
  return { kind: 'path', role, d: `M${points.map(([x, y]) => `${r1(x)} ${r1(y)}`).join('L')}Z` };
}

/**
 * An anode (or pile) symbol: an outline whose lower part is filled by the remaining fraction (a full symbol is a
 * new anode, an empty one is used up), so the level reads in grey print without colour. When the fraction is not
 * known the symbol is its own shape, a dashed outline with "?", never the empty outline of a used-up anode.
 */
export function fillSymbol(x: number, y: number, w: number, h: number, remainingFraction: number | null): Shape[] {
  if (remainingFraction === null) return [rect('anode-unknown', x, y, w, h), text('anode-unknown-mark', x + w / 2, y + h / 2 + 2.3, '?', 'middle')];
  const f = Math.min(1, Math.max(0, remainingFraction));
  return [rect('anode-left', x, y + h * (1 - f), w, h * f), rect('anode', x, y, w, h)];
}

/** "62 % left", or the words when the fraction is not known. */
export function remainingWords(remainingFraction: number | null): string {
  return remainingFraction === null ? 'remaining not forecast' : `${Math.round(remainingFraction * 100)} % left`;
}

/** Estimated width of a label in drawing units (8.5-unit text, about 0.56 em a character). */
export const labelWidth = (value: string, fontSize = 8.5) => value.length * fontSize * 0.56;

/**
 * Moves labels up, a line at a time, until none overlaps one placed before it (left to right), so the texts of
 * groups and readings close together stay readable. At most `levels` lines up; past that a label stays where it is.
 */
export function spreadLabels(labels: Extract<Shape, { kind: 'text' }>[], lineHeight = 10, levels = 5): void {
  const placed: { x0: number; x1: number; y: number }[] = [];
  const box = (t: Extract<Shape, { kind: 'text' }>) => {
    const w = labelWidth(t.text);
    const x0 = t.anchor === 'start' ? t.x : t.anchor === 'end' ? t.x - w : t.x - w / 2;
    return { x0, x1: x0 + w };
  };
  for (const t of [...labels].sort((a, b) => box(a).x0 - box(b).x0)) {
    const { x0, x1 } = box(t);
    let y = t.y;
    for (let i = 0; i < levels && placed.some((p) => p.x0 < x1 + 2 && x0 < p.x1 + 2 && Math.abs(p.y - y) < lineHeight - 1); i++) y -= lineHeight;
    t.y = r1(y);
    placed.push({ x0, x1, y: t.y });
  }
}
