'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createAssetAction, updateAssetAction } from '@/app/o/[org]/assets/actions';
import { AssetFields } from './asset-fields';

/** Create a vessel or structure, or edit one's particulars (then the kind is fixed). */
export function AssetForm({ org, asset }: { org: string; asset?: { id: string; kind: string; values: Record<string, string | undefined> } }) {
  const form = useBoundAction((asset ? updateAssetAction : createAssetAction).bind(null, org), { initial: asset?.values, invalidate: [queryKeys.assets(org)] });
  const [kind, setKind] = useState(asset?.kind ?? form.state.values?.kind ?? 'vessel');
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      {asset ? (
        <>
          <input type="hidden" name="assetId" value={asset.id} />
          <input type="hidden" name="kind" value={asset.kind} />
        </>
      ) : (
        <SelectField label="Kind" name="kind" value={kind} onChange={(e) => setKind(e.target.value)} options={[{ value: 'vessel', label: 'Vessel' }, { value: 'structure', label: 'Harbour structure' }]} />
      )}
      <AssetFields kind={kind} values={form.values} errors={form.state.fieldErrors} />
      <Button type="submit" disabled={form.pending}>
        {asset ? 'Save particulars' : 'Add the asset'}
      </Button>
    </ActionForm>
  );
}
