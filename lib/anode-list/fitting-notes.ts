/**
 * Fitting notes printed on the dry-dock anode list, in our own words. Each note says to
 * which lines it applies, so a jetty's list does not talk about propellers and an all-welded
 * list does not talk about bolts. "(practice)" marks common practice of the trade with no
 * single source (design-basis.md, Ship hulls, placement notes). No acceptance value is
 * invented: where a limit is needed the note points to the approved procedure.
 */
export type FittingNoteScope = 'all' | 'welded' | 'bolted' | 'vessel';

export interface FittingNote {
  id: string;
  scope: FittingNoteScope;
  text: string;
}

export const FITTING_NOTES: readonly FittingNote[] = [
  {
    id: 'mask',
    scope: 'all',
    text: 'Mask every anode face before blasting and painting, and take the masking off again before the hull or structure goes back into the water. A masked anode gives no current.',
  },
  {
    id: 'no-paint',
    scope: 'all',
    text: 'Never paint, coat or grease an anode face, and keep overspray off it.',
  },
  {
    id: 'welded',
    scope: 'welded',
    text: 'Weld-on anodes: weld the straps, cores or legs to the approved welding procedure, never the anode body itself. Do not weld anodes over fuel tanks without the approval of the owner and class (practice).',
  },
  {
    id: 'bolted',
    scope: 'bolted',
    text: 'Bolt-on anodes: fit them on clean, bare-metal contact faces and measure continuity to the hull after fitting. Accept each anode against the limit in the approved procedure, and refit any anode that fails.',
  },
  {
    id: 'flow',
    scope: 'vessel',
    text: 'Keep anodes out of line with the propeller blade tips, and fit them with their long axis along the flow lines (practice).',
  },
  {
    id: 'positions',
    scope: 'all',
    text: "Fit at the positions listed. Where a position cannot be used, agree another with the owner's representative and note it on this list.",
  },
  {
    id: 'record',
    scope: 'all',
    text: 'Record the positions and the quantities actually fitted, and enter them back in Tidewarden, so the register and the next forecast start from what is really installed.',
  },
];

const WELDED_MOUNTINGS = new Set(['flush-weld', 'standoff', 'pile-mounted', 'bracelet']);
// Bracelets are welded or bolted depending on the make: both notes apply to them.
const BOLTED_MOUNTINGS = new Set(['flush-bolt', 'bracelet']);

/** The notes that apply to a list with these mountings on this kind of asset, in FITTING_NOTES order. */
export function fittingNotesFor(assetKind: 'vessel' | 'structure', mountings: Iterable<string>): string[] {
  const present = new Set(mountings);
  const welded = [...present].some((m) => WELDED_MOUNTINGS.has(m));
  const bolted = [...present].some((m) => BOLTED_MOUNTINGS.has(m));
  return FITTING_NOTES.filter(
    (n) => n.scope === 'all' || (n.scope === 'welded' && welded) || (n.scope === 'bolted' && bolted) || (n.scope === 'vessel' && assetKind === 'vessel'),
  ).map((n) => n.text);
}
