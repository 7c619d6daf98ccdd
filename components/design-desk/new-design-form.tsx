'use client';
import { useState } from 'react';
import dynamic from 'next/dynamic';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createDesignAction } from '@/app/o/[org]/designs/actions';
import { assetKindWord } from '@/lib/labels';

/*
 * The new asset's fields, loaded when "A new vessel or structure…" is chosen (or shown from the start, with no
 * asset yet): their code (the particulars' constants, the potential criteria and the schemas' lists) is not part of
 * the design desk's first-load JavaScript otherwise (npm run bench, at most 1.5 x the smallest page).
 */
const AssetFields = dynamic(() => import('@/components/register/asset-fields').then((m) => m.AssetFields));

/** Pick an asset, or create a vessel or structure on the spot; the desk opens with starting zones. */
export function NewDesignForm({ org, assets }: { org: string; assets: { id: string; name: string; kind: string }[] }) {
  const form = useBoundAction(createDesignAction.bind(null, org));
  const [assetId, setAssetId] = useState(form.values.assetId ?? assets[0]?.id ?? 'new');
  const [kind, setKind] = useState(form.values['asset.kind'] ?? 'vessel');
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <SelectField
        label="Asset"
        name="assetId"
        value={assetId}
        onChange={(ev) => setAssetId(ev.target.value)}
        options={[...assets.map((a) => ({ value: a.id, label: `${a.name} (${assetKindWord(a.kind)})` })), { value: 'new', label: 'A new vessel or structure…' }]}
        errors={form.errors('assetId')}
      />
      {assetId === 'new' ? (
        <fieldset className="flex flex-col gap-3 rounded-[3px] border border-rule p-3">
          <legend className="px-1 text-xs font-semibold text-ink-soft">New asset</legend>
          <SelectField label="Kind" name="asset.kind" value={kind} onChange={(ev) => setKind(ev.target.value)} options={[{ value: 'vessel', label: 'Vessel' }, { value: 'structure', label: 'Harbour structure' }]} />
          <AssetFields prefix="asset." kind={kind} values={form.values} errors={form.state.fieldErrors} />
        </fieldset>
      ) : null}
      <Field label="Design title (optional)" name="title" defaultValue={form.values.title} />
      <Button type="submit" disabled={form.pending}>
        {form.pending ? 'Opening…' : 'Open a new design'}
      </Button>
    </ActionForm>
  );
}
