import { isCleanText } from '@/lib/schemas/text';
import { notFound } from './errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const isUuid = (value: unknown): value is string => typeof value === 'string' && UUID.test(value);

/**
 * An id from a URL or a form that is not a UUID names nothing: answer 404 like any absent record,
 * before PostgreSQL refuses the cast with a 500.
 */
export function uuidOrNotFound(value: unknown, what: string): string {
  if (!isUuid(value)) throw notFound(what);
  return value;
}

/**
 * An organisation slug from the URL. One that no organisation could have (a NUL byte, a control character,
 * a broken character, or far too long) is answered like any unknown organisation, before it reaches a query.
 */
export function slugOrNotFound(value: unknown): string {
  if (typeof value !== 'string' || value.length === 0 || value.length > 200 || !isCleanText(value)) throw notFound('Organisation');
  return value;
}
