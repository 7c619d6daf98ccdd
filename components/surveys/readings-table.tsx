'use client';
import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { useRouter } from 'next/navigation';
import { DataTable } from '@/components/ui/data-table';
import { StatusTag } from '@/components/ui/panel';
import { REMAINING_TONES } from '@/lib/status/palette';
import { Button } from '@/components/ui/button';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { POTENTIAL_STATUS_TONES } from '@/components/register/potential-tag';
import { ELECTRODE_SHORT_LABELS, REMAINING_STATUS_LABELS, versusElectrode } from '@/lib/labels';
import { fmt } from '@/lib/format';
import { deleteReadingAction, restoreReadingAction, updateReadingAction } from '@/app/o/[org]/surveys/actions';
import { announce, undoBy, UNDO_SECONDS } from '@/components/ui/toast';
import type { ActionState } from '@/lib/server/action';
import type { getSurveyDetails } from '@/lib/server/services/surveys/survey-details';
import { ReadingFields } from './reading-form';
import { ConfirmDelete } from './confirm-delete';

type Reading = Awaited<ReturnType<typeof getSurveyDetails>>['readings'][number];

interface Editing {
  org: string;
  surveyId: string;
  groups: string[];
  electrode: string;
}

/**
 * Deletes a reading, then offers its Undo in the page's notice (the row, and this control, are gone once the
 * page refreshes, so the notice lives in the page-wide store).
 */
function deleteWithUndo(editing: Editing, refresh: () => void) {
  return async (prev: ActionState, formData: FormData): Promise<ActionState> => {
    const answer = await deleteReadingAction(editing.org, prev, formData);
    const readingId = typeof answer.data?.undoReadingId === 'string' ? answer.data.undoReadingId : null;
    if (!answer.ok || !readingId) return answer;
    const location = typeof answer.data?.location === 'string' ? answer.data.location : '';
    announce({
      ok: true,
      message: answer.message ?? `Reading at ${location} deleted.`,
      undo: {
        label: `Undo: put back the reading at ${location}`,
        run: undoBy(restoreReadingAction.bind(null, editing.org), { surveyId: editing.surveyId, readingId }, () => refresh()),
      },
    });
    return answer;
  };
}

