'use client';
import { useQuery } from '@tanstack/react-query';
import { fetchJson, queryKeys } from './query-client';
import type { DesignListRow } from '@/lib/server/services/designs/list-designs';

export function useDesigns(org: string, initialData?: DesignListRow[]) {
  return useQuery({
    queryKey: queryKeys.designs(org),
    queryFn: async () => (await fetchJson<{ designs: DesignListRow[] }>(`/api/orgs/${org}/designs`)).designs,
    initialData,
  });
}
