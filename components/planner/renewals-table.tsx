'use client';
import { useEffect, useMemo } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { ActionError, useBoundAction } from '@/components/ui/action-form';
import { StatusTag } from '@/components/ui/panel';
import { RENEWAL_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { fetchJson, queryKeys } from '@/lib/client/query-client';
import { fmt } from '@/lib/format';
import { todayDateOnly } from '@/lib/dates/date-only';
import type { DockingRenewalRow } from '@/lib/server/services/planner/docking-renewals';
import { renewalStepAction } from '@/app/o/[org]/dockings/actions';
import { RENEWAL_REASON_LABELS, RENEWAL_STATUS_LABELS } from '@/lib/labels';

const STATUS_WORDS = RENEWAL_STATUS_LABELS;

function Steps({ org, row, dockingId, canEdit, dockings }: { org: string; row: DockingRenewalRow; dockingId: string; canEdit: boolean; dockings: { id: string; label: string }[] }) {
  const { state, action, pending } = useBoundAction(renewalStepAction.bind(null, org), { invalidate: [queryKeys.dockingRenewals(org, dockingId)] });
  if (!canEdit || row.status === 'fitted' || row.status === 'cancelled') return null;
  const today = todayDateOnly();
  return (
    <form action={action} className="flex flex-wrap items-center gap-1">
      <input type="hidden" name="renewalId" value={row.id} />
      <input type="hidden" name="notes" value={row.notes ?? ''} />
      {row.status === 'proposed' || row.status === 'confirmed' ? (
        <>
          <input type="number" name="quantity" min={1} step={1} defaultValue={row.quantity} aria-label={`Quantity to renew, ${row.groupLabel}`} className="num w-14 rounded-[3px] border border-rule-strong px-1 py-0.5 text-xs max-lg:min-h-11" />
          <select name="dockingId" defaultValue={dockingId} aria-label={`Docking for ${row.groupLabel}`} className="max-w-36 rounded-[3px] border border-rule-strong px-1 py-0.5 text-xs max-lg:min-h-11">
            {dockings.map((d) => (
              <option key={d.id} value={d.id}>
                {d.label}
              </option>
            ))}
          </select>
          <Button type="submit" name="step" value="update" variant="ghost" className="text-xs" disabled={pending}>
            Save<span className="sr-only"> quantity and docking of {row.groupLabel}</span>
          </Button>
        </>
      ) : (
        <input type="hidden" name="dockingId" value={dockingId} />
      )}
      {row.status === 'proposed' ? (
        <Button type="submit" name="step" value="confirm" className="text-xs" disabled={pending} aria-label={`Confirm renewal of ${row.groupLabel}`}>
          Confirm
        </Button>
      ) : null}
      {row.status === 'confirmed' ? (
        <Button type="submit" name="step" value="ordered" variant="secondary" className="text-xs" disabled={pending}>
          Mark ordered<span className="sr-only">: {row.groupLabel}</span>
        </Button>
      ) : null}
      {row.status === 'confirmed' || row.status === 'ordered' ? (
        <>
          <input type="date" name="fittedOn" defaultValue={today} max={today} aria-label={`Fitted on, ${row.groupLabel}`} className="rounded-[3px] border border-rule-strong px-1 py-0.5 text-xs max-lg:min-h-11" />
          <Button type="submit" name="step" value="fitted" variant="secondary" className="text-xs" disabled={pending}>
            Fitted<span className="sr-only">: {row.groupLabel}</span>
          </Button>
        </>
      ) : null}
      <Button type="submit" name="step" value="cancel" variant="ghost" className="text-xs" disabled={pending}>
        Cancel<span className="sr-only"> the renewal of {row.groupLabel}</span>
      </Button>
      <ActionError state={state} className="w-full" />
    </form>
  );
}

export function RenewalsTable({ org, dockingId, initial, canEdit, dockings }: { org: string; dockingId: string; initial: DockingRenewalRow[]; canEdit: boolean; dockings: { id: string; label: string }[] }) {
  const client = useQueryClient();
  const key = useMemo(() => queryKeys.dockingRenewals(org, dockingId), [org, dockingId]);
  // After a server action the page is rendered again with fresh rows: they replace the cached ones.
  useEffect(() => {
    client.setQueryData(key, initial);
  }, [client, key, initial]);
  const query = useQuery({
    queryKey: key,
    queryFn: async () => (await fetchJson<{ renewals: DockingRenewalRow[] }>(`/api/orgs/${org}/dockings/${dockingId}/renewals`)).renewals,
    initialData: initial,
  });
  const columns = useMemo(() => {
    const col = createColumnHelper<DockingRenewalRow>();
    return [
      col.accessor('zone', { header: 'Zone', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('groupLabel', { header: 'Group' }),
      col.accessor('designation', { header: 'Model' }),
      col.accessor('quantity', { header: 'Qty', meta: { numeric: true } }),
      col.accessor((r) => r.quantity * r.netMassKg, { id: 'net', header: 'Net mass', meta: { numeric: true }, cell: (c) => `${fmt(c.getValue(), 1)} kg` }),
      col.accessor('reason', {
        header: 'Reason',
        // The scheduler's sentence (with the renew-by date and the margin) in words on the page, not in a tooltip.
        cell: (c) => (
          <span className="flex min-w-[16rem] max-w-md flex-col">
            <span>{RENEWAL_REASON_LABELS[c.getValue()] ?? 'Other'}</span>
            {c.row.original.rationale ? <span className="text-2xs text-ink-soft">{c.row.original.rationale}</span> : null}
          </span>
        ),
      }),
      col.accessor('status', { header: 'Status', cell: (c) => <StatusTag tone={toneOf(RENEWAL_STATUS_TONES, c.getValue())}>{STATUS_WORDS[c.getValue()] ?? c.getValue()}</StatusTag> }),
      col.display({ id: 'steps', header: () => <span className="sr-only">Next step</span>, cell: (c) => <Steps org={org} row={c.row.original} dockingId={dockingId} canEdit={canEdit} dockings={dockings} /> }),
    ];
    // The docking choices are compared by content: a refreshed page passes an equal but new array.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [org, dockingId, canEdit, JSON.stringify(dockings)]);
  const rows = query.data ?? [];
  const open = rows.filter((r) => r.status !== 'cancelled' && r.status !== 'fitted');
  return (
    <div className="flex flex-col gap-2">
      <DataTable label="Renewals" data={rows} columns={columns} pageSize={100} empty="No renewals booked at this docking." filterPlaceholder="Filter by zone, group, model…" />
      <p className="num text-left text-xs whitespace-normal text-ink-soft">
        Open: {open.reduce((t, r) => t + r.quantity, 0)} anodes, {fmt(open.reduce((t, r) => t + r.quantity * r.netMassKg, 0), 1)} kg net. Proposals are the scheduler&apos;s and follow the forecast; a confirmed renewal is never changed by it.
      </p>
    </div>
  );
}
