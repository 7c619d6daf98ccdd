'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { ALLOY_LABELS, MOUNTING_LABELS, SHAPE_FORMULA_OPTIONS } from '@/lib/labels';
import { createAnodeModelAction } from '@/app/o/[org]/catalogue/actions';

const opts = (labels: Record<string, string>) => Object.entries(labels).map(([value, label]) => ({ value, label }));

/** An organisation's own anode model, with the dimensions its resistance formula needs. */
export function AnodeModelForm({ org }: { org: string }) {
  const form = useBoundAction(createAnodeModelAction.bind(null, org), { invalidate: [queryKeys.catalogue(org)] });
  const [shape, setShape] = useState(form.values.shapeKind ?? 'short-flush');
  const f = form.field;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3" messageClassName="col-span-2" noValidate>
      <Field className="col-span-2" label="Designation" {...f('designation')} />
      <SelectField label="Alloy" {...f('alloy', 'al-zn-in')} options={opts(ALLOY_LABELS)} />
      <SelectField label="Mounting" {...f('mounting', 'flush-weld')} options={opts(MOUNTING_LABELS)} />
      <SelectField
        className="col-span-2"
        label="Resistance formula (DNV-RP-B401)"
        name="shapeKind"
        value={shape}
        onChange={(ev) => setShape(ev.target.value)}
        options={SHAPE_FORMULA_OPTIONS}
        errors={form.errors('shapeKind')}
      />
      <Field label="Length" {...f('lengthM')} type="number" step="any" unit="m" />
      {shape === 'slender-standoff' ? (
        <>
          <Field label="Equivalent radius" {...f('radiusM')} type="number" step="any" unit="m" hint="Non-round: perimeter / 2π" />
          <Field label="Stand-off" {...f('standoffM')} type="number" step="any" unit="m" hint="Blank: 0.30 m or more" />
        </>
      ) : (
        <>
          <Field label="Width" {...f('widthM')} type="number" step="any" unit="m" />
          <Field label="Thickness" {...f('thicknessM')} type="number" step="any" unit="m" />
          {shape !== 'long-flush' ? <Field label="Exposed area" {...f('exposedAreaM2')} type="number" step="any" unit="m²" /> : null}
        </>
      )}
      <Field label="Net mass" {...f('netMassKg')} type="number" step="any" unit="kg" />
      <Field label="Gross mass" {...f('grossMassKg')} type="number" step="any" unit="kg" />
      <Field label="Rated output (optional)" {...f('ratedOutputA')} type="number" step="any" unit="A" />
      <Field label="Rated at resistivity (optional)" {...f('ratedAtResistivityOhmM')} type="number" step="any" unit="Ω·m" hint="The data sheet's water; the output is scaled to the job's resistivity" />
      <Field label="Unit price (optional)" {...f('unitPrice')} type="number" step="any" />
      <div className="col-span-2">
        <Button type="submit" disabled={form.pending}>
          Add to the catalogue
        </Button>
      </div>
    </ActionForm>
  );
}
