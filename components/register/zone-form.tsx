'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, ZONE_KIND_LABELS, WATER_TYPE_LABELS } from '@/lib/labels';
import { createZoneAction, updateZoneAction } from '@/app/o/[org]/assets/actions';

const opts = (labels: Record<string, string>) => Object.entries(labels).map(([value, label]) => ({ value, label }));

export interface ZoneValues {
  id?: string;
  name: string;
  kind: string;
  areaM2: number | string;
  coatingCategory: string;
  coatingAgeYears: number | string;
  waterType: string;
  climate: string;
  depthBand: string;
  drainsCurrent: string | null;
}

/** Add a zone to an asset, or edit one; the same fields the design desk uses. */
export function ZoneForm({ org, assetId, zone }: { org: string; assetId: string; zone?: ZoneValues }) {
  const form = useBoundAction((zone ? updateZoneAction : createZoneAction).bind(null, org), {
    initial: zone ? Object.fromEntries(Object.entries(zone).map(([k, val]) => [k, val === null ? '' : String(val)])) : {},
  });
  const f = form.field;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3 md:grid-cols-4" messageClassName="col-span-2 md:col-span-4" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      {zone?.id ? <input type="hidden" name="zoneId" value={zone.id} /> : null}
      <Field className="col-span-2" label="Zone name" {...f('name')} />
      <SelectField label="Kind" {...f('kind', 'hull-bottom')} options={opts(ZONE_KIND_LABELS)} />
      <Field label="Wetted area" {...f('areaM2')} type="number" step="any" unit="m²" />
      <SelectField label="Coating" {...f('coatingCategory', 'II')} options={opts(COATING_LABELS)} />
      <Field label="Coating age" {...f('coatingAgeYears', '0')} type="number" step="any" unit="yr" />
      <SelectField label="Environment" {...f('waterType', 'seawater')} options={opts(WATER_TYPE_LABELS)} />
      <SelectField label="Temperature band" {...f('climate', 'temperate')} options={opts(CLIMATE_LABELS)} />
      <SelectField label="Depth" {...f('depthBand', '0-30')} options={opts(DEPTH_BAND_LABELS)} />
      <SelectField label="Bare item draining current" {...f('drainsCurrent', '')} options={[{ value: '', label: 'None' }, { value: 'copper-alloy', label: 'Copper alloy (propeller)' }, { value: 'stainless', label: 'Stainless (shaft)' }]} />
      <div className="col-span-2 flex items-end md:col-span-2">
        <Button type="submit" disabled={form.pending}>
          {zone ? 'Save zone' : 'Add zone'}
        </Button>
      </div>
    </ActionForm>
  );
}
