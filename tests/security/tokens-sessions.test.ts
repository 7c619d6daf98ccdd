// Signing in replaces the session the browser held: a session id known before the sign-in (planted by
// someone else, or left by the previous user of the browser) is dead afterwards.
import { afterAll, describe, expect, it, vi } from 'vitest';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { getEm, getOrm } from '@/lib/server/db';
import { getLucia } from '@/lib/server/auth/lucia';
import type { ActionState } from '@/lib/server/action';
import { makeUser, TEST_PASSWORD, uniqueEmail, inUnitOfWork } from '../fixtures/factories';
import { OutboxMessageSchema } from '@/entities';
import { sessionCookie, signInAs } from '../fixtures/entry-points';

vi.mock('next/headers', async () => (await import('../fixtures/next-headers-mock')).nextHeadersMock);

afterAll(async () => (await getOrm()).close(true));

async function submit(module: () => Promise<Record<string, unknown>>, name: string, fields: Record<string, string>) {
  const action = (await module())[name] as (previous: ActionState, form: FormData) => Promise<ActionState>;
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  try {
    return { state: await action({ ok: false }, form) };
  } catch (error) {
    if (isRedirectError(error)) return { redirected: true };
    throw error;
  }
}

const signInModule = () => import('@/app/(auth)/sign-in/actions');
const stillValid = async (sessionId: string) => (await getLucia().validateSession(sessionId)).session !== null;

describe('sign-in and the session the browser already had', () => {
  it('signing in as someone else ends the previous user\'s session in this browser', async () => {
    const first = await makeUser(await getEm());
    const second = await makeUser(await getEm());
    const previous = (await signInAs(first, { fresh: true }))!;
    expect(await stillValid(previous)).toBe(true);
    expect(await submit(signInModule, 'signInAction', { email: second.email, password: TEST_PASSWORD })).toEqual({ redirected: true });
    const now = sessionCookie()!;
    expect(now).not.toBe(previous);
    expect((await getLucia().validateSession(now)).user?.id).toBe(second.id);
    expect(await stillValid(previous)).toBe(false);
  });

  it('signing in again as the same user gives a new session id and ends the old one', async () => {
    const user = await makeUser(await getEm());
    const previous = (await signInAs(user, { fresh: true }))!;
    expect(await submit(signInModule, 'signInAction', { email: user.email, password: TEST_PASSWORD })).toEqual({ redirected: true });
    const now = sessionCookie()!;
    expect(now).not.toBe(previous);
    expect(await stillValid(now)).toBe(true);
    expect(await stillValid(previous)).toBe(false);
  });

  it('a confirmation link opened in a browser signed in as someone else signs that browser in as the link\'s owner, ending the other session', async () => {
    const other = await makeUser(await getEm());
    const email = uniqueEmail('confirm-in-shared-browser');
    await inUnitOfWork((w) => import('@/lib/server/services/accounts/sign-up').then(({ signUp }) => signUp({ ...w, input: { name: 'Nia Strake', email, password: 'brass-rudder-stock-7' } })));
    const [mail] = await (await getEm()).find(OutboxMessageSchema, { toAddress: email });
    const token = mail!.textBody.match(/\/verify\/([\w-]+)/)![1]!;
    const previous = (await signInAs(other, { fresh: true }))!;
    expect(await submit(() => import('@/app/(auth)/verify/[token]/actions'), 'verifyEmailAction', { token })).toEqual({ redirected: true });
    expect((await getLucia().validateSession(sessionCookie()!)).user?.email).toBe(email);
    expect(await stillValid(previous)).toBe(false);
  });
});
