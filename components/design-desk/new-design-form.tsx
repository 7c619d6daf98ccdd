'use client';
import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { createDesignAction } from '@/app/o/[org]/designs/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

/** Pick an asset, or create a vessel or structure on the spot; the desk opens with starting zones. */
export function NewDesignForm({ org, assets }: { org: string; assets: { id: string; name: string; kind: string }[] }) {
  const [state, action, pending] = useActionState(createDesignAction.bind(null, org) as Bound, { ok: false });
  const [assetId, setAssetId] = useState(state.values?.assetId ?? assets[0]?.id ?? 'new');
  const [kind, setKind] = useState(state.values?.['asset.kind'] ?? 'vessel');
  const v = state.values ?? {};
  const e = (field: string) => state.fieldErrors?.[field];
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <SelectField
        label="Asset"
        name="assetId"
        value={assetId}
        onChange={(ev) => setAssetId(ev.target.value)}
        options={[...assets.map((a) => ({ value: a.id, label: `${a.name} (${a.kind})` })), { value: 'new', label: 'A new vessel or structure…' }]}
        errors={e('assetId')}
      />
      {assetId === 'new' ? (
        <fieldset className="flex flex-col gap-3 rounded-[3px] border border-rule p-3">
          <legend className="px-1 text-xs font-semibold text-ink-soft">New asset</legend>
          <SelectField label="Kind" name="asset.kind" value={kind} onChange={(ev) => setKind(ev.target.value)} options={[{ value: 'vessel', label: 'Vessel' }, { value: 'structure', label: 'Harbour structure' }]} />
          <Field label="Name" name="asset.name" defaultValue={v['asset.name']} errors={e('name')} />
          {kind === 'vessel' ? (
            <div className="grid grid-cols-2 gap-3">
              <Field label="Length between perpendiculars" name="asset.lengthBppM" type="number" step="any" unit="m" defaultValue={v['asset.lengthBppM']} errors={e('lengthBppM')} />
              <Field label="Beam" name="asset.beamM" type="number" step="any" unit="m" defaultValue={v['asset.beamM']} errors={e('beamM')} />
              <Field label="Draught" name="asset.draughtM" type="number" step="any" unit="m" defaultValue={v['asset.draughtM']} errors={e('draughtM')} />
              <Field label="Block coefficient" name="asset.blockCoefficient" type="number" step="any" defaultValue={v['asset.blockCoefficient']} errors={e('blockCoefficient')} />
              <SelectField label="Hull material" name="asset.hullMaterial" defaultValue={v['asset.hullMaterial'] ?? 'steel'} options={[{ value: 'steel', label: 'Steel' }, { value: 'aluminium', label: 'Aluminium' }]} errors={e('hullMaterial')} />
              <Field label="Vessel type" name="asset.vesselType" defaultValue={v['asset.vesselType']} errors={e('vesselType')} />
              <label className="col-span-2 flex items-center gap-2 text-sm">
                <input type="checkbox" name="asset.hasImpressedCurrent" defaultChecked={v['asset.hasImpressedCurrent'] === 'on'} /> Impressed-current system fitted
              </label>
            </div>
          ) : (
            <div className="grid grid-cols-2 gap-3">
              <SelectField
                label="Structure"
                name="asset.structureType"
                defaultValue={v['asset.structureType'] ?? 'jetty'}
                options={['jetty', 'wharf', 'dolphin', 'pontoon', 'sheet-pile-wall', 'other'].map((t) => ({ value: t, label: t.replace(/-/g, ' ') }))}
                errors={e('structureType')}
              />
              <SelectField label="Water" name="asset.waterType" defaultValue={v['asset.waterType'] ?? 'seawater'} options={[{ value: 'seawater', label: 'Seawater' }, { value: 'brackish', label: 'Brackish' }, { value: 'fresh', label: 'Fresh' }]} errors={e('waterType')} />
              <Field label="Number of piles" name="asset.pileCount" type="number" defaultValue={v['asset.pileCount']} errors={e('pileCount')} />
              <Field label="Pile diameter" name="asset.pileDiameterM" type="number" step="any" unit="m" defaultValue={v['asset.pileDiameterM']} errors={e('pileDiameterM')} />
              <Field label="Design life" name="asset.designLifeYears" type="number" step="any" unit="years" defaultValue={v['asset.designLifeYears']} errors={e('designLifeYears')} />
              <Field label="Location" name="asset.location" defaultValue={v['asset.location']} errors={e('location')} />
            </div>
          )}
        </fieldset>
      ) : null}
      <Field label="Design title (optional)" name="title" defaultValue={v.title} />
      <Button type="submit" disabled={pending}>
        {pending ? 'Opening…' : 'Open a new design'}
      </Button>
    </form>
  );
}
