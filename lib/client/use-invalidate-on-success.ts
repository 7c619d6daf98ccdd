'use client';
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';

/** After a server action succeeds, drop the cached lists it changed so tables fetch them again. */
export function useInvalidateOnSuccess(state: { ok: boolean }, ...keys: readonly (readonly unknown[])[]) {
  const client = useQueryClient();
  useEffect(() => {
    if (state.ok) for (const queryKey of keys) client.invalidateQueries({ queryKey });
    // keys are literals built from the org slug; state identity changes once per action result.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state, client]);
}
