'use client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionError, ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createDockingAction } from '@/app/o/[org]/dockings/actions';

import { assetKindWord, dockingKindOptions } from '@/lib/labels';

/** Every kind, in the words of lib/labels (a campaign is for structures, the dockings for vessels). */
export const DOCKING_KIND_OPTIONS = dockingKindOptions();

export function DockingForm({ org, assets }: { org: string; assets: { id: string; name: string; kind: string }[] }) {
  const form = useBoundAction(createDockingAction.bind(null, org));
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <SelectField label="Vessel or structure" {...form.field('assetId')} options={assets.map((a) => ({ value: a.id, label: `${a.name} (${assetKindWord(a.kind)})` }))} />
      <SelectField label="Kind" {...form.field('kind', 'intermediate')} options={DOCKING_KIND_OPTIONS} />
      <div className="grid grid-cols-2 gap-3">
        <Field label="Planned start" {...form.field('plannedStart')} type="date" />
        <Field label="Planned end" {...form.field('plannedEnd')} type="date" />
      </div>
      <Field label="Yard or contractor" {...form.field('yard')} />
      <Field label="Reference" {...form.field('reference')} />
      <Button type="submit" disabled={form.pending}>
        Plan it
      </Button>
    </ActionForm>
  );
}

/** A suggestion under class practice, accepted as it is (it can be moved on the docking page). */
export function AcceptSuggestion({ org, assetId, date, kind }: { org: string; assetId: string; date: string; kind: string }) {
  const { state, action, pending } = useBoundAction(createDockingAction.bind(null, org));
  return (
    <form action={action} className="inline">
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="kind" value={kind} />
      <input type="hidden" name="plannedStart" value={date} />
      <Button type="submit" variant="secondary" className="text-xs" disabled={pending}>
        Accept
      </Button>
      <ActionError state={state} className="ml-2" />
    </form>
  );
}
