import type { Role } from '@/lib/roles';

/** The roles in words (safe for client code); what each may do is in lib/server/permissions.ts. */
export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  engineer: 'Engineer',
  planner: 'Planner',
  inspector: 'Inspector',
  viewer: 'Viewer',
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  owner: 'Everything, including team and billing.',
  engineer: 'Assets, zones, designs (prepare and approve), catalogue, surveys.',
  planner: 'Dockings, campaigns, renewals and anode lists.',
  inspector: 'Surveys and photos only.',
  viewer: 'Reads and prints; changes nothing.',
};
