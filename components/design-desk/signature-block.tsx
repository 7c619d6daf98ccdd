'use client';
import { format } from 'date-fns';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/field';
import { useBoundAction } from '@/components/ui/action-form';
import { approveDesignAction, checkDesignAction, newRevisionAction } from '@/app/o/[org]/designs/actions';
import { TableFrame } from '@/components/ui/table-frame';

interface Props {
  org: string;
  designId: string;
  status: string;
  prepared: { name: string | null; at: string };
  checked: { name: string | null; at: string | null } | null;
  approved: { name: string | null; at: string | null } | null;
  can: { check: boolean; approve: boolean; revise: boolean };
  reason: string | null;
}

const when = (iso: string | null) => (iso ? format(new Date(iso), 'd MMM yyyy HH:mm') : '');

/** Prepared / checked / approved, with the actions the signed-in member may take. */
export function SignatureBlock({ org, designId, status, prepared, checked, approved, can, reason }: Props) {
  // checkDesign and approveDesign revalidate this page: the answer brings the new badge and read-only desk.
  const check = useBoundAction(checkDesignAction.bind(null, org), { refresh: false });
  const approve = useBoundAction(approveDesignAction.bind(null, org), { refresh: false });
  const revise = useBoundAction(newRevisionAction.bind(null, org));
  return (
    <div className="flex flex-col gap-3">
      <TableFrame label="Revision block">
      <table className="w-full text-sm" aria-label="Revision block">
        <tbody>
          <tr className="border-b border-rule">
            <th className="w-28 py-1 text-left text-xs font-medium text-ink-soft">Prepared</th>
            <td className="py-1">{prepared.name}</td>
            <td className="num py-1 text-xs text-ink-soft">{when(prepared.at)}</td>
          </tr>
          <tr className="border-b border-rule">
            <th className="py-1 text-left text-xs font-medium text-ink-soft">Checked</th>
            <td className="py-1">{checked?.name ?? '—'}</td>
            <td className="num py-1 text-xs text-ink-soft">{when(checked?.at ?? null)}</td>
          </tr>
          <tr>
            <th className="py-1 text-left text-xs font-medium text-ink-soft">Approved</th>
            <td className="py-1">{approved?.name ?? '—'}</td>
            <td className="num py-1 text-xs text-ink-soft">{when(approved?.at ?? null)}</td>
          </tr>
        </tbody>
      </table>
      </TableFrame>
      <FormMessage state={check.state} />
      <FormMessage state={approve.state} />
      <FormMessage state={revise.state} />
      <div className="no-print flex flex-wrap gap-2">
        {can.check && status === 'draft' ? (
          <form action={check.action}>
            <input type="hidden" name="designId" value={designId} />
            <Button type="submit" variant="secondary" disabled={check.pending}>Sign as checker</Button>
          </form>
        ) : null}
        {can.approve && status !== 'approved' ? (
          <form action={approve.action} onSubmit={(e) => { if (!confirm('Approve this revision? It cannot change afterwards.')) e.preventDefault(); }}>
            <input type="hidden" name="designId" value={designId} />
            <Button type="submit" disabled={approve.pending}>Approve revision</Button>
          </form>
        ) : null}
        {can.revise ? (
          <form action={revise.action}>
            <input type="hidden" name="designId" value={designId} />
            <Button type="submit" variant="secondary" disabled={revise.pending}>Make a new revision</Button>
          </form>
        ) : null}
      </div>
      {reason ? <p className="text-xs text-ink-faint">{reason}</p> : null}
    </div>
  );
}
