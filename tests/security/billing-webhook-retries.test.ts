// The demo seed's own webhooks were given up during the first start (the seed runs before the app is
// up, and the fake gave up after 7.5 s). The fake must retry like the hosted service: at once, then on a
// growing back-off over about three days, each event on its own schedule.
import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';

const ROOT = path.resolve(import.meta.dirname, '../..');
const HOUR = 3_600_000;

// The app's webhook endpoint, down (503) until a test brings it up.
let appUp = false;
const received: string[] = [];
const receiver = http.createServer((req, res) => {
  const chunks: Buffer[] = [];
  req.on('data', (c: Buffer) => chunks.push(c));
  req.on('end', () => {
    if (!appUp) return void res.writeHead(503).end('starting');
    received.push((JSON.parse(Buffer.concat(chunks).toString('utf8')) as { id: string }).id);
    res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
  });
});

let fake: ChildProcess;
let base = '';
let stripe: Stripe;

beforeAll(async () => {
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const port = (receiver.address() as { port: number }).port;
  const env: NodeJS.ProcessEnv = { ...process.env, FAKE_STRIPE_PORT: '0', FAKE_STRIPE_WEBHOOK_URL: `http://127.0.0.1:${port}/api/webhooks/stripe`, FAKE_STRIPE_PUBLIC_URL: '', FAKE_STRIPE_STATE_FILE: '' };
  delete env.FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS; // the default schedule, as `npm start` runs it
  fake = spawn(process.execPath, ['--import', 'tsx', 'fakes/stripe/server.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  base = await new Promise<string>((resolve, reject) => {
    let output = '';
    const timer = setTimeout(() => reject(new Error(`the fake did not start:\n${output}`)), 20_000);
    fake.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      const match = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(output);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    });
  });
  stripe = new Stripe('sk_test_tidewarden_local', { host: '127.0.0.1', port: Number(new URL(base).port), protocol: 'http', maxNetworkRetries: 0, telemetry: false });
});

afterAll(async () => {
  if (fake && fake.exitCode === null) {
    const exited = new Promise((resolve) => fake.once('exit', resolve));
    fake.kill('SIGTERM');
    await exited;
  }
  await new Promise((resolve) => receiver.close(resolve));
});

interface Listed {
  id: string;
  type: string;
  data: { object: { id: string } };
  delivery: { state: string; attempts: { at: number; status?: number }[]; next_attempt_at?: number | null };
}
const eventsAbout = async (id: string) => ((await (await fetch(`${base}/__control/events`)).json()) as { data: Listed[] }).data.filter((e) => e.data.object.id === id);

async function waitFor<T>(probe: () => Promise<T | undefined | false>, what: string, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('webhook deliveries while the app is down', () => {
  let firstEvent: Listed;

  it('an event the app could not take is kept pending, next tried a minute later, on a schedule of about three days', async () => {
    const health = (await (await fetch(`${base}/__control/health`)).json()) as { webhook_retry_delays_ms?: number[] };
    const total = (health.webhook_retry_delays_ms ?? []).reduce((s, d) => s + d, 0);
    expect(total).toBeGreaterThanOrEqual(70 * HOUR);
    expect(total).toBeLessThanOrEqual(72 * HOUR);
    // Growing back-off: each of the first delays longer than the one before.
    const first = health.webhook_retry_delays_ms!.slice(0, 5);
    first.slice(1).forEach((delay, i) => expect(delay).toBeGreaterThan(first[i]));

    const customer = await stripe.customers.create({ email: 'seeded-before-the-app@example.test' });
    firstEvent = await waitFor(async () => (await eventsAbout(customer.id)).find((e) => e.delivery.attempts.length >= 1), 'the first attempt', 5000);
    // Still pending well after the old give-up point (three retries within 7.5 s).
    await new Promise((r) => setTimeout(r, 8000));
    const [later] = await eventsAbout(customer.id);
    expect(later.delivery.state).toBe('pending');
    expect(later.delivery.attempts.map((a) => a.status)).toEqual([503]);
    const wait = later.delivery.next_attempt_at! - later.delivery.attempts[0].at;
    expect(wait).toBeGreaterThanOrEqual(59_000);
    expect(wait).toBeLessThanOrEqual(62_000);
    firstEvent = later;
  }, 20_000);

  it('a later event is delivered as soon as the app is up, not held behind the earlier one', async () => {
    appUp = true;
    const customer = await stripe.customers.create({ email: 'after-the-app-is-up@example.test' });
    const delivered = await waitFor(async () => (await eventsAbout(customer.id)).find((e) => e.delivery.state === 'delivered'), 'the new event delivered', 3000);
    expect(received).toContain(delivered.id);
    // The earlier event keeps its own schedule (its retry is due in about a minute) and is not lost.
    const [earlier] = await eventsAbout(firstEvent.data.object.id);
    expect(earlier.delivery.state).toBe('pending');
    expect(earlier.delivery.next_attempt_at).toBeGreaterThan(Date.now());
  });
});
