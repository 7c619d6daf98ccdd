'use client';
import { Button } from '@/components/ui/button';
import { ActionError, useBoundAction } from '@/components/ui/action-form';
import { archiveAssetAction } from '@/app/o/[org]/assets/actions';

/** Archive (never delete) or restore an asset. */
export function ArchiveAssetButton({ org, assetId, archived, name }: { org: string; assetId: string; archived: boolean; name: string }) {
  const { state, action, pending } = useBoundAction(archiveAssetAction.bind(null, org));
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
      <ActionError state={state} />
      <Button type="submit" variant={archived ? 'secondary' : 'danger'} disabled={pending}>
        {archived ? 'Restore' : 'Archive'}
      </Button>
    </form>
  );
}
