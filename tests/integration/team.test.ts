import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { subDays } from 'date-fns';
import { AuditEventSchema, InvitationSchema, MembershipSchema, UserSchema, type Organisation, type User } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { ROLES, type Role } from '@/lib/roles';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/server/services/team/accept-invitation';
import { changeMemberRole } from '@/lib/server/services/team/change-member-role';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { revokeInvitation } from '@/lib/server/services/team/revoke-invitation';
import { getTeam } from '@/lib/server/services/team/get-team';
import { getAuditLog } from '@/lib/server/services/accounts/get-audit-log';
import { hashToken } from '@/lib/server/tokens';
import { deliverDueMail, outboxSettled } from '@/lib/server/mail/outbox';
import { invitationMailKey, MAIL_DELIVERY_WORDS } from '@/lib/labels';
import { ctxFor, inUnitOfWork, makeOrgWithRoles, makeUser, uniqueEmail, runAs } from '../fixtures/factories';

let organisation: Organisation;
let users: Record<Role, User>;

beforeAll(async () => {
  ({ organisation, users } = await makeOrgWithRoles(await getEm()));
});
afterAll(async () => (await getOrm()).close(true));

const ctx = async (role: Role) => ctxFor(await getEm(), organisation, users[role]);
const currentUser = (u: User) => ({ id: u.id, email: u.email, name: u.name, emailVerified: true });

describe('team permissions by role', () => {
  // Only the owner manages the team (product brief: Owner = everything, including team and billing).
  for (const role of ROLES) {
    const allowed = role === 'owner';
    it(`${role} ${allowed ? 'may' : 'may not'} list, invite, change roles, remove and read the audit log`, async () => {
      const c = await ctx(role);
      const attempts: Promise<unknown>[] = [
        getTeam(c),
        getAuditLog(c),
        inviteMember(c, { email: uniqueEmail('perm'), role: 'viewer' }),
      ];
      const results = await Promise.allSettled(attempts);
      for (const r of results) {
        if (allowed) expect(r.status).toBe('fulfilled');
        else {
          expect(r.status).toBe('rejected');
          expect((r as PromiseRejectedResult).reason).toBeInstanceOf(AppError);
          expect(((r as PromiseRejectedResult).reason as AppError).code).toBe('forbidden');
        }
      }
    });
  }
});

describe('invitations', () => {
  it('the team list says the invitation e-mail is queued until the mail server has taken it, then sent', async () => {
    const email = uniqueEmail('queued');
    const { invitation } = await runAs(ctx('owner'), (c) => inviteMember(c, { email, role: 'viewer' }));
    await outboxSettled();
    const em = await getEm();
    const key = invitationMailKey(invitation.id);
    const mailOf = async () => (await getTeam(await ctx('owner'))).invitations.find((i) => i.id === invitation.id)?.mail;
    // Hold the message as the worker would find it before its first pass.
    await em.execute(`update outbox_message set status = 'pending', attempts = 0, sent_at = null, next_attempt_at = now() where dedupe_key = ?`, [key]);
    expect(await mailOf()).toBe('queued');
    await em.execute(`update outbox_message set attempts = 2 where dedupe_key = ?`, [key]);
    expect(await mailOf()).toBe('retrying');
    await em.execute(`update outbox_message set status = 'failed' where dedupe_key = ?`, [key]);
    expect(await mailOf()).toBe('not-delivered');
    await em.execute(`update outbox_message set status = 'pending', attempts = 0, next_attempt_at = now() where dedupe_key = ?`, [key]);
    await deliverDueMail(em.fork(), { limit: 100 });
    expect(await mailOf()).toBe('sent');
    expect(MAIL_DELIVERY_WORDS.sent).toBe('Sent');
    expect(MAIL_DELIVERY_WORDS.queued).toMatch(/not sent yet/);
  });

  it('a new person accepts: the account is created confirmed, with the invited role, and the link then stops working', async () => {
    const email = uniqueEmail('newcomer');
    const { token } = await runAs(ctx('owner'), (c) => inviteMember(c, { email, role: 'engineer' }));
    const { user } = await inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token, name: 'New Comer', password: 'jetty-pile-bent-4B' } }));
    const membership = await (await getEm()).findOneOrFail(MembershipSchema, { user: user.id, organisation });
    expect(membership.role).toBe('engineer');
    expect((await (await getEm()).findOneOrFail(UserSchema, { id: user.id })).emailVerifiedAt).not.toBeNull();
    const again = await inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token, name: 'X', password: 'jetty-pile-bent-4B' } })).catch((e) => e);
    expect(again).toBeInstanceOf(AppError);
    expect(again.message).toMatch(/already accepted/);
  });

  it('an existing user accepts with the invited address; another address is refused', async () => {
    const existing = await makeUser(await getEm());
    const stranger = await makeUser(await getEm());
    const { token } = await runAs(ctx('owner'), (c) => inviteMember(c, { email: existing.email, role: 'planner' }));
    const refused = await inUnitOfWork((w) => acceptInvitationAsUser({ ...w, user: currentUser(stranger), input: { token } })).catch((e) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect(refused.code).toBe('forbidden');
    expect(await (await getEm()).count(MembershipSchema, { user: stranger.id })).toBe(0);
    await inUnitOfWork((w) => acceptInvitationAsUser({ ...w, user: currentUser(existing), input: { token } }));
    expect((await (await getEm()).findOneOrFail(MembershipSchema, { user: existing.id, organisation })).role).toBe('planner');
  });

  it('stores only the hash of the token, and expires after 7 days', async () => {
    const { token, invitation } = await runAs(ctx('owner'), (c) => inviteMember(c, { email: uniqueEmail('hash'), role: 'viewer' }));
    const row = await (await getEm()).findOneOrFail(InvitationSchema, { id: invitation.id });
    expect(row.tokenHash).toBe(hashToken(token));
    expect(row.tokenHash).not.toContain(token);
    expect(Math.round((row.expiresAt.getTime() - row.createdAt.getTime()) / 86_400_000)).toBe(7);
  });

  it('refuses an expired invitation and creates nothing', async () => {
    const email = uniqueEmail('late');
    const { token, invitation } = await runAs(ctx('owner'), (c) => inviteMember(c, { email, role: 'viewer' }));
    await (await getEm()).nativeUpdate(InvitationSchema, { id: invitation.id }, { expiresAt: subDays(new Date(), 1) });
    const error = await inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token, name: 'Late', password: 'jetty-pile-bent-4B' } })).catch((e) => e);
    expect(error.message).toMatch(/expired/);
    expect(await (await getEm()).count(UserSchema, { email })).toBe(0);
  });

  it('a withdrawn invitation is refused; an unknown token is not found', async () => {
    const { token, invitation } = await runAs(ctx('owner'), (c) => inviteMember(c, { email: uniqueEmail('withdrawn'), role: 'viewer' }));
    await runAs(ctx('owner'), (c) => revokeInvitation(c, { invitationId: invitation.id }));
    expect((await inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token, name: 'W', password: 'jetty-pile-bent-4B' } })).catch((e) => e)).message).toMatch(/withdrawn/);
    expect((await inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token: 'y'.repeat(43), name: 'W', password: 'jetty-pile-bent-4B' } })).catch((e) => e)).code).toBe('not-found');
  });

  it('refuses to invite someone who is already a member', async () => {
    const error = await runAs(ctx('owner'), (c) => inviteMember(c, { email: users.viewer.email, role: 'engineer' })).catch((e) => e);
    expect(error.code).toBe('conflict');
    expect(error.fieldErrors.email[0]).toMatch(/already a member/);
  });
});

