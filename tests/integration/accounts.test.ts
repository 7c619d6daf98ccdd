import { afterAll, describe, expect, it } from 'vitest';
import { subHours } from 'date-fns';
import { AuditEventSchema, OutboxMessageSchema, SessionSchema, UserSchema, UserTokenSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { verifyEmail } from '@/lib/server/services/accounts/verify-email';
import { signIn, MAX_FAILURES_PER_PAIR, MAX_FAILURES_PER_ADDRESS } from '@/lib/server/services/accounts/sign-in';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { resetPassword } from '@/lib/server/services/accounts/reset-password';
import { changePassword } from '@/lib/server/services/accounts/change-password';
import { createOrganisation } from '@/lib/server/services/accounts/create-organisation';
import { hashToken } from '@/lib/server/tokens';
import { inUnitOfWork, makeUser, TEST_PASSWORD, uniqueEmail } from '../fixtures/factories';

afterAll(async () => (await getOrm()).close(true));

/** The token is only in the e-mail: read it back from the queued message. */
async function tokenFromOutbox(email: string, path: 'verify' | 'reset') {
  const messages = await (await getEm()).find(OutboxMessageSchema, { toAddress: email }, { orderBy: { createdAt: 'desc' } });
  const match = messages.map((m) => m.textBody.match(new RegExp(`/${path}/([\\w-]+)`))).find(Boolean);
  if (!match) throw new Error(`no ${path} link queued for ${email}`);
  return match[1];
}

async function expectAppError(promise: Promise<unknown>, code: string, message?: RegExp) {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  expect((error as AppError).code).toBe(code);
  if (message) expect((error as AppError).message).toMatch(message);
  return error as AppError;
}

describe('sign-up and e-mail verification', () => {
  it('creates an unverified user with an argon2id hash and queues a confirmation e-mail', async () => {
    const email = uniqueEmail('signup');
    const user = await inUnitOfWork((w) => signUp({ ...w, input: { name: 'Ada Keel', email: email.toUpperCase(), password: 'brass-rudder-stock-7' } }));
    const stored = await (await getEm()).findOneOrFail(UserSchema, { id: user!.id });
    expect(stored.email).toBe(email); // lower-cased
    expect(stored.passwordHash).toMatch(/^\$argon2id\$/);
    expect(stored.emailVerifiedAt).toBeNull();
    expect(await tokenFromOutbox(email, 'verify')).toHaveLength(43);
  });

  it('a sign-up with an existing address creates nothing and mails the owner instead of telling the requester', async () => {
    const email = uniqueEmail('dup');
    await makeUser(await getEm(), { email });
    await expect(inUnitOfWork((w) => signUp({ ...w, input: { name: 'Second', email, password: 'brass-rudder-stock-7' } }))).resolves.toBeNull();
    expect(await (await getEm()).count(UserSchema, { email })).toBe(1);
    const mail = await (await getEm()).find(OutboxMessageSchema, { toAddress: email });
    expect(mail.map((m) => m.subject)).toEqual(['Someone tried to create a Tidewarden account with your address']);
  });

  it.each([
    ['short', 'Short-1', /at least 10/],
    ['common', 'password123', /too common/],
    ['repeated', 'aaaaaaaaaaaa', /too common/],
  ])('refuses a weak password (%s) and creates nothing', async (_label, password, message) => {
    const email = uniqueEmail('weak');
    const error = await inUnitOfWork((w) => signUp({ ...w, input: { name: 'Weak', email, password } })).catch((e) => e);
    expect(error.issues?.[0]?.message ?? '').toMatch(message);
    expect(await (await getEm()).count(UserSchema, { email })).toBe(0);
  });

  it('verifies once; a reused link is refused', async () => {
    const email = uniqueEmail('verify');
    await inUnitOfWork((w) => signUp({ ...w, input: { name: 'V', email, password: 'brass-rudder-stock-7' } }));
    const token = await tokenFromOutbox(email, 'verify');
    const user = await inUnitOfWork((w) => verifyEmail({ ...w, token }));
    expect(user.emailVerifiedAt).toBeInstanceOf(Date);
    await expectAppError(inUnitOfWork((w) => verifyEmail({ ...w, token })), 'invalid', /already used/);
  });

  it('refuses an expired verification link', async () => {
    const email = uniqueEmail('expired');
    await inUnitOfWork((w) => signUp({ ...w, input: { name: 'E', email, password: 'brass-rudder-stock-7' } }));
    const token = await tokenFromOutbox(email, 'verify');
    await (await getEm()).nativeUpdate(UserTokenSchema, { tokenHash: hashToken(token) }, { expiresAt: subHours(new Date(), 1) });
    await expectAppError(inUnitOfWork((w) => verifyEmail({ ...w, token })), 'invalid', /expired/);
    const user = await (await getEm()).findOneOrFail(UserSchema, { email });
    expect(user.emailVerifiedAt).toBeNull();
  });

  it('an unknown token is refused', async () => {
    await expectAppError(inUnitOfWork((w) => verifyEmail({ ...w, token: 'x'.repeat(43) })), 'invalid');
  });

  it('an unverified user cannot create an organisation; a verified one becomes its owner', async () => {
    const unverified = await makeUser(await getEm(), { verified: false });
    await expectAppError(
      inUnitOfWork((w) => createOrganisation({ ...w, user: { id: unverified.id, email: unverified.email, name: 'U', emailVerified: false }, input: { name: 'Quayside Survey Ltd' } })),
      'forbidden',
    );
    const verified = await makeUser(await getEm());
    const org = await inUnitOfWork((w) => createOrganisation({ ...w, user: { id: verified.id, email: verified.email, name: 'V', emailVerified: true }, input: { name: 'Quayside Survey Ltd' } }));
    const second = await inUnitOfWork((w) => createOrganisation({ ...w, user: { id: verified.id, email: verified.email, name: 'V', emailVerified: true }, input: { name: 'Quayside Survey Ltd' } }));
    expect(org.slug).toBe('quayside-survey-ltd');
    // The audit row names the new organisation (its id exists before the flush).
    expect(await (await getEm()).count(AuditEventSchema, { organisationId: org.id, action: 'organisation.created' })).toBe(1);
    expect(second.slug).toBe('quayside-survey-ltd-2');
  });
});

describe('sign-in with rate limits', () => {
  it('signs in with the right password and records an audit event', async () => {
    const user = await makeUser(await getEm());
    const signedIn = await inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip: '198.51.100.1' }));
    expect(signedIn.id).toBe(user.id);
    expect(await (await getEm()).count(AuditEventSchema, { actorUserId: user.id, action: 'user.signed-in' })).toBe(1);
  });

  it('gives the same message for an unknown account and a wrong password', async () => {
    const user = await makeUser(await getEm());
    const a = await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: 'wrong-password-1' }, ip: '198.51.100.2' })), 'invalid');
    const b = await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: uniqueEmail('nobody'), password: 'wrong-password-1' }, ip: '198.51.100.2' })), 'invalid');
    expect(a.message).toBe(b.message);
  });

  it(`blocks an address on an account after ${MAX_FAILURES_PER_PAIR} failures, even with the right password, and logs the lock-out`, async () => {
    const user = await makeUser(await getEm());
    for (let i = 0; i < MAX_FAILURES_PER_PAIR; i++) {
      await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: 'wrong-password-1' }, ip: '198.51.100.10' })), 'invalid');
    }
    await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip: '198.51.100.10' })), 'rate-limited', /Too many failed sign-ins/);
    expect(await (await getEm()).count(AuditEventSchema, { action: 'user.sign-in-locked' })).toBeGreaterThan(0);
  });

  it(`limits one client address after ${MAX_FAILURES_PER_ADDRESS} failures across accounts`, async () => {
    const ip = '203.0.113.77';
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) {
      await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: uniqueEmail('spray'), password: 'wrong-password-1' }, ip })), 'invalid');
    }
    const user = await makeUser(await getEm());
    await expectAppError(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip })), 'rate-limited');
    // Another address is not affected.
    await expect(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip: '203.0.113.78' }))).resolves.toBeTruthy();
  });
});

