import { expect, test } from '@playwright/test';
import { actionHeaders, assetNamed, captureSignInAction, demoUser, FOREIGN, org, ownOrigin, signIn } from './helpers';

// Unsafe requests to route handlers and server actions must come from our own pages. A page on
// another origin (or a script posting text/plain, which needs no CORS preflight) must change nothing.

const vessel = (name: string) => ({ kind: 'vessel', name, hullMaterial: 'steel' });

test.describe('route handlers refuse what did not come from our own pages', () => {
  test.beforeEach(async ({ page }) => {
    await signIn(page, demoUser('engineer').email);
  });

  test('a JSON POST from another origin creates no asset', async ({ page }) => {
    const name = `Foreign origin ${Date.now()}`;
    const res = await page.request.post(`/api/orgs/${org}/assets`, { data: vessel(name), headers: { origin: FOREIGN } });
    expect(res.status()).toBe(403);
    const body = await res.json();
    expect(body.error.code).toBe('forbidden');
    expect(body.error.message).toMatch(/nothing was changed/);
    expect(await assetNamed(page.request, name)).toHaveLength(0);
  });

  test('a POST that a browser marks cross-site, with no Origin, creates no asset', async ({ page }) => {
    const name = `Cross site ${Date.now()}`;
    const res = await page.request.post(`/api/orgs/${org}/assets`, { data: vessel(name), headers: { 'sec-fetch-site': 'cross-site' } });
    expect(res.status()).toBe(403);
    expect(await assetNamed(page.request, name)).toHaveLength(0);
  });

  test('a JSON body sent as text/plain from another origin creates no asset', async ({ page }) => {
    const name = `Text plain foreign ${Date.now()}`;
    const res = await page.request.post(`/api/orgs/${org}/assets`, {
      data: JSON.stringify(vessel(name)),
      headers: { origin: FOREIGN, 'content-type': 'text/plain;charset=UTF-8' },
    });
    expect(res.status()).toBe(403);
    expect(await assetNamed(page.request, name)).toHaveLength(0);
  });

  test('a JSON body sent as text/plain is refused even from our own origin', async ({ page }) => {
    const name = `Text plain own ${Date.now()}`;
    const res = await page.request.post(`/api/orgs/${org}/assets`, {
      data: JSON.stringify(vessel(name)),
      headers: { origin: ownOrigin(page), 'content-type': 'text/plain;charset=UTF-8' },
    });
    expect(res.status()).toBe(415);
    expect((await res.json()).error.code).toBe('unsupported');
    expect(await assetNamed(page.request, name)).toHaveLength(0);
  });

  test('the same request from our own origin, as JSON, is accepted', async ({ page }) => {
    // The control: the body above is a valid asset, so the refusals are about origin and type only.
    const name = `Own origin ${Date.now()}`;
    const res = await page.request.post(`/api/orgs/${org}/assets`, { data: vessel(name), headers: { origin: ownOrigin(page) } });
    expect(res.status(), await res.text()).toBe(201);
    expect(await assetNamed(page.request, name)).toHaveLength(1);
  });

  test('a multipart upload from another origin imports nothing', async ({ page }) => {
    const surveys = await (await page.request.get(`/api/orgs/${org}/surveys?pageSize=5`)).json();
    const survey = surveys.rows[0] as { id: string; readingCount?: number };
    const before = await page.request.get(`/api/orgs/${org}/surveys?pageSize=5`);
    const res = await page.request.post(`/api/orgs/${org}/surveys/${survey.id}/readings`, {
      headers: { origin: FOREIGN },
      multipart: { file: { name: 'readings.csv', mimeType: 'text/csv', buffer: Buffer.from('location,potential_v\nForeign,-0.95\n') } },
    });
    expect(res.status()).toBe(403);
    const after = await page.request.get(`/api/orgs/${org}/surveys?pageSize=5`);
    expect(await after.json()).toEqual(await before.json());
  });

  test('an upload route takes a file, not a JSON or text body', async ({ page }) => {
    const surveys = await (await page.request.get(`/api/orgs/${org}/surveys?pageSize=5`)).json();
    const res = await page.request.post(`/api/orgs/${org}/surveys/${surveys.rows[0].id}/attachments`, {
      headers: { origin: ownOrigin(page), 'content-type': 'text/plain' },
      data: 'not a file',
    });
    expect(res.status()).toBe(415);
  });
});

test('the payment webhook is exempt: it is judged by its signature, not its origin', async ({ request }) => {
  const res = await request.post('/api/webhooks/stripe', { data: '{"id":"evt_forged"}', headers: { 'content-type': 'text/plain', origin: FOREIGN } });
  expect(res.status()).toBe(400);
  expect((await res.json()).error.message).toMatch(/signature/i);
});

test('a server action replayed from another origin is refused with a 403, not a 500', async ({ page }) => {
  const action = await captureSignInAction(page);
  const foreign = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin: FOREIGN }), data: action.body });
  expect(foreign.status()).toBe(403);
  expect((await foreign.json()).error.code).toBe('forbidden');
  // The control: the same bytes from our own origin reach the action (which refuses the wrong password).
  const own = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin: ownOrigin(page) }), data: action.body });
  expect(own.status()).toBe(200);
});
