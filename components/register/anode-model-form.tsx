'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { ALLOY_LABELS, MOUNTING_LABELS } from '@/lib/design/labels';
import { createAnodeModelAction } from '@/app/o/[org]/catalogue/actions';

import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;
const opts = (labels: Record<string, string>) => Object.entries(labels).map(([value, label]) => ({ value, label }));

/** An organisation's own anode model, with the dimensions its resistance formula needs. */
export function AnodeModelForm({ org }: { org: string }) {
  const [state, action, pending] = useActionState(createAnodeModelAction.bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.catalogue(org));
  const v = !state.ok && state.values ? state.values : {};
  const [shape, setShape] = useState(v.shapeKind ?? 'short-flush');
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="grid grid-cols-2 gap-3" noValidate>
      <div className="col-span-2">
        <FormMessage state={state} />
      </div>
      <Field className="col-span-2" label="Designation" name="designation" defaultValue={v.designation} errors={e('designation')} />
      <SelectField label="Alloy" name="alloy" defaultValue={v.alloy ?? 'al-zn-in'} options={opts(ALLOY_LABELS)} errors={e('alloy')} />
      <SelectField label="Mounting" name="mounting" defaultValue={v.mounting ?? 'flush-weld'} options={opts(MOUNTING_LABELS)} errors={e('mounting')} />
      <SelectField
        className="col-span-2"
        label="Resistance formula (DNV-RP-B401)"
        name="shapeKind"
        value={shape}
        onChange={(ev) => setShape(ev.target.value)}
        options={[
          { value: 'slender-standoff', label: 'Slender stand-off (Dwight)' },
          { value: 'long-flush', label: 'Long flush, L ≥ 4 × width' },
          { value: 'short-flush', label: 'Short flush (McCoy)' },
          { value: 'bracelet', label: 'Bracelet (McCoy)' },
        ]}
        errors={e('shapeKind')}
      />
      <Field label="Length" name="lengthM" type="number" step="any" unit="m" defaultValue={v.lengthM} errors={e('lengthM')} />
      {shape === 'slender-standoff' ? (
        <>
          <Field label="Equivalent radius" name="radiusM" type="number" step="any" unit="m" defaultValue={v.radiusM} errors={e('radiusM')} hint="Non-round: perimeter / 2π" />
          <Field label="Stand-off" name="standoffM" type="number" step="any" unit="m" defaultValue={v.standoffM} errors={e('standoffM')} hint="Blank: 0.30 m or more" />
        </>
      ) : (
        <>
          <Field label="Width" name="widthM" type="number" step="any" unit="m" defaultValue={v.widthM} errors={e('widthM')} />
          <Field label="Thickness" name="thicknessM" type="number" step="any" unit="m" defaultValue={v.thicknessM} errors={e('thicknessM')} />
          {shape !== 'long-flush' ? <Field label="Exposed area" name="exposedAreaM2" type="number" step="any" unit="m²" defaultValue={v.exposedAreaM2} errors={e('exposedAreaM2')} /> : null}
        </>
      )}
      <Field label="Net mass" name="netMassKg" type="number" step="any" unit="kg" defaultValue={v.netMassKg} errors={e('netMassKg')} />
      <Field label="Gross mass" name="grossMassKg" type="number" step="any" unit="kg" defaultValue={v.grossMassKg} errors={e('grossMassKg')} />
      <Field label="Rated output (optional)" name="ratedOutputA" type="number" step="any" unit="A" defaultValue={v.ratedOutputA} errors={e('ratedOutputA')} />
      <Field label="Unit price (optional)" name="unitPrice" type="number" step="any" defaultValue={v.unitPrice} errors={e('unitPrice')} />
      <div className="col-span-2">
        <Button type="submit" disabled={pending}>
          Add to the catalogue
        </Button>
      </div>
    </form>
  );
}