describe('password reset and change', () => {
  async function sessionFor(userId: string) {
    const em = await getEm();
    em.create(SessionSchema, { id: `s-${Math.random().toString(36).slice(2)}`, user: em.getReference(UserSchema, userId), expiresAt: new Date(Date.now() + 86_400_000) });
    await em.flush();
  }

  it('resets once with an e-mailed token, signs out every session, and refuses the token again', async () => {
    const user = await makeUser(await getEm());
    await sessionFor(user.id);
    await sessionFor(user.id);
    await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
    const token = await tokenFromOutbox(user.email, 'reset');
    await inUnitOfWork((w) => resetPassword({ ...w, input: { token, password: 'new-keel-plate-42' } }));
    expect(await (await getEm()).count(SessionSchema, { user: user.id })).toBe(0);
    await expect(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: 'new-keel-plate-42' }, ip: '192.0.2.1' }))).resolves.toBeTruthy();
    await expectAppError(inUnitOfWork((w) => resetPassword({ ...w, input: { token, password: 'another-keel-43' } })), 'invalid', /already used/);
  });

  it('refuses an expired reset token (older than one hour) and keeps the old password', async () => {
    const user = await makeUser(await getEm());
    await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
    const token = await tokenFromOutbox(user.email, 'reset');
    const row = await (await getEm()).findOneOrFail(UserTokenSchema, { tokenHash: hashToken(token) });
    expect(Math.abs(row.expiresAt.getTime() - row.createdAt.getTime() - 3_600_000)).toBeLessThan(1000); // one hour
    await (await getEm()).nativeUpdate(UserTokenSchema, { id: row.id }, { expiresAt: new Date(Date.now() - 1000) });
    await expectAppError(inUnitOfWork((w) => resetPassword({ ...w, input: { token, password: 'new-keel-plate-42' } })), 'invalid', /expired/);
    await expect(inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip: '192.0.2.2' }))).resolves.toBeTruthy();
  });

  it('says nothing about unknown addresses and makes no link for them; the address is told it has no account', async () => {
    const email = uniqueEmail('ghost');
    await expect(inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email } }))).resolves.toBeUndefined();
    const mail = await (await getEm()).find(OutboxMessageSchema, { toAddress: email });
    expect(mail.map((m) => m.subject)).toEqual(['Password reset for Tidewarden']);
    expect(mail[0]!.textBody).not.toMatch(/\/reset\//);
  });

  it('a password change needs the current password and ends all sessions', async () => {
    const user = await makeUser(await getEm());
    await sessionFor(user.id);
    await expectAppError(inUnitOfWork((w) => changePassword({ ...w, userId: user.id, input: { currentPassword: 'not-it-at-all', password: 'fresh-anode-bolt-1' } })), 'invalid');
    expect(await (await getEm()).count(SessionSchema, { user: user.id })).toBe(1);
    await inUnitOfWork((w) => changePassword({ ...w, userId: user.id, input: { currentPassword: TEST_PASSWORD, password: 'fresh-anode-bolt-1' } }));
    expect(await (await getEm()).count(SessionSchema, { user: user.id })).toBe(0);
  });
});
