'use client';
import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import { AssetFields } from '@/components/register/asset-fields';
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
          <AssetFields prefix="asset." kind={kind} values={v} errors={state.fieldErrors} />
        </fieldset>
      ) : null}
      <Field label="Design title (optional)" name="title" defaultValue={v.title} />
      <Button type="submit" disabled={pending}>
        {pending ? 'Opening…' : 'Open a new design'}
      </Button>
    </form>
  );
}
