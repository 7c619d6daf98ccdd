import { describe, expect, it } from 'vitest';
import { storedComputed } from '@/lib/design/desk-computed';
import { DESIGN_SCHEMA_VERSION, StoredRecordError, parseDesignRecord, parseStoredResults } from '@/lib/schemas/design-record';
import { ferryRecord } from './record-fixture';

const refusal = (raw: unknown) => {
  try {
    parseDesignRecord(raw, 'Design revision 4 (test)');
  } catch (error) {
    if (error instanceof StoredRecordError) return error;
    throw error;
  }
  throw new Error('the record was accepted');
};

describe('the stored design record', () => {
  it('keeps every field of a live calculation: a record round-trips through the schema unchanged', () => {
    const record = ferryRecord();
    expect(record.results?.options.some((o) => !o.suitable)).toBe(true);
    expect(record.results?.impressedCurrent).not.toBeNull();
    expect(record.results?.surfaces.some((s) => s.drainsCurrent)).toBe(true);
    expect(parseDesignRecord(record, 'test')).toEqual(record);
  });

  it('refuses a malformed stored value with a message naming the field and the row', () => {
    const record = ferryRecord() as unknown as { results: Record<string, unknown> };
    record.results.anodeCount = 'many';
    const error = refusal(record);
    expect(error.fields).toEqual(['results.anodeCount']);
    expect(error.message).toContain('Design revision 4 (test)');
    expect(error.message).toMatch(/results\.anodeCount: .*expected number/);
  });

  it('names a missing field deep in the record by its path', () => {
    const record = ferryRecord() as unknown as { results: { surfaces: Record<string, unknown>[] }; anodeModel: Record<string, unknown> };
    delete record.results.surfaces[1].meanA;
    delete record.anodeModel.netMassKg;
    const error = refusal(record);
    expect(error.fields.sort()).toEqual(['anodeModel.netMassKg', 'results.surfaces[1].meanA']);
    expect(error.message).toContain('results.surfaces[1].meanA');
  });

  it('refuses a row of the old layout (snapshot inside the inputs, version 1) instead of guessing', () => {
    const { anodeModel, ...rest } = ferryRecord();
    const legacy = { ...rest, schemaVersion: 1, inputs: { ...rest.inputs, anodeModelSnapshot: anodeModel } };
    const error = refusal(legacy);
    expect(error.fields).toContain('schemaVersion');
    expect(error.fields).toContain('anodeModel');
    expect(error.message).toContain(`schemaVersion: version 1 found, this app reads version ${DESIGN_SCHEMA_VERSION} (run the migrations)`);
    expect(() => parseStoredResults({ schemaVersion: 1, results: rest.results }, 'old row')).toThrow(/old row: .*schemaVersion/);
  });

  it('holds stored inputs to their shape, not to today’s plausibility limits (a tightened limit keeps old revisions readable)', () => {
    const record = ferryRecord();
    record.inputs.designLifeYears = 80; // above the desk's 50-year limit
    expect(parseDesignRecord(record, 'test').inputs.designLifeYears).toBe(80);
    const wrongType = ferryRecord() as unknown as { inputs: Record<string, unknown> };
    wrongType.inputs.designLifeYears = '2.5';
    expect(refusal(wrongType).fields).toEqual(['inputs.designLifeYears']);
  });

  it('shows a stored record as it is, and a missing snapshot as missing', () => {
    const record = parseDesignRecord(ferryRecord(), 'test');
    const shown = storedComputed(record);
    expect(shown.result?.anodeCount).toBe(record.results?.anodeCount);
    expect(shown.result).not.toHaveProperty('options');
    expect(shown.options).toEqual(record.results?.options);
    expect(shown.model?.designation).toBe('TW-AW-4020');
    expect(storedComputed({ ...record, anodeModel: null }).model).toBeNull();
    const unsized = storedComputed({ ...record, results: null, basis: null, resultError: 'surfaces: The surfaces have no mean current demand.' });
    expect(unsized.result).toBeNull();
    expect(unsized.error).toEqual({ field: 'surfaces', message: 'The surfaces have no mean current demand.' });
  });
});
