import type { AnodePosition, PileRef } from '@/lib/schemas/anode-position';
import { TIDAL_DATUM_LABELS } from '@/lib/labels';
import { fillSymbol, line, r1, rect, remainingWords, text, type DrawingView, type Shape, type ShapeGroup } from './shapes';
import type { DrawnGroup, DrawnReading } from './hull-drawing';

/*
 * The plan of a pile grid: bents (numbered from 1) across the drawing, rows (lettered from A) down it; each pile with
 * the anodes of the groups that cover it, filled by the lowest remaining fraction among them, and a pile's elevation
 * with its anodes and readings by depth. Pure: no I/O, metres.
 */

export interface PileGridParticulars {
  pileCount: number | null;
  /** Entered rows and bents; null: estimated (pileGridOf). */
  pileRows: number | null;
  pileBents: number | null;
}

export const rowLetter = (i: number) => String.fromCharCode(65 + i);
const rowIndex = (row: string) => row.charCodeAt(0) - 65;

/**
 * The grid: entered rows and bents, or an estimate from the positions recorded (the highest row letter and bent
 * named) and the pile count (bents = piles / rows, rounded up). Without any of these: two rows (an assumption).
 */
export function pileGridOf(p: PileGridParticulars, positions: readonly AnodePosition[]): { rows: number; bents: number; source: 'entered' | 'estimate' } {
  if (p.pileRows && p.pileBents) return { rows: p.pileRows, bents: p.pileBents, source: 'entered' };
  const refs = positions.flatMap((q) => [q.pileFrom, q.pileTo].filter((r): r is PileRef => r !== null));
  const namedRows = Math.max(0, ...refs.map((r) => (r.row ? rowIndex(r.row) + 1 : 0)));
  const namedBents = Math.max(0, ...refs.map((r) => r.bent ?? 0));
  const rows = Math.min(26, p.pileRows || namedRows || (p.pileCount && p.pileBents ? Math.ceil(p.pileCount / p.pileBents) : 2));
  const bents = Math.min(200, Math.max(p.pileBents || (p.pileCount ? Math.ceil(p.pileCount / rows) : 0), namedBents, 1));
  return { rows, bents, source: 'estimate' };
}

export interface GridPile {
  bent: number;
  row: string;
  /** "3-C": bent and row, the pile's id in links and element ids. */
  key: string;
}

export function gridPiles(grid: { rows: number; bents: number }): GridPile[] {
  const out: GridPile[] = [];
  for (let r = 0; r < grid.rows; r++) for (let b = 1; b <= grid.bents; b++) out.push({ bent: b, row: rowLetter(r), key: `${b}-${rowLetter(r)}` });
  return out;
}

/**
 * The piles a position covers: the rectangle of bents and rows between its two piles (a missing bent or row
 * covers all of them); no pile named: none (the group is listed, not drawn on a pile).
 */
export function pilesCovered(p: AnodePosition, grid: { rows: number; bents: number }): GridPile[] {
  if (!p.pileFrom) return [];
  const to = p.pileTo ?? p.pileFrom;
  const b0 = Math.min(p.pileFrom.bent ?? 1, to.bent ?? (p.pileFrom.bent === null ? grid.bents : p.pileFrom.bent));
  const b1 = Math.max(p.pileFrom.bent ?? grid.bents, to.bent ?? (p.pileFrom.bent ?? grid.bents));
  const ra = p.pileFrom.row ? rowIndex(p.pileFrom.row) : 0;
  const rb = to.row ? rowIndex(to.row) : p.pileFrom.row ? ra : grid.rows - 1;
  const [r0, r1_] = [Math.min(ra, rb), Math.max(ra, rb)];
  return gridPiles(grid).filter((pile) => pile.bent >= b0 && pile.bent <= b1 && rowIndex(pile.row) >= r0 && rowIndex(pile.row) <= r1_);
}

export const PLAN_WIDTH = 760;
const MARGIN_LEFT = 34;
const MARGIN_TOP = 44;
const PILE = 14;

/** Drawing coordinates of a pile's centre in the plan. */
export function pileCentre(grid: { rows: number; bents: number }, bent: number, row: string): [number, number] {
  const dx = Math.min(60, (PLAN_WIDTH - MARGIN_LEFT - 20) / Math.max(grid.bents, 1));
  const dy = 40;
  return [r1(MARGIN_LEFT + dx * (bent - 0.5)), r1(MARGIN_TOP + dy * (rowIndex(row) + 0.5))];
}

export interface PileState {
  pile: GridPile;
  /** The groups on this pile with their anodes per pile. */
  groups: { id: string; label: string; anodes: number; remainingFraction: number | null; depthBelowDatumM: number | null; datum: AnodePosition['datum'] }[];
  /** The lowest remaining fraction of its groups; null without a forecast or without anodes. */
  remainingFraction: number | null;
  readings: DrawnReading[];
}

/** Every pile of the grid with the groups that cover it (their anodes shared evenly over the piles) and the readings taken on it. */
export function pileStates(grid: { rows: number; bents: number }, groups: readonly DrawnGroup[], readings: readonly DrawnReading[]): PileState[] {
  const states = new Map(gridPiles(grid).map((pile) => [pile.key, { pile, groups: [], remainingFraction: null, readings: [] } as PileState]));
  for (const g of groups) {
    const piles = pilesCovered(g.position, grid);
    piles.forEach((pile, i) => {
      // The anodes shared over the piles; the first piles take the remainder.
      const anodes = Math.floor(g.quantity / piles.length) + (i < g.quantity % piles.length ? 1 : 0);
      if (!anodes) return;
      states.get(pile.key)!.groups.push({ id: g.id, label: g.label, anodes, remainingFraction: g.remainingFraction, depthBelowDatumM: g.position.depthBelowDatumM, datum: g.position.datum });
    });
  }
  for (const r of readings) for (const pile of pilesCovered(r.position, grid).slice(0, 1)) states.get(pile.key)!.readings.push(r);
  for (const s of states.values()) {
    const known = s.groups.map((g) => g.remainingFraction).filter((f): f is number => f !== null);
    s.remainingFraction = known.length ? Math.min(...known) : null;
  }
  return [...states.values()];
}

