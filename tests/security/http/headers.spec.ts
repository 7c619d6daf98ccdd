import { expect, test, type APIResponse, type ConsoleMessage, type Page } from '@playwright/test';
import { demoUser, org, signIn } from './helpers';

// Every response carries the security headers; pages carry a Content-Security-Policy with a fresh
// nonce that the app itself passes (no violations in the console), and nothing may be framed.

function expectSecurityHeaders(headers: Record<string, string>) {
  expect(headers['x-frame-options']).toBe('DENY');
  expect(headers['x-content-type-options']).toBe('nosniff');
  expect(headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
  expect(headers['permissions-policy']).toMatch(/geolocation=\(\)/);
  expect(headers['permissions-policy']).toMatch(/microphone=\(\)/);
  expect(headers['content-security-policy']).toMatch(/frame-ancestors 'none'/);
  // Served over plain http here: no HSTS.
  expect(headers['strict-transport-security']).toBeUndefined();
}

const policy = (res: APIResponse) => res.headers()['content-security-policy'] ?? '';
const nonceOf = (csp: string) => /'nonce-([^']+)'/.exec(csp)?.[1] ?? null;

test('a page carries the headers and a policy with a fresh nonce on every response', async ({ request }) => {
  const first = await request.get('/sign-in');
  expect(first.status()).toBe(200);
  expectSecurityHeaders(first.headers());
  const csp = policy(first);
  expect(csp).toMatch(/default-src 'self'/);
  expect(csp).toMatch(/object-src 'none'/);
  expect(csp).toMatch(/base-uri 'self'/);
  expect(csp).not.toMatch(/unsafe-inline/);
  const nonce = nonceOf(csp);
  expect(nonce).toBeTruthy();
  // Next put the nonce on its scripts.
  expect(await first.text()).toContain(`nonce="${nonce}"`);
  const second = await request.get('/sign-in');
  expect(nonceOf(policy(second))).not.toBe(nonce);
});

test('an API response carries the headers', async ({ request }) => {
  const res = await request.get('/api/health');
  expectSecurityHeaders(res.headers());
  expect(policy(res)).toMatch(/default-src 'none'/);
  const refused = await request.get(`/api/orgs/${org}/team`);
  expect(refused.status()).toBe(401);
  expectSecurityHeaders(refused.headers());
});

test('the team page cannot be framed by another site', async ({ page }) => {
  await signIn(page, demoUser('owner').email);
  const res = await page.request.get(`/o/${org}/team`);
  expect(res.status()).toBe(200);
  expectSecurityHeaders(res.headers());
});

test('HSTS is sent when the request reached a proxy over https', async ({ request }) => {
  const res = await request.get('/sign-in', { headers: { 'x-forwarded-proto': 'https' } });
  expect(res.headers()['strict-transport-security']).toMatch(/max-age=\d{7,}/);
});

function collectViolations(page: Page) {
  const violations: string[] = [];
  page.on('console', (message: ConsoleMessage) => {
    const text = message.text();
    if (message.type() === 'error' && /Content Security Policy|Refused to (load|execute|apply|connect|frame)/i.test(text)) violations.push(`${page.url()}: ${text}`);
  });
  page.on('pageerror', (error) => {
    if (/Content Security Policy/i.test(error.message)) violations.push(`${page.url()}: ${error.message}`);
  });
  return violations;
}

/** The page's scripts ran: Next's client runtime announces itself on window once it has started. */
async function expectScriptsRan(page: Page) {
  await page.waitForFunction(() => Boolean((window as unknown as { next?: { version?: string } }).next?.version), null, { timeout: 20_000 });
}

test('the main pages run under the policy without a single violation', async ({ page }) => {
  test.setTimeout(180_000);
  const violations = collectViolations(page);
  await page.goto('/');
  await expectScriptsRan(page);
  await page.goto('/sign-in');
  await expectScriptsRan(page);
  await signIn(page, demoUser('engineer').email);
  // The fleet.
  await page.goto(`/o/${org}`);
  await expectScriptsRan(page);
  // A design desk.
  await page.goto(`/o/${org}/designs`);
  await page.getByRole('link', { name: 'Kittiwake Crossing: anode design' }).click();
  await expect(page.getByTestId('anode-count')).toBeVisible();
  await expectScriptsRan(page);
  // The planner, with its timeline, and a docking's anode list as a PDF.
  await page.goto(`/o/${org}/dockings`);
  await expect(page.getByRole('figure', { name: 'Docking timeline' })).toBeVisible();
  await expectScriptsRan(page);
  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('link').first().click();
  const href = await page.getByRole('link', { name: /^Print the .*anode list.* \(PDF\)$/ }).getAttribute('href');
  const pdf = await page.request.get(href!);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  expectSecurityHeaders(pdf.headers());
  // The register, the team page and an unknown address (the not-found page).
  for (const path of [`/o/${org}/register`, `/o/${org}/team`, '/no-such-page']) {
    await page.goto(path);
    await expectScriptsRan(page);
  }
  expect(violations).toEqual([]);
});
