'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { createAssetAction, updateAssetAction } from '@/app/o/[org]/assets/actions';
import { AssetFields } from './asset-fields';

import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

/** Create a vessel or structure, or edit one's particulars (then the kind is fixed). */
export function AssetForm({ org, asset }: { org: string; asset?: { id: string; kind: string; values: Record<string, string | undefined> } }) {
  const [state, action, pending] = useActionState((asset ? updateAssetAction : createAssetAction).bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.assets(org));
  const [kind, setKind] = useState(asset?.kind ?? state.values?.kind ?? 'vessel');
  const values = state.ok || !state.values ? (asset?.values ?? {}) : state.values;
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      {asset ? (
        <>
          <input type="hidden" name="assetId" value={asset.id} />
          <input type="hidden" name="kind" value={asset.kind} />
        </>
      ) : (
        <SelectField label="Kind" name="kind" value={kind} onChange={(e) => setKind(e.target.value)} options={[{ value: 'vessel', label: 'Vessel' }, { value: 'structure', label: 'Harbour structure' }]} />
      )}
      <AssetFields kind={kind} values={values} errors={state.fieldErrors} />
      <Button type="submit" disabled={pending}>
        {asset ? 'Save particulars' : 'Add the asset'}
      </Button>
    </form>
  );
}
