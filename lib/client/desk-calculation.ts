
/** What the server answers for one set of desk inputs (computeDeskAction; nothing is stored). */
export type { DeskComputed } from '@/lib/design/desk-computed';
import type { DeskComputed } from '@/lib/design/desk-computed';

/** A recompute the server refused: its sentence, and the messages per field path ("surfaces.2.areaM2"). */
export class DeskCalculationError extends Error {
  constructor(
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = 'DeskCalculationError';
  }
}

/** What the desk shows: the results of the last inputs that could be sized, and the messages of the last answer. */
export interface DeskAnswer {
  computed: DeskComputed | null;
  fieldErrors: Record<string, string[]>;
  message: string | null;
}

/** The part of a query's state that settles the answer (TanStack Query's result has these fields). */
export interface DeskQueryState {
  status: 'pending' | 'error' | 'success';
  data: DeskComputed | undefined;
  isPlaceholderData: boolean;
  error: Error | null;
}

const NO_ERRORS: Record<string, string[]> = {};

export const initialDeskAnswer = (computed: DeskComputed | null): DeskAnswer => ({ computed, fieldErrors: NO_ERRORS, message: null });

/**
 * The answer after the query's latest state. Results for the current inputs replace everything; a
 * refusal brings its messages and keeps the last results; while a request is pending (the previous
 * results shown as placeholder) the last answer stands, so messages do not flicker while typing.
 * Returns `previous` itself when nothing changed.
 */
export function settleDeskAnswer(previous: DeskAnswer, query: DeskQueryState): DeskAnswer {
  if (query.status === 'success' && !query.isPlaceholderData && query.data) {
    if (previous.computed === query.data && previous.message === null && previous.fieldErrors === NO_ERRORS) return previous;
    return { computed: query.data, fieldErrors: NO_ERRORS, message: null };
  }
  if (query.status === 'error' && query.error) {
    const fieldErrors = query.error instanceof DeskCalculationError ? query.error.fieldErrors : NO_ERRORS;
    if (previous.message === query.error.message && previous.fieldErrors === fieldErrors) return previous;
    return { computed: previous.computed, fieldErrors, message: query.error.message };
  }
  return previous;
}