describe('audit log', () => {
  it("shows owners their members' sign-ins and lock-outs, and nothing of other organisations' members", async () => {
    const { signIn } = await import('@/lib/server/services/accounts/sign-in');
    await inUnitOfWork((w) => signIn({ ...w, input: { email: users.planner.email, password: 'Harbour-anodes-9921' }, ip: '192.0.2.50' }));
    const outsider = await makeUser(await getEm());
    await inUnitOfWork((w) => signIn({ ...w, input: { email: outsider.email, password: 'Harbour-anodes-9921' }, ip: '192.0.2.51' }));
    const log = await runAs(ctx('owner'), (c) => getAuditLog(c, { pageSize: 200 }));
    const signIns = log.rows.filter((r) => r.action === 'user.signed-in').map((r) => r.actor);
    expect(signIns).toContain(users.planner.email);
    expect(signIns).not.toContain(outsider.email);
  });
});

describe('roles and removal', () => {
  it('changes a role and records who did it', async () => {
    const { organisation: org, users: u } = await makeOrgWithRoles(await getEm(), 'Role Change Marine');
    const owner = await ctxFor(await getEm(), org, u.owner);
    const viewerMembership = (await ctxFor(await getEm(), org, u.viewer)).membership.id;
    await runAs(owner, (c) => changeMemberRole(c, { membershipId: viewerMembership, role: 'inspector' }));
    expect((await (await getEm()).findOneOrFail(MembershipSchema, { user: u.viewer.id, organisation: org })).role).toBe('inspector');
    const event = await (await getEm()).findOneOrFail(AuditEventSchema, { organisationId: org.id, action: 'member.role-changed' });
    expect(event.actorEmail).toBe(u.owner.email);
    expect(event.details).toMatchObject({ from: 'viewer', to: 'inspector' });
  });

  it('always keeps at least one owner: the last owner can be neither demoted nor removed', async () => {
    const { organisation: org, users: u } = await makeOrgWithRoles(await getEm(), 'Last Owner Marine');
    const owner = await ctxFor(await getEm(), org, u.owner);
    const demote = await changeMemberRole(owner, { membershipId: owner.membership.id, role: 'viewer' }).catch((e) => e);
    expect(demote.code).toBe('conflict');
    const remove = await runAs(ctxFor(await getEm(), org, u.owner), (c) => removeMember(c, { membershipId: owner.membership.id })).catch((e) => e);
    expect(remove.code).toBe('conflict');
    expect(await (await getEm()).count(MembershipSchema, { organisation: org, role: 'owner' })).toBe(1);
    // With a second owner, the first may step down.
    const engineerMembership = (await ctxFor(await getEm(), org, u.engineer)).membership.id;
    await runAs(ctxFor(await getEm(), org, u.owner), (c) => changeMemberRole(c, { membershipId: engineerMembership, role: 'owner' }));
    await runAs(ctxFor(await getEm(), org, u.owner), (c) => changeMemberRole(c, { membershipId: owner.membership.id, role: 'viewer' }));
    expect(await (await getEm()).count(MembershipSchema, { organisation: org, role: 'owner' })).toBe(1);
  });

  it('cannot touch a membership of another organisation (not found)', async () => {
    const other = await makeOrgWithRoles(await getEm(), 'Other Harbour');
    const foreign = await ctxFor(await getEm(), other.organisation, other.users.viewer);
    const error = await runAs(ctx('owner'), (c) => removeMember(c, { membershipId: foreign.membership.id })).catch((e) => e);
    expect(error.code).toBe('not-found');
    expect(await (await getEm()).count(MembershipSchema, { id: foreign.membership.id })).toBe(1);
  });
});
