'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { updateSettingsAction } from '@/app/o/[org]/team/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export function SettingsForm({ org, values }: { org: string; values: { name: string; renewalMarginMonths: number; fittingRatePerKg: number | null; currency: string } }) {
  const [state, action, pending] = useActionState(updateSettingsAction.bind(null, org) as Bound, { ok: false });
  const v = !state.ok && state.values ? state.values : { name: values.name, renewalMarginMonths: String(values.renewalMarginMonths), fittingRatePerKg: values.fittingRatePerKg === null ? '' : String(values.fittingRatePerKg), currency: values.currency };
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="grid grid-cols-2 gap-3" noValidate>
      <div className="col-span-2">
        <FormMessage state={state} />
      </div>
      <Field className="col-span-2" label="Organisation name" name="name" defaultValue={v.name} errors={e('name')} />
      <Field label="Renewal margin" name="renewalMarginMonths" type="number" step="1" unit="months" defaultValue={v.renewalMarginMonths} errors={e('renewalMarginMonths')} hint="Renewals are booked this long before a group's forecast end of life" />
      <Field label="Fitting rate" name="fittingRatePerKg" type="number" step="any" unit="per kg" defaultValue={v.fittingRatePerKg} errors={e('fittingRatePerKg')} hint="Costs the design options (gross mass)" />
      <Field label="Currency" name="currency" defaultValue={v.currency} errors={e('currency')} />
      <div className="col-span-2">
        <Button type="submit" disabled={pending}>Save settings</Button>
      </div>
    </form>
  );
}
