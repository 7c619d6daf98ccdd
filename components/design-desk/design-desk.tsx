'use client';
import { useCallback, useEffect, useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import type { AnodeModelSnapshot } from '@/lib/schemas/design-record';
import type { CatalogueModel } from '@/lib/server/services/catalogue/anode-models';
import type { DeskComputed } from '@/lib/client/desk-calculation';
import { useDeskCalculation } from '@/lib/client/use-desk-calculation';
import { saveDesignAction } from '@/app/o/[org]/designs/actions';
import { Button } from '@/components/ui/button';
import { IDEMPOTENCY_FIELD, useIdempotencyKey } from '@/lib/client/idempotency-key';
import { Caution, Panel } from '@/components/ui/panel';
import { announce, dismissNotice } from '@/components/ui/toast';
import { JobFields } from './job-fields';
import { ZonesTable } from './zones-table';
import { AnodePicker } from './anode-picker';
import { ResultsPanel } from './results-panel';
import { OptionsTable } from './options-table';
import type { DeskState } from './desk-state';

export type { DeskComputed } from '@/lib/client/desk-calculation';

interface Props {
  org: string;
  designId: string;
  initialTitle: string;
  initialInputs: DeskState;
  initialComputed: DeskComputed | null;
  catalogue: CatalogueModel[];
  editable: boolean;
  /** A signed revision: its model key and stored snapshot (null when none was kept), shown instead of the catalogue's entry. */
  storedModel?: { key: string; model: AnodeModelSnapshot | null };
  vessel: { lengthBppM: number | null; beamM: number | null; draughtM: number | null; blockCoefficient: number | null } | null;
}

/**
 * The design desk: inputs on the left, results recomputed by the server as they change (useDeskCalculation).
 * Nothing is written until "Save draft"; an approved revision is shown read-only.
 */
export function DesignDesk({ org, designId, initialTitle, initialInputs, initialComputed, catalogue, editable, storedModel, vessel }: Props) {
  const [title, setTitle] = useState(initialTitle);
  const [inputs, setInputs] = useState<DeskState>(initialInputs);
  const [dirty, setDirty] = useState(false);
  const [saveState, setSaveState] = useState<{ ok: boolean; message: string; fieldErrors?: Record<string, string[]> } | null>(null);
  const [saving, startSave] = useTransition();
  // One key per save: a double click saves once.
  const saveKey = useIdempotencyKey();
  const { computed, fieldErrors: computeErrors, message: computeMessage, computing } = useDeskCalculation({ org, designId, inputs, initialInputs, initialComputed });
  // A refused save's field messages stand until the next edit; then the recompute's do.
  const fieldErrors = saveState?.fieldErrors ?? computeErrors;

  const router = useRouter();
  const update = useCallback((change: (previous: DeskState) => DeskState) => {
    setInputs((previous) => {
      const next = change(previous);
      // A zone taken out can be put back for a few seconds (the whole desk as it was before).
      const removal = next.surfaces.length === previous.surfaces.length - 1 && next.surfaces.every((zone) => previous.surfaces.includes(zone));
      if (removal) {
        const gone = previous.surfaces.find((zone) => !next.surfaces.includes(zone));
        // In the page-wide notice at the foot of the window: the zone's place may be scrolled away.
        queueMicrotask(() =>
          announce({
            ok: true,
            message: `Removed ${gone?.name ? `zone “${gone.name}”` : 'a zone'} (not saved yet).`,
            undo: { label: `Undo: put ${gone?.name ? `zone ${gone.name}` : 'the zone'} back`, run: () => { setInputs(previous); dismissNotice(); } },
          }),
        );
      }
      return next;
    });
    setDirty(true);
    setSaveState(null);
  }, []);

  useEffect(() => {
    if (!dirty) return;
    // A reload, a closed tab or a typed address: the browser asks.
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    // A link inside the app (sidebar, breadcrumb) navigates without unloading, so ask first; the
    // capture phase runs before Next's Link handler, which a cancelled click never reaches.
    const guard = (event: MouseEvent) => {
      if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
      const link = (event.target as Element | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
      if (!link || link.target === '_blank' || link.hasAttribute('download')) return;
      const to = new URL(link.href, window.location.href);
      if (to.origin === window.location.origin && to.pathname === window.location.pathname) return;
      if (!window.confirm('This design has unsaved changes. Leave without saving them?')) {
        event.preventDefault();
        event.stopPropagation();
      }
    };
    window.addEventListener('beforeunload', warn);
    document.addEventListener('click', guard, true);
    return () => {
      window.removeEventListener('beforeunload', warn);
      document.removeEventListener('click', guard, true);
    };
  }, [dirty]);

  const save = () =>
    startSave(async () => {
      const answer = await saveDesignAction(org, { designId, title, inputs, [IDEMPOTENCY_FIELD]: saveKey.current() });
      saveKey.renew();
      if (answer.ok) {
        setDirty(false);
        dismissNotice();
        // The header's title and badge (a checked revision that changes is a draft again) follow the save.
        router.refresh();
        setSaveState({
          ok: true,
          message: `Saved: “${title}”, ${inputs.surfaces.length} zone${inputs.surfaces.length === 1 ? '' : 's'}, at ${new Date(answer.data.updatedAt).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}${answer.data.resultError ? ' (inputs still need attention)' : ''}.`,
        });
      } else {
        setSaveState({ ok: false, message: answer.message, fieldErrors: answer.fieldErrors });
      }
    });

  return (
    <div className="flex flex-col gap-4">
      {editable ? (
        <div className="no-print sticky top-14 z-10 -mx-3 flex flex-wrap items-center gap-3 border-b border-rule bg-paper/95 px-3 py-2 backdrop-blur sm:-mx-6 sm:px-6 lg:top-0 lg:-mx-8 lg:px-8">
          <label className="flex min-w-0 flex-1 basis-full items-center gap-2 text-xs text-ink-soft sm:min-w-80 sm:basis-auto">
            Title
            <input aria-label="Design title" value={title} onChange={(e) => { setTitle(e.target.value); setDirty(true); }} className="min-w-0 flex-1 rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm text-ink max-lg:min-h-11" />
          </label>
          <span role="status" className="text-xs text-ink-faint">
            {computing ? 'Recomputing…' : dirty ? 'Unsaved changes' : 'All changes saved'}
          </span>
          {saveState ? <span role={saveState.ok ? 'status' : 'alert'} className={`text-xs ${saveState.ok ? 'text-state-sound' : 'text-state-action'}`}>{saveState.message}</span> : null}
          <Button onClick={save} disabled={saving || !dirty}>
            {saving ? 'Saving…' : 'Save draft'}
          </Button>
        </div>
      ) : null}
      {computeMessage ? (
        <p role="alert" className="rounded-[3px] border border-state-action/40 bg-state-actionbg px-3 py-2 text-sm text-state-action">
          {computeMessage} Results below are from the last valid inputs.
        </p>
      ) : null}
      <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-[minmax(0,11fr)_minmax(0,9fr)]">
        <div className="flex min-w-0 flex-col gap-4">
          <Panel title="Job and environment">
            <JobFields inputs={inputs} update={update} errors={fieldErrors} editable={editable} />
          </Panel>
          <Panel title="Zones">
            <ZonesTable inputs={inputs} update={update} errors={fieldErrors} editable={editable} vessel={vessel} />
          </Panel>
          <Panel title="Anode">
            <AnodePicker inputs={inputs} update={update} errors={fieldErrors} editable={editable} catalogue={catalogue} stored={storedModel} />
          </Panel>
        </div>
        <div className="flex min-w-0 flex-col gap-4 xl:sticky xl:top-12 xl:max-h-[calc(100vh-4rem)] xl:overflow-y-auto print:static print:max-h-none print:overflow-visible">
          <ResultsPanel computed={computed} stale={computing} />
          {computed?.options.length ? (
            <Panel title="Options compared (same job, every suitable catalogue model)">
              <OptionsTable options={computed.options} chosenKey={inputs.anodeModelKey} onChoose={editable ? (key) => update((s) => ({ ...s, anodeModelKey: key })) : undefined} />
            </Panel>
          ) : null}
          <Caution />
        </div>
      </div>
    </div>
  );
}
