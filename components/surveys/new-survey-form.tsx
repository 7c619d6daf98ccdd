'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { createSurveyAction } from '@/app/o/[org]/surveys/actions';
import { todayDateOnly } from '@/lib/dates/date-only';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export const ELECTRODE_OPTIONS = [
  { value: 'ag-agcl-seawater', label: 'Ag/AgCl/seawater' },
  { value: 'cse', label: 'Cu/CuSO₄ (CSE)' },
  { value: 'sce', label: 'Saturated calomel (SCE)' },
  { value: 'zinc', label: 'Zinc' },
];

export function NewSurveyForm({ org, assets, assetId }: { org: string; assets: { id: string; name: string }[]; assetId?: string }) {
  const [state, action, pending] = useActionState(createSurveyAction.bind(null, org) as Bound, { ok: false });
  const v = state.values ?? {};
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <SelectField label="Asset" name="assetId" defaultValue={v.assetId ?? assetId ?? assets[0]?.id} options={assets.map((a) => ({ value: a.id, label: a.name }))} errors={e('assetId')} />
      <div className="grid grid-cols-2 gap-3">
        <Field label="Surveyed on" name="surveyedOn" type="date" defaultValue={v.surveyedOn ?? todayDateOnly()} errors={e('surveyedOn')} />
        <SelectField
          label="Method"
          name="method"
          defaultValue={v.method ?? 'diver'}
          options={[
            { value: 'diver', label: 'Diver' },
            { value: 'drop-cell', label: 'Drop cell' },
            { value: 'rov', label: 'ROV' },
            { value: 'dry-dock', label: 'In dry dock' },
            { value: 'other', label: 'Other' },
          ]}
          errors={e('method')}
        />
      </div>
      <Field label="Surveyor or contractor" name="surveyor" defaultValue={v.surveyor} errors={e('surveyor')} />
      <SelectField label="Reference electrode used" name="defaultElectrode" defaultValue={v.defaultElectrode ?? 'ag-agcl-seawater'} options={ELECTRODE_OPTIONS} errors={e('defaultElectrode')} />
      <Field label="Notes" name="notes" defaultValue={v.notes} errors={e('notes')} />
      <Button type="submit" disabled={pending}>
        Record the survey
      </Button>
      <p className="text-xs text-ink-faint">Next you upload the readings as CSV or type them in, and attach photos and reports.</p>
    </form>
  );
}
