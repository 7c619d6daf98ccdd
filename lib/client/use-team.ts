'use client';
import { useQuery } from '@tanstack/react-query';
import { fetchJson, queryKeys } from './query-client';
import type { Role } from '@/lib/roles';
import type { MailDelivery } from '@/lib/labels';

export interface TeamMember {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  since: string;
  isYou: boolean;
}
export interface TeamInvitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  createdAt: string;
  /** Where the invitation e-mail stands; null for an invitation older than this record. */
  mail: MailDelivery | null;
}

export function useTeam(org: string) {
  return useQuery({
    queryKey: queryKeys.team(org),
    queryFn: () => fetchJson<{ members: TeamMember[]; invitations: TeamInvitation[] }>(`/api/orgs/${org}/team`),
    // While an invitation e-mail waits for the worker, look again every few seconds until it is sent.
    refetchInterval: (query) => (query.state.data?.invitations.some((i) => i.mail === 'queued' || i.mail === 'retrying') ? 4000 : false),
  });
}
