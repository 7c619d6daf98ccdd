'use client';
import { queryKeys } from '@/lib/client/query-client';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { ServerTable } from '@/components/ui/server-table';
import { StatusTag } from '@/components/ui/panel';
import { REMAINING_TONES } from '@/lib/status/palette';
import { ALLOY_LABELS } from '@/lib/labels';
import { classifyRemaining } from '@/lib/surveys/criteria';
import { REMAINING_STATUS_LABELS } from '@/lib/labels';
import { fmt } from '@/lib/format';
import { formatDateOnly } from '@/lib/dates/date-only';
import type { AnodeGroupRow } from '@/lib/server/services/register/list-anode-groups';

const day = (iso: string | null) => (iso ? formatDateOnly(iso) : '—');

/** The anode register: every fitted group, paged and sorted on the server. */
export function RegisterTable({ org, assetId, pageSize = 50 }: { org: string; assetId?: string; pageSize?: number }) {
  const [removed, setRemoved] = useState(false);
  const columns = useMemo(() => {
    const col = createColumnHelper<AnodeGroupRow>();
    return [
      ...(assetId ? [] : [col.accessor('assetName', { id: 'asset', header: 'Asset', cell: (c) => <Link className="text-tide-600 hover:underline" href={`/o/${org}/assets/${c.row.original.assetId}`}>{c.getValue()}</Link> })]),
      col.accessor('label', { id: 'label', header: 'Group' }),
      col.accessor('zoneName', { id: 'zone', header: 'Zone', cell: (c) => c.getValue() ?? '—' }),
      col.accessor((r) => r.model.designation, { id: 'model', header: 'Model', cell: (c) => `${c.getValue()} (${ALLOY_LABELS[c.row.original.model.alloy] ?? c.row.original.model.alloy})` }),
      col.accessor('quantity', { id: 'quantity', header: 'Qty', meta: { numeric: true } }),
      col.accessor((r) => r.quantity * r.model.netMassKg, { id: 'netMass', header: 'Net mass', meta: { numeric: true }, cell: (c) => `${fmt(c.getValue(), 1)} kg` }),
      col.accessor('positions', { id: 'positions', header: 'Positions', enableSorting: false, cell: (c) => <span className="line-clamp-2 max-w-56 text-xs">{c.getValue() ?? '—'}</span> }),
      col.accessor('installedOn', { id: 'installedOn', header: removed ? 'Installed / removed' : 'Installed', cell: (c) => (removed ? `${day(c.getValue())} / ${day(c.row.original.removedOn)}` : day(c.getValue())) }),
      col.accessor('lastRemainingFraction', {
        id: 'remaining',
        header: 'Last surveyed remaining',
        meta: { numeric: true },
        cell: (c) => {
          const f = c.getValue();
          if (f === null) return <span className="text-ink-faint">not surveyed</span>;
          const status = classifyRemaining(f, c.row.original.model.utilisationFactor);
          return (
            <span className="inline-flex items-center gap-1.5">
              {fmt(f * 100, 0)} %<span className="text-2xs text-ink-faint">{day(c.row.original.lastSurveyedOn)}</span>
              <StatusTag tone={REMAINING_TONES[status]}>{REMAINING_STATUS_LABELS[status]}</StatusTag>
            </span>
          );
        },
      }),
    ];
  }, [org, assetId, removed]);
  return (
    <ServerTable
      label="Anode register"
      url={`/api/orgs/${org}/anode-groups`}
      queryKey={queryKeys.anodeGroups(org)}
      columns={columns}
      pageSize={pageSize}
      extraParams={{ archived: removed ? '1' : '0', ...(assetId ? { assetId } : {}) }}
      filterPlaceholder="Filter by asset, group, zone, model, position…"
      empty={removed ? 'No removed groups.' : 'No anode groups recorded.'}
      toolbar={
        <div className="flex items-center gap-3 text-xs">
          <label className="flex items-center gap-2 text-ink-soft">
            <input type="checkbox" checked={removed} onChange={(e) => setRemoved(e.target.checked)} /> Removed groups (history)
          </label>
          {assetId ? null : (
            <a href={`/api/orgs/${org}/anode-groups/export`} className="rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-ink no-underline hover:bg-paper-sunk">
              Export CSV
            </a>
          )}
        </div>
      }
    />
  );
}
