'use client';
import Link from 'next/link';
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { format } from 'date-fns';
import { DataTable } from '@/components/ui/data-table';
import { StatusTag } from '@/components/ui/panel';
import { DESIGN_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { useDesigns } from '@/lib/client/use-designs';
import { CRITERION_LABELS, STATUS_LABELS } from '@/lib/labels';
import { fmt } from '@/lib/format';
import type { DesignListRow } from '@/lib/server/services/designs/list-designs';

export function DesignsList({ org, initial }: { org: string; initial: DesignListRow[] }) {
  const designs = useDesigns(org, initial);
  const columns = useMemo(() => {
    const col = createColumnHelper<DesignListRow>();
    return [
      col.accessor('assetName', { header: 'Asset' }),
      col.accessor('title', { header: 'Design', cell: (c) => <Link className="text-tide-600 hover:underline" href={`/o/${org}/designs/${c.row.original.id}`}>{c.getValue()}</Link> }),
      col.accessor('revision', { header: 'Rev.', meta: { numeric: true } }),
      col.accessor('status', {
        header: 'Status',
        cell: (c) => <StatusTag tone={toneOf(DESIGN_STATUS_TONES, c.getValue())}>{STATUS_LABELS[c.getValue()]}</StatusTag>,
      }),
      col.accessor('anodeCount', { header: 'Anodes', meta: { numeric: true }, cell: (c) => (c.row.original.hasError ? 'needs inputs' : (c.getValue() ?? '–')) }),
      col.accessor('governingCriterion', { header: 'Governed by', cell: (c) => (c.getValue() ? CRITERION_LABELS[c.getValue()!] : '–') }),
      col.accessor('installedNetMassKg', { header: 'Net mass kg', meta: { numeric: true }, cell: (c) => fmt(c.getValue(), 0) }),
      col.accessor('warningCount', { header: 'Warnings', meta: { numeric: true } }),
      col.accessor('preparedBy', { header: 'Prepared by' }),
      col.accessor('approvedBy', { header: 'Approved by', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('updatedAt', { header: 'Updated', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy') }),
    ];
  }, [org]);
  if (designs.isError) return <p role="alert" className="text-sm text-state-action">{designs.error.message}</p>;
  return <DataTable label="Designs" data={designs.data ?? []} columns={columns} empty="No designs yet." filterPlaceholder="Filter by asset, title, person…" />;
}
