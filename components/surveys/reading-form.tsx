'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { addReadingAction } from '@/app/o/[org]/surveys/actions';
import { ELECTRODE_OPTIONS } from './new-survey-form';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export function ReadingForm({ org, surveyId, groups }: { org: string; surveyId: string; groups: string[] }) {
  const [state, action, pending] = useActionState(addReadingAction.bind(null, org) as Bound, { ok: false });
  const v = !state.ok && state.values ? state.values : {};
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="grid grid-cols-2 gap-3 md:grid-cols-3" noValidate>
      <div className="col-span-2 md:col-span-3">
        <FormMessage state={state} />
      </div>
      <input type="hidden" name="surveyId" value={surveyId} />
      <Field label="Location" name="location" defaultValue={v.location} errors={e('location')} placeholder="B3-A, CH 120, Fr 42 P" />
      <Field label="Potential" name="potentialV" type="number" step="any" unit="V" defaultValue={v.potentialV} errors={e('potentialV')} />
      <SelectField label="Electrode" name="electrode" defaultValue={v.electrode ?? 'ag-agcl-seawater'} options={ELECTRODE_OPTIONS} errors={e('electrode')} />
      <SelectField label="Anode group" name="anodeGroupLabel" defaultValue={v.anodeGroupLabel ?? ''} options={[{ value: '', label: 'None' }, ...groups.map((g) => ({ value: g, label: g }))]} errors={e('anodeGroupLabel')} />
      <Field label="Remaining" name="remainingPercent" type="number" step="any" unit="%" defaultValue={v.remainingPercent} errors={e('remainingFraction')} />
      <div className="flex items-end">
        <Button type="submit" variant="secondary" disabled={pending}>
          Add reading
        </Button>
      </div>
      <Field className="col-span-2 md:col-span-3" label="Comment" name="comment" defaultValue={v.comment} errors={e('comment')} />
    </form>
  );
}
