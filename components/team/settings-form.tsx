'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { updateSettingsAction } from '@/app/o/[org]/team/actions';

export function SettingsForm({ org, values }: { org: string; values: { name: string; renewalMarginMonths: number; fittingRatePerKg: number | null; currency: string } }) {
  const form = useBoundAction(updateSettingsAction.bind(null, org), {
    initial: { name: values.name, renewalMarginMonths: String(values.renewalMarginMonths), fittingRatePerKg: values.fittingRatePerKg === null ? '' : String(values.fittingRatePerKg), currency: values.currency },
  });
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3" messageClassName="col-span-2" noValidate>
      <Field className="col-span-2" label="Organisation name" {...form.field('name')} />
      <Field label="Renewal margin" {...form.field('renewalMarginMonths')} type="number" step="1" unit="months" hint="Renewals are booked this long before a group's forecast end of life" />
      <Field label="Fitting rate" {...form.field('fittingRatePerKg')} type="number" step="any" unit="per kg" hint="Costs the design options (gross mass)" />
      <Field label="Currency" {...form.field('currency')} />
      <div className="col-span-2">
        <Button type="submit" disabled={form.pending}>Save settings</Button>
      </div>
    </ActionForm>
  );
}
