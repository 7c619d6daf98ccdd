import type { Metadata } from 'next';
import { MembershipSchema } from '@/entities';
import { getPageOrgContext } from '@/lib/server/page-context';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/server/permissions';
import { PageHeader, Panel } from '@/components/ui/panel';

export const metadata: Metadata = { title: 'Fleet overview' };

export default async function FleetOverviewPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const memberCount = await ctx.em.count(MembershipSchema, { organisation: ctx.organisation });
  return (
    <>
      <PageHeader title="Fleet overview" subtitle={`${ctx.organisation.name} · ${memberCount} member${memberCount === 1 ? '' : 's'}`} />
      <div className="grid gap-4 lg:grid-cols-2">
        <Panel title="Your role">
          <p className="text-sm">
            <strong>{ROLE_LABELS[ctx.role]}</strong>: {ROLE_DESCRIPTIONS[ctx.role]}
          </p>
        </Panel>
      </div>
    </>
  );
}
