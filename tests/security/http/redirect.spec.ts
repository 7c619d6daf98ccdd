import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

// After sign-in the app goes to ?next=, but only when that stays on our origin. The targets are written
// as they appear in the query string (so %09 arrives as a tab and %5C as a backslash).
const hostile = ['/%09/other-host/sign-in', '/.//other-host/sign-in', '//other-host', '/%5Cother-host', 'https://other-host/', '/%2e%2e//other-host/x', '/a/..//other-host'];

for (const next of hostile) {
  test(`signing in with next=${next} stays on our origin`, async ({ page }) => {
    await page.goto(`/sign-in?next=${next}`);
    const own = new URL(page.url()).origin;
    await page.getByLabel('E-mail').fill(demoUser('viewer').email);
    await page.getByLabel('Password').fill(demo.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(/\/(orgs|o\/)/);
    expect(new URL(page.url()).origin).toBe(own);
  });
}

test('a signed-in visit to the sign-in page answers with a Location on our origin', async ({ page }) => {
  await signIn(page, demoUser('viewer').email);
  const base = new URL(page.url()).origin;
  for (const next of hostile) {
    const res = await page.request.get(`/sign-in?next=${next}`, { maxRedirects: 0 });
    expect(res.status(), next).toBeGreaterThanOrEqual(300);
    const location = res.headers()['location'] ?? '';
    expect(new URL(location, base).origin, `${next} -> ${location}`).toBe(base);
  }
  // A legitimate target is kept, query and all.
  const ok = await page.request.get(`/sign-in?next=${encodeURIComponent(`/o/${demo.organisation.slug}/register?x=1`)}`, { maxRedirects: 0 });
  expect(ok.headers()['location']).toContain(`/o/${demo.organisation.slug}/register?x=1`);
});
