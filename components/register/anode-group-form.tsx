'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { createAnodeGroupAction, removeAnodeGroupAction, updateAnodeGroupAction } from '@/app/o/[org]/assets/actions';
import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';
import { todayDateOnly } from '@/lib/dates/date-only';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export interface GroupChoice {
  id: string;
  label: string;
  zoneId: string | null;
  anodeModelKey: string;
  quantity: number;
  positions: string | null;
  installedOn: string;
  meanCurrentA: number | null;
  notes: string | null;
}

interface Props {
  org: string;
  assetId: string;
  zones: { id: string; name: string }[];
  models: { key: string; label: string }[];
  designs: { id: string; label: string }[];
  groups?: GroupChoice[];
}

/** Record anodes fitted on a zone (new group), or edit a fitted group; edits are kept in its history. */
export function AnodeGroupForm({ org, assetId, zones, models, designs, groups }: Props) {
  const editing = Boolean(groups);
  const [state, action, pending] = useActionState((editing ? updateAnodeGroupAction : createAnodeGroupAction).bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.anodeGroups(org), queryKeys.assets(org));
  const [groupId, setGroupId] = useState(groups?.[0]?.id ?? '');
  const group = groups?.find((g) => g.id === groupId);
  const fallback: Record<string, string | undefined> = group
    ? { label: group.label, zoneId: group.zoneId ?? '', anodeModelKey: group.anodeModelKey, quantity: String(group.quantity), positions: group.positions ?? '', installedOn: group.installedOn, meanCurrentA: group.meanCurrentA === null ? '' : String(group.meanCurrentA), notes: group.notes ?? '' }
    : { installedOn: todayDateOnly() };
  const v = !state.ok && state.values ? state.values : fallback;
  const e = (name: string) => state.fieldErrors?.[name];
  if (editing && !groups!.length) return <p className="text-sm text-ink-faint">No fitted groups to edit.</p>;
  return (
    <form key={groupId} action={action} className="grid grid-cols-2 gap-3 md:grid-cols-4" noValidate>
      <div className="col-span-2 md:col-span-4">
        <FormMessage state={state} />
      </div>
      <input type="hidden" name="assetId" value={assetId} />
      {editing ? (
        <SelectField className="col-span-2 md:col-span-4" label="Group to edit" name="groupId" value={groupId} onChange={(ev) => setGroupId(ev.target.value)} options={groups!.map((g) => ({ value: g.id, label: g.label }))} />
      ) : null}
      <Field label="Group label" name="label" defaultValue={v.label} errors={e('label')} hint="Used in survey files" />
      <SelectField label="Zone" name="zoneId" defaultValue={v.zoneId ?? zones[0]?.id ?? ''} options={[{ value: '', label: 'No particular zone' }, ...zones.map((z) => ({ value: z.id, label: z.name }))]} errors={e('zoneId')} />
      <SelectField className="col-span-2" label="Anode model" name="anodeModelKey" defaultValue={v.anodeModelKey ?? models[0]?.key} options={models.map((m) => ({ value: m.key, label: m.label }))} errors={e('anodeModelKey')} />
      <Field label="Quantity" name="quantity" type="number" step="1" defaultValue={v.quantity} errors={e('quantity')} />
      <Field label="Installed on" name="installedOn" type="date" defaultValue={v.installedOn} errors={e('installedOn')} />
      {!editing ? (
        <SelectField label="From design" name="designId" defaultValue={v.designId ?? designs[0]?.id ?? ''} options={[{ value: '', label: 'None' }, ...designs.map((d) => ({ value: d.id, label: d.label }))]} errors={e('designId')} />
      ) : null}
      <Field label="Mean current (optional)" name="meanCurrentA" type="number" step="any" unit="A" defaultValue={v.meanCurrentA} errors={e('meanCurrentA')} hint={editing ? 'Drives the forecast' : 'Blank: the design’s share'} />
      <Field className="col-span-2" label="Positions" name="positions" defaultValue={v.positions} errors={e('positions')} hint="Frame numbers on a hull (Fr 12–18 P/S); pile ids by bent and letter on a jetty" />
      <Field className="col-span-2" label="Notes" name="notes" defaultValue={v.notes} errors={e('notes')} />
      <div className="col-span-2 flex items-end md:col-span-4">
        <Button type="submit" disabled={pending}>
          {editing ? 'Save the group' : 'Record the fitted group'}
        </Button>
      </div>
    </form>
  );
}

export function RemoveGroupForm({ org, groups }: { org: string; groups: { id: string; label: string }[] }) {
  const [state, action, pending] = useActionState(removeAnodeGroupAction.bind(null, org) as Bound, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.anodeGroups(org), queryKeys.assets(org));
  if (!groups.length) return null;
  return (
    <form action={action} className="grid grid-cols-2 gap-3 md:grid-cols-4" noValidate>
      <div className="col-span-2 md:col-span-4">
        <FormMessage state={state} />
      </div>
      <SelectField label="Group" name="groupId" options={groups.map((g) => ({ value: g.id, label: g.label }))} defaultValue={state.values?.groupId} />
      <Field label="Removed on" name="removedOn" type="date" defaultValue={state.values?.removedOn ?? todayDateOnly()} errors={state.fieldErrors?.removedOn} />
      <Field label="Reason" name="reason" defaultValue={state.values?.reason} errors={state.fieldErrors?.reason} placeholder="e.g. renewed at docking, lost, damaged" />
      <div className="flex items-end">
        <Button type="submit" variant="danger" disabled={pending}>
          Close the group
        </Button>
      </div>
    </form>
  );
}
