import { estimatedFrameSpacingM } from './hull-drawing';
import { pileGridOf, rowLetter } from './pile-plan';
import { parsePosition } from './parse-position';
import { EMPTY_POSITION, type AnodePosition } from '@/lib/schemas/anode-position';

/*
 * Where an approved design's anodes go, proposed zone by zone from the zone's anode count (the design distributes
 * the anodes by zone demand) and the asset's particulars, as position texts the engineer can edit before fitting.
 * Hull placement follows the design basis (../shared/design-basis.md, "Placement (practice)"): anodes about 6 m
 * apart, 15-20 % (some say a third) at the stern and rudder, none in line with the propeller tips, long axis along
 * the flow lines. On a structure the anodes are shared evenly over the piles (common practice). Pure.
 */

/** Spacing along the hull (design basis, placement, practice). */
export const HULL_ANODE_SPACING_M = 6;
/**
 * Share of all the hull's anodes at the stern and rudder (design basis line 64, practice: 15-20 %; some say a third,
 * some 40-50 %). The rudder and stern-frame zones count towards it; the bottom makes up the rest in its aft quarter.
 */
export const STERN_SHARE = 0.2;
/** How the stern's share is made up: the rudder and stern-frame zones first, the bottom's aft quarter for the rest. */
function sternWords(atStern: number, aft: number, needed: number): string {
  const zones = `the rudder and stern-frame zones hold ${atStern}`;
  if (needed === 0) return `${zones}, enough without adding any of the bottom's at the stern`;
  if (aft < needed) return `${zones}, and ${aft} of the ${needed} still needed come from the bottom, in its aft quarter (the bottom has no more)`;
  return `${zones}, and ${aft} of the bottom's ${aft === 1 ? 'goes' : 'go'} in its aft quarter to make it up`;
}

/** The aft part of the bottom that counts as "at the stern": its aft quarter. */
export const STERN_REACH_L = 0.25;
/** Design basis line 64: "not over fuel tanks if welded". */
export const FUEL_TANK_CAUTION = 'Not over fuel tanks if the anodes are welded (design basis, practice): check the tank plan.';
/** The heights proposed (0.07 T on the bottom, 0.6 T on the sides) are not in the design basis. */
const HEIGHT_ASSUMPTION = 'The height is an assumption (not in the design basis): set it from the shell expansion.';

export interface ProposalZone {
  name: string;
  kind: string;
  count: number;
}

export interface ProposalAsset {
  kind: 'vessel' | 'structure';
  lengthBppM?: number | null;
  draughtM?: number | null;
  frameSpacingM?: number | null;
  /** 'estimate' when the frame spacing on record is Tidewarden's estimate, not the yard's frame plan. */
  frameSpacingSource?: 'entered' | 'estimate' | null;
  /** A structure's type (STRUCTURE_TYPE_LABELS): sheet-pile walls and pontoons have no pile grid. */
  structureType?: string | null;
  pileCount?: number | null;
  pileRows?: number | null;
  pileBents?: number | null;
  /** 'estimate' when the rows and bents on record are estimated, not entered. */
  pileGridSource?: 'entered' | 'estimate' | null;
}

export interface ProposedPosition {
  zone: string;
  /** The position as text (what the form shows and the group keeps); parsePosition reads it back. Empty when none is proposed (the basis says why). */
  text: string;
  position: AnodePosition;
  /** Why it is placed so, naming the practice it follows. */
  basis: string;
}

/** The zone kinds of a hull (the anodes counted for the stern share). */
const HULL_KINDS = new Set(['hull-bottom', 'boot-top-sides', 'rudder', 'propeller-shaft', 'sea-chest', 'thruster-tunnel', 'other']);

const frame = (m: number, spacing: number) => Math.max(0, Math.round(m / spacing));

