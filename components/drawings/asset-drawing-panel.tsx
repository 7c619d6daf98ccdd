import type { AssetDrawingResult } from '@/lib/drawings/asset-drawing';
import { DrawingSvg, KeySwatch, PatternDefs } from './drawing-svg';
import { PileElevation } from './pile-elevation';
import { TableFrame } from '@/components/ui/table-frame';

/**
 * The asset's drawing on its page: the views (hull from starboard and from port, or the pile plan with a pile's
 * elevation on choosing it), the key, what is estimated, and the text alternative: every group with its position,
 * count, remaining fraction and latest readings in words. Each group on the drawing links to its row here.
 */
export function AssetDrawingPanel({ result, printLinks }: { result: AssetDrawingResult; printLinks?: React.ReactNode }) {
  if (!result.drawing) return <p className="text-sm text-ink-soft">{result.missing}</p>;
  const d = result.drawing;
  const listId = 'drawing-groups';
  return (
    <div className="relative flex flex-col gap-3" data-drawing={d.kind}>
      <PatternDefs />
      {d.views.map((view) => (
        // On a phone the drawing keeps a legible size and scrolls sideways rather than shrinking to the screen.
        <div key={view.id} role="region" aria-label={`${view.title}: scrolls sideways on a narrow screen`} tabIndex={0} className="max-w-full overflow-x-auto">
          <DrawingSvg view={view} idPrefix={`drawing-${view.id}`} describedBy={listId} className="w-full min-w-[40rem] rounded-[3px] border border-rule bg-white" />
        </div>
      ))}
      {d.kind === 'piles' && d.grid ? <PileElevation grid={d.grid} groups={d.groups} readings={d.readings} /> : null}
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Key to the drawing">
        {d.key.map((k) => (
          <li key={k.role} className="flex items-center gap-1.5">
            <KeySwatch role={k.role} />
            {k.label}
          </li>
        ))}
      </ul>
      {d.notes.map((n) => (
        <p key={n} className="text-xs text-ink-soft">{n}</p>
      ))}
      <TableFrame label="Anode groups on the drawing">
        <table id={listId} className="w-full text-sm" aria-label="Anode groups on the drawing">
          <thead className="text-xs text-ink-soft">
            <tr className="border-b border-rule">
              <th className="py-1 text-left font-medium">Group</th>
              <th className="py-1 text-left font-medium">Where</th>
              <th className="py-1 text-right font-medium">Anodes</th>
              <th className="py-1 pl-3 pr-3 text-left font-medium">Left today (forecast)</th>
              <th className="py-1 text-left font-medium">Latest readings</th>
            </tr>
          </thead>
          <tbody>
            {d.rows.map((r) => (
              <tr key={r.id} id={`drawing-group-${r.id}`} className="scroll-mt-24 border-b border-rule align-top target:bg-paper-sunk target:outline target:outline-2 target:outline-ink-soft">
                <th scope="row" className="py-1 text-left font-medium">{r.label}</th>
                <td className="py-1">
                  {r.where}
                  {r.note ? <span className="block text-xs text-ink-soft">{r.note}</span> : null}
                  {!r.drawn ? <span className="block text-xs text-ink-soft">Not on the drawing: the position names no {d.kind === 'hull' ? 'frames or part of the hull' : 'pile, bent or row'}.</span> : null}
                </td>
                <td className="num py-1">{r.count}</td>
                <td className="whitespace-nowrap py-1 pl-3 pr-3">{r.remaining}</td>
                <td className="py-1 text-xs">{r.readings ?? '—'}</td>
              </tr>
            ))}
            {!d.rows.length ? (
              <tr>
                <td colSpan={5} className="py-3 text-center text-ink-faint">No anode groups fitted.</td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </TableFrame>
      {printLinks}
    </div>
  );
}
