// A fleet operator runs several app instances behind a reverse proxy against one PostgreSQL. This spec starts a
// second instance of the same production build (the one the e2e stage serves, E2E_DIST_DIR) with the same
// environment on another port, and checks that what must be shared is shared: a session made on one instance
// works on the other and ends on both, and the sign-in rate limits count across both (they live in PostgreSQL).
// The scheduled jobs and reminders with two workers are checked in tests/integration/fleet-*.test.ts.
import path from 'node:path';
import { randomInt } from 'node:crypto';
import { spawn, type ChildProcess } from 'node:child_process';
import { expect, request as playwrightRequest, test, type APIRequestContext } from '@playwright/test';
import { LIMITS } from '@/lib/server/auth/rate-limit';
import { demo, demoUser, signIn } from './helpers';
import { guess, newPeer, signInForm } from '../fixtures/raw-sign-in';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const urlA = new URL(process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100');
// The second instance: E2E_SECOND_PORT, or ten above the first (3110 under `npm test`).
const portB = Number(process.env.E2E_SECOND_PORT ?? Number(urlA.port) + 10);
const urlB = new URL(`http://127.0.0.1:${portB}`);
const slug = demo.organisation.slug;

let instanceB: ChildProcess | null = null;
const outputB: string[] = [];

function stopB() {
  if (instanceB && instanceB.exitCode === null && instanceB.signalCode === null) instanceB.kill('SIGTERM');
}

test.beforeAll(async () => {
  test.setTimeout(90_000);
  const distDir = process.env.E2E_DIST_DIR;
  if (!distDir) throw new Error('E2E_DIST_DIR is not set: run this spec through npm test or scripts/dev/e2e.mjs, which build the app and name its folder.');
  // Whatever answers on the port must be the instance started here, not something left running.
  if (await fetch(new URL('/', urlB)).then(() => true, () => false)) throw new Error(`Port ${portB} (the second instance) is already in use: stop what runs there, or set E2E_SECOND_PORT to a free port.`);
  // Started the way scripts/lib/bootstrap.mjs starts the first: one Node process running next start.
  instanceB = spawn(process.execPath, [path.join(ROOT, 'node_modules', 'next', 'dist', 'bin', 'next'), 'start', '-H', '127.0.0.1', '-p', String(portB)], {
    cwd: ROOT,
    env: { ...process.env, TIDEWARDEN_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: '1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  instanceB.stdout!.on('data', (c: Buffer) => outputB.push(c.toString()));
  instanceB.stderr!.on('data', (c: Buffer) => outputB.push(c.toString()));
  // Should the runner itself be stopped, the second instance goes with it.
  process.once('exit', stopB);
  const started = Date.now();
  for (;;) {
    if (instanceB.exitCode !== null) throw new Error(`The second instance stopped during start-up (exit ${instanceB.exitCode}):\n${outputB.join('')}`);
    const ok = await fetch(new URL('/api/health', urlB)).then((r) => r.ok, () => false);
    if (ok) break;
    if (Date.now() - started > 60_000) throw new Error(`The second instance did not answer on port ${portB} within 60 s:\n${outputB.join('')}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  console.log(`[two-instances] second instance on ${urlB.origin} (pid ${instanceB.pid}) answered in ${Date.now() - started} ms`);
});

test.afterAll(async () => {
  if (!instanceB) return;
  const child = instanceB;
  if (child.exitCode === null && child.signalCode === null) {
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
  }
  process.removeListener('exit', stopB);
  instanceB = null;
});

test('a session made on one instance works on the other, and signing out on the other ends it on both', async ({ page, context }) => {
  const viewer = demoUser('viewer');
  // Signed in through the sign-in page of instance A.
  await signIn(page, viewer.email);
  const session = await context.storageState();
  expect(session.cookies.length).toBeGreaterThan(0);

  const on = (base: URL, withSession: boolean): Promise<APIRequestContext> =>
    playwrightRequest.newContext({ baseURL: base.origin, storageState: withSession ? session : undefined, maxRedirects: 0 });
  const plainB = await on(urlB, false);
  const signedB = await on(urlB, true);
  const signedA = await on(urlA, true);
  try {
    // Without the cookie, instance B sends the organisation page to the sign-in page and refuses the API.
    const anonymousPage = await plainB.get(`/o/${slug}`);
    expect(anonymousPage.status()).toBeGreaterThanOrEqual(300);
    expect(anonymousPage.status()).toBeLessThan(400);
    expect(anonymousPage.headers()['location']).toContain('/sign-in');
    expect((await plainB.get(`/api/orgs/${slug}/assets`)).status()).toBe(401);

    // With the cookie instance A set, instance B knows the user: the page and the organisation's data.
    const orgPage = await signedB.get(`/o/${slug}`);
    expect(orgPage.status()).toBe(200);
    const html = await orgPage.text();
    expect(html).toContain(demo.organisation.name.replace(/&/g, '&amp;'));
    expect(html).toContain(viewer.name);
    const assets = await signedB.get(`/api/orgs/${slug}/assets`);
    expect(assets.status()).toBe(200);
    expect(((await assets.json()) as { rows: unknown[] }).rows.length).toBeGreaterThan(0);

    // In the browser on instance B (the cookie is the host's, so the browser sends it there too): sign out.
    await page.goto(new URL(`/o/${slug}`, urlB).toString());
    await expect(page.getByText(viewer.name).first()).toBeVisible();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page).not.toHaveURL(new RegExp(`/o/${slug}`));

    // The session is gone on instance A as well: the old cookie opens nothing there, nor on B.
    expect((await signedA.get(`/api/orgs/${slug}/assets`)).status()).toBe(401);
    expect((await signedB.get(`/api/orgs/${slug}/assets`)).status()).toBe(401);
    await page.goto(`/o/${slug}`);
    await expect(page).toHaveURL(/\/sign-in/);
  } finally {
    await Promise.all([plainB.dispose(), signedB.dispose(), signedA.dispose()]);
  }
});

// ----- rate limits: no-script form posts from an address of their own in 127/8 (as tests/security/http/throttling.spec.ts) -----

/** Failed sign-ins from one address, the n-th sent to instances[n % instances.length]; the outcome of each. */
async function guesses(instances: URL[], count: number, emailFor: (i: number) => string) {
  const peer = newPeer();
  const forms = await Promise.all(instances.map((base) => signInForm(base, peer)));
  const outcomes: string[] = [];
  for (let i = 0; i < count; i++) outcomes.push(await guess(instances[i % instances.length]!, peer, forms[i % instances.length]!, emailFor(i)));
  return outcomes;
}

/** The outcomes expected when the limit allows `points` failures and refuses every further one. */
const limitReachedAt = (points: number, count: number) => Array.from({ length: count }, (_, i) => (i < points ? 'refused' : 'blocked'));

test('failed sign-ins on one account spread over both instances are blocked at the same count as on one', async () => {
  const points = LIMITS.signInPair.points;
  const count = points + 3;
  const tag = `${Date.now().toString(36)}${randomInt(1e6)}`;
  const oneInstance = await guesses([urlA], count, () => `pair-one-${tag}@e2e.example`);
  const bothInstances = await guesses([urlA, urlB], count, () => `pair-both-${tag}@e2e.example`);
  expect(oneInstance).toEqual(limitReachedAt(points, count));
  // Counted per instance, the alternating guesses would only be blocked after 2 × points.
  expect(bothInstances).toEqual(limitReachedAt(points, count));
});

test('failed sign-ins over many accounts from one address, spread over both instances, meet the address limit at its count', async () => {
  test.setTimeout(180_000);
  const points = LIMITS.signInAddress.points;
  const count = points + 4;
  const tag = `${Date.now().toString(36)}${randomInt(1e6)}`;
  const started = Date.now();
  const outcomes = await guesses([urlA, urlB], count, (i) => `spray-${i}-${tag}@e2e.example`);
  console.log(`[two-instances] ${count} guesses over both instances in ${Date.now() - started} ms`);
  expect(outcomes).toEqual(limitReachedAt(points, count));
});
