'use client';
import { queryKeys } from '@/lib/client/query-client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { PositionField } from '@/components/drawings/position-field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createAnodeGroupAction, removeAnodeGroupAction, restoreAnodeGroupAction, updateAnodeGroupAction } from '@/app/o/[org]/assets/actions';
import { announce, undoBy } from '@/components/ui/toast';
import type { ActionState } from '@/lib/server/action';
import { todayDateOnly } from '@/lib/dates/date-only';

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
  /** The asset's kind: the position preview reads hull words on a vessel and pile words on a structure. */
  assetKind?: 'vessel' | 'structure';
}

/** Record anodes fitted on a zone (new group), or edit a fitted group; edits are kept in its history. */
export function AnodeGroupForm({ org, assetId, zones, models, designs, groups, assetKind }: Props) {
  const editing = Boolean(groups);
  const [groupId, setGroupId] = useState(groups?.[0]?.id ?? '');
  const group = groups?.find((g) => g.id === groupId);
  const form = useBoundAction((editing ? updateAnodeGroupAction : createAnodeGroupAction).bind(null, org), {
    initial: group
      ? { label: group.label, zoneId: group.zoneId ?? '', anodeModelKey: group.anodeModelKey, quantity: String(group.quantity), positions: group.positions ?? '', installedOn: group.installedOn, meanCurrentA: group.meanCurrentA === null ? '' : String(group.meanCurrentA), notes: group.notes ?? '' }
      : { installedOn: todayDateOnly() },
    invalidate: [queryKeys.anodeGroups(org), queryKeys.assets(org)],
  });
  const f = form.field;
  if (editing && !groups!.length) return <p className="text-sm text-ink-faint">No fitted groups to edit.</p>;
  return (
    <ActionForm key={groupId} form={form} className="grid grid-cols-2 gap-3 md:grid-cols-4" messageClassName="col-span-2 md:col-span-4" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      {editing ? (
        <SelectField className="col-span-2 md:col-span-4" label="Group to edit" name="groupId" value={groupId} onChange={(ev) => setGroupId(ev.target.value)} options={groups!.map((g) => ({ value: g.id, label: g.label }))} />
      ) : null}
      <Field label="Group label" {...f('label')} hint="Used in survey files" />
      <SelectField label="Zone" {...f('zoneId', zones[0]?.id ?? '')} options={[{ value: '', label: 'No particular zone' }, ...zones.map((z) => ({ value: z.id, label: z.name }))]} />
      <SelectField className="col-span-2" label="Anode model" {...f('anodeModelKey', models[0]?.key)} options={models.map((m) => ({ value: m.key, label: m.label }))} />
      <Field label="Quantity" {...f('quantity')} type="number" step="1" />
      <Field label="Installed on" {...f('installedOn')} type="date" />
      {!editing ? (
        <SelectField label="From design" {...f('designId', designs[0]?.id ?? '')} options={[{ value: '', label: 'None' }, ...designs.map((d) => ({ value: d.id, label: d.label }))]} />
      ) : null}
      <Field label="Mean current (optional)" {...f('meanCurrentA')} type="number" step="any" unit="A" hint={editing ? 'Drives the forecast' : 'Blank: the design’s share'} />
      <PositionField kind={assetKind} className="col-span-2" label="Positions" {...f('positions')} hint="On a hull: frames, side, height and part, e.g. “Fr 22–30 P, 1.2 m above keel”, “rudder”, “sea chest SB aft”. On a structure: piles and depth, e.g. “B1-A to B6-D, −4 m CD”, “bent 3 row C, 1.5 m below MLWS”. These place the group on the drawing; the rest is kept as a note." />
      <Field className="col-span-2" label="Notes" {...f('notes')} />
      <div className="col-span-2 flex items-end md:col-span-4">
        <Button type="submit" disabled={form.pending}>
          {editing ? 'Save the group' : 'Record the fitted group'}
        </Button>
      </div>
    </ActionForm>
  );
}

export function RemoveGroupForm({ org, groups }: { org: string; groups: { id: string; label: string }[] }) {
  const client = useQueryClient();
  const router = useRouter();
  // The close, then its Undo in the page's notice for a few seconds.
  const closeWithUndo = async (prev: ActionState, formData: FormData): Promise<ActionState> => {
    const answer = await removeAnodeGroupAction(org, prev, formData);
    const groupId = typeof answer.data?.undoGroupId === 'string' ? answer.data.undoGroupId : null;
    if (!answer.ok || !groupId) return answer;
    const label = typeof answer.data?.label === 'string' ? answer.data.label : '';
    announce({
      ok: true,
      message: answer.message ?? `Group "${label}" closed.`,
      undo: {
        label: `Undo: fit the group ${label} again`,
        run: undoBy(restoreAnodeGroupAction.bind(null, org), { groupId }, async () => {
          for (const queryKey of [queryKeys.anodeGroups(org), queryKeys.assets(org)]) await client.invalidateQueries({ queryKey });
          router.refresh();
        }),
      },
    });
    return answer;
  };
  const form = useBoundAction(closeWithUndo, { invalidate: [queryKeys.anodeGroups(org), queryKeys.assets(org)] });
  if (!groups.length) return null;
  return (
    <ActionForm form={form} className="grid grid-cols-2 gap-3 md:grid-cols-4" messageClassName="col-span-2 md:col-span-4" noValidate>
      <SelectField label="Group" name="groupId" options={groups.map((g) => ({ value: g.id, label: g.label }))} defaultValue={form.values.groupId} />
      <Field label="Removed on" {...form.field('removedOn', todayDateOnly())} type="date" />
      <Field label="Reason" {...form.field('reason')} placeholder="e.g. renewed at docking, lost, damaged" />
      <div className="flex items-end">
        <Button type="submit" variant="danger" disabled={form.pending}>
          Close the group
        </Button>
      </div>
    </ActionForm>
  );
}
