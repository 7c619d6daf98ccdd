'use client';
import { useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { computeDeskAction } from '@/app/o/[org]/designs/actions';
import type { DeskInputsDraft } from '@/lib/schemas/design';
import { queryKeys } from './query-client';
import { useDebouncedValue } from './use-debounced-value';
import { unlessAborted } from './unless-aborted';
import { DeskCalculationError, initialDeskAnswer, settleDeskAnswer, type DeskComputed } from './desk-calculation';

/** How long typing must pause before the desk asks for results. */
const DEBOUNCE_MS = 250;

interface Args {
  org: string;
  designId: string;
  inputs: DeskInputsDraft;
  /** The saved inputs the page computed `initialComputed` from (compared by identity: untouched or not). */
  initialInputs: DeskInputsDraft;
  initialComputed: DeskComputed | null;
}

/**
 * The desk's results for the inputs being edited: one query per set of inputs once typing pauses, so
 * an answer for inputs already replaced is never shown and a superseded request is cancelled (the
 * server action cannot take the signal: the desk stops waiting while the server still finishes the calculation).
 * `computed` stays on the last inputs that could be sized; `fieldErrors` and `message` are the last refusal's.
 */
export function useDeskCalculation({ org, designId, inputs, initialInputs, initialComputed }: Args) {
  const debounced = useDebouncedValue(inputs, DEBOUNCE_MS);
  const untouched = debounced === initialInputs;
  const query = useQuery({
    queryKey: queryKeys.deskCalculation(org, designId, debounced),
    queryFn: async ({ signal }): Promise<DeskComputed> => {
      const answer = await unlessAborted(computeDeskAction(org, { designId, inputs: debounced }), signal);
      if (!answer.ok) throw new DeskCalculationError(answer.message, answer.fieldErrors);
      return answer.data;
    },
    placeholderData: keepPreviousData,
    // The page sized the saved inputs already; when it could not, the first change asks.
    initialData: untouched ? (initialComputed ?? undefined) : undefined,
    enabled: !untouched || initialComputed !== null,
    // A refusal is an answer about the inputs: asking again would only delay the message.
    retry: false,
  });
  const [answer, setAnswer] = useState(() => initialDeskAnswer(initialComputed));
  const settled = settleDeskAnswer(answer, query);
  if (settled !== answer) setAnswer(settled); // React's way of keeping what earlier renders saw
  return { ...settled, computing: query.isFetching };
}
