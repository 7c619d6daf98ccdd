/**
 * Fitting notes printed on the anode list, in our own words. Each note says to which lists it
 * applies, so a jetty's list does not talk about propellers, a diving campaign not about blasting
 * and painting, a dry-docking not about divers, and an all-welded list not about bolts. "(common practice)" marks common practice of the trade with no
 * single source (design-basis.md, Ship hulls, placement notes). No acceptance value is
 * invented: where a limit is needed the note points to the approved procedure.
 */
import type { AnodeListOccasion } from '@/lib/labels/anode-list';

/** Which lines a note is about (its `work` says at which kind of docking or campaign). */
export type FittingNoteScope = 'all' | 'welded' | 'bolted' | 'vessel';

export type FittingNoteWork = 'any' | AnodeListOccasion;

export interface FittingNote {
  id: string;
  scope: FittingNoteScope;
  /** A dry-docking's note, a diving campaign's, or both. */
  work: FittingNoteWork;
  text: string;
}

export const FITTING_NOTES: readonly FittingNote[] = [
  {
    id: 'mask',
    scope: 'all',
    work: 'docking',
    text: 'Mask every anode face before blasting and painting, and take the masking off again before the hull or structure goes back into the water. A masked anode gives no current.',
  },
  {
    id: 'no-paint',
    scope: 'all',
    work: 'docking',
    text: 'Never paint, coat or grease an anode face, and keep overspray off it.',
  },
  {
    id: 'dive-plan',
    scope: 'all',
    work: 'campaign',
    text: "All work under water to the diving contractor's approved dive plan and method statement, with the structure's or ship's own systems made safe (impressed-current systems, intakes, thrusters) before divers go in.",
  },
  {
    id: 'clean',
    scope: 'all',
    work: 'campaign',
    text: 'Clean marine growth, scale and corrosion products off each contact face or weld area back to bare metal before fitting (common practice). Never coat or grease an anode face.',
  },
  {
    id: 'welded',
    scope: 'welded',
    work: 'docking',
    text: 'Weld-on anodes: weld the straps, cores or legs to the approved welding procedure, never the anode body itself. Do not weld anodes over fuel tanks without the approval of the owner and class (common practice).',
  },
  {
    id: 'wet-welded',
    scope: 'welded',
    work: 'campaign',
    text: 'Weld-on anodes: weld the straps, cores or legs under water only to the approved wet-welding procedure, by a welder-diver qualified to it, never the anode body itself.',
  },
  {
    id: 'bolted',
    scope: 'bolted',
    work: 'any',
    text: 'Bolt-on anodes: fit them on clean, bare-metal contact faces and measure continuity to the hull after fitting. Accept each anode against the limit in the approved procedure, and refit any anode that fails.',
  },
  {
    id: 'flow',
    scope: 'vessel',
    work: 'any',
    text: 'Keep anodes out of line with the propeller blade tips, and fit them with their long axis along the flow lines (common practice).',
  },
  {
    id: 'positions',
    scope: 'all',
    work: 'any',
    text: "Fit at the positions listed. Where a position cannot be used, agree another with the owner's representative and note it on this list.",
  },
  {
    id: 'record',
    scope: 'all',
    work: 'docking',
    text: 'Record the positions and the quantities actually fitted, and enter them back in Tidewarden, so the register and the next forecast start from what is really installed.',
  },
  {
    id: 'wet-record',
    scope: 'all',
    work: 'campaign',
    text: 'Record the positions and the quantities actually fitted, with a photograph or video of each anode as fitted, and enter them back in Tidewarden, so the register and the next forecast start from what is really installed.',
  },
];

const WELDED_MOUNTINGS = new Set(['flush-weld', 'standoff', 'pile-mounted', 'bracelet']);
// Bracelets are welded or bolted depending on the make: both notes apply to them.
const BOLTED_MOUNTINGS = new Set(['flush-bolt', 'bracelet']);

/** The notes that apply to a list with these mountings on this kind of asset and work, in FITTING_NOTES order. */
export function fittingNotesFor(assetKind: 'vessel' | 'structure', mountings: Iterable<string>, occasion: AnodeListOccasion = assetKind === 'vessel' ? 'docking' : 'campaign'): string[] {
  const present = new Set(mountings);
  const welded = [...present].some((m) => WELDED_MOUNTINGS.has(m));
  const bolted = [...present].some((m) => BOLTED_MOUNTINGS.has(m));
  return FITTING_NOTES.filter((n) => n.work === 'any' || n.work === occasion).filter(
    (n) => n.scope === 'all' || (n.scope === 'welded' && welded) || (n.scope === 'bolted' && bolted) || (n.scope === 'vessel' && assetKind === 'vessel'),
  ).map((n) => n.text);
}
