'use client';
import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';

/**
 * After a server action succeeds, drop the cached lists it changed so tables fetch them again, and
 * re-render the page's server components, so badges, read-only fields and counts show what was saved
 * without a reload (services also revalidate the paths they change; this covers the page in hand).
 */
export function useInvalidateOnSuccess(state: { ok: boolean }, keys: readonly (readonly unknown[])[], { refresh = true }: { refresh?: boolean } = {}) {
  const client = useQueryClient();
  const router = useRouter();
  useEffect(() => {
    if (!state.ok) return;
    for (const queryKey of keys) client.invalidateQueries({ queryKey });
    if (refresh) router.refresh();
    // keys are literals built from the org slug; state identity changes once per action result.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state, client]);
}
