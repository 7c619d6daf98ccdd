'use client';
import { Button } from '@/components/ui/button';
import { ActionError, useBoundAction } from '@/components/ui/action-form';
import { FormMessage } from '@/components/ui/field';
import { restoreSurveyAction } from '@/app/o/[org]/surveys/actions';
import { queryKeys } from '@/lib/client/query-client';
import { formatDateOnly } from '@/lib/dates/date-only';
import { useState } from 'react';
import { newRequestKey } from './request-key';
import type { DeletedSurveyRow } from '@/lib/server/services/surveys/manage-surveys';

/** Surveys deleted in the last 30 days, each with its restore button (engineers and owners). */
export function DeletedSurveys({ org, rows }: { org: string; rows: DeletedSurveyRow[] }) {
  if (!rows.length) return <p className="text-sm text-ink-faint">No survey was deleted in the last 30 days.</p>;
  return (
    <ul className="flex flex-col gap-2 text-sm">
      {rows.map((r) => (
        <DeletedSurvey key={r.id} org={org} row={r} />
      ))}
    </ul>
  );
}

function DeletedSurvey({ org, row }: { org: string; row: DeletedSurveyRow }) {
  const { state, action, pending } = useBoundAction(restoreSurveyAction.bind(null, org), { invalidate: [queryKeys.surveys(org)] });
  const [key] = useState(newRequestKey);
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 border-b border-rule pb-2">
      <span>
        {row.assetName}: {row.method} survey of {formatDateOnly(row.surveyedOn)} · {row.readings} reading{row.readings === 1 ? '' : 's'}
        <span className="block text-xs text-ink-faint">
          Deleted by {row.deletedBy ?? 'someone'}; can be restored until {formatDateOnly(row.restorableUntil)}.
        </span>
      </span>
      <form action={action} className="flex items-center gap-2">
        <input type="hidden" name="surveyId" value={row.id} />
        <input type="hidden" name="idempotencyKey" value={key} />
        {state.ok ? <FormMessage state={state} /> : <ActionError state={state} />}
        <Button type="submit" variant="secondary" disabled={pending || state.ok}>
          Restore
        </Button>
      </form>
    </li>
  );
}
