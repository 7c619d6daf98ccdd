import type { AssetDrawingResult } from '@/lib/drawings/asset-drawing';
import { DrawingSvg, PatternDefs } from './drawing-svg';
import { PileElevation } from './pile-elevation';
import { StaticHtml } from '@/components/ui/static-html';
import type { SafeHtml } from '@/lib/figures/markup';
import { drawingListHtml } from '@/components/register/asset-page-markup';

/**
 * The asset's drawing on its page: the views (hull from starboard and from port, or the pile plan with a pile's
 * elevation on choosing it), the key, what is estimated, and the text alternative: every group with its position,
 * count, remaining fraction and latest readings in words. Each group on the drawing links to its row here. The views
 * are drawn from their images (their own addresses, kept by the browser): the page carries the links over them.
 */
/** The id of the drawing's list of groups (the views' description). */
export const DRAWING_LIST_ID = 'drawing-groups';

export function AssetDrawingPanel({ result, imageHrefs, listMarkup, printLinks }: { result: AssetDrawingResult; /** Each view's image address (asset-figures.ts), by view id. */ imageHrefs: Record<string, string>; /** The key, notes and list (drawingListHtml with DRAWING_LIST_ID) when the caller built them already. */ listMarkup?: SafeHtml | null; printLinks?: React.ReactNode }) {
  if (!result.drawing) return <p className="text-sm text-ink-soft">{result.missing}</p>;
  const d = result.drawing;
  const listId = DRAWING_LIST_ID;
  return (
    <div className="relative flex flex-col gap-3" data-drawing={d.kind}>
      <PatternDefs />
      {d.views.map((view) => (
        // On a phone the drawing keeps a legible size and scrolls sideways rather than shrinking to the screen.
        <div key={view.id} role="region" aria-label={`${view.title}: scrolls sideways on a narrow screen`} tabIndex={0} className="max-w-full overflow-x-auto">
          <DrawingSvg view={view} imageHref={imageHrefs[view.id] ?? ''} idPrefix={`drawing-${view.id}`} describedBy={listId} className="w-full min-w-[40rem] rounded-[3px] border border-rule bg-white" />
        </div>
      ))}
      {d.kind === 'piles' && d.grid ? <PileElevation grid={d.grid} groups={d.groups} readings={d.readings} /> : null}
      <StaticHtml markup={listMarkup ?? drawingListHtml(d, listId)} />
      {printLinks}
    </div>
  );
}
