'use client';
import { useEffect, useState } from 'react';
import type { DrawnGroup, DrawnReading } from '@/lib/drawings/hull-drawing';
import { pileElevationView, pileStates } from '@/lib/drawings/pile-plan';
import { DrawingSvg } from './drawing-svg';

/** The elevation of the pile chosen on the plan (the link's #pile-<bent>-<row>), computed from the plan's own data. */
export function PileElevation({ grid, groups, readings }: { grid: { rows: number; bents: number }; groups: DrawnGroup[]; readings: DrawnReading[] }) {
  const [key, setKey] = useState<string | null>(null);
  useEffect(() => {
    const read = () => setKey(/^#pile-(\d+-[A-Z]{1,2})$/.exec(window.location.hash)?.[1] ?? null);
    read();
    window.addEventListener('hashchange', read);
    return () => window.removeEventListener('hashchange', read);
  }, []);
  const state = key ? pileStates(grid, groups, readings).find((s) => s.pile.key === key) : undefined;
  return (
    // The plan's pile links point here: the elevation takes the id of the pile it shows.
    <div id={state ? `pile-${state.pile.key}` : undefined} aria-live="polite" className="mt-3 scroll-mt-24" data-testid="pile-elevation">
      {state ? (
        <DrawingSvg view={pileElevationView(state)} idPrefix="pile-elevation" className="w-full max-w-md rounded-[3px] border border-rule bg-white" />
      ) : (
        <p className="text-sm text-ink-soft">Choose a pile on the plan to see its elevation: its anodes by depth and the readings taken on it.</p>
      )}
    </div>
  );
}
