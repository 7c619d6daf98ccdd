import { CpInputError } from './errors';

/** Short human rendering of a bad value for messages. */
export function show(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (Array.isArray(value)) return 'a list';
  return `a ${typeof value}`;
}

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export function record(value: unknown, field: string): Record<string, unknown> {
  if (!isRecord(value)) throw new CpInputError(field, `${field} must be an object (got ${show(value)}).`);
  return value;
}

export function finite(value: unknown, field: string, unit = ''): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CpInputError(field, `${field} must be a finite number${unit ? ` in ${unit}` : ''} (got ${show(value)}).`);
  }
  return value;
}

export function positive(value: unknown, field: string, unit = ''): number {
  const v = finite(value, field, unit);
  if (v <= 0) throw new CpInputError(field, `${field} must be greater than zero${unit ? ` ${unit}` : ''} (got ${v}).`);
  return v;
}

export function nonNegative(value: unknown, field: string, unit = ''): number {
  const v = finite(value, field, unit);
  if (v < 0) throw new CpInputError(field, `${field} must not be negative (got ${v}${unit ? ` ${unit}` : ''}).`);
  return v;
}

/** A fraction in (0, 1], such as a utilisation factor or an efficiency. */
export function unitFraction(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v <= 0 || v > 1) throw new CpInputError(field, `${field} must be greater than 0 and at most 1 (got ${v}).`);
  return v;
}

export function optional<T>(value: unknown, check: (v: unknown) => T): T | undefined {
  return value === undefined ? undefined : check(value);
}

export function oneOf<T extends string>(value: unknown, allowed: readonly T[], field: string): T {
  if (typeof value === 'string' && (allowed as readonly string[]).includes(value)) return value as T;
  throw new CpInputError(field, `${field} must be one of ${allowed.map((a) => `'${a}'`).join(', ')} (got ${show(value)}).`);
}

export function wholeNonNegative(value: unknown, field: string): number {
  const v = nonNegative(value, field);
  if (!Number.isInteger(v)) throw new CpInputError(field, `${field} must be a whole number (got ${v}).`);
  return v;
}

export function bool(value: unknown, field: string): boolean {
  if (typeof value !== 'boolean') throw new CpInputError(field, `${field} must be true or false (got ${show(value)}).`);
  return value;
}

export function text(value: unknown, field: string): string {
  if (typeof value !== 'string') throw new CpInputError(field, `${field} must be text (got ${show(value)}).`);
  return value;
}

export function list(value: unknown, field: string, nonEmpty = true): unknown[] {
  if (!Array.isArray(value)) throw new CpInputError(field, `${field} must be a list (got ${show(value)}).`);
  if (nonEmpty && value.length === 0) throw new CpInputError(field, `${field} must hold at least one entry.`);
  return value;
}

/** Path of the first NaN or infinite number inside a value, or null. */
export function firstNonFinite(value: unknown, path = ''): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path || 'result';
  if (value === null || typeof value !== 'object') return null;
  for (const [k, v] of Object.entries(value)) {
    const found = firstNonFinite(v, Array.isArray(value) ? `${path}[${k}]` : path ? `${path}.${k}` : k);
    if (found) return found;
  }
  return null;
}

/**
 * Last line of defence against overflow and underflow from extreme but finite inputs
 * (areas of 1e300 m2 and the like): a result must never carry NaN or Infinity.
 */
export function assertFiniteResult<T>(result: T, field: string): T {
  const bad = firstNonFinite(result);
  if (bad !== null) {
    throw new CpInputError(field, `${field} is too large or too small to give a finite result (${bad}); check the units.`);
  }
  return result;
}
