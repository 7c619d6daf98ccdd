import type { Metadata } from 'next';
import { getPageOrgContextWith } from '@/lib/server/page-context';
import { PageHeader } from '@/components/ui/panel';
import { TeamManager } from '@/components/team/team-manager';

export const metadata: Metadata = { title: 'Team' };

export default async function TeamPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  await getPageOrgContextWith(org, 'team:manage');
  return (
    <>
      <PageHeader title="Team" subtitle="Who can see and change this organisation’s data. At least one owner always remains." />
      <TeamManager org={org} />
    </>
  );
}
