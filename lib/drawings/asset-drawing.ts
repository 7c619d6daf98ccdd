import type { AnodePosition } from '@/lib/schemas/anode-position';
import { PARTICULAR_SOURCE_LABELS, TIDAL_DATUM_LABELS } from '@/lib/labels';
import { HULL_ZONE_KEY, beyondHull, frameSpacingOf, hullScale, hullView, type DrawnGroup, type DrawnReading, type HullScale } from './hull-drawing';
import { pileGridOf, pilePlanView, pileStates, pilesCovered } from './pile-plan';
import { positionPlaceWords } from './parse-position';
import { remainingWords, type DrawingView, type ShapeRole } from './shapes';

/*
 * An asset's drawing, put together from its particulars, its fitted groups (each with its position and remaining
 * fraction) and the latest survey's readings: the views to draw, the key, the notes on what is estimated, and the
 * text alternative (one row per group). Pure; the page and the PDFs render the same thing.
 */

export interface DrawingAsset {
  kind: 'vessel' | 'structure';
  name: string;
  lengthBppM?: number | null;
  beamM?: number | null;
  draughtM?: number | null;
  blockCoefficient?: number | null;
  frameSpacingM?: number | null;
  frameSpacingSource?: 'entered' | 'estimate' | null;
  pileCount?: number | null;
  pileRows?: number | null;
  pileBents?: number | null;
  pileGridSource?: 'entered' | 'estimate' | null;
}

export interface DrawingRow {
  id: string;
  label: string;
  /** Where, in words (frames, side, height; or piles and depth), the note after it. */
  where: string;
  note: string | null;
  count: number;
  remaining: string;
  remainingFraction: number | null;
  /** The latest readings placed at this group, in words; null without any. */
  readings: string | null;
  /** False when the position could not be put on the drawing (listed only). */
  drawn: boolean;
}

export interface AssetDrawing {
  kind: 'hull' | 'piles';
  title: string;
  /** Hull: starboard then port; structure: the plan. */
  views: DrawingView[];
  key: { role: ShapeRole; label: string }[];
  notes: string[];
  rows: DrawingRow[];
  /** What a pile elevation needs (computed on the client when a pile is chosen). */
  grid: { rows: number; bents: number } | null;
  groups: DrawnGroup[];
  readings: DrawnReading[];
  /** The readings at no group (location and words): drawn on the views, listed under the groups' list. */
  otherReadings: string[];
}

export type AssetDrawingResult = { drawing: AssetDrawing; missing: null } | { drawing: null; missing: string };

const SYMBOL_KEY: { role: ShapeRole; label: string }[] = [
  { role: 'anode', label: 'Anode: the filled part is the mass left (full: new, empty: used up)' },
  { role: 'anode-unknown', label: 'Anode, mass left not known (no forecast): dashed outline with "?"' },
  { role: 'reading', label: 'Survey reading: value and verdict written beside it' },
];

function sameSpot(a: AnodePosition, b: AnodePosition): boolean {
  if (a.pileFrom || b.pileFrom) return false;
  if (a.place && a.place === b.place) return true;
  if (a.frameFrom === null || b.frameFrom === null) return false;
  return b.frameFrom >= a.frameFrom && b.frameFrom <= (a.frameTo ?? a.frameFrom) && (a.side === null || b.side === null || a.side === 'both' || a.side === b.side);
}

/** The most rows and bents the pile plan draws (a larger grid is drawn in part, and the notes say so). */
export const MAX_PLAN_GRID = { rows: 30, bents: 60 };
const rowIndexOf = (row: string) => row.charCodeAt(0) - 65;

/** Said of a group whose frames lie outside the hull drawn (listed, not drawn). */
export const BEYOND_HULL_WORDS = 'beyond the hull (check the frame spacing)';

function hullRows(scale: HullScale, groups: readonly DrawnGroup[], readings: readonly DrawnReading[]): DrawingRow[] {
  return groups.map((g) => {
    const at = readings.filter((r) => sameSpot(g.position, r.position));
    if (beyondHull(scale, g.position)) {
      const r = row(g, false, at);
      return { ...r, where: `${r.where}, ${BEYOND_HULL_WORDS}` };
    }
    const drawn = g.position.frameFrom !== null || g.position.place !== null || g.position.heightAboveKeelM !== null;
    return row(g, drawn, at);
  });
}

/** The readings no group's row lists, in words. */
function readingsAtNoGroup(readings: readonly DrawnReading[], atAGroup: (r: DrawnReading) => boolean): string[] {
  return readings.filter((r) => !atAGroup(r)).map((r) => `${r.location}: ${r.words}`);
}

function row(g: DrawnGroup, drawn: boolean, readings: readonly DrawnReading[]): DrawingRow {
  return {
    id: g.id,
    label: g.label,
    where: positionPlaceWords({ ...g.position, note: null }) ?? 'Position not given',
    note: g.position.note,
    count: g.quantity,
    remaining: remainingWords(g.remainingFraction),
    remainingFraction: g.remainingFraction,
    readings: readings.length ? readings.map((r) => `${r.location}: ${r.words}`).join('; ') : null,
    drawn,
  };
}

