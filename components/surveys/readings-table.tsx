'use client';
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { StatusTag } from '@/components/ui/panel';
import { POTENTIAL_STATUS_TONES } from '@/components/register/potential-tag';
import { REMAINING_STATUS_LABELS } from '@/lib/surveys/criteria';
import { fmt } from '@/lib/format';
import type { getSurveyDetails } from '@/lib/server/services/surveys/survey-details';

type Reading = Awaited<ReturnType<typeof getSurveyDetails>>['readings'][number];
const ELECTRODES: Record<string, string> = { 'ag-agcl-seawater': 'Ag/AgCl', cse: 'CSE', sce: 'SCE', zinc: 'Zn' };

/** Readings against the criteria: status in words, colour only as a second cue. */
export function ReadingsTable({ readings }: { readings: Reading[] }) {
  const columns = useMemo(() => {
    const col = createColumnHelper<Reading>();
    return [
      col.accessor('line', { header: 'Line', meta: { numeric: true }, cell: (c) => c.getValue() ?? '—' }),
      col.accessor('location', { header: 'Location' }),
      col.accessor('potentialV', { header: 'As measured', meta: { numeric: true }, cell: (c) => (c.getValue() === null ? '—' : `${fmt(c.getValue(), 3)} V ${ELECTRODES[c.row.original.electrode ?? ''] ?? ''}`) }),
      col.accessor('potentialAgAgClV', { header: 'vs Ag/AgCl/seawater', meta: { numeric: true }, cell: (c) => (c.getValue() === null ? '—' : `${fmt(c.getValue(), 3)} V`) }),
      col.accessor('potentialStatus', {
        header: 'Protection',
        cell: (c) =>
          c.getValue() ? (
            <span title={c.row.original.potentialMessage ?? undefined} data-status={c.getValue()}>
              <StatusTag tone={POTENTIAL_STATUS_TONES[c.getValue()!]}>{c.row.original.potentialLabel}</StatusTag>
              {c.row.original.potentialCriterion ? <span className="block text-2xs text-ink-faint">{c.row.original.potentialCriterion}</span> : null}
            </span>
          ) : (
            '—'
          ),
      }),
      col.accessor('group', { header: 'Anode group', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('remainingFraction', {
        header: 'Remaining',
        meta: { numeric: true },
        cell: (c) =>
          c.getValue() === null ? (
            '—'
          ) : (
            <span className="inline-flex items-center gap-1.5">
              {fmt(c.getValue()! * 100, 0)} %
              {c.row.original.remainingStatus ? <StatusTag tone={c.row.original.remainingStatus === 'sound' ? 'sound' : c.row.original.remainingStatus === 'renew-soon' ? 'due' : 'overdue'}>{REMAINING_STATUS_LABELS[c.row.original.remainingStatus]}</StatusTag> : null}
            </span>
          ),
      }),
      col.accessor('comment', { header: 'Comment', enableSorting: false, cell: (c) => <span className="text-xs">{c.getValue() ?? ''}</span> }),
    ];
  }, []);
  return <DataTable label="Readings" data={readings} columns={columns} pageSize={50} empty="No readings yet: upload a CSV or add them one by one." filterPlaceholder="Filter by location, group, status…" />;
}
