import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { allowed } from '@/lib/server/org-context';
import { listCatalogue } from '@/lib/server/services/catalogue/anode-models';
import { PageHeader, Panel } from '@/components/ui/panel';
import { CatalogueTable } from '@/components/register/catalogue-table';
import { AnodeModelForm } from '@/components/register/anode-model-form';

export const metadata: Metadata = { title: 'Catalogue' };

export default async function CataloguePage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const canWrite = allowed(ctx, 'catalogue:write');
  const models = await listCatalogue(ctx, { includeArchived: true });
  return (
    <>
      <PageHeader title="Anode catalogue" subtitle="Built-in generic models (TW- designations, typical sizes, no maker's data) and your organisation's own." />
      <div className={`grid grid-cols-1 items-start gap-4 ${canWrite ? 'xl:grid-cols-[minmax(0,1fr)_24rem]' : ''}`}>
        <Panel title="Models">
          <CatalogueTable org={org} initial={models} canWrite={canWrite} />
        </Panel>
        {canWrite ? (
          <Panel title="Add your own model">
            <AnodeModelForm org={org} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
