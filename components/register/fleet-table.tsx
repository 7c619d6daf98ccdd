'use client';
import { queryKeys } from '@/lib/client/query-client';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { ServerTable } from '@/components/ui/server-table';
import { PotentialTag } from './potential-tag';
import { fmt } from '@/lib/format';
import { formatDateOnly } from '@/lib/dates/date-only';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';
import { ASSET_KIND_LABELS, MIXED_EVENT_WORDS, STRUCTURE_TYPE_LABELS, eventWords, forecastDateWords } from '@/lib/labels';

/** "Vessel · Ro-pax ferry" (the vessel type is the user's own words), "Structure · Dolphin" (a stored type, in words). */
function kindWords(r: Pick<FleetRow, 'kind' | 'type' | 'hullMaterial'>): string {
  const type = r.type ? (r.kind === 'structure' ? STRUCTURE_TYPE_LABELS[r.type] ?? r.type : r.type) : null;
  return [ASSET_KIND_LABELS[r.kind] ?? 'Asset', type, r.hullMaterial === 'aluminium' ? 'aluminium hull' : null].filter(Boolean).join(' · ');
}
import type { FleetRow } from '@/lib/server/services/assets/list-fleet';
import { OutlookTag } from '@/components/planner/outlook-tag';

export function FleetTable({ org }: { org: string }) {
  const [archived, setArchived] = useState(false);
  const columns = useMemo(() => {
    const col = createColumnHelper<FleetRow>();
    return [
      col.accessor('name', { id: 'name', header: 'Asset', cell: (c) => <Link className="font-medium text-tide-600 hover:underline" href={`/o/${org}/assets/${c.row.original.id}`}>{c.getValue()}</Link> }),
      col.accessor('kind', { id: 'kind', header: 'Kind', cell: (c) => kindWords(c.row.original) }),
      col.accessor('outlookWords', {
        id: 'outlook',
        header: 'Protection outlook',
        enableSorting: false,
        cell: (c) => {
          const o = c.row.original.outlook;
          if (!o) return '—';
          return (
            <span className="flex flex-col gap-0.5">
              <OutlookTag outlook={o} />
              {c.row.original.renewBy ? <span className="text-2xs text-state-action">{forecastDateWords('renewBy')} {formatDateOnly(c.row.original.renewBy)}, no {eventWords(c.row.original.kind).event} planned in time</span> : null}
            </span>
          );
        },
      }),
      col.accessor((r) => r.nextDocking?.date ?? null, {
        id: 'nextDocking',
        header: `Next ${MIXED_EVENT_WORDS.event}`,
        enableSorting: false,
        cell: (c) => {
          const d = c.row.original.nextDocking;
          if (!d) return <span className="text-ink-faint">none planned</span>;
          return (
            <span className="flex flex-col">
              <Link className="text-tide-600 hover:underline" href={`/o/${org}/dockings/${d.id}`}>{formatDateOnly(d.date)}</Link>
              <span className="num text-left text-2xs text-ink-soft">{fmt(c.row.original.massDueAtNextDockingKg, 0)} kg anodes due</span>
            </span>
          );
        },
      }),
      col.accessor('anodes', { id: 'anodes', header: 'Anodes fitted', meta: { numeric: true }, cell: (c) => `${c.getValue()} in ${c.row.original.groups} group${c.row.original.groups === 1 ? '' : 's'}` }),
      col.accessor('netMassKg', { id: 'netMass', header: 'Net mass', meta: { numeric: true }, cell: (c) => `${fmt(c.getValue(), 0)} kg` }),
      col.accessor('lastSurveyedOn', { id: 'lastSurvey', header: 'Last survey', cell: (c) => { const day = c.getValue(); return day ? formatDateOnly(day) : 'none'; } }),
      col.display({
        id: 'potentials',
        header: 'Latest potentials (Ag/AgCl)',
        cell: (c) => {
          const r = c.row.original;
          if (r.lastSurveyLeastNegativeV === null) return <span className="text-ink-faint">—</span>;
          const criteria = surveyCriteriaOf(r);
          return (
            <span className="flex flex-col gap-0.5">
              <PotentialTag valueV={r.lastSurveyLeastNegativeV} criteria={criteria} />
              {r.lastSurveyMostNegativeV !== null && r.lastSurveyMostNegativeV !== r.lastSurveyLeastNegativeV ? <PotentialTag valueV={r.lastSurveyMostNegativeV} criteria={criteria} /> : null}
            </span>
          );
        },
      }),
    ];
  }, [org]);
  return (
    <ServerTable
      label="Fleet"
      url={`/api/orgs/${org}/assets`}
      queryKey={queryKeys.assets(org)}
      columns={columns}
      extraParams={{ archived: archived ? '1' : '0' }}
      filterPlaceholder="Filter by name, type, location…"
      empty={archived ? 'No archived assets.' : 'No assets yet.'}
      toolbar={
        <label className="flex items-center gap-2 text-xs text-ink-soft">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> Show archived assets
        </label>
      }
    />
  );
}