/** Readings against the criteria: status in words, colour only as a second cue. With `editing`, each row can be corrected or deleted. */
export function ReadingsTable({ readings, editing }: { readings: Reading[]; editing?: Editing }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const router = useRouter();
  const editKey = editing ? JSON.stringify(editing) : '';
  // The reading as the page has it now: after a saved correction the page refreshes and the form shows the new values.
  const open = openId ? (readings.find((r) => r.id === openId) ?? null) : null;
  const columns = useMemo(() => {
    const col = createColumnHelper<Reading>();
    const base = [
      col.accessor('line', { header: 'Line', meta: { numeric: true }, cell: (c) => c.getValue() ?? '—' }),
      col.accessor('location', { header: 'Location' }),
      col.accessor('potentialV', { header: 'As measured', meta: { numeric: true }, cell: (c) => (c.getValue() === null ? '—' : `${fmt(c.getValue(), 3)} ${versusElectrode(ELECTRODE_SHORT_LABELS[c.row.original.electrode ?? ''] ?? 'the survey electrode')}`) }),
      col.accessor('potentialAgAgClV', { header: 'vs Ag/AgCl/seawater', meta: { numeric: true }, cell: (c) => (c.getValue() === null ? '—' : `${fmt(c.getValue(), 3)} V`) }),
      col.accessor('potentialStatus', {
        header: 'Protection',
        cell: (c) =>
          c.getValue() ? (
            <span title={c.row.original.potentialMessage ?? undefined} data-status={c.getValue()}>
              <StatusTag tone={POTENTIAL_STATUS_TONES[c.getValue()!]}>{c.row.original.potentialLabel}</StatusTag>
              {c.row.original.potentialCriterion ? <span className="block text-2xs text-ink-faint">{c.row.original.potentialCriterion}</span> : null}
            </span>
          ) : (
            '—'
          ),
      }),
      col.accessor('group', { header: 'Anode group', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('remainingFraction', {
        header: 'Remaining',
        meta: { numeric: true },
        cell: (c) =>
          c.getValue() === null ? (
            '—'
          ) : (
            <span className="inline-flex items-center gap-1.5">
              {fmt(c.getValue()! * 100, 0)} %
              {c.row.original.remainingStatus ? <StatusTag tone={REMAINING_TONES[c.row.original.remainingStatus]}>{REMAINING_STATUS_LABELS[c.row.original.remainingStatus]}</StatusTag> : null}
            </span>
          ),
      }),
      col.accessor('comment', { header: 'Comment', enableSorting: false, cell: (c) => <span className="text-xs">{c.getValue() ?? ''}</span> }),
    ];
    if (!editing) return base;
    return [
      ...base,
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Correct</span>,
        cell: (c) => (
          <span className="inline-flex flex-wrap items-center gap-2">
            <Button type="button" variant="secondary" className="text-xs" onClick={() => setOpenId(c.row.original.id)} aria-label={`Edit the reading at ${c.row.original.location}`}>
              Edit
            </Button>
            <ConfirmDelete
              action={deleteWithUndo(editing, router.refresh)}
              fields={{ surveyId: editing.surveyId, readingId: c.row.original.id }}
              what={`the reading at ${c.row.original.location}`}
              consequence={`You can undo it for ${UNDO_SECONDS} seconds; the audit log keeps its values.`}
            />
          </span>
        ),
      }),
    ];
    // Keyed on what editing holds, not its identity: a page refresh (another action's) must not remount the
    // cells and close a "Delete …?" question the user is answering.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [editKey, router]);
  return (
    <>
      {editing && open ? <ReadingEditForm key={open.id} reading={open} editing={editing} onClose={() => setOpenId(null)} /> : null}
      <DataTable label="Readings" data={readings} columns={columns} pageSize={50} empty="No readings yet: upload a CSV or add them one by one." filterPlaceholder="Filter by location, group, status…" />
    </>
  );
}

/** Corrects one reading; the values it had are the starting point, and stay typed in after a refusal. */
function ReadingEditForm({ reading, editing, onClose }: { reading: Reading; editing: Editing; onClose: () => void }) {
  const form = useBoundAction(updateReadingAction.bind(null, editing.org));
  const initial: Record<string, string> = {
    location: reading.location,
    potentialV: reading.potentialV === null ? '' : String(reading.potentialV),
    electrode: reading.electrode ?? editing.electrode,
    anodeGroupLabel: reading.group ?? '',
    remainingPercent: reading.remainingFraction === null ? '' : String(Math.round(reading.remainingFraction * 100000) / 1000),
    comment: reading.comment ?? '',
  };
  return (
    <div className="mb-3 rounded-[3px] border border-rule-strong bg-paper-sunk p-3">
      <p className="mb-2 text-sm font-medium">Correct the reading at {reading.location}</p>
      <ActionForm form={form} className="grid grid-cols-2 gap-3 md:grid-cols-3" messageClassName="col-span-2 md:col-span-3" noValidate aria-label={`Correct the reading at ${reading.location}`}>
        <input type="hidden" name="surveyId" value={editing.surveyId} />
        <input type="hidden" name="readingId" value={reading.id} />
        <ReadingFields field={form.field} groups={editing.groups} electrode={editing.electrode} initial={initial} />
        <div className="col-span-2 flex items-end gap-2 md:col-span-3">
          <Button type="submit" disabled={form.pending}>
            Save the correction
          </Button>
          <Button type="button" variant="secondary" onClick={onClose}>
            Close
          </Button>
        </div>
      </ActionForm>
    </div>
  );
}
