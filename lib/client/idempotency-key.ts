'use client';
import { useCallback, useRef } from 'react';

/** The form field and the request header that carry a write's key (see lib/server/idempotency.ts). */
export const IDEMPOTENCY_FIELD = 'idempotencyKey';
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

/** A random UUID (v4); crypto.randomUUID needs a secure context, getRandomValues does not. */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/**
 * One key per logical write for code that sends its own requests (uploads, JSON actions): `current()`
 * is the same until `renew()`, which the caller runs once the write has been answered. A double click
 * or a retry before then sends the same key, so the server does the write once.
 */
export function useIdempotencyKey() {
  const key = useRef<string | null>(null);
  const current = useCallback(() => (key.current ??= newIdempotencyKey()), []);
  const renew = useCallback(() => {
    key.current = null;
  }, []);
  return { current, renew };
}
