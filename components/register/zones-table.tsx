'use client';
import { useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { announce, undoBy } from '@/components/ui/toast';
import { IDEMPOTENCY_FIELD, newIdempotencyKey } from '@/lib/client/idempotency-key';
import { archiveZoneAction, restoreZoneAction } from '@/app/o/[org]/assets/actions';
import { ZoneForm } from './lazy-forms';
import type { AssetPage } from '@/lib/server/services/assets/get-asset-page';

/** A zone as the asset page reads it (getAssetPage) and its edit form takes it. */
export type ZoneRow = AssetPage['zones'][number];

/**
 * The asset's zones: the table is static markup (zonesTableHtml), and this component answers its buttons. Edit opens
 * the zone's form under the table (one zone at a time; it stays open after saving, with the form's message); Archive
 * asks first, archives, and offers Undo in the page's notice. The rows are not components of their own: the asset
 * page is benchmarked (npm run bench), and a component per row cost more than the rest of the table.
 *
 * `zones`: the rows' data for the edit form, for a member who may change the register; null for one who may not
 * (the markup then has no buttons).
 */
export function ZonesTable({ org, assetId, markup, zones }: { org: string; assetId: string; markup: string; zones: ZoneRow[] | null }) {
  const router = useRouter();
  const rootRef = useRef<HTMLDivElement>(null);
  const editorRef = useRef<HTMLElement>(null);
  const [editing, setEditing] = useState<string | null>(null);
  /** Why the last archive did not go through, as a sentence (a refusal, or no answer at all). */
  const [refusal, setRefusal] = useState<string | null>(null);
  const archiving = useRef(false);
  const zone = zones?.find((z) => z.id === editing) ?? null;

  // The Edit buttons say which zone's form is open (the markup is static: kept in step here, also after a refresh).
  useEffect(() => {
    for (const button of rootRef.current?.querySelectorAll<HTMLButtonElement>('button[data-zone-edit]') ?? []) {
      button.setAttribute('aria-expanded', String(zone !== null && button.dataset.zoneEdit === zone.id));
      if (zone !== null && button.dataset.zoneEdit === zone.id) button.setAttribute('aria-controls', 'zone-editor');
      else button.removeAttribute('aria-controls');
    }
  }, [zone, markup]);

  const editButton = (id: string) => rootRef.current?.querySelector<HTMLButtonElement>(`button[data-zone-edit="${CSS.escape(id)}"]`) ?? null;

  const close = () => {
    const id = editing;
    setEditing(null);
    if (id) editButton(id)?.focus();
  };

  const archive = async (button: HTMLButtonElement) => {
    const zoneId = button.dataset.zoneArchive ?? '';
    const name = button.dataset.zoneName ?? '';
    if (archiving.current || !confirm(`Archive the zone "${name}"? Designs that used it keep their copy.`)) return;
    const data = new FormData();
    data.set('assetId', assetId);
    data.set('zoneId', zoneId);
    data.set(IDEMPOTENCY_FIELD, newIdempotencyKey());
    archiving.current = true;
    button.disabled = true;
    setRefusal(null);
    try {
      const answer = await archiveZoneAction(org, { ok: false }, data);
      if (!answer.ok) {
        setRefusal(`The zone ${name} was not archived${answer.message ? `: ${answer.message}` : '.'}`);
        return;
      }
      if (editing === zoneId) setEditing(null);
      const undoZoneId = answer.data?.undoZoneId;
      // The answer may carry the refreshed page, in which this row is gone: the confirmation and its Undo go to the
      // page-wide notice.
      announce({
        ok: true,
        message: answer.message ?? `Zone "${name}" archived.`,
        undo:
          typeof undoZoneId === 'string'
            ? { label: `Undo: restore the zone ${name}`, run: undoBy(restoreZoneAction.bind(null, org), { zoneId: undoZoneId }, () => router.refresh()) }
            : undefined,
      });
      router.refresh();
    } catch {
      setRefusal(`No answer from the server on archiving the zone ${name}: reload the page to see whether it was archived.`);
    } finally {
      archiving.current = false;
      button.disabled = false;
    }
  };

  const onClick = (event: React.MouseEvent<HTMLDivElement>) => {
    if (!zones) return;
    const button = (event.target as Element).closest<HTMLButtonElement>('button[data-zone-edit], button[data-zone-archive]');
    if (!button || !rootRef.current?.contains(button)) return;
    const editId = button.dataset.zoneEdit;
    if (editId) {
      setEditing((current) => (current === editId ? null : editId));
      return;
    }
    void archive(button);
  };

  // Opening a zone's form moves the focus to it (its heading), so a keyboard or screen-reader user lands there.
  useEffect(() => {
    if (editing) editorRef.current?.focus();
  }, [editing]);

  return (
    <>
      <div ref={rootRef} className="contents" onClick={onClick} dangerouslySetInnerHTML={{ __html: markup }} />
      {refusal ? (
        <p role="alert" className="mt-2 text-xs text-state-action">
          {refusal}
        </p>
      ) : null}
      {zone ? (
        <section ref={editorRef} id="zone-editor" tabIndex={-1} aria-label={`Edit the zone ${zone.name}`} className="mt-3 rounded-[3px] border border-rule bg-paper p-3 outline-none">
          <div className="mb-2 flex items-center justify-between gap-3">
            <h3 className="text-sm font-semibold text-ink">Edit the zone {zone.name}</h3>
            <button type="button" onClick={close} className="cursor-pointer text-xs text-tide-600 hover:underline max-lg:min-h-11">
              Close<span className="sr-only"> the zone&apos;s form</span>
            </button>
          </div>
          <ZoneForm key={zone.id} org={org} assetId={assetId} zone={zone} />
        </section>
      ) : null}
    </>
  );
}
