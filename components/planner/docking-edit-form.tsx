'use client';
import { queryKeys } from '@/lib/client/query-client';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { addRenewalAction, updateDockingAction } from '@/app/o/[org]/dockings/actions';
import { DOCKING_KIND_OPTIONS } from './docking-form';
import { DOCKING_STATUS_LABELS, RENEWAL_REASON_LABELS, dockingKindOptions, eventWords } from '@/lib/labels';

/** A docking's or a campaign's dates and status; the words follow the asset (a vessel docks at a yard, a structure has a campaign by a contractor). */
export function DockingEditForm({ org, docking, assetKind }: { org: string; docking: Record<string, string | null> & { id: string }; assetKind?: string }) {
  const words = assetKind ? eventWords(assetKind) : null;
  // The kinds this asset can have, and the stored one even when it is not among them (an older record), so it still shows.
  const kindOptions = [...(assetKind ? dockingKindOptions(assetKind) : DOCKING_KIND_OPTIONS)];
  if (docking.kind && !kindOptions.some((o) => o.value === docking.kind)) kindOptions.push(DOCKING_KIND_OPTIONS.find((o) => o.value === docking.kind) ?? { value: docking.kind, label: 'Docking' });
  const form = useBoundAction(updateDockingAction.bind(null, org), {
    initial: Object.fromEntries(Object.entries(docking).map(([k, val]) => [k, val ?? ''])),
    invalidate: [queryKeys.dockingRenewals(org, docking.id)],
  });
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3" messageClassName="col-span-2" noValidate>
      <input type="hidden" name="dockingId" value={docking.id} />
      <SelectField label="Kind" {...form.field('kind')} options={kindOptions} />
      <SelectField label="Status" {...form.field('status')} options={['planned', 'done', 'cancelled'].map((value) => ({ value, label: DOCKING_STATUS_LABELS[value]! }))} />
      <Field label="Planned start" {...form.field('plannedStart')} type="date" />
      <Field label="Planned end" {...form.field('plannedEnd')} type="date" />
      <Field label="Actual start" {...form.field('actualStart')} type="date" />
      <Field label="Actual end" {...form.field('actualEnd')} type="date" />
      <Field label={words ? words.Place : 'Yard or contractor'} {...form.field('yard')} />
      <Field label="Reference" {...form.field('reference')} />
      <Field className="col-span-2" label="Notes" {...form.field('notes')} />
      <div className="col-span-2">
        <Button type="submit" disabled={form.pending}>Save the {words ? words.event : 'docking'}</Button>
      </div>
    </ActionForm>
  );
}

export function AddRenewalForm({ org, dockingId, groups }: { org: string; dockingId: string; groups: { id: string; label: string }[] }) {
  const form = useBoundAction(addRenewalAction.bind(null, org), { invalidate: [queryKeys.dockingRenewals(org, dockingId)] });
  const e = form.errors;
  if (!groups.length) return <p className="text-sm text-ink-faint">No fitted groups on this asset.</p>;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3" messageClassName="col-span-2" noValidate>
      <input type="hidden" name="dockingId" value={dockingId} />
      <SelectField label="Anode group" name="groupId" options={groups.map((g) => ({ value: g.id, label: g.label }))} errors={e('groupId')} />
      <SelectField label="Reason" name="reason" options={['survey-finding', 'damage', 'forecast-depletion', 'other'].map((value) => ({ value, label: RENEWAL_REASON_LABELS[value]! }))} errors={e('reason')} />
      <Field label="Quantity (blank: the whole group)" name="quantity" type="number" step="1" errors={e('quantity')} />
      <Field label="Notes" name="notes" errors={e('notes')} />
      <div className="col-span-2">
        <Button type="submit" variant="secondary" disabled={form.pending}>Book the renewal</Button>
      </div>
    </ActionForm>
  );
}
