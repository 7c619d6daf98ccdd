import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { allowed } from '@/lib/server/org-context';
import { Caution, PageHeader, Panel } from '@/components/ui/panel';
import { ButtonLink } from '@/components/ui/button';
import { Disclosure } from '@/components/ui/disclosure';
import { FleetTable } from '@/components/register/fleet-table';
import { AssetForm } from '@/components/register/lazy-forms';
import { FirstRunGuide } from '@/components/onboarding/first-run-guide';
import { getFirstRun } from '@/lib/server/services/onboarding/get-first-run';

export const metadata: Metadata = { title: 'Fleet overview' };

export default async function FleetOverviewPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const canWrite = allowed(ctx, 'asset:write');
  // The guide is for those who can do its steps; it reads the organisation's records each time.
  const firstRun = canWrite || allowed(ctx, 'design:write') ? await getFirstRun(ctx) : null;
  return (
    <>
      <PageHeader
        title="Fleet overview"
        subtitle={`${ctx.organisation.name}: every vessel and structure with its anodes and latest survey.`}
        actions={<ButtonLink href={`/o/${org}/register`} variant="secondary">Anode register</ButtonLink>}
      />
      <div className="flex flex-col gap-4">
        {firstRun ? <FirstRunGuide org={org} progress={firstRun} /> : null}
        {canWrite ? (
          <Disclosure id="add-asset" defaultOpen={firstRun ? !firstRun.done.asset : false} className="rounded-[4px] border border-rule bg-paper-raised" summaryClassName="cursor-pointer px-4 py-2.5 text-sm font-semibold text-tide-700" summary="Add a vessel or structure">
            <div className="max-w-2xl px-4 pb-4">
              <AssetForm org={org} />
            </div>
          </Disclosure>
        ) : null}
        <Panel title="Assets">
          <FleetTable org={org} />
        </Panel>
        <Caution />
      </div>
    </>
  );
}
