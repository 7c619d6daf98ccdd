import type { Role } from '@/lib/roles';

// Permissions as data: one table, checked by the wrappers and again inside the services.
export const PERMISSIONS = [
  'org:read',
  'org:print',
  'team:manage',
  'billing:manage',
  'audit:read',
  'asset:write',
  'design:write',
  'design:approve',
  'catalogue:write',
  'docking:write',
  'renewal:write',
  'survey:write',
  // Restoring a deleted survey is an engineer's call (inspectors delete, engineers can undo it for 30 days).
  'survey:restore',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const READ: Permission[] = ['org:read', 'org:print'];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  owner: [...PERMISSIONS],
  engineer: [...READ, 'asset:write', 'design:write', 'design:approve', 'catalogue:write', 'survey:write', 'survey:restore'],
  planner: [...READ, 'docking:write', 'renewal:write'],
  inspector: [...READ, 'survey:write'],
  viewer: [...READ],
};

export function can(role: Role, permission: Permission): boolean {
  return ROLE_PERMISSIONS[role].includes(permission);
}

export { ROLE_LABELS, ROLE_DESCRIPTIONS } from '@/lib/labels/roles';
