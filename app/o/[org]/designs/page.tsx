import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { allowed } from '@/lib/server/org-context';
import { listDesigns } from '@/lib/server/services/designs/list-designs';
import { PageHeader, Panel } from '@/components/ui/panel';
import { DesignsList } from '@/components/design-desk/designs-list';
import { NewDesignForm } from '@/components/design-desk/new-design-form';
import { listAssetChoices } from '@/lib/server/services/assets/list-asset-choices';

export const metadata: Metadata = { title: 'Design desk' };

export default async function DesignsPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const [designs, assets] = await Promise.all([
    listDesigns(ctx),
    listAssetChoices(ctx),
  ]);
  const canWrite = allowed(ctx, 'design:write');
  return (
    <>
      <PageHeader title="Design desk" subtitle="Sacrificial-anode designs for hulls and harbour structures, by revision, with who prepared, checked and approved each." />
      <div className={`grid grid-cols-1 gap-4 ${canWrite ? 'xl:grid-cols-[minmax(0,1fr)_24rem]' : ''}`}>
        <Panel title="Designs">
          <DesignsList org={org} initial={designs} />
        </Panel>
        {canWrite ? (
          <Panel title="New design">
            <NewDesignForm org={org} assets={assets.map((a) => ({ id: a.id, name: a.name, kind: a.kind }))} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