/** The plan: bents and rows labelled, each pile a symbol filled to its lowest remaining fraction, readings marked. */
export function pilePlanView(title: string, grid: { rows: number; bents: number }, states: readonly PileState[]): DrawingView {
  const height = Math.round(MARGIN_TOP + 40 * grid.rows + 24);
  const shapes: Shape[] = [text('title', MARGIN_LEFT, 16, title)];
  const [, yTop] = pileCentre(grid, 1, 'A');
  for (let b = 1; b <= grid.bents; b++) {
    const [x] = pileCentre(grid, b, 'A');
    shapes.push(text('label', x, yTop - 14, `${b}`, 'middle'));
  }
  for (let r = 0; r < grid.rows; r++) {
    const [x0, y] = pileCentre(grid, 1, rowLetter(r));
    const [x1] = pileCentre(grid, grid.bents, rowLetter(r));
    shapes.push(line('grid', x0, y, x1, y), text('label', MARGIN_LEFT - 22, y + 3, rowLetter(r), 'middle'));
  }
  shapes.push(text('label', MARGIN_LEFT - 22, yTop - 14, 'Bent', 'start'));
  const groups: ShapeGroup[] = states.map((s) => {
    const [x, y] = pileCentre(grid, s.pile.bent, s.pile.row);
    const anodes = s.groups.reduce((n, g) => n + g.anodes, 0);
    const pileShapes: Shape[] = anodes
      ? fillSymbol(x - PILE / 2, y - PILE / 2, PILE, PILE, s.remainingFraction)
      : [rect('pile', x - PILE / 2, y - PILE / 2, PILE, PILE)];
    if (s.readings.length) pileShapes.push({ kind: 'path', role: 'reading', d: `M${r1(x + PILE / 2 + 1)} ${r1(y - PILE / 2 - 5)}l4 4l-4 4l-4 -4z` });
    const words = anodes ? `${anodes} anode${anodes === 1 ? '' : 's'}, ${remainingWords(s.remainingFraction)}` : 'no anodes recorded';
    const readingWords = s.readings.length ? `; ${s.readings.map((r) => r.words).join('; ')}` : '';
    return { target: `pile-${s.pile.key}`, title: `Pile bent ${s.pile.bent} row ${s.pile.row}: ${words}${readingWords}`, shapes: pileShapes };
  });
  return { id: 'plan', title, width: PLAN_WIDTH, height, shapes, groups };
}

const ELEVATION_WIDTH = 360;

/**
 * One pile's elevation: the datum, the pile from above the datum down to below the deepest anode or reading, its
 * anodes at their depths (filled by their remaining fraction) and its readings with value and word.
 */
export function pileElevationView(state: PileState, readingDepths: readonly (number | null)[] = state.readings.map((r) => r.position.depthBelowDatumM)): DrawingView {
  const depths = [...state.groups.map((g) => g.depthBelowDatumM), ...readingDepths].filter((d): d is number => d !== null);
  const bottomM = Math.max(4, ...depths) + 2;
  const topM = -3;
  const sy = 200 / (bottomM - topM);
  const y = (d: number) => r1(40 + (d - topM) * sy);
  const x = 120;
  const datum = state.groups.find((g) => g.datum)?.datum ?? state.readings.find((r) => r.position.datum)?.position.datum ?? null;
  const shapes: Shape[] = [
    text('title', 12, 16, `Pile bent ${state.pile.bent} row ${state.pile.row}`),
    rect('hull', x - 8, y(topM), 16, y(bottomM) - y(topM)),
    line('datum', 30, y(0), ELEVATION_WIDTH - 20, y(0)),
    text('label', 30, y(0) - 4, datum ? `0 m ${TIDAL_DATUM_LABELS[datum]}` : '0 m datum'),
  ];
  for (let d = 2; d < bottomM; d += 2) shapes.push(line('grid', x - 14, y(d), x - 10, y(d)), text('label', x - 16, y(d) + 3, `−${d} m`, 'end'));
  const groups: ShapeGroup[] = state.groups.map((g, i) => {
    const at = y(g.depthBelowDatumM ?? 0) + i * 12;
    const symbols = Array.from({ length: Math.min(g.anodes, 4) }, (_, k) => fillSymbol(x + 10 + k * 12, at - 5, 9, 10, g.remainingFraction)).flat();
    return {
      target: `drawing-group-${g.id}`,
      title: `${g.label}: ${g.anodes} on this pile, ${remainingWords(g.remainingFraction)}`,
      shapes: [...symbols, text('label', x + 62, at + 3, `${g.label} · ${g.anodes} · ${remainingWords(g.remainingFraction)}${g.depthBelowDatumM === null ? ' (depth not given)' : ''}`)],
    };
  });
  state.readings.forEach((r, i) => {
    const at = y(readingDepths[i] ?? 0);
    shapes.push({ kind: 'path', role: 'reading', d: `M${x - 22} ${r1(at - 5)}l5 5l-5 5l-5 -5z` }, text('label', x - 30, at + 14 + i * 10, r.words, 'end'));
  });
  return { id: `elevation-${state.pile.key}`, title: `Elevation of pile bent ${state.pile.bent} row ${state.pile.row}`, width: ELEVATION_WIDTH, height: Math.round(y(bottomM) + 30), shapes, groups };
}
