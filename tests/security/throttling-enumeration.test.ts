// Neither the sign-up nor the reset form tells whether an address has an account: the same answer, the
// owner mailed instead, and timings that differ by less than 30 %.
import { performance } from 'node:perf_hooks';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { OutboxMessageSchema, UserSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import type { ActionState } from '@/lib/server/action';
import { makeUser, uniqueEmail } from '../fixtures/factories';
import { requestHeaders } from '../fixtures/next-headers-mock';
import { sessionCookie, signInAs } from '../fixtures/entry-points';

vi.mock('next/headers', async () => (await import('../fixtures/next-headers-mock')).nextHeadersMock);

afterAll(async () => (await getOrm()).close(true));

let addressCounter = 0;

/** Submits a form as a browser would, each from an address of its own (the per-address limits stay out of the way). */
async function submit(module: () => Promise<Record<string, unknown>>, name: string, fields: Record<string, string>): Promise<ActionState> {
  addressCounter++;
  requestHeaders.set('x-forwarded-for', `198.19.${addressCounter >> 8}.${addressCounter & 255}`);
  const action = (await module())[name] as (previous: ActionState, form: FormData) => Promise<ActionState>;
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return action({ ok: false }, form);
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

/** Times two kinds of request, interleaved so a busy machine slows both alike; returns both medians. */
async function medians(runs: number, a: (i: number) => Promise<unknown>, b: (i: number) => Promise<unknown>) {
  const ta: number[] = [];
  const tb: number[] = [];
  for (let i = 0; i < runs; i++) {
    for (const [call, times] of (i % 2 ? [[a, ta], [b, tb]] : [[b, tb], [a, ta]]) as [(i: number) => Promise<unknown>, number[]][]) {
      const start = performance.now();
      await call(i);
      times.push(performance.now() - start);
    }
  }
  return { a: median(ta), b: median(tb) };
}

const RUNS = 11;
const signUpModule = () => import('@/app/(auth)/sign-up/actions');
const resetModule = () => import('@/app/(auth)/reset/actions');

describe('sign-up', () => {
  it('answers an existing address exactly as a new one, signs nobody in, and mails the owner', async () => {
    const owner = await makeUser(await getEm(), { name: 'Ora Keel' });
    const fresh = uniqueEmail('fresh');
    await signInAs(null);
    const forExisting = await submit(signUpModule, 'signUpAction', { name: 'Mallory', email: owner.email, password: 'brass-rudder-stock-7' });
    expect(sessionCookie()).toBeUndefined();
    const forNew = await submit(signUpModule, 'signUpAction', { name: 'Nell', email: fresh, password: 'brass-rudder-stock-7' });
    expect(sessionCookie()).toBeUndefined();
    expect({ ...forExisting, message: forExisting.message?.replace(owner.email, '<email>') }).toEqual({ ...forNew, message: forNew.message?.replace(fresh, '<email>') });
    expect(forExisting.ok).toBe(true);
    const em = await getEm();
    expect(await em.count(UserSchema, { email: owner.email })).toBe(1);
    const mail = await em.find(OutboxMessageSchema, { toAddress: owner.email });
    expect(mail.map((m) => m.subject)).toEqual(['Someone tried to create a Tidewarden account with your address']);
    expect(mail[0]!.textBody).toMatch(/^Hello Ora Keel,/);
  });

  it('takes as long for an existing address as for a new one (medians within 30 %)', async () => {
    const existing = await Promise.all(Array.from({ length: RUNS }, async () => (await makeUser(await getEm())).email));
    await submit(signUpModule, 'signUpAction', { name: 'Warm Up', email: uniqueEmail('warm'), password: 'brass-rudder-stock-7' });
    const { a, b } = await medians(
      RUNS,
      (i) => submit(signUpModule, 'signUpAction', { name: 'Taken', email: existing[i]!, password: 'brass-rudder-stock-7' }),
      () => submit(signUpModule, 'signUpAction', { name: 'New', email: uniqueEmail('timing'), password: 'brass-rudder-stock-7' }),
    );
    expect(Math.max(a, b) / Math.min(a, b), `medians ${a.toFixed(1)} ms (existing) and ${b.toFixed(1)} ms (new)`).toBeLessThan(1.3);
  });
});

describe('password reset requests', () => {
  it('answer the same for known and unknown addresses', async () => {
    const user = await makeUser(await getEm());
    const known = await submit(resetModule, 'requestResetAction', { email: user.email });
    const unknown = await submit(resetModule, 'requestResetAction', { email: uniqueEmail('nobody') });
    expect(known).toEqual(unknown);
  });

  it('take as long for an unknown address as for a known one (medians within 30 %)', async () => {
    const known = await Promise.all(Array.from({ length: RUNS }, async () => (await makeUser(await getEm())).email));
    await submit(resetModule, 'requestResetAction', { email: uniqueEmail('warm') });
    const { a, b } = await medians(
      RUNS,
      (i) => submit(resetModule, 'requestResetAction', { email: known[i]! }),
      () => submit(resetModule, 'requestResetAction', { email: uniqueEmail('unknown') }),
    );
    expect(Math.max(a, b) / Math.min(a, b), `medians ${a.toFixed(1)} ms (known) and ${b.toFixed(1)} ms (unknown)`).toBeLessThan(1.3);
  });
});
