import type { AnodeModelSnapshot, DesignRecord, StoredDesignResult, StoredResults } from '@/lib/schemas/design-record';
import type { DeskNotice } from './build-design-input';

/** What the desk shows beside the inputs: a fresh calculation (a draft) or a signed revision's stored record. */
export interface DeskComputed {
  result: StoredDesignResult | null;
  /** Why the inputs cannot be sized (lib/cp's field and sentence). */
  error: { field: string; message: string } | null;
  notices: DeskNotice[];
  options: StoredResults['options'];
  impressedCurrent: StoredResults['impressedCurrent'];
  /** Null only for a revision stored before the model snapshot was kept; nothing is substituted. */
  model: AnodeModelSnapshot | null;
}

/** A stored record as the desk shows it, without calling the calculation. */
export function storedComputed(record: DesignRecord): DeskComputed {
  const model = record.anodeModel;
  if (!record.results) {
    // result_error is stored as "field: message" (see storeResults).
    const [field, ...rest] = (record.resultError ?? '').split(': ');
    const error = record.resultError ? { field: rest.length ? field : 'inputs', message: rest.length ? rest.join(': ') : field } : null;
    return { result: null, error, notices: [], options: [], impressedCurrent: null, model };
  }
  const { notices, impressedCurrent, options, ...result } = record.results;
  return { result, error: null, notices, options, impressedCurrent, model };
}
