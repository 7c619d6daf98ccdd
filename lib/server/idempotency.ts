import { createHash } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from './errors';
import { isUuid } from './ids';

/** The hidden form field, the JSON action field and the request header that carry a write's key. */
export const IDEMPOTENCY_FIELD = 'idempotencyKey';
export const IDEMPOTENCY_HEADER = 'idempotency-key';
/** How long a key answers repeats; a retry comes within seconds, a reopened tab within a day. */
export const IDEMPOTENCY_KEY_HOURS = 48;

/** What a write answered the first time, stored with its key and given again to a repeat. */
export type StoredResult =
  | { kind: 'value'; value: unknown }
  | { kind: 'redirect'; url: string; type: 'push' | 'replace' }
  | { kind: 'response'; status: number; contentType: string | null; body: string };

export interface IdempotencyClaim {
  /** The user's id, or 'anonymous' before sign-in. */
  owner: string;
  key: string;
  /** What the write is and what it was sent with (a hash): the same key with other values is refused. */
  fingerprint: string;
}

/** A key as sent: absent is null (the write runs unguarded); anything but a UUID is refused. */
export function readIdempotencyKey(raw: unknown): string | null {
  if (raw === null || raw === undefined || raw === '') return null;
  if (!isUuid(raw)) throw new AppError('invalid', 'This form carries a damaged key; reload the page and send it again. Nothing was changed.');
  return raw.toLowerCase();
}

// Secrets never go into a stored hash: a password or token would otherwise sit in the table as a fast hash.
const SECRET = /password|token/i;

function stable(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(stable);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.keys(value as Record<string, unknown>)
        .filter((k) => k !== IDEMPOTENCY_FIELD && !SECRET.test(k))
        .sort()
        .map((k) => [k, stable((value as Record<string, unknown>)[k])]),
    );
  }
  return value;
}

/** A hash of what the write is (its scope: action or method and path) and of its input, secrets left out. */
export function idempotencyFingerprint(scope: string, input: unknown): string {
  return createHash('sha256').update(scope).update('\n').update(JSON.stringify(stable(input)) ?? '').digest('hex');
}

/** A form's fields for the fingerprint: strings as sent, files by name, type and size. */
export function formFingerprintInput(formData: FormData): Record<string, unknown[]> {
  const input: Record<string, unknown[]> = {};
  for (const [name, value] of formData.entries()) {
    const entry = typeof value === 'string' ? value : { file: value.name, type: value.type, size: value.size };
    (input[name] ??= []).push(entry);
  }
  return input;
}

/**
 * Claims a key at the start of a unit of work by inserting it. A concurrent write with the same key
 * waits on the primary key until the first commits (then it gets the first result back) or rolls back
 * (then the insert goes through and this one does the work). Returns the stored result of an earlier
 * write, or null when this one is the first.
 */
export async function claimIdempotencyKey(em: EntityManager, claim: IdempotencyClaim): Promise<StoredResult | null> {
  const inserted = await em.execute<{ key: string }[]>(
    `insert into idempotency_key (owner, key, fingerprint, created_at) values (?, ?, ?, now()) on conflict do nothing returning key`,
    [claim.owner, claim.key, claim.fingerprint],
  );
  if (inserted.length) return null;
  const [row] = await em.execute<{ fingerprint: string; result: StoredResult | null }[]>(`select fingerprint, result from idempotency_key where owner = ? and key = ?`, [claim.owner, claim.key]);
  if (!row || !row.result) throw new AppError('conflict', 'The same request is still being handled; reload the page in a moment. Nothing was changed.');
  if (row.fingerprint !== claim.fingerprint) {
    throw new AppError('invalid', 'This form was already sent with other values. Reload the page to send the new values. Nothing was changed.');
  }
  return row.result;
}

/** Stores the first result with its key, in the same transaction as the change it describes. */
export async function storeIdempotentResult(em: EntityManager, claim: IdempotencyClaim, result: StoredResult): Promise<void> {
  await em.execute(`update idempotency_key set result = ?::jsonb where owner = ? and key = ?`, [JSON.stringify(result), claim.owner, claim.key]);
}

/** Forgets keys older than the window; the scheduled jobs call it. Returns how many were removed. */
export async function deleteExpiredIdempotencyKeys(em: EntityManager, olderThanHours = IDEMPOTENCY_KEY_HOURS): Promise<number> {
  const rows = await em.execute<{ key: string }[]>(`delete from idempotency_key where created_at < now() - make_interval(hours => ?) returning key`, [olderThanHours]);
  return rows.length;
}
