'use client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { useBoundAction } from '@/components/ui/action-form';
import { FormMessage } from '@/components/ui/field';
import { restoreSurveyAction } from '@/app/o/[org]/surveys/actions';
import { queryKeys } from '@/lib/client/query-client';
import { formatDateOnly } from '@/lib/dates/date-only';
import { surveyMethodWords } from '@/lib/labels';
import type { DeletedSurveyRow } from '@/lib/server/services/surveys/manage-surveys';

/**
 * Surveys deleted in the last 30 days, each with its restore button (engineers and owners). One action for
 * the list, so its message stays when the restored survey leaves the list.
 */
export function DeletedSurveys({ org, rows }: { org: string; rows: DeletedSurveyRow[] }) {
  const form = useBoundAction(restoreSurveyAction.bind(null, org), { invalidate: [queryKeys.surveys(org)] });
  return (
    <div className="flex flex-col gap-2">
      <FormMessage state={form.state} />
      {rows.length ? (
        <ul className="flex flex-col gap-2 text-sm">
          {rows.map((row) => (
            <DeletedSurvey key={row.id} row={row} action={form.action} pending={form.pending} />
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-faint">No survey was deleted in the last 30 days.</p>
      )}
    </div>
  );
}

function DeletedSurvey({ row, action, pending }: { row: DeletedSurveyRow; action: (formData: FormData) => void; pending: boolean }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 border-b border-rule pb-2">
      <span>
        {row.assetName}: {surveyMethodWords(row.method)} of {formatDateOnly(row.surveyedOn)} · {row.readings} reading{row.readings === 1 ? '' : 's'}
        <span className="block text-xs text-ink-faint">
          Deleted by {row.deletedBy ?? 'someone'}; can be restored until {formatDateOnly(row.restorableUntil)}.
        </span>
      </span>
      <form action={action}>
        <input type="hidden" name="surveyId" value={row.id} />
        <Button type="submit" variant="secondary" disabled={pending}>
          Restore
        </Button>
      </form>
    </li>
  );
}
