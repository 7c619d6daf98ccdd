import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { allowed } from '@/lib/server/org-context';
import { PageHeader, Panel } from '@/components/ui/panel';
import { SurveysTable } from '@/components/surveys/surveys-table';
import { NewSurveyForm } from '@/components/surveys/new-survey-form';
import { listAssetChoices } from '@/lib/server/services/assets/list-asset-choices';
import { listDeletedSurveys } from '@/lib/server/services/surveys/manage-surveys';
import { DeletedSurveys } from '@/components/surveys/deleted-surveys';
import { SurveyDeletedNotice } from '@/components/surveys/survey-deleted-notice';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const metadata: Metadata = { title: 'Surveys' };

export default async function SurveysPage({ params, searchParams }: { params: Promise<{ org: string }>; searchParams: Promise<{ assetId?: string; deleted?: string }> }) {
  const { org } = await params;
  const { assetId, deleted } = await searchParams;
  const ctx = await getPageOrgContext(org);
  const canWrite = allowed(ctx, 'survey:write');
  const assets = canWrite ? await listAssetChoices(ctx) : [];
  const canRestore = allowed(ctx, 'survey:restore');
  const binned = canRestore ? await listDeletedSurveys(ctx) : [];
  return (
    <>
      <PageHeader title="Surveys" subtitle="Diver, drop-cell and ROV surveys: potentials against the protection criteria, and what remains of the anodes." />
      {deleted && UUID.test(deleted) ? <SurveyDeletedNotice key={deleted} org={org} surveyId={deleted} /> : null}
      <div className={`grid grid-cols-1 items-start gap-4 ${canWrite ? 'xl:grid-cols-[minmax(0,1fr)_22rem]' : ''}`}>
        <Panel title="All surveys">
          <SurveysTable org={org} />
        </Panel>
        {canWrite ? (
          <Panel title="Record a survey">
            <NewSurveyForm org={org} assets={assets.map((a) => ({ id: a.id, name: a.name }))} assetId={assetId} />
          </Panel>
        ) : null}
      </div>
      {canRestore ? (
        <div className="mt-4">
          <Panel title="Deleted surveys (restorable for 30 days)">
            <DeletedSurveys org={org} rows={binned} />
          </Panel>
        </div>
      ) : null}
    </>
  );
}
