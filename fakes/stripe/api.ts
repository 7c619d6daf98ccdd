// What every resource module needs to answer like Stripe: the error shape, ids, time and money, the list
// envelope and metadata updates. No state and no I/O here.
import { randomBytes } from 'node:crypto';
import type { Params } from './form';

/** The API version the installed SDK (stripe 23.1.0) pins; events are stamped with it. */
export const API_VERSION = '2026-10-28.endive';

export type Json = { [key: string]: unknown };

type ErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

/** An error that the server renders as Stripe's `{ error: { type, message, code?, param? } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

export const missing = (kind: string, id: string, param = 'id') =>
  new ApiError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);

/** A referenced object that does not exist: Stripe answers 400 (not 404) and names the param. */
export const missingParam = (kind: string, id: string, param: string) =>
  new ApiError(400, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);

export const badParam = (message: string, param: string) => new ApiError(400, 'invalid_request_error', message, 'parameter_invalid', param);

// ----- ids, time, money -----------------------------------------------------------------------------------

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

export const DAY = 86_400;

/** One calendar month later, clamped to the end of the month (31 Jan → 28/29 Feb), as Stripe bills. */
export function addMonth(unix: number): number {
  const d = new Date(unix * 1000);
  const target = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1, d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds()));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d.getUTCDate(), lastDay));
  return Math.floor(target.getTime() / 1000);
}

export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat('en-IE', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
}

// ----- lists and metadata ---------------------------------------------------------------------------------

/** Sorts records newest first; `seq` breaks ties between objects created within the same second. */
export const newestFirst = <T extends { created: number; seq: number }>(items: Iterable<T>): T[] =>
  [...items].sort((a, b) => b.created - a.created || b.seq - a.seq);

/**
 * Stripe's list envelope over newest-first items, with `limit` and `starting_after` (the SDK's
 * auto-pagination sends the last id of the previous page).
 */
export function paginate<T extends { id: string; created: number; seq: number }>(items: Iterable<T>, p: Params, url: string, render: (item: T) => Json): Json {
  const limit = p.integer('limit', { min: 1, max: 100 }) ?? 10;
  let rest = newestFirst(items);
  const after = p.string('starting_after');
  if (after) {
    const i = rest.findIndex((x) => x.id === after);
    if (i === -1) throw missingParam('object', after, 'starting_after');
    rest = rest.slice(i + 1);
  }
  return { object: 'list', data: rest.slice(0, limit).map(render), has_more: rest.length > limit, url };
}

/** Applies a metadata update: `null` clears everything, an empty value removes one key. */
export function mergeMetadata(current: Record<string, string>, update: Record<string, string> | null | undefined): Record<string, string> {
  if (update === undefined) return current;
  if (update === null) return {};
  const next = { ...current };
  for (const [k, v] of Object.entries(update)) {
    if (v === '') delete next[k];
    else next[k] = v;
  }
  return next;
}

export const cleanMetadata = (m: Record<string, string> | null | undefined) => mergeMetadata({}, m);
