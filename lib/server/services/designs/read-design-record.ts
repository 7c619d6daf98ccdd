import type { Design } from '@/entities';
import { parseDesignRecord, parseStoredResults, type DesignRecord, type StoredResults } from '@/lib/schemas/design-record';

export const designLabel = (design: Pick<Design, 'revision' | 'id'>) => `Design revision ${design.revision} (${design.id})`;

/** A revision's stored record, parsed; a row that does not match the schema throws StoredRecordError naming the field. */
export function readDesignRecord(design: Design): DesignRecord {
  const { schemaVersion, inputs, anodeModel, results, resultError, basis } = design;
  return parseDesignRecord({ schemaVersion, inputs, anodeModel, results, resultError, basis }, designLabel(design));
}

/** Only the stored results, for callers that do not load the inputs (lists, the register). */
export function readDesignResults(design: Pick<Design, 'revision' | 'id' | 'schemaVersion' | 'results'>): StoredResults | null {
  return parseStoredResults({ schemaVersion: design.schemaVersion, results: design.results }, designLabel(design));
}
