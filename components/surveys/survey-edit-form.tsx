'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { updateSurveyAction } from '@/app/o/[org]/surveys/actions';
import { ELECTRODE_OPTIONS, METHOD_OPTIONS } from './new-survey-form';

interface SurveyFields {
  id: string;
  surveyedOn: string;
  method: string;
  surveyor: string | null;
  defaultElectrode: string;
  notes: string | null;
}

/** Corrects a survey's date, method, surveyor, electrode and notes. */
export function SurveyEditForm({ org, survey }: { org: string; survey: SurveyFields }) {
  const form = useBoundAction(updateSurveyAction.bind(null, org));
  const f = form.field;
  return (
    <ActionForm form={form} className="grid grid-cols-1 gap-3 md:grid-cols-2" messageClassName="md:col-span-2" noValidate aria-label="Edit the survey">
      <input type="hidden" name="surveyId" value={survey.id} />
      <Field label="Surveyed on" {...f('surveyedOn', survey.surveyedOn)} type="date" />
      <SelectField label="Method" {...f('method', survey.method)} options={METHOD_OPTIONS} />
      <Field label="Surveyor or contractor" {...f('surveyor', survey.surveyor ?? '')} />
      <SelectField label="Reference electrode used" {...f('defaultElectrode', survey.defaultElectrode)} options={ELECTRODE_OPTIONS} />
      <Field className="md:col-span-2" label="Notes" {...f('notes', survey.notes ?? '')} />
      <p className="text-xs text-ink-faint md:col-span-2">Readings already recorded keep the electrode they were read against; correct a reading itself to change it.</p>
      <div>
        <Button type="submit" variant="secondary" disabled={form.pending}>
          Save the survey
        </Button>
      </div>
    </ActionForm>
  );
}
