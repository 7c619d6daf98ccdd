'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';
import { addRenewalAction, updateDockingAction } from '@/app/o/[org]/dockings/actions';
import { DOCKING_KIND_OPTIONS } from './docking-form';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export function DockingEditForm({ org, docking }: { org: string; docking: Record<string, string | null> & { id: string } }) {
  const [state, action, pending] = useActionState(updateDockingAction.bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.dockingRenewals(org, docking.id));
  const v = !state.ok && state.values ? state.values : (Object.fromEntries(Object.entries(docking).map(([k, val]) => [k, val ?? ''])) as Record<string, string>);
  const e = (n: string) => state.fieldErrors?.[n];
  return (
    <form action={action} className="grid grid-cols-2 gap-3" noValidate>
      <div className="col-span-2">
        <FormMessage state={state} />
      </div>
      <input type="hidden" name="dockingId" value={docking.id} />
      <SelectField label="Kind" name="kind" defaultValue={v.kind} options={DOCKING_KIND_OPTIONS} errors={e('kind')} />
      <SelectField label="Status" name="status" defaultValue={v.status} options={[{ value: 'planned', label: 'Planned' }, { value: 'done', label: 'Done' }, { value: 'cancelled', label: 'Cancelled' }]} errors={e('status')} />
      <Field label="Planned start" name="plannedStart" type="date" defaultValue={v.plannedStart} errors={e('plannedStart')} />
      <Field label="Planned end" name="plannedEnd" type="date" defaultValue={v.plannedEnd} errors={e('plannedEnd')} />
      <Field label="Actual start" name="actualStart" type="date" defaultValue={v.actualStart} errors={e('actualStart')} />
      <Field label="Actual end" name="actualEnd" type="date" defaultValue={v.actualEnd} errors={e('actualEnd')} />
      <Field label="Yard or contractor" name="yard" defaultValue={v.yard} errors={e('yard')} />
      <Field label="Reference" name="reference" defaultValue={v.reference} errors={e('reference')} />
      <Field className="col-span-2" label="Notes" name="notes" defaultValue={v.notes} errors={e('notes')} />
      <div className="col-span-2">
        <Button type="submit" disabled={pending}>Save the docking</Button>
      </div>
    </form>
  );
}

export function AddRenewalForm({ org, dockingId, groups }: { org: string; dockingId: string; groups: { id: string; label: string }[] }) {
  const [state, action, pending] = useActionState(addRenewalAction.bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.dockingRenewals(org, dockingId));
  const e = (n: string) => state.fieldErrors?.[n];
  if (!groups.length) return <p className="text-sm text-ink-faint">No fitted groups on this asset.</p>;
  return (
    <form action={action} className="grid grid-cols-2 gap-3" noValidate>
      <div className="col-span-2">
        <FormMessage state={state} />
      </div>
      <input type="hidden" name="dockingId" value={dockingId} />
      <SelectField label="Anode group" name="groupId" options={groups.map((g) => ({ value: g.id, label: g.label }))} errors={e('groupId')} />
      <SelectField label="Reason" name="reason" options={[{ value: 'survey-finding', label: 'Survey finding' }, { value: 'damage', label: 'Damage' }, { value: 'forecast-depletion', label: 'Forecast depletion' }, { value: 'other', label: 'Other' }]} errors={e('reason')} />
      <Field label="Quantity (blank: the whole group)" name="quantity" type="number" step="1" errors={e('quantity')} />
      <Field label="Notes" name="notes" errors={e('notes')} />
      <div className="col-span-2">
        <Button type="submit" variant="secondary" disabled={pending}>Book the renewal</Button>
      </div>
    </form>
  );
}
