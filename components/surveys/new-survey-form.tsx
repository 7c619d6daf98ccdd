'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createSurveyAction } from '@/app/o/[org]/surveys/actions';
import { todayDateOnly } from '@/lib/dates/date-only';

import { ELECTRODE_LABELS, SURVEY_METHOD_LABELS } from '@/lib/labels';

const optionsOf = (labels: Record<string, string>) => Object.entries(labels).map(([value, label]) => ({ value, label }));
export const ELECTRODE_OPTIONS = optionsOf(ELECTRODE_LABELS);
export const METHOD_OPTIONS = optionsOf(SURVEY_METHOD_LABELS);

export function NewSurveyForm({ org, assets, assetId }: { org: string; assets: { id: string; name: string }[]; assetId?: string }) {
  const form = useBoundAction(createSurveyAction.bind(null, org));
  const f = form.field;
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <SelectField label="Asset" {...f('assetId', assetId ?? assets[0]?.id)} options={assets.map((a) => ({ value: a.id, label: a.name }))} />
      <div className="grid grid-cols-2 gap-3">
        <Field label="Surveyed on" {...f('surveyedOn', todayDateOnly())} type="date" />
        <SelectField label="Method" {...f('method', 'diver')} options={METHOD_OPTIONS} />
      </div>
      <Field label="Surveyor or contractor" {...f('surveyor')} />
      <SelectField label="Reference electrode used" {...f('defaultElectrode', 'ag-agcl-seawater')} options={ELECTRODE_OPTIONS} />
      <Field label="Notes" {...f('notes')} />
      <Button type="submit" disabled={form.pending}>
        Record the survey
      </Button>
      <p className="text-xs text-ink-faint">Next you upload the readings as CSV or type them in, and attach photos and reports.</p>
    </ActionForm>
  );
}
