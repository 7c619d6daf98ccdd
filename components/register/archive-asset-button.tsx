'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import type { ActionState } from '@/lib/server/action';
import { archiveAssetAction } from '@/app/o/[org]/assets/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

/** Archive (never delete) or restore an asset. */
export function ArchiveAssetButton({ org, assetId, archived, name }: { org: string; assetId: string; archived: boolean; name: string }) {
  const [state, action, pending] = useActionState(archiveAssetAction.bind(null, org) as Bound, { ok: false });
  return (
    <form
      action={action}
      className="flex items-center gap-2"
      onSubmit={(e) => {
        if (!archived && !confirm(`Archive ${name}? It leaves the lists; designs, groups and surveys are kept and it can be restored.`)) e.preventDefault();
      }}
    >
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="archive" value={archived ? '0' : '1'} />
      {state.message && !state.ok ? <span role="alert" className="text-xs text-state-overdue">{state.message}</span> : null}
      <Button type="submit" variant={archived ? 'secondary' : 'danger'} disabled={pending}>
        {archived ? 'Restore' : 'Archive'}
      </Button>
    </form>
  );
}
