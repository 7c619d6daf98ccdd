import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { PageHeader, Panel } from '@/components/ui/panel';
import { RegisterTable } from '@/components/register/register-table';

export const metadata: Metadata = { title: 'Anode register' };

export default async function RegisterPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  await getPageOrgContext(org);
  return (
    <>
      <PageHeader title="Anode register" subtitle="Every anode group fitted on the fleet and the structures: model, quantity, positions, and what the last survey found." />
      <Panel>
        <RegisterTable org={org} />
      </Panel>
    </>
  );
}
