import type { Metadata } from 'next';
import Link from 'next/link';
import { getPageOrgContext } from '@/lib/server/page-context';
import { allowed } from '@/lib/server/org-context';
import { getPlannerView } from '@/lib/server/services/planner/planner-view';
import { fmt } from '@/lib/format';
import { formatDateOnly } from '@/lib/dates/date-only';
import { FORECAST_DATE_LABELS, dockingKindWords, eventWords, forecastDateWords } from '@/lib/labels';
import { Caution, PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { Timeline } from '@/components/planner/timeline';
import { AcceptSuggestion, DockingForm } from '@/components/planner/docking-form';
import { TableFrame } from '@/components/ui/table-frame';

export const metadata: Metadata = { title: 'Docking planner' };


export default async function DockingsPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const today = new Date();
  const view = await getPlannerView(ctx, today);
  const canPlan = allowed(ctx, 'docking:write');
  const upcoming = view.dockings.filter((d) => d.status === 'planned');
  return (
    <>
      <PageHeader title="Docking planner" subtitle="Dry-dockings and diving campaigns across the fleet, the anode renewals booked at each, and where a docking is needed." />
      <div className="flex flex-col gap-4">
        <Panel title="Timeline">
          <Timeline org={org} assets={view.assets} dockings={view.dockings} needsDocking={view.needsDocking} today={today} />
          <p className="mt-2 text-xs text-ink-soft">{view.renewalRule}</p>
        </Panel>
        {view.needsDocking.length ? (
          <Panel title="Groups that cannot wait for a planned docking">
            <ul className="flex flex-col gap-1 text-sm" aria-label="Groups that cannot wait for a planned docking">
              {view.needsDocking.map((n, i) => (
                <li key={i} className="flex flex-col">
                  <span className="flex flex-wrap items-center gap-2">
                    <StatusTag tone="action">{n.overdue ? 'Overdue' : 'Needs an earlier docking'}</StatusTag>
                    <span className="min-w-0">
                    <Link href={`/o/${org}/assets/${n.assetId}`} className="text-tide-600 hover:underline">{n.assetName}</Link>: {n.group}, {forecastDateWords('renewBy')} <strong>{formatDateOnly(n.renewBy)}</strong>
                    </span>
                  </span>
                  <span className="text-xs text-ink-soft">{n.reason}</span>
                </li>
              ))}
            </ul>
          </Panel>
        ) : null}
        {view.renewBy.length ? (
          <Panel title="Renewals by renew-by date">
            <p className="mb-2 text-sm text-ink-soft">{view.marginWords}</p>
            <TableFrame label="Renew-by dates">
            <table className="w-full text-sm" aria-label="Renew-by dates">
              <thead className="text-xs text-ink-soft">
                <tr className="border-b border-rule">
                  <th className="py-1 text-left font-medium">{FORECAST_DATE_LABELS.renewBy}</th>
                  <th className="py-1 text-left font-medium">Asset</th>
                  <th className="py-1 text-left font-medium">Group</th>
                  <th className="py-1 text-left font-medium">Renewal</th>
                </tr>
              </thead>
              <tbody>
                {view.renewBy.map((r) => (
                  <tr key={r.groupId} className="border-b border-rule align-top">
                    <td className="py-1.5">{formatDateOnly(r.renewBy)}</td>
                    <td className="py-1.5"><Link href={`/o/${org}/assets/${r.assetId}`} className="text-tide-600 hover:underline">{r.assetName}</Link></td>
                    <td className="py-1.5">{r.group}</td>
                    <td className="py-1.5">
                      <span className="flex flex-wrap items-center gap-2">
                        {r.overdue || r.status === 'no-docking' ? <StatusTag tone="action">{r.overdue ? 'Overdue' : `Needs a ${eventWords(r.assetKind).event}`}</StatusTag> : null}
                        {r.dockingId ? (
                          <Link className="text-tide-600 hover:underline" href={`/o/${org}/dockings/${r.dockingId}`}>{r.words}</Link>
                        ) : (
                          <span>{r.words}</span>
                        )}
                      </span>
                      <span className="block text-xs text-ink-soft">{r.reason}</span>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            </TableFrame>
          </Panel>
        ) : null}
        <div className={`grid grid-cols-1 items-start gap-4 ${canPlan ? 'xl:grid-cols-[minmax(0,1fr)_22rem]' : ''}`}>
          <Panel title="Planned dockings and campaigns">
            <TableFrame label="Planned dockings">
            <table className="w-full text-sm" aria-label="Planned dockings">
              <thead className="text-xs text-ink-soft">
                <tr className="border-b border-rule">
                  <th className="py-1 text-left font-medium">Start</th>
                  <th className="py-1 text-left font-medium">Asset</th>
                  <th className="py-1 text-left font-medium">Kind</th>
                  <th className="py-1 text-left font-medium">Yard or contractor</th>
                  <th className="py-1 text-right font-medium">Renewals</th>
                  <th className="py-1 text-right font-medium">Anode mass due</th>
                </tr>
              </thead>
              <tbody>
                {upcoming.map((d) => (
                  <tr key={d.id} className="border-b border-rule">
                    <td className="py-1.5"><Link className="text-tide-600 hover:underline" href={`/o/${org}/dockings/${d.id}`}>{formatDateOnly(d.start)}</Link></td>
                    <td className="py-1.5">{d.assetName}</td>
                    <td className="py-1.5">{dockingKindWords(d.kind)}</td>
                    <td className="py-1.5">{d.yard ?? '—'}</td>
                    <td className="num py-1.5">{d.openRenewals}</td>
                    <td className="num py-1.5">{fmt(d.massDueKg, 0)} kg</td>
                  </tr>
                ))}
                {!upcoming.length ? (
                  <tr><td colSpan={6} className="py-4 text-center text-ink-faint">No dockings planned.</td></tr>
                ) : null}
              </tbody>
            </table>
            </TableFrame>
            {view.suggestions.length ? (
              <div className="mt-4">
                <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Suggested dockings: earlier ones for renewals that cannot wait, and class practice (bottom inspections no more than 36 months apart, two in each five years)</h3>
                <ul className="flex flex-col gap-1 text-sm" aria-label="Suggested dockings">
                  {view.suggestions.map((s, i) => (
                    <li key={i} className="flex flex-wrap items-center gap-2">
                      {s.source === 'renewal' ? <StatusTag tone="action">For a renewal</StatusTag> : null}
                      <span>{s.assetName}: {dockingKindWords(s.kind)} {s.source === 'renewal' ? 'by' : 'about'} <strong>{formatDateOnly(s.date)}</strong></span>
                      <span className="text-xs text-ink-soft">{s.reason}</span>
                      {canPlan ? <AcceptSuggestion org={org} assetId={s.assetId} date={s.date} kind={s.kind} /> : null}
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
          </Panel>
          {canPlan ? (
            <Panel title="Plan a docking or campaign">
              <DockingForm org={org} assets={view.assets} />
            </Panel>
          ) : null}
        </div>
        <Caution />
      </div>
    </>
  );
}
