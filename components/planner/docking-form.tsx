'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { createDockingAction } from '@/app/o/[org]/dockings/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export const DOCKING_KIND_OPTIONS = [
  { value: 'intermediate', label: 'Intermediate docking' },
  { value: 'renewal-survey', label: 'Renewal-survey docking' },
  { value: 'unplanned', label: 'Unplanned docking' },
  { value: 'campaign', label: 'Diving or works campaign (structures)' },
];

export function DockingForm({ org, assets }: { org: string; assets: { id: string; name: string; kind: string }[] }) {
  const [state, action, pending] = useActionState(createDockingAction.bind(null, org) as Bound, { ok: false });
  const v = state.values ?? {};
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <SelectField label="Vessel or structure" name="assetId" defaultValue={v.assetId} options={assets.map((a) => ({ value: a.id, label: `${a.name} (${a.kind})` }))} errors={e('assetId')} />
      <SelectField label="Kind" name="kind" defaultValue={v.kind ?? 'intermediate'} options={DOCKING_KIND_OPTIONS} errors={e('kind')} />
      <div className="grid grid-cols-2 gap-3">
        <Field label="Planned start" name="plannedStart" type="date" defaultValue={v.plannedStart} errors={e('plannedStart')} />
        <Field label="Planned end" name="plannedEnd" type="date" defaultValue={v.plannedEnd} errors={e('plannedEnd')} />
      </div>
      <Field label="Yard or contractor" name="yard" defaultValue={v.yard} errors={e('yard')} />
      <Field label="Reference" name="reference" defaultValue={v.reference} errors={e('reference')} />
      <Button type="submit" disabled={pending}>
        Plan it
      </Button>
    </form>
  );
}

/** A suggestion under class practice, accepted as it is (it can be moved on the docking page). */
export function AcceptSuggestion({ org, assetId, date, kind }: { org: string; assetId: string; date: string; kind: string }) {
  const [state, action, pending] = useActionState(createDockingAction.bind(null, org) as Bound, { ok: false });
  return (
    <form action={action} className="inline">
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="kind" value={kind} />
      <input type="hidden" name="plannedStart" value={date} />
      <Button type="submit" variant="secondary" className="px-2 py-0.5 text-xs" disabled={pending}>
        Accept
      </Button>
      {state.message && !state.ok ? <span role="alert" className="ml-2 text-xs text-state-overdue">{state.message}</span> : null}
    </form>
  );
}
