'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, ZONE_KIND_LABELS } from '@/lib/design/labels';
import { archiveZoneAction, createZoneAction, updateZoneAction } from '@/app/o/[org]/assets/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;
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
  const [state, action, pending] = useActionState((zone ? updateZoneAction : createZoneAction).bind(null, org) as Bound, { ok: false });
  const v: Record<string, string | undefined> = !state.ok && state.values ? state.values : zone ? Object.fromEntries(Object.entries(zone).map(([k, val]) => [k, val === null ? '' : String(val)])) : {};
  const e = (name: string) => state.fieldErrors?.[name];
  return (
    <form action={action} className="grid grid-cols-2 gap-3 md:grid-cols-4" noValidate>
      <div className="col-span-2 md:col-span-4">
        <FormMessage state={state} />
      </div>
      <input type="hidden" name="assetId" value={assetId} />
      {zone?.id ? <input type="hidden" name="zoneId" value={zone.id} /> : null}
      <Field className="col-span-2" label="Zone name" name="name" defaultValue={v.name} errors={e('name')} />
      <SelectField label="Kind" name="kind" defaultValue={v.kind ?? 'hull-bottom'} options={opts(ZONE_KIND_LABELS)} errors={e('kind')} />
      <Field label="Wetted area" name="areaM2" type="number" step="any" unit="m²" defaultValue={v.areaM2} errors={e('areaM2')} />
      <SelectField label="Coating" name="coatingCategory" defaultValue={v.coatingCategory ?? 'II'} options={opts(COATING_LABELS)} errors={e('coatingCategory')} />
      <Field label="Coating age" name="coatingAgeYears" type="number" step="any" unit="yr" defaultValue={v.coatingAgeYears ?? '0'} errors={e('coatingAgeYears')} />
      <SelectField label="Environment" name="waterType" defaultValue={v.waterType ?? 'seawater'} options={[{ value: 'seawater', label: 'Seawater' }, { value: 'brackish', label: 'Brackish' }, { value: 'fresh', label: 'Fresh water' }, { value: 'sediment', label: 'Sediment / mud' }]} errors={e('waterType')} />
      <SelectField label="Temperature band" name="climate" defaultValue={v.climate ?? 'temperate'} options={opts(CLIMATE_LABELS)} errors={e('climate')} />
      <SelectField label="Depth" name="depthBand" defaultValue={v.depthBand ?? '0-30'} options={opts(DEPTH_BAND_LABELS)} errors={e('depthBand')} />
      <SelectField label="Bare item draining current" name="drainsCurrent" defaultValue={v.drainsCurrent ?? ''} options={[{ value: '', label: 'None' }, { value: 'copper-alloy', label: 'Copper alloy (propeller)' }, { value: 'stainless', label: 'Stainless (shaft)' }]} errors={e('drainsCurrent')} />
      <div className="col-span-2 flex items-end md:col-span-2">
        <Button type="submit" disabled={pending}>
          {zone ? 'Save zone' : 'Add zone'}
        </Button>
      </div>
    </form>
  );
}

export function ArchiveZoneButton({ org, assetId, zoneId, name }: { org: string; assetId: string; zoneId: string; name: string }) {
  const [state, action, pending] = useActionState(archiveZoneAction.bind(null, org) as Bound, { ok: false });
  return (
    <form action={action} onSubmit={(ev) => { if (!confirm(`Archive the zone "${name}"? Designs that used it keep their copy.`)) ev.preventDefault(); }}>
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="zoneId" value={zoneId} />
      <Button type="submit" variant="danger" className="px-2 py-0.5 text-xs" disabled={pending}>
        Archive
      </Button>
      {state.message && !state.ok ? <span role="alert" className="ml-2 text-xs text-state-overdue">{state.message}</span> : null}
    </form>
  );
}
