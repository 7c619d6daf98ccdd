import type { Metadata } from 'next';
import Link from 'next/link';
import { format } from 'date-fns';
import { getPageOrgContextWith } from '@/lib/server/page-context';
import { getAuditLog } from '@/lib/server/services/accounts/get-audit-log';
import { PageHeader } from '@/components/ui/panel';
import { TableFrame } from '@/components/ui/table-frame';

export const metadata: Metadata = { title: 'Audit log' };
const PAGE_SIZE = 50;

export default async function AuditPage({ params, searchParams }: { params: Promise<{ org: string }>; searchParams: Promise<{ page?: string }> }) {
  const { org } = await params;
  const page = Math.max(1, Number((await searchParams).page) || 1);
  const ctx = await getPageOrgContextWith(org, 'audit:read');
  const { rows, total } = await getAuditLog(ctx, { page, pageSize: PAGE_SIZE });
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  return (
    <>
      <PageHeader title="Audit log" subtitle={`${total} event${total === 1 ? '' : 's'}: sign-ins, role changes, invitations, approvals and deletions.`} />
      <TableFrame label="Audit log" head="sunk">
      <table className="w-full border-collapse rounded-[3px] border border-rule bg-paper-raised text-sm" aria-label="Audit log">
        <thead className="bg-paper-sunk text-xs text-ink-soft">
          <tr>
            <th className="px-3 py-2 text-left font-medium">When (UTC)</th>
            <th className="px-3 py-2 text-left font-medium">Who</th>
            <th className="px-3 py-2 text-left font-medium">What</th>
            <th className="px-3 py-2 text-left font-medium">Details</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-t border-rule">
              <td className="num px-3 py-1.5 text-left">{format(new Date(r.at), 'yyyy-MM-dd HH:mm:ss')}</td>
              <td className="px-3 py-1.5">{r.actor ?? 'system'}</td>
              <td className="px-3 py-1.5 font-medium">{r.action}</td>
              <td className="px-3 py-1.5 text-xs text-ink-soft">{r.details ? Object.entries(r.details).map(([k, v]) => `${k}: ${String(v)}`).join(' · ') : ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
      </TableFrame>
      <p className="mt-3 flex gap-3 text-xs">
        {page > 1 ? <Link href={`?page=${page - 1}`} className="text-tide-600 underline">Newer</Link> : null}
        <span className="text-ink-soft">Page {page} of {pages}</span>
        {page < pages ? <Link href={`?page=${page + 1}`} className="text-tide-600 underline">Older</Link> : null}
      </p>
    </>
  );
}
