import { QueryClient } from '@tanstack/react-query';

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

/** fetch JSON from our own API; errors arrive in the one shape the server uses. */
export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, { ...init, headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) } });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new ApiError(res.status, body?.error?.message ?? `Request failed (${res.status}).`, body?.error?.fieldErrors);
  return body as T;
}
