'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { updateSettingsAction } from '@/app/o/[org]/team/actions';
import { RENEWAL_THRESHOLD_PERCENT } from '@/lib/schemas/accounts';
import { RENEW_BY_DATE_WORDS } from '@/lib/labels';

export interface SettingsValues {
  name: string;
  renewalMarginMonths: number;
  renewalThresholdPercent: number;
  fittingRatePerKg: number | null;
  currency: string;
}

export function SettingsForm({ org, values }: { org: string; values: SettingsValues }) {
  const form = useBoundAction(updateSettingsAction.bind(null, org), {
    initial: {
      name: values.name,
      renewalMarginMonths: String(values.renewalMarginMonths),
      renewalThresholdPercent: String(values.renewalThresholdPercent),
      fittingRatePerKg: values.fittingRatePerKg === null ? '' : String(values.fittingRatePerKg),
      currency: values.currency,
    },
  });
  const { min, max } = RENEWAL_THRESHOLD_PERCENT;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3" messageClassName="col-span-2" noValidate>
      <Field className="col-span-2" label="Organisation name" {...form.field('name')} />
      <Field
        label="Renewal threshold"
        {...form.field('renewalThresholdPercent')}
        type="number"
        step="1"
        min={min}
        max={max}
        unit="% left"
        hint={`Sets ${RENEW_BY_DATE_WORDS}: when this share of a group's anode mass remains (${min} to ${max} %), or when its utilisation factor is used up if that comes first`}
      />
      <Field label="Renewal margin" {...form.field('renewalMarginMonths')} type="number" step="1" unit="months" hint={`Counted back from ${RENEW_BY_DATE_WORDS}: renewals are proposed at the last docking at least this long before it`} />
      <Field label="Fitting rate" {...form.field('fittingRatePerKg')} type="number" step="any" unit="per kg" hint="Costs the design options (gross mass)" />
      <Field label="Currency" {...form.field('currency')} />
      <div className="col-span-2">
        <Button type="submit" disabled={form.pending}>Save settings</Button>
      </div>
    </ActionForm>
  );
}
