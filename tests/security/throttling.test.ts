// Sign-in throttling and the limits on sign-ups, reset requests and invitations: counted atomically before
// the work, per address and account, on the client address the server saw (not on what the client wrote).
import http from 'node:http';
import { randomInt } from 'node:crypto';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { OutboxMessageSchema, UserSchema, UserTokenSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { AppError } from '@/lib/server/errors';
import type { ActionState } from '@/lib/server/action';
import { addressFromForwardedFor } from '@/lib/server/auth/session';
import { installPeerAddressStamp, PEER_HEADER, peerAddress } from '@/lib/server/peer-address';
import { LIMITS } from '@/lib/server/auth/rate-limit';
import { signIn } from '@/lib/server/services/accounts/sign-in';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { ctxFor, inUnitOfWork, makeOrgWithRoles, makeUser, runAs, TEST_PASSWORD, uniqueEmail } from '../fixtures/factories';
import { requestHeaders } from '../fixtures/next-headers-mock';
import { atOnceSettled } from '../fixtures/at-once';

const MAX_FAILURES_PER_PAIR = LIMITS.signInPair.points;
const MAX_FAILURES_PER_ADDRESS = LIMITS.signInAddress.points;
const FREE_ATTEMPTS_PER_ACCOUNT = LIMITS.signInAccount.points;

vi.mock('next/headers', async () => (await import('../fixtures/next-headers-mock')).nextHeadersMock);

afterAll(async () => (await getOrm()).close(true));

/** A documentation-range address of its own for each test, so counts never carry over. */
const freshAddress = () => `198.18.${randomInt(0, 255)}.${randomInt(1, 254)}`;


const codeOf = (o: PromiseSettledResult<unknown>) => (o.status === 'fulfilled' ? 'ok' : o.reason instanceof AppError ? o.reason.code : `thrown: ${String(o.reason)}`);

const attempt = (email: string, password: string, ip: string) =>
  inUnitOfWork((w) => signIn({ ...w, input: { email, password }, ip })).then(
    () => 'ok',
    (e: unknown) => (e instanceof AppError ? e.code : Promise.reject(e)),
  );

describe('sign-in guesses', () => {
  it('30 simultaneous wrong guesses on one account from one address: at most 5 are checked', async () => {
    const user = await makeUser(await getEm());
    const ip = freshAddress();
    const outcomes = await atOnceSettled(30, () => inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: 'wrong-guess-123' }, ip })));
    const codes = outcomes.map(codeOf);
    expect(codes.filter((c) => c === 'invalid').length).toBeLessThanOrEqual(MAX_FAILURES_PER_PAIR);
    expect(codes.filter((c) => c === 'rate-limited').length).toBeGreaterThanOrEqual(30 - MAX_FAILURES_PER_PAIR);
    expect(codes.every((c) => c === 'invalid' || c === 'rate-limited')).toBe(true);
  });

  it('30 simultaneous wrong guesses on one account from 30 addresses: at most 5 and one delayed attempt are checked', async () => {
    const user = await makeUser(await getEm());
    const outcomes = await atOnceSettled(30, () => inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: 'wrong-guess-123' }, ip: freshAddress() })));
    const codes = outcomes.map(codeOf);
    expect(codes.filter((c) => c === 'invalid').length).toBeLessThanOrEqual(FREE_ATTEMPTS_PER_ACCOUNT + 1);
    expect(codes.every((c) => c === 'invalid' || c === 'rate-limited')).toBe(true);
  });

  it('an attacker on another address cannot lock the owner out; the attacker is blocked', async () => {
    const user = await makeUser(await getEm());
    const attacker = freshAddress();
    const codes = [];
    for (let i = 0; i < MAX_FAILURES_PER_PAIR + 5; i++) codes.push(await attempt(user.email, `wrong-guess-${i}-x`, attacker));
    expect(codes.slice(0, MAX_FAILURES_PER_PAIR)).toEqual(Array(MAX_FAILURES_PER_PAIR).fill('invalid'));
    expect(codes.slice(MAX_FAILURES_PER_PAIR)).toEqual(Array(5).fill('rate-limited'));
    // Even the right password is refused from the attacker's address...
    expect(await attempt(user.email, TEST_PASSWORD, attacker)).toBe('rate-limited');
    // ...while the owner, elsewhere, signs in at once.
    expect(await attempt(user.email, TEST_PASSWORD, freshAddress())).toBe('ok');
  });

  it('failures from many addresses slow the account down (one attempt per growing gap) without locking it', async () => {
    const user = await makeUser(await getEm());
    for (let i = 0; i < FREE_ATTEMPTS_PER_ACCOUNT; i++) expect(await attempt(user.email, `wrong-guess-${i}-x`, freshAddress())).toBe('invalid');
    // Past the free attempts one attempt gets through per gap; another at the same moment is told to wait.
    const outcomes = await atOnceSettled(2, (i) => inUnitOfWork((w) => signIn({ ...w, input: { email: user.email, password: `wrong-guess-late-${i}` }, ip: freshAddress() })));
    expect(outcomes.map(codeOf).sort()).toEqual(['invalid', 'rate-limited']);
    const error = outcomes.map((o) => (o.status === 'rejected' ? o.reason : null)).find((e) => e?.code === 'rate-limited');
    expect((error as AppError).message).toMatch(/Wait \d+ seconds? and try again/);
    // The owner gets in once the gap has passed.
    const wait = Number((error as AppError).message.match(/Wait (\d+) second/)![1]);
    await new Promise((r) => setTimeout(r, wait * 1000 + 200));
    expect(await attempt(user.email, TEST_PASSWORD, freshAddress())).toBe('ok');
  });

  it('a success clears the count of its address and account', async () => {
    const user = await makeUser(await getEm());
    const ip = freshAddress();
    for (let i = 0; i < MAX_FAILURES_PER_PAIR - 1; i++) expect(await attempt(user.email, 'wrong-guess-123', ip)).toBe('invalid');
    expect(await attempt(user.email, TEST_PASSWORD, ip)).toBe('ok');
    for (let i = 0; i < MAX_FAILURES_PER_PAIR - 1; i++) expect(await attempt(user.email, 'wrong-guess-123', ip)).toBe('invalid');
    expect(await attempt(user.email, TEST_PASSWORD, ip)).toBe('ok');
  });
});

