import { ForecastInputError } from './errors';

function show(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (Array.isArray(value)) return 'a list';
  if (value instanceof Date) return 'an invalid date';
  return `a ${typeof value}`;
}

/** The checks of record, date and text without the error: hot loops test first and build a field path only to refuse. */
export const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);
export const isValidDate = (value: unknown): value is Date => value instanceof Date && Number.isFinite(value.getTime());
export const isText = (value: unknown): value is string => typeof value === 'string' && value.length > 0;

export function record(value: unknown, field: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new ForecastInputError(field, `${field} must be an object (got ${show(value)}).`);
  }
  return value as Record<string, unknown>;
}

export function date(value: unknown, field: string): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) {
    throw new ForecastInputError(field, `${field} must be a valid date (got ${show(value)}).`);
  }
  return value;
}

export function finite(value: unknown, field: string, unit = ''): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ForecastInputError(field, `${field} must be a finite number${unit ? ` in ${unit}` : ''} (got ${show(value)}).`);
  }
  return value;
}

export function positive(value: unknown, field: string, unit = ''): number {
  const v = finite(value, field, unit);
  if (v <= 0) throw new ForecastInputError(field, `${field} must be greater than zero (got ${v}${unit ? ` ${unit}` : ''}).`);
  return v;
}

export function nonNegative(value: unknown, field: string, unit = ''): number {
  const v = finite(value, field, unit);
  if (v < 0) throw new ForecastInputError(field, `${field} must not be negative (got ${v}${unit ? ` ${unit}` : ''}).`);
  return v;
}

/** A whole number at least `min` (counts, months). */
export function whole(value: unknown, field: string, min: number, max = Number.MAX_SAFE_INTEGER): number {
  const v = finite(value, field);
  if (!Number.isInteger(v) || v < min || v > max) {
    const range = max === Number.MAX_SAFE_INTEGER ? `at least ${min}` : `from ${min} to ${max}`;
    throw new ForecastInputError(field, `${field} must be a whole number ${range} (got ${v}).`);
  }
  return v;
}

/** A fraction in [0, 1] (a remaining fraction). */
export function fraction(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v < 0 || v > 1) throw new ForecastInputError(field, `${field} must be from 0 to 1 (got ${v}).`);
  return v;
}

/** A fraction in (0, 1] (a utilisation factor). */
export function unitFraction(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v <= 0 || v > 1) throw new ForecastInputError(field, `${field} must be greater than 0 and at most 1 (got ${v}).`);
  return v;
}

export function text(value: unknown, field: string): string {
  if (typeof value !== 'string' || value.length === 0) {
    throw new ForecastInputError(field, `${field} must be non-empty text (got ${show(value)}).`);
  }
  return value;
}

export function list(value: unknown, field: string): unknown[] {
  if (!Array.isArray(value)) throw new ForecastInputError(field, `${field} must be a list (got ${show(value)}).`);
  return value;
}
