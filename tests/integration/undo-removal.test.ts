import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { subMinutes } from 'date-fns';
import { AuditEventSchema, MembershipSchema, OrganisationSchema, type Organisation, type User } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { ROLES, type Role } from '@/lib/roles';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { restoreMember, MEMBER_RESTORE_MINUTES } from '@/lib/server/services/team/restore-member';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { archiveZone, createZone } from '@/lib/server/services/register/zones';
import { restoreZone } from '@/lib/server/services/register/restore-zone';
import { ZoneSchema } from '@/entities';
import { ctxFor, makeOrgWithRoles, makeUser, runAs } from '../fixtures/factories';

// Undo of "Remove member" (the same membership back, from the removal's own audit row) and of "Archive zone".
let organisation: Organisation;
let users: Record<Role, User>;
let other: { organisation: Organisation; users: Record<Role, User> };

beforeAll(async () => {
  ({ organisation, users } = await makeOrgWithRoles(await getEm(), 'Undo Harbour'));
  other = await makeOrgWithRoles(await getEm(), 'Other Undo Harbour');
});
afterAll(async () => (await getOrm()).close(true));

const as = async <T,>(role: Role, work: Parameters<typeof runAs<T>>[1], org = { organisation, users }) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);

/** A fresh member in the given role, removed by the owner; returns the removed membership's id and person. */
async function removedMember(role: Role = 'planner') {
  const em = await getEm();
  const user = await makeUser(em, { name: `Removed ${role}` });
  const membership = em.create(MembershipSchema, { organisation: em.getReference(OrganisationSchema, organisation.id), user, role });
  await em.flush();
  await as('owner', (c) => removeMember(c, { membershipId: membership.id }));
  return { membershipId: membership.id, user };
}

const membershipsOf = async (userId: string) => (await getEm()).find(MembershipSchema, { user: userId, organisation: organisation.id });
const auditRows = async (action: string, targetId: string) => (await getEm()).find(AuditEventSchema, { action, targetId });

describe('restoreMember', () => {
  it('puts the same membership back (same id, person and role) and audits it', async () => {
    const { membershipId, user } = await removedMember('planner');
    expect(await membershipsOf(user.id)).toHaveLength(0);
    const { restored } = await as('owner', (c) => restoreMember(c, { membershipId }));
    expect(restored).toBe(true);
    const back = await membershipsOf(user.id);
    expect(back.map((m) => [m.id, m.role])).toEqual([[membershipId, 'planner']]);
    const rows = await auditRows('member.restored', membershipId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.owner.id, details: { email: user.email, role: 'planner' } });
  });

  it('is idempotent: a second undo changes nothing and writes no second audit row', async () => {
    const { membershipId, user } = await removedMember('inspector');
    await as('owner', (c) => restoreMember(c, { membershipId }));
    const again = await as('owner', (c) => restoreMember(c, { membershipId }));
    expect(again.restored).toBe(false);
    expect(await membershipsOf(user.id)).toHaveLength(1);
    expect(await auditRows('member.restored', membershipId)).toHaveLength(1);
  });

  for (const role of ROLES.filter((r) => r !== 'owner')) {
    it(`${role} may not undo a removal (team:manage is the owner's)`, async () => {
      const { membershipId, user } = await removedMember();
      await expect(as(role, (c) => restoreMember(c, { membershipId }))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await membershipsOf(user.id)).toHaveLength(0);
      expect(await auditRows('member.restored', membershipId)).toHaveLength(0);
    });
  }

  it("another organisation's owner cannot bring back our member (404, nothing written)", async () => {
    const { membershipId, user } = await removedMember();
    await expect(as('owner', (c) => restoreMember(c, { membershipId }), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await membershipsOf(user.id)).toHaveLength(0);
  });

  it('a membership that was never removed here is a 404: nobody can be added this way', async () => {
    await expect(as('owner', (c) => restoreMember(c, { membershipId: crypto.randomUUID() }))).rejects.toBeInstanceOf(AppError);
  });

  it(`a removal older than ${MEMBER_RESTORE_MINUTES} minutes can no longer be undone`, async () => {
    const { membershipId, user } = await removedMember();
    const em = await getEm();
    await em.nativeUpdate(AuditEventSchema, { action: 'member.removed', targetId: membershipId }, { createdAt: subMinutes(new Date(), MEMBER_RESTORE_MINUTES + 1) });
    await expect(as('owner', (c) => restoreMember(c, { membershipId }))).rejects.toMatchObject({ code: 'conflict' });
    expect(await membershipsOf(user.id)).toHaveLength(0);
  });
});

describe('restoreZone', () => {
  const zoneFields = { kind: 'hull-bottom', areaM2: '80', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
  let assetId: string;
  beforeAll(async () => {
    assetId = (await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: 'Undo Tender', hullMaterial: 'steel' }))).id;
  });
  let serial = 0;
  async function archivedZone() {
    const zone = await as('engineer', (c) => createZone(c, assetId, { ...zoneFields, name: `Flat bottom ${++serial}` }));
    await as('engineer', (c) => archiveZone(c, zone.id));
    return zone.id;
  }
  const archivedAt = async (id: string) => (await (await getEm()).findOneOrFail(ZoneSchema, { id })).archivedAt;

  it('brings the zone back as it was and audits it once, however often it is sent', async () => {
    const id = await archivedZone();
    expect(await archivedAt(id)).not.toBeNull();
    expect((await as('engineer', (c) => restoreZone(c, id))).restored).toBe(true);
    expect(await archivedAt(id)).toBeNull();
    expect((await as('engineer', (c) => restoreZone(c, id))).restored).toBe(false);
    const rows = await auditRows('zone.restored', id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ organisationId: organisation.id, actorUserId: users.engineer.id });
  });

  for (const role of ['planner', 'inspector', 'viewer'] as const) {
    it(`${role} may not restore a zone (asset:write)`, async () => {
      const id = await archivedZone();
      await expect(as(role, (c) => restoreZone(c, id))).rejects.toMatchObject({ code: 'forbidden' });
      expect(await archivedAt(id)).not.toBeNull();
      expect(await auditRows('zone.restored', id)).toHaveLength(0);
    });
  }

  it("another organisation's engineer gets a 404 and the zone stays archived", async () => {
    const id = await archivedZone();
    await expect(as('engineer', (c) => restoreZone(c, id), other)).rejects.toMatchObject({ code: 'not-found' });
    expect(await archivedAt(id)).not.toBeNull();
  });
});
