import type { Metadata } from 'next';
import { anodeListWords, DOCKING_STATUS_LABELS, dockingKindWords, eventWords } from '@/lib/labels';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getPageOrgContext } from '@/lib/server/page-context';
import { AppError } from '@/lib/server/errors';
import { allowed } from '@/lib/server/org-context';
import { listDockingRenewals } from '@/lib/server/services/planner/docking-renewals';
import { formatDateOnly } from '@/lib/dates/date-only';
import { Caution, PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { DOCKING_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { ButtonLink } from '@/components/ui/button';
import { RenewalsTable } from '@/components/planner/renewals-table';
import { AddRenewalForm, DockingEditForm } from '@/components/planner/docking-edit-form';
import { listGroupChoices } from '@/lib/server/services/register/list-group-choices';
import { listPlannedDockings } from '@/lib/server/services/planner/dockings';

export const metadata: Metadata = { title: 'Docking' };

export default async function DockingPage({ params }: { params: Promise<{ org: string; dockingId: string }> }) {
  const { org, dockingId } = await params;
  const ctx = await getPageOrgContext(org);
  let data;
  try {
    data = await listDockingRenewals(ctx, dockingId);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not-found') notFound();
    throw error;
  }
  const { docking, rows } = data;
  const canPlan = allowed(ctx, 'docking:write');
  const canRenew = allowed(ctx, 'renewal:write');
  const [groups, planned] = canRenew
    ? await Promise.all([
        listGroupChoices(ctx, docking.asset.id),
        listPlannedDockings(ctx, docking.asset.id),
      ])
    : [[], []];
  const dockingChoices = planned.map((d) => ({ id: d.id, label: `${formatDateOnly(d.plannedStart)}${d.yard ? `, ${d.yard}` : ''}` }));
  const start = docking.actualStart ?? docking.plannedStart;
  const listBase = `/api/orgs/${org}/dockings/${docking.id}/anode-list`;
  const words = anodeListWords(docking.asset.kind, docking.kind);
  return (
    <>
      <PageHeader
        title={`${docking.asset.name}: ${dockingKindWords(docking.kind)} of ${formatDateOnly(start)}`}
        subtitle={
          <>
            <Link href={`/o/${org}/dockings`} className="text-tide-600 hover:underline">Docking planner</Link> · <Link href={`/o/${org}/assets/${docking.asset.id}`} className="text-tide-600 hover:underline">{docking.asset.name}</Link>
            {docking.yard ? ` · ${eventWords(docking.asset.kind).Place}: ${docking.yard}` : ''} · <StatusTag tone={toneOf(DOCKING_STATUS_TONES, docking.status)}>{DOCKING_STATUS_LABELS[docking.status] ?? 'Unknown'}</StatusTag>
          </>
        }
        actions={
          <>
            <ButtonLink href={`${listBase}?format=pdf`} variant="secondary" prefetch={false} target="_blank">{`Print the ${words.title.toLowerCase()} (PDF)`}</ButtonLink>
            <ButtonLink href={`${listBase}?format=csv`} variant="secondary" prefetch={false}>{`${words.title} (CSV)`}</ButtonLink>
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <Panel title="Renewals">
          <RenewalsTable org={org} dockingId={docking.id} initial={rows} canEdit={canRenew} dockings={dockingChoices} />
        </Panel>
        <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-2">
          {canPlan ? (
            <Panel title={`Dates, ${words.worksBy.toLowerCase()} and status`}>
              <DockingEditForm
                org={org}
                assetKind={docking.asset.kind}
                docking={{ id: docking.id, kind: docking.kind, status: docking.status, plannedStart: docking.plannedStart, plannedEnd: docking.plannedEnd ?? null, actualStart: docking.actualStart ?? null, actualEnd: docking.actualEnd ?? null, yard: docking.yard ?? null, reference: docking.reference ?? null, notes: docking.notes ?? null }}
              />
            </Panel>
          ) : null}
          {canRenew && docking.status === 'planned' ? (
            <Panel title="Book another renewal">
              <AddRenewalForm org={org} dockingId={docking.id} groups={groups.map((g) => ({ id: g.id, label: g.label }))} />
            </Panel>
          ) : null}
        </div>
        <Caution>Renewal dates come from a forecast of anode consumption: confirm quantities against a diver or dry-dock inspection, and verify against the governing standard and class rules before ordering.</Caution>
      </div>
    </>
  );
}
