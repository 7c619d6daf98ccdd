import { describe, expect, it } from 'vitest';
import { PERMISSIONS, ROLE_PERMISSIONS, can } from '@/lib/server/permissions';
import { ROLES } from '@/lib/roles';

// The role table as the product brief states it, written out independently of the code:
// owner everything; engineer assets, designs (create and approve), catalogue; planner dockings,
// renewals, anode lists; inspector surveys only (an engineer restores a deleted survey); viewer read and print only.
const EXPECTED: Record<string, string[]> = {
  owner: [...PERMISSIONS],
  engineer: ['org:read', 'org:print', 'asset:write', 'design:write', 'design:approve', 'catalogue:write', 'survey:write', 'survey:restore'],
  planner: ['org:read', 'org:print', 'docking:write', 'renewal:write'],
  inspector: ['org:read', 'org:print', 'survey:write'],
  viewer: ['org:read', 'org:print'],
};

describe('permission table', () => {
  for (const role of ROLES) {
    for (const permission of PERMISSIONS) {
      const allowed = EXPECTED[role].includes(permission);
      it(`${role} ${allowed ? 'has' : 'lacks'} ${permission}`, () => {
        expect(can(role, permission)).toBe(allowed);
      });
    }
  }

  it('only the owner manages the team and billing', () => {
    expect(ROLES.filter((r) => can(r, 'team:manage'))).toEqual(['owner']);
    expect(ROLES.filter((r) => can(r, 'billing:manage'))).toEqual(['owner']);
  });

  it('the viewer changes nothing', () => {
    expect(ROLE_PERMISSIONS.viewer.every((p) => p === 'org:read' || p === 'org:print')).toBe(true);
  });
});
