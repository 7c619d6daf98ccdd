import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { formatDateOnly } from '@/lib/dates/date-only';
import { getPageOrgContext } from '@/lib/server/page-context';
import { AppError } from '@/lib/server/errors';
import { allowed } from '@/lib/server/org-context';
import { getSurveyDetails } from '@/lib/server/services/surveys/survey-details';
import { Caution, PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { POTENTIAL_STATUS_TONES } from '@/components/register/potential-tag';
import { ReadingsTable } from '@/components/surveys/readings-table';
import { CsvUpload } from '@/components/surveys/csv-upload';
import { ReadingForm } from '@/components/surveys/reading-form';
import { CapturePanel } from '@/components/surveys/capture-panel';
import { AttachmentUpload } from '@/components/surveys/attachment-upload';
import { AttachmentActions } from '@/components/surveys/attachment-actions';
import { SurveyEditForm } from '@/components/surveys/survey-edit-form';
import { ConfirmDelete } from '@/components/surveys/confirm-delete';
import { deleteSurveyAction } from '../actions';
import { queryKeys } from '@/lib/client/query-client';
import { SURVEY_CSV_COLUMNS } from '@/lib/surveys/survey-csv';
import { listGroupChoices } from '@/lib/server/services/register/list-group-choices';
import { TableFrame } from '@/components/ui/table-frame';
import { surveyMethodWords } from '@/lib/labels';

export const metadata: Metadata = { title: 'Survey' };

export default async function SurveyPage({ params }: { params: Promise<{ org: string; surveyId: string }> }) {
  const { org, surveyId } = await params;
  const ctx = await getPageOrgContext(org);
  let details;
  try {
    details = await getSurveyDetails(ctx, surveyId);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not-found') notFound();
    throw error;
  }
  const { survey, readings, counts, attachments } = details;
  const canWrite = allowed(ctx, 'survey:write');
  const groupChoices = canWrite ? await listGroupChoices(ctx, survey.assetId) : [];
  const groups = groupChoices.map((g) => g.label);
  return (
    <>
      <PageHeader
        title={`${survey.assetName}: ${surveyMethodWords(survey.method)} of ${formatDateOnly(survey.surveyedOn)}`}
        subtitle={
          <>
            <Link href={`/o/${org}/surveys`} className="text-tide-600 hover:underline">Surveys</Link> · <Link href={`/o/${org}/assets/${survey.assetId}`} className="text-tide-600 hover:underline">{survey.assetName}</Link>
            {survey.surveyor ? ` · by ${survey.surveyor}` : ''} · recorded by {survey.createdBy} · criteria for {survey.criteriaFor}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap gap-2" aria-label="Outcome">
          <StatusTag tone={counts['under-protected'] ? POTENTIAL_STATUS_TONES['under-protected'] : 'neutral'}>{counts['under-protected']} under-protected</StatusTag>
          <StatusTag tone={counts.protected ? POTENTIAL_STATUS_TONES.protected : 'neutral'}>{counts.protected} protected</StatusTag>
          <StatusTag tone={counts['over-protected'] ? POTENTIAL_STATUS_TONES['over-protected'] : 'neutral'}>{counts['over-protected']} over-protected</StatusTag>
          <span className="text-xs text-ink-soft">of {readings.length} readings</span>
        </div>
        {survey.notes ? <p className="text-sm text-ink-soft">{survey.notes}</p> : null}
        {canWrite ? (
          <Panel title="Capture on site">
            <CapturePanel
              org={org}
              surveyId={survey.id}
              userId={ctx.user.id}
              defaultElectrode={survey.defaultElectrode}
              groups={groupChoices}
              lastLocations={readings.slice(-2).map((r) => r.location)}
            />
          </Panel>
        ) : null}
        <Panel title="Readings">
          <ReadingsTable readings={readings} editing={canWrite ? { org, surveyId: survey.id, groups, electrode: survey.defaultElectrode } : undefined} />
        </Panel>
        {canWrite ? (
          <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-2">
            <Panel title="Upload readings (CSV)">
              <CsvUpload org={org} surveyId={survey.id} electrode={survey.defaultElectrode} />
              <details className="mt-3 text-xs text-ink-soft">
                <summary className="cursor-pointer">The columns</summary>
                <TableFrame label="The survey file columns">
                <table className="mt-1 w-full">
                  <tbody>
                    {SURVEY_CSV_COLUMNS.map((c) => (
                      <tr key={c.name} className="border-b border-rule align-top">
                        <td className="py-1 pr-2 font-mono text-ink">{c.name}</td>
                        <td className="py-1 pr-2">{c.required ? 'required' : 'optional'}</td>
                        <td className="py-1">{c.description} <span className="text-ink-faint">e.g. {c.example}</span></td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                </TableFrame>
              </details>
            </Panel>
            <Panel title="Add a reading">
              <ReadingForm org={org} surveyId={survey.id} groups={groups} electrode={survey.defaultElectrode} />
            </Panel>
          </div>
        ) : null}
        <Panel title="Photos and reports">
          {attachments.length ? (
            <ul className="mb-3 grid grid-cols-2 gap-3 md:grid-cols-4">
              {attachments.map((a) => {
                const href = `/api/orgs/${org}/surveys/${survey.id}/attachments/${a.id}`;
                return (
                  <li key={a.id} className="rounded-[3px] border border-rule p-2 text-xs">
                    {a.contentType.startsWith('image/') ? (
                      // eslint-disable-next-line @next/next/no-img-element
                      <img src={href} alt={a.caption ?? a.filename} className="mb-1 h-32 w-full rounded-[2px] object-cover" />
                    ) : null}
                    <a href={href} className="text-tide-600 underline">{a.filename}</a>
                    <p className="text-ink-faint">{a.caption ?? ''} · {Math.ceil(a.sizeBytes / 1024)} KB</p>
                    {canWrite ? <AttachmentActions org={org} surveyId={survey.id} attachment={a} /> : null}
                  </li>
                );
              })}
            </ul>
          ) : (
            <p className="mb-3 text-sm text-ink-faint">Nothing attached.</p>
          )}
          {canWrite ? <AttachmentUpload org={org} surveyId={survey.id} /> : null}
        </Panel>
        {canWrite ? (
          <Panel title="Correct or delete the survey">
            <SurveyEditForm org={org} survey={{ id: survey.id, surveyedOn: survey.surveyedOn, method: survey.method, surveyor: survey.surveyor, defaultElectrode: survey.defaultElectrode, notes: survey.notes }} />
            <div className="mt-4 border-t border-rule pt-3">
              <ConfirmDelete
                action={deleteSurveyAction.bind(null, org)}
                fields={{ surveyId: survey.id }}
                what={`this survey with its ${readings.length} reading${readings.length === 1 ? '' : 's'} and ${attachments.length} attachment${attachments.length === 1 ? '' : 's'}`}
                consequence="An engineer can restore it within 30 days."
                label="Delete the survey"
                invalidate={[queryKeys.surveys(org)]}
              />
            </div>
          </Panel>
        ) : null}
        <Caution>
          Readings are judged against -0.80 V Ag/AgCl/seawater for steel (-0.90 V where sulphate-reducing bacteria are active) and the over-protection limits of the protected metal, with IR drop as measured. Verify against the governing standard and local rules before acting on a survey.
        </Caution>
      </div>
    </>
  );
}
