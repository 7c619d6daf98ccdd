'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { addReadingAction } from '@/app/o/[org]/surveys/actions';
import { ELECTRODE_OPTIONS } from './new-survey-form';

export function ReadingForm({ org, surveyId, groups }: { org: string; surveyId: string; groups: string[] }) {
  const form = useBoundAction(addReadingAction.bind(null, org));
  const f = form.field;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3 md:grid-cols-3" messageClassName="col-span-2 md:col-span-3" noValidate>
      <input type="hidden" name="surveyId" value={surveyId} />
      <Field label="Location" {...f('location')} placeholder="B3-A, CH 120, Fr 42 P" />
      <Field label="Potential" {...f('potentialV')} type="number" step="any" unit="V" />
      <SelectField label="Electrode" {...f('electrode', 'ag-agcl-seawater')} options={ELECTRODE_OPTIONS} />
      <SelectField label="Anode group" {...f('anodeGroupLabel', '')} options={[{ value: '', label: 'None' }, ...groups.map((g) => ({ value: g, label: g }))]} />
      {/* The server checks the fraction it derives from the percentage. */}
      <Field label="Remaining" {...f('remainingPercent')} errors={form.errors('remainingFraction')} type="number" step="any" unit="%" />
      <div className="flex items-end">
        <Button type="submit" variant="secondary" disabled={form.pending}>
          Add reading
        </Button>
      </div>
      <Field className="col-span-2 md:col-span-3" label="Comment" {...f('comment')} />
    </ActionForm>
  );
}