describe('the client address', () => {
  it.each([
    ['the peer alone', '203.0.113.9', 0, '203.0.113.9'],
    ['a spoofed entry before the peer, no proxy', '6.6.6.6, 203.0.113.9', 0, '203.0.113.9'],
    ['one trusted proxy', '6.6.6.6, 198.51.100.4, 10.0.0.2', 1, '198.51.100.4'],
    ['two trusted proxies', '6.6.6.6, 198.51.100.4, 10.0.0.3, 10.0.0.2', 2, '198.51.100.4'],
    ['a chain shorter than the proxies', '10.0.0.2', 2, '10.0.0.2'],
    ['spaces and empty entries', ' , 6.6.6.6 ,, 203.0.113.9 ', 0, '203.0.113.9'],
    ['no header', '', 0, null],
  ])('%s', (_label, chain, hops, expected) => {
    expect(addressFromForwardedFor(chain, hops)).toBe(expected);
  });

  it('the server stamps the peer address, so 60 guesses with rotating spoofed X-Forwarded-For values are still blocked', async () => {
    // The stamp the app's server installs at start-up (instrumentation.ts), installed on a plain server here.
    installPeerAddressStamp();
    const seen: { forwarded: string; peer: string }[] = [];
    const server = http.createServer((req, res) => {
      seen.push({ forwarded: String(req.headers['x-forwarded-for']), peer: String(req.headers[PEER_HEADER]) });
      res.end('ok');
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const port = (server.address() as { port: number }).port;
    // The client connects from an address of its own in 127/8, so the counts are not shared with other tests.
    const peer = `127.${randomInt(1, 254)}.${randomInt(1, 254)}.${randomInt(1, 254)}`;
    const viaServer = (spoofed: string) =>
      new Promise<{ forwarded: string; peer: string }>((resolve, reject) => {
        const before = seen.length;
        http
          .get({ host: '127.0.0.1', port, localAddress: peer, headers: { 'x-forwarded-for': spoofed, [PEER_HEADER]: `forged ${spoofed}` } }, (res) => {
            res.resume();
            res.on('end', () => resolve(seen[before]!));
          })
          .on('error', reject);
      });
    const { signInAction } = await import('@/app/(auth)/sign-in/actions');
    const original = requestHeaders.get('x-forwarded-for');
    const messages: string[] = [];
    try {
      for (let i = 0; i < 60; i++) {
        const arrived = await viaServer(`10.${i}.${i}.${i}`);
        requestHeaders.set('x-forwarded-for', arrived.forwarded);
        requestHeaders.set(PEER_HEADER, arrived.peer);
        const form = new FormData();
        form.set('email', uniqueEmail('spray'));
        form.set('password', 'Summer2026!-guess');
        const state = (await signInAction({ ok: false }, form).catch((e: unknown) => (isRedirectError(e) ? { ok: true } : Promise.reject(e)))) as ActionState;
        messages.push(state.message ?? '');
      }
    } finally {
      requestHeaders.set('x-forwarded-for', original ?? '127.0.0.1');
      requestHeaders.delete(PEER_HEADER);
      server.close();
    }
    // The client's own X-Forwarded-For arrives as written; the forged stamp is replaced by the real one.
    expect(seen[0]!.forwarded).toBe('10.0.0.0');
    expect(peerAddress(seen[0]!.peer)).toBe(peer);
    const blocked = messages.filter((m) => /Too many failed sign-ins/.test(m)).length;
    expect(messages.slice(0, MAX_FAILURES_PER_ADDRESS).every((m) => m === 'The e-mail address or password is not right.')).toBe(true);
    expect(blocked).toBe(60 - MAX_FAILURES_PER_ADDRESS);
  });
});

describe('limits on sign-ups, reset requests and invitations', () => {
  it(`sign-ups from one address stop after ${LIMITS.signUpAddress.points} an hour, and the refused one creates nothing`, async () => {
    const ip = freshAddress();
    for (let i = 0; i < LIMITS.signUpAddress.points; i++) {
      await inUnitOfWork((w) => signUp({ ...w, ip, input: { name: 'Batch', email: uniqueEmail('batch'), password: 'brass-rudder-stock-7' } }));
    }
    const email = uniqueEmail('one-too-many');
    const error = await inUnitOfWork((w) => signUp({ ...w, ip, input: { name: 'Batch', email, password: 'brass-rudder-stock-7' } })).catch((e: unknown) => e);
    expect((error as AppError).code).toBe('rate-limited');
    expect((error as AppError).message).toMatch(/Too many sign-ups from your network\. Wait \d+ (minutes?|hours?) and try again\./);
    expect(await (await getEm()).count(UserSchema, { email })).toBe(0);
    // Another address is not affected.
    await expect(inUnitOfWork((w) => signUp({ ...w, ip: freshAddress(), input: { name: 'Other', email, password: 'brass-rudder-stock-7' } }))).resolves.toBeTruthy();
  });

  it(`reset requests from one address stop after ${LIMITS.resetAddress.points} an hour`, async () => {
    const ip = freshAddress();
    for (let i = 0; i < LIMITS.resetAddress.points; i++) await inUnitOfWork((w) => requestPasswordReset({ ...w, ip, input: { email: uniqueEmail('reset-batch') } }));
    const error = await inUnitOfWork((w) => requestPasswordReset({ ...w, ip, input: { email: uniqueEmail('reset-batch') } })).catch((e: unknown) => e);
    expect((error as AppError).code).toBe('rate-limited');
  });

  it(`one address gets at most ${LIMITS.mailToAddress.points} reset mails an hour, however many addresses ask`, async () => {
    const user = await makeUser(await getEm());
    for (let i = 0; i < LIMITS.mailToAddress.points + 3; i++) await inUnitOfWork((w) => requestPasswordReset({ ...w, ip: freshAddress(), input: { email: user.email } }));
    expect(await (await getEm()).count(UserTokenSchema, { user: user.id, kind: 'reset-password' })).toBe(LIMITS.mailToAddress.points);
    expect(await (await getEm()).count(OutboxMessageSchema, { toAddress: user.email })).toBe(LIMITS.mailToAddress.points);
  });

  it(`invitations to one address stop after ${LIMITS.inviteEmail.points} an hour`, async () => {
    const { organisation, users } = await makeOrgWithRoles(await getEm());
    const email = uniqueEmail('invite-spam');
    for (let i = 0; i < LIMITS.inviteEmail.points; i++) await runAs(ctxFor(await getEm(), organisation, users.owner), (ctx) => inviteMember(ctx, { email, role: 'viewer' }));
    const error = await runAs(ctxFor(await getEm(), organisation, users.owner), (ctx) => inviteMember(ctx, { email, role: 'viewer' })).catch((e: unknown) => e);
    expect((error as AppError).code).toBe('rate-limited');
    expect((error as AppError).message).toMatch(/Too many invitations to/);
    expect(await (await getEm()).count(OutboxMessageSchema, { toAddress: email })).toBe(LIMITS.inviteEmail.points);
  });
});
