'use client';
import { queryKeys } from '@/lib/client/query-client';
import Link from 'next/link';
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { formatDateOnly } from '@/lib/dates/date-only';
import { ServerTable } from '@/components/ui/server-table';
import { StatusTag } from '@/components/ui/panel';
import { POTENTIAL_TONES } from '@/lib/status/palette';
import { fmt } from '@/lib/format';
import type { SurveyListRow } from '@/lib/server/services/surveys/survey-details';
import { SURVEY_METHOD_LABELS } from '@/lib/labels';

export function SurveysTable({ org, assetId }: { org: string; assetId?: string }) {
  const columns = useMemo(() => {
    const col = createColumnHelper<SurveyListRow>();
    return [
      col.accessor('surveyedOn', { id: 'surveyedOn', header: 'Date', cell: (c) => <Link className="text-tide-600 hover:underline" href={`/o/${org}/surveys/${c.row.original.id}`}>{formatDateOnly(c.getValue())}</Link> }),
      col.accessor('assetName', { id: 'asset', header: 'Asset' }),
      col.accessor('method', { id: 'method', header: 'Method', cell: (c) => SURVEY_METHOD_LABELS[c.getValue()] ?? 'Other' }),
      col.accessor('surveyor', { id: 'surveyor', header: 'Surveyor', enableSorting: false, cell: (c) => c.getValue() ?? '—' }),
      col.accessor('readings', { id: 'readings', header: 'Readings', enableSorting: false, meta: { numeric: true } }),
      col.accessor('leastNegativeV', { id: 'leastNegative', header: 'Least negative (Ag/AgCl)', enableSorting: false, meta: { numeric: true }, cell: (c) => (c.getValue() === null ? '—' : `${fmt(c.getValue(), 3)} V`) }),
      col.accessor('underProtected', {
        id: 'under',
        header: 'Outcome',
        enableSorting: false,
        cell: (c) => (c.row.original.readings === 0 ? <StatusTag tone="neutral">No readings yet</StatusTag> : c.getValue() ? <StatusTag tone={POTENTIAL_TONES['under-protected']}>{c.getValue()} under-protected</StatusTag> : <StatusTag tone="sound">No under-protection</StatusTag>),
      }),
    ];
  }, [org]);
  return <ServerTable label="Surveys" url={`/api/orgs/${org}/surveys`} queryKey={queryKeys.surveys(org)} columns={columns} extraParams={assetId ? { assetId } : {}} filterPlaceholder="Filter by asset, surveyor, method…" empty="No surveys yet." />;
}
