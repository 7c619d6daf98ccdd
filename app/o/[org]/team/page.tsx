import type { Metadata } from 'next';
import { getPageOrgContextWith } from '@/lib/server/page-context';
import { PageHeader, Panel } from '@/components/ui/panel';
import { SettingsForm } from '@/components/team/settings-form';
import { TeamManager } from '@/components/team/team-manager';

export const metadata: Metadata = { title: 'Team' };

export default async function TeamPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContextWith(org, 'team:manage');
  return (
    <>
      <PageHeader title="Team" subtitle="Who can see and change this organisation’s data. At least one owner always remains." />
      <TeamManager org={org} />
      <div className="mt-5 max-w-2xl">
        <Panel title="Organisation settings">
          <SettingsForm org={org} values={{ name: ctx.organisation.name, renewalMarginMonths: ctx.organisation.renewalMarginMonths, renewalThresholdPercent: ctx.organisation.renewalThresholdPercent, fittingRatePerKg: ctx.organisation.fittingRatePerKg ?? null, currency: ctx.organisation.currency }} />
        </Panel>
      </div>
    </>
  );
}