function hullProposal(a: ProposalAsset, z: ProposalZone, zones: readonly ProposalZone[]): { text: string; basis: string } {
  const L = a.lengthBppM ?? 0;
  const T = a.draughtM ?? 0;
  const spacing = a.frameSpacingM || (L ? estimatedFrameSpacingM(L) : 0);
  // Frame numbers from an estimated spacing go into the text the yard works from: the text says so.
  const estimated = !a.frameSpacingM || a.frameSpacingSource === 'estimate';
  const estimateWords = `frames from an estimated ${Math.round(spacing * 100) / 100} m spacing: check the frame plan`;
  const framed = (r: { text: string; basis: string }) => (estimated ? { text: `${r.text}; ${estimateWords}`, basis: `${r.basis} Frames from an estimated ${Math.round(spacing * 100) / 100} m spacing (0.002 L + 0.48 m, from memory of common practice, not in the design basis): check the frame plan.` } : r);
  const perSide = Math.ceil(z.count / 2);
  const spread = (fromM: number, toM: number) => {
    // About 6 m apart: the span the anodes of one side need, centred on the stretch, no longer than it.
    const need = Math.min(toM - fromM, Math.max(0, perSide - 1) * HULL_ANODE_SPACING_M);
    const mid = (fromM + toM) / 2;
    return [frame(mid - need / 2, spacing), frame(mid + need / 2, spacing)] as const;
  };
  const spacingWords = `about ${HULL_ANODE_SPACING_M} m apart`;
  switch (z.kind) {
    case 'rudder':
      return { text: 'Rudder P/S, both faces', basis: 'Rudder: the stern sees the highest flow (design basis, practice).' };
    case 'propeller-shaft':
      return { text: 'Stern frame and shaft brackets P/S, clear of propeller tips', basis: 'None in line with the propeller tips (design basis, practice).' };
    case 'sea-chest':
      return { text: 'Sea chest P/S aft, gratings', basis: 'Inside the sea chests, at the gratings (common practice).' };
    case 'thruster-tunnel':
      return { text: 'Bow thruster tunnel', basis: 'Inside the tunnel, clear of the blades (common practice).' };
    case 'boot-top-sides': {
      if (!L || !spacing) return { text: 'Boot-top and sides P/S', basis: 'Enter the length to propose frames.' };
      const [f0, f1] = spread(0.1 * L, 0.95 * L);
      return framed({ text: `Fr ${f0}-${f1} P/S, boot-top and sides, ${T ? `${Math.round(0.6 * T * 10) / 10} m above keel, ` : ''}${spacingWords}`, basis: `Along the flow lines, ${spacingWords} (design basis, practice). ${T ? `${HEIGHT_ASSUMPTION} ` : ''}${FUEL_TANK_CAUTION}` });
    }
    case 'hull-bottom': {
      // 15-20 % of all the hull's anodes at the stern and rudder: what the rudder and stern-frame zones do not
      // already have goes in the bottom's aft quarter (towards the propeller and rudder), the rest forward of it.
      if (!L || !spacing) return { text: 'Bottom P/S', basis: 'Enter the length to propose frames.' };
      const [f0, f1] = spread(0.08 * L, 0.92 * L);
      const total = zones.filter((x) => HULL_KINDS.has(x.kind)).reduce((n, x) => n + Math.max(0, x.count), 0);
      const atStern = zones.filter((x) => x.kind === 'rudder' || x.kind === 'propeller-shaft').reduce((n, x) => n + Math.max(0, x.count), 0);
      const needed = Math.max(0, Math.round(total * STERN_SHARE) - atStern);
      const aft = Math.min(z.count, needed);
      const aftWords = aft >= 1 ? `, ${aft} of them within Fr ${f0}-${Math.max(f0, frame(STERN_REACH_L * L, spacing))}` : '';
      const share = `${Math.round(STERN_SHARE * 100)} % of the hull's ${total} anodes at the stern and rudder (design basis, practice: 15-20 %; some say a third, some 40-50 %)`;
      return framed({
        text: `Fr ${f0}-${f1} P/S, bottom, ${T ? `${Math.round(0.07 * T * 10) / 10} m above keel, ` : ''}${spacingWords}${aftWords}`,
        basis: `${spacingWords}; ${share}: ${sternWords(atStern, aft, needed)}. ${T ? `${HEIGHT_ASSUMPTION} ` : ''}${FUEL_TANK_CAUTION}`,
      });
    }
    default:
      // A zone of another kind has no usual place on the hull: no frames are made up for it.
      return { text: '', basis: 'No position proposed for this kind of zone: enter where its anodes go.' };
  }
}

function pileProposal(a: ProposalAsset, z: ProposalZone): { text: string; basis: string } {
  // No invented piles: a sheet-pile wall is placed by chainage, a pontoon by its hull, and a pile grid only when its
  // rows and bents were entered.
  if (a.structureType === 'sheet-pile-wall') return { text: '', basis: 'No position proposed: a sheet-pile wall has no piles to share the anodes over. Enter where they go by chainage and depth (for example "Ch 120-180 m, 1.5 m below LAT").' };
  if (a.structureType === 'pontoon') return { text: '', basis: 'No position proposed: a pontoon has no pile grid. Enter where the anodes go on its hull.' };
  if (!a.pileRows || !a.pileBents || a.pileGridSource === 'estimate') return { text: '', basis: "No position proposed: the pile grid is not known. Enter the structure's rows and bents in its particulars, or enter the piles here." };
  const grid = pileGridOf({ pileCount: a.pileCount ?? null, pileRows: a.pileRows ?? null, pileBents: a.pileBents ?? null }, []);
  const piles = grid.rows * grid.bents;
  const per = z.count / piles;
  const each = Number.isInteger(per) ? `${per} per pile` : `${z.count} over ${piles} piles, evenly`;
  const where = z.kind.endsWith('mud') ? ', below the mudline' : '';
  return {
    text: `B1-A to B${grid.bents}-${rowLetter(grid.rows - 1)}, ${each}${where}`,
    basis: 'Evenly per pile (common practice; the design basis is silent on the split between piles).',
  };
}

/** Positions for each zone of a design that has anodes, in the zones' order. */
export function proposePositions(asset: ProposalAsset, zones: readonly ProposalZone[]): ProposedPosition[] {
  return zones
    .filter((z) => z.count > 0)
    .map((z) => {
      const { text, basis } = asset.kind === 'vessel' ? hullProposal(asset, z, zones) : pileProposal(asset, z);
      return { zone: z.name, text, position: text ? parsePosition(text, asset.kind) : { ...EMPTY_POSITION }, basis };
    });
}
