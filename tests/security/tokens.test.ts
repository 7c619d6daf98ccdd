// E-mailed links (password reset, address confirmation, invitation) work exactly once, even when one link
// is submitted many times at the same moment; a reset retires the user's other reset links and sessions.
import { afterAll, describe, expect, it } from 'vitest';
import { InvitationSchema, MembershipSchema, OutboxMessageSchema, SessionSchema, UserSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { verifyPassword } from '@/lib/server/auth/password';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { verifyEmail } from '@/lib/server/services/accounts/verify-email';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { resetPassword } from '@/lib/server/services/accounts/reset-password';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/server/services/team/accept-invitation';
import { ROLES } from '@/lib/roles';
import { ctxFor, inUnitOfWork, makeOrgWithRoles, makeUser, runAs, uniqueEmail } from '../fixtures/factories';
import { atOnceSettled } from '../fixtures/at-once';

afterAll(async () => (await getOrm()).close(true));

const SIMULTANEOUS = 8;


const fulfilled = <T>(outcomes: PromiseSettledResult<T>[]) => outcomes.filter((o): o is PromiseFulfilledResult<T> => o.status === 'fulfilled');

function expectOnlyRefusals(outcomes: PromiseSettledResult<unknown>[]) {
  for (const o of outcomes.filter((o) => o.status === 'rejected')) {
    expect((o as PromiseRejectedResult).reason).toBeInstanceOf(AppError);
  }
}

async function linkFromOutbox(email: string, path: 'verify' | 'reset' | 'invite', nth = 0) {
  const messages = await (await getEm()).find(OutboxMessageSchema, { toAddress: email }, { orderBy: { createdAt: 'desc' } });
  const tokens = messages.map((m) => m.textBody.match(new RegExp(`/${path}/([\\w-]+)`))?.[1]).filter(Boolean) as string[];
  if (!tokens[nth]) throw new Error(`no ${path} link queued for ${email}`);
  return tokens[nth];
}

async function addSession(userId: string) {
  const em = await getEm();
  em.create(SessionSchema, { id: `s-${Math.random().toString(36).slice(2)}`, user: em.getReference(UserSchema, userId), expiresAt: new Date(Date.now() + 86_400_000) });
  await em.flush();
}

describe('password reset links', () => {
  it(`${SIMULTANEOUS} simultaneous uses of one reset link: exactly one sets the password`, async () => {
    const user = await makeUser(await getEm());
    await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
    const token = await linkFromOutbox(user.email, 'reset');
    const outcomes = await atOnceSettled(SIMULTANEOUS, (i) => inUnitOfWork((w) => resetPassword({ ...w, input: { token, password: `new-keel-plate-${i}-x` } })));
    const winners = fulfilled(outcomes);
    expect(winners).toHaveLength(1);
    expectOnlyRefusals(outcomes);
    const winner = outcomes.indexOf(winners[0]!);
    const stored = await (await getEm()).findOneOrFail(UserSchema, { id: user.id });
    expect(await verifyPassword(stored.passwordHash, `new-keel-plate-${winner}-x`)).toBe(true);
  });

  it('an older reset link no longer works once a newer one was used, and every session ends', async () => {
    const user = await makeUser(await getEm());
    await addSession(user.id);
    await addSession(user.id);
    await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
    await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
    const newer = await linkFromOutbox(user.email, 'reset', 0);
    const older = await linkFromOutbox(user.email, 'reset', 1);
    expect(older).not.toBe(newer);
    await inUnitOfWork((w) => resetPassword({ ...w, input: { token: newer, password: 'new-keel-plate-42' } }));
    expect(await (await getEm()).count(SessionSchema, { user: user.id })).toBe(0);
    const error = await inUnitOfWork((w) => resetPassword({ ...w, input: { token: older, password: 'attacker-chosen-77' } })).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).message).toMatch(/not valid or was already used/);
    const stored = await (await getEm()).findOneOrFail(UserSchema, { id: user.id });
    expect(await verifyPassword(stored.passwordHash, 'new-keel-plate-42')).toBe(true);
  });
});

describe('confirmation links', () => {
  it(`${SIMULTANEOUS} simultaneous uses of one confirmation link: exactly one succeeds`, async () => {
    const email = uniqueEmail('confirm-race');
    await inUnitOfWork((w) => signUp({ ...w, input: { name: 'Vera Race', email, password: 'brass-rudder-stock-7' } }));
    const token = await linkFromOutbox(email, 'verify');
    const outcomes = await atOnceSettled(SIMULTANEOUS, () => inUnitOfWork((w) => verifyEmail({ ...w, token })));
    expect(fulfilled(outcomes)).toHaveLength(1);
    expectOnlyRefusals(outcomes);
  });
});

describe('invitation links', () => {
  async function invitation() {
    const { organisation, users } = await makeOrgWithRoles(await getEm());
    const email = uniqueEmail('invitee');
    const { token } = await runAs(ctxFor(await getEm(), organisation, users.owner), (ctx) => inviteMember(ctx, { email, role: 'engineer' }));
    return { organisation, email, token };
  }

  it(`${SIMULTANEOUS} simultaneous acceptances by someone new: one account, one membership`, async () => {
    const { organisation, email, token } = await invitation();
    const outcomes = await atOnceSettled(SIMULTANEOUS, (i) => inUnitOfWork((w) => acceptInvitationAsNewUser({ ...w, input: { token, name: `Sol ${i}`, password: 'bracelet-anode-set-5' } })));
    expect(fulfilled(outcomes)).toHaveLength(1);
    // The others are told the truth (already accepted), not a failed insert.
    expectOnlyRefusals(outcomes);
    const em = await getEm();
    expect(await em.count(UserSchema, { email })).toBe(1);
    expect(await em.count(MembershipSchema, { organisation: organisation.id })).toBe(ROLES.length + 1);
    expect((await em.findOneOrFail(InvitationSchema, { organisation: organisation.id, email })).acceptedAt).toBeInstanceOf(Date);
  });

  it(`${SIMULTANEOUS} simultaneous acceptances by the signed-in invitee: accepted once, audited once`, async () => {
    const { organisation, email, token } = await invitation();
    const invitee = await makeUser(await getEm(), { email });
    const current = { id: invitee.id, email, name: invitee.name, emailVerified: true };
    const outcomes = await atOnceSettled(SIMULTANEOUS, () => inUnitOfWork((w) => acceptInvitationAsUser({ ...w, user: current, input: { token } })));
    expect(fulfilled(outcomes)).toHaveLength(1);
    expectOnlyRefusals(outcomes);
    const em = await getEm();
    expect(await em.count(MembershipSchema, { organisation: organisation.id, user: invitee.id })).toBe(1);
    const joined = await em.execute<{ n: number }[]>(`select count(*)::int as n from audit_event where organisation_id = ? and action = 'member.joined'`, [organisation.id]);
    expect(joined[0]!.n).toBe(1);
  });
});