export function buildAssetDrawing(asset: DrawingAsset, groups: readonly DrawnGroup[], readings: readonly DrawnReading[]): AssetDrawingResult {
  if (asset.kind === 'vessel') {
    if (!asset.lengthBppM || !asset.draughtM) return { drawing: null, missing: 'Enter the length between perpendiculars and the draught in the particulars to draw the hull.' };
    const particulars = { lengthBppM: asset.lengthBppM, beamM: asset.beamM ?? 0, draughtM: asset.draughtM, blockCoefficient: asset.blockCoefficient ?? null, frameSpacingM: asset.frameSpacingM ?? null };
    const spacing = frameSpacingOf(particulars);
    const source = spacing.source === 'estimate' || asset.frameSpacingSource === 'estimate' ? 'estimate' : 'entered';
    const scale = hullScale(particulars);
    const notes = [
      `Frame 0 at the aft perpendicular, frames every ${spacing.spacingM} m (${PARTICULAR_SOURCE_LABELS[source]}${spacing.source === 'estimate' ? ' from the length, 0.002 L + 0.48 m, common practice' : ''}).`,
      `Length ${asset.lengthBppM} m between perpendiculars; heights drawn ${scale.exaggeration === 1 ? 'to the same scale' : `${scale.exaggeration} times the length scale`}. The outline and the zones are schematic; the anodes are at their recorded frames and heights (or the usual place of their part of the hull).`,
    ];
    const views = [hullView(particulars, 'starboard', groups, readings), hullView(particulars, 'port', groups, readings)];
    return {
      drawing: { kind: 'hull', title: `${asset.name}: anodes on the hull`, views, key: [...HULL_ZONE_KEY.map(([role, label]) => ({ role, label })), ...SYMBOL_KEY], notes, rows: hullRows(scale, groups, readings), grid: null, groups: [...groups], readings: [...readings], otherReadings: readingsAtNoGroup(readings, (r) => groups.some((g) => sameSpot(g.position, r.position))) },
      missing: null,
    };
  }
  const grid = pileGridOf({ pileCount: asset.pileCount ?? null, pileRows: asset.pileRows ?? null, pileBents: asset.pileBents ?? null }, [...groups.map((g) => g.position), ...readings.map((r) => r.position)]);
  const source = grid.source === 'estimate' || asset.pileGridSource === 'estimate' ? 'estimate' : 'entered';
  const states = pileStates(grid, groups, readings);
  // A large grid is drawn in part (the page and the sheet stay readable and light); the list gives every group.
  const shownGrid = { rows: Math.min(grid.rows, MAX_PLAN_GRID.rows), bents: Math.min(grid.bents, MAX_PLAN_GRID.bents) };
  const capped = shownGrid.rows < grid.rows || shownGrid.bents < grid.bents;
  const shownStates = capped ? states.filter((s) => s.pile.bent <= shownGrid.bents && rowIndexOf(s.pile.row) < shownGrid.rows) : states;
  const plan = pilePlanView(`Plan: ${grid.rows} rows × ${grid.bents} bents${capped ? ` (first ${shownGrid.rows} × ${shownGrid.bents} drawn)` : ''}`, shownGrid, shownStates);
  const datums = [...new Set(groups.flatMap((g) => (g.position.datum ? [g.position.datum] : [])))];
  const notes = [
    `Pile grid ${grid.rows} rows (A–${String.fromCharCode(64 + grid.rows)}) by ${grid.bents} bents (1–${grid.bents}), ${PARTICULAR_SOURCE_LABELS[source]}. Piles by bent and row letter (common practice).`,
    `Each pile is filled to the lowest remaining fraction of the anodes on it; a group's anodes are shared evenly over the piles it names.${datums.length ? ` Depths below ${datums.map((d) => TIDAL_DATUM_LABELS[d]).join(', ')}.` : ''}`,
    ...(capped ? [`The plan draws the first ${shownGrid.rows} rows and ${shownGrid.bents} bents of the ${grid.rows} × ${grid.bents} grid; every group is in the list with its piles.`] : []),
  ];
  const rows = groups.map((g) => {
    const piles = pilesCovered(g.position, grid);
    const at = readings.filter((r) => pilesCovered(r.position, grid).some((p) => piles.some((q) => q.key === p.key)));
    return row(g, piles.length > 0, at);
  });
  return {
    drawing: { kind: 'piles', title: `${asset.name}: anodes by pile`, views: [plan], key: [{ role: 'pile', label: 'Pile without anodes recorded' }, ...SYMBOL_KEY.map((k) => (k.role === 'anode' ? { ...k, label: 'Pile with anodes: the filled part is the mass left on it' } : k.role === 'anode-unknown' ? { ...k, label: 'Pile with anodes, mass left not known (no forecast): dashed outline with "?"' } : k))], notes, rows, grid: { rows: grid.rows, bents: grid.bents }, groups: [...groups], readings: [...readings], otherReadings: readingsAtNoGroup(readings, (r) => groups.some((g) => pilesCovered(r.position, grid).some((p) => pilesCovered(g.position, grid).some((q) => q.key === p.key)))) },
    missing: null,
  };
}
