'use client';
import { useState } from 'react';
import type { ActionState } from '@/lib/server/action';
import { useRouter } from 'next/navigation';
import { announce, undoBy } from '@/components/ui/toast';
import { IDEMPOTENCY_FIELD, newIdempotencyKey } from '@/lib/client/idempotency-key';
import { Button } from '@/components/ui/button';
import { ActionError } from '@/components/ui/action-form';
import { archiveZoneAction, restoreZoneAction } from '@/app/o/[org]/assets/actions';

/** The zone row's archive button (a file of its own: the asset page shows it on every row, the zone form only on opening). */
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
