'use client';
import { useQuery } from '@tanstack/react-query';
import { fetchJson, queryKeys } from './query-client';
import type { Role } from '@/lib/roles';

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
}

export function useTeam(org: string) {
  return useQuery({ queryKey: queryKeys.team(org), queryFn: () => fetchJson<{ members: TeamMember[]; invitations: TeamInvitation[] }>(`/api/orgs/${org}/team`) });
}
