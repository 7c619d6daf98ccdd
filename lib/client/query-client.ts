import { QueryClient } from '@tanstack/react-query';
import { IDEMPOTENCY_HEADER, newIdempotencyKey } from './idempotency-key';

export function makeQueryClient() {
  return new QueryClient({ defaultOptions: { queries: { staleTime: 15_000, retry: 1, refetchOnWindowFocus: false } } });
}

/** Every query key in one place. */
export const queryKeys = {
  team: (org: string) => ['orgs', org, 'team'] as const,
  designs: (org: string) => ['orgs', org, 'designs'] as const,
  assets: (org: string) => ['orgs', org, 'assets'] as const,
  anodeGroups: (org: string) => ['orgs', org, 'anode-groups'] as const,
  catalogue: (org: string) => ['orgs', org, 'catalogue'] as const,
  surveys: (org: string) => ['orgs', org, 'surveys'] as const,
  dockingRenewals: (org: string, dockingId: string) => ['orgs', org, 'dockings', dockingId, 'renewals'] as const,
  /** The desk's results for one set of inputs (kept apart from 'designs' so invalidating the list leaves them). */
  deskCalculation: (org: string, designId: string, inputs: unknown) => ['orgs', org, 'desk-calculation', designId, inputs] as const,
};

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
  }
}

const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * fetch JSON from our own API; errors arrive in the one shape the server uses. An unsafe request carries an
 * Idempotency-Key: pass `idempotencyKey` (one per logical write, the same for its retries, e.g. from
 * useIdempotencyKey) or one is made for this call.
 */
export async function fetchJson<T>(url: string, init?: RequestInit & { idempotencyKey?: string }): Promise<T> {
  const { idempotencyKey, ...rest } = init ?? {};
  const headers = new Headers(rest.headers);
  if (!headers.has('content-type')) headers.set('content-type', 'application/json');
  if (UNSAFE_METHODS.has((rest.method ?? 'GET').toUpperCase()) && !headers.has(IDEMPOTENCY_HEADER)) headers.set(IDEMPOTENCY_HEADER, idempotencyKey ?? newIdempotencyKey());
  const res = await fetch(url, { ...rest, headers });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new ApiError(res.status, body?.error?.message ?? `Request failed (${res.status}).`, body?.error?.fieldErrors);
  return body as T;
}
