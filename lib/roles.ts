// The roles a member can hold in an organisation; what each may do is in lib/server/permissions.ts,
// their words in lib/labels/roles.ts.
export const ROLES = ['owner', 'engineer', 'planner', 'inspector', 'viewer'] as const;
export type Role = (typeof ROLES)[number];
