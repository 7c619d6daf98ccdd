'use client';
import { useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { PositionField } from '@/components/drawings/position-field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { bookDesignRenewalsAction, fitDesignAction } from '@/app/o/[org]/designs/actions';
import { queryKeys } from '@/lib/client/query-client';

interface Props {
  org: string;
  designId: string;
  assetName: string;
  /** Planned dockings or campaigns of the asset: [id, "Intermediate docking from 3 May 2027"]. */
  dockings: { value: string; label: string }[];
  can: { install: boolean; book: boolean };
  /** Where each zone's anodes go, proposed from the design (editable before fitting). */
  proposals?: { zone: string; text: string; basis: string }[];
  /** The asset's kind, for the position preview. */
  assetKind?: 'vessel' | 'structure';
}

/**
 * "Fit this design" on an approved revision: its anodes, zone by zone, either fitted on a day or
 * booked as renewals at a planned docking or campaign. The form carries an idempotency key, so a
 * double click or a resend is recognised as the same request.
 */
export function FitDesignForm({ org, designId, assetName, dockings, can, proposals = [], assetKind }: Props) {
  // Recording an installation is an engineer's (asset:write), booking renewals a planner's (renewal:write): one action each.
  const fit = useBoundAction(fitDesignAction.bind(null, org), { invalidate: [queryKeys.anodeGroups(org), queryKeys.assets(org)] });
  const book = useBoundAction(bookDesignRenewalsAction.bind(null, org), { invalidate: [queryKeys.anodeGroups(org), queryKeys.assets(org)] });
  const [mode, setMode] = useState<'installed' | 'renewal'>(can.install ? 'installed' : 'renewal');
  const form = mode === 'installed' ? fit : book;
  // A new key once the server has answered: a resend of the same submit keeps it, a deliberate second fit gets a new one.
  const idempotencyKey = useMemo(() => crypto.randomUUID(), [form.state]);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" aria-label="Fit this design">
      <input type="hidden" name="designId" value={designId} />
      <input type="hidden" name="idempotencyKey" value={idempotencyKey} />
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 text-xs font-medium text-ink-soft">{`Put this revision's anodes on ${assetName}`}</legend>
        {can.install ? (
          <label className="flex items-center gap-2">
            <input type="radio" name="mode" value="installed" checked={mode === 'installed'} onChange={() => setMode('installed')} /> Fitted on a day (installed groups)
          </label>
        ) : null}
        {can.book ? (
          <label className="flex items-center gap-2">
            <input type="radio" name="mode" value="renewal" checked={mode === 'renewal'} onChange={() => setMode('renewal')} /> Booked as renewals at a docking
          </label>
        ) : null}
      </fieldset>
      {mode === 'installed' ? (
        <>
          <Field label="Fitted on" type="date" {...form.field('fittedOn')} />
          {proposals.length ? (
            <fieldset className="flex flex-col gap-2">
              <legend className="mb-1 text-xs font-medium text-ink-soft">Where the anodes go: proposed from the design, edit any before fitting (frames and side, or piles and depth)</legend>
              {proposals.map((p, i) => (
                <div key={p.zone}>
                  <input type="hidden" name={`positionZone-${i}`} value={p.zone} />
                  <PositionField kind={assetKind} label={`Position, ${p.zone}`} {...form.field(`position-${i}`, p.text)} hint={p.basis} />
                </div>
              ))}
            </fieldset>
          ) : null}
        </>
      ) : dockings.length ? (
        <SelectField label="Docking or campaign" options={dockings} {...form.field('dockingId', dockings[0]?.value)} />
      ) : (
        <p className="text-sm text-ink-soft">{`${assetName} has no planned docking or campaign: plan one first.`}</p>
      )}
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="confirmSecondFit" defaultChecked={form.values.confirmSecondFit === 'on'} /> Fit it again (only if this revision is already fitted and a second set is really going on)
      </label>
      {form.errors('confirmSecondFit') ? <p className="text-xs text-state-action">{form.errors('confirmSecondFit')!.join(' ')}</p> : null}
      <div>
        <Button type="submit" disabled={form.pending || (mode === 'renewal' && !dockings.length)}>
          Fit this design
        </Button>
      </div>
    </ActionForm>
  );
}
