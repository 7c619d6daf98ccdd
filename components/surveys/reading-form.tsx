'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { addReadingAction } from '@/app/o/[org]/surveys/actions';
import { ELECTRODE_OPTIONS } from './new-survey-form';

/** "Add a reading": the electrode starts at the survey's own and keeps what was chosen after a refused submit. */
export function ReadingForm({ org, surveyId, groups, electrode }: { org: string; surveyId: string; groups: string[]; electrode: string }) {
  const form = useBoundAction(addReadingAction.bind(null, org));
  const f = form.field;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3 md:grid-cols-3" messageClassName="col-span-2 md:col-span-3" noValidate aria-label="Add a reading">
      <input type="hidden" name="surveyId" value={surveyId} />
      <ReadingFields field={f} groups={groups} electrode={electrode} />
      <div className="flex items-end">
        <Button type="submit" variant="secondary" disabled={form.pending}>
          Add reading
        </Button>
      </div>
    </ActionForm>
  );
}

type FieldOf = ReturnType<typeof useBoundAction>['field'];

/** The fields of one reading, shared by "Add a reading" and "Edit". */
export function ReadingFields({ field: f, groups, electrode, initial = {} }: { field: FieldOf; groups: string[]; electrode: string; initial?: Record<string, string> }) {
  return (
    <>
      <Field label="Location" {...f('location', initial.location)} placeholder="B3-A, CH 120, Fr 42 P" />
      <Field label="Potential" {...f('potentialV', initial.potentialV)} type="number" step="any" unit="V" />
      <SelectField label="Electrode" {...f('electrode', initial.electrode ?? electrode)} options={ELECTRODE_OPTIONS} />
      <SelectField label="Anode group" {...f('anodeGroupLabel', initial.anodeGroupLabel ?? '')} options={[{ value: '', label: 'None' }, ...groups.map((g) => ({ value: g, label: g }))]} />
      <Field label="Remaining" {...f('remainingPercent', initial.remainingPercent)} type="number" step="any" min={0} max={100} unit="%" />
      <Field className="col-span-2 md:col-span-3" label="Comment" {...f('comment', initial.comment)} />
    </>
  );
}
