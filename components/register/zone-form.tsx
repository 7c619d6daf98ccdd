'use client';
import { useState } from 'react';
import type { ActionState } from '@/lib/server/action';
import { useRouter } from 'next/navigation';
import { announce, undoBy } from '@/components/ui/toast';
import { IDEMPOTENCY_FIELD, newIdempotencyKey } from '@/lib/client/idempotency-key';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionError, ActionForm, useBoundAction } from '@/components/ui/action-form';
import { CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, ZONE_KIND_LABELS, WATER_TYPE_LABELS } from '@/lib/labels';
import { archiveZoneAction, createZoneAction, restoreZoneAction, updateZoneAction } from '@/app/o/[org]/assets/actions';

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

export function ArchiveZoneButton({ org, assetId, zoneId, name }: { org: string; assetId: string; zoneId: string; name: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [refusal, setRefusal] = useState<ActionState>({ ok: false });
  // Run from the submit handler, not as a form transition: the answer may carry the refreshed page, in
  // which this row is gone, so the confirmation and its Undo go to the page-wide notice first.
  const archive = async (form: HTMLFormElement) => {
    const data = new FormData(form);
    data.set(IDEMPOTENCY_FIELD, newIdempotencyKey());
    setPending(true);
    const answer = await archiveZoneAction(org, { ok: false }, data);
    setPending(false);
    const undoZoneId = answer.ok ? answer.data?.undoZoneId : null;
    if (!answer.ok || typeof undoZoneId !== 'string') {
      setRefusal(answer);
      return;
    }
    announce({
      ok: true,
      message: answer.message ?? `Zone "${name}" archived.`,
      undo: {
        label: `Undo: restore the zone ${name}`,
        run: undoBy(restoreZoneAction.bind(null, org), { zoneId: undoZoneId }, () => router.refresh()),
      },
    });
    router.refresh();
  };
  return (
    <form
      onSubmit={(ev) => {
        ev.preventDefault();
        if (confirm(`Archive the zone "${name}"? Designs that used it keep their copy.`)) void archive(ev.currentTarget);
      }}
    >
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="zoneId" value={zoneId} />
      <Button type="submit" variant="danger" className="px-2 py-0.5 text-xs" disabled={pending}>
        Archive<span className="sr-only"> the zone {name}</span>
      </Button>
      <ActionError state={refusal} className="ml-2" />
    </form>
  );
}
