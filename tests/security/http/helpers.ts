import type { APIRequestContext, Page, Request } from '@playwright/test';
import { demo } from '../../e2e/helpers';

export { demo, demoUser, signIn } from '../../e2e/helpers';

export const FOREIGN = 'http://evil.example';
export const org = demo.organisation.slug;

/** The app's own origin, as the browser sends it in the Origin header. */
export const ownOrigin = (page: Page) => new URL(page.url()).origin;

export async function assetNamed(request: APIRequestContext, name: string) {
  const res = await request.get(`/api/orgs/${org}/assets?q=${encodeURIComponent(name)}`);
  const body = (await res.json()) as { rows: { name: string }[] };
  return body.rows.filter((r) => r.name === name);
}

/**
 * Submits the sign-in form with a wrong password and returns the server-action request the browser
 * made, so a test can replay it with other headers or another body.
 */
export async function captureSignInAction(page: Page): Promise<{ url: string; headers: Record<string, string>; body: Buffer }> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('nobody-here@e2e.example');
  await page.getByLabel('Password').fill('not the password');
  const captured = page.waitForRequest((r: Request) => r.method() === 'POST' && Boolean(r.headers()['next-action']));
  await page.getByRole('button', { name: 'Sign in' }).click();
  const request = await captured;
  return { url: request.url(), headers: await request.allHeaders(), body: request.postDataBuffer() ?? Buffer.alloc(0) };
}

/** The headers worth replaying from a captured action request (the rest Playwright sets itself). */
export function actionHeaders(headers: Record<string, string>, extra: Record<string, string> = {}) {
  const keep = ['next-action', 'next-router-state-tree', 'content-type', 'accept'];
  return { ...Object.fromEntries(Object.entries(headers).filter(([k]) => keep.includes(k))), ...extra };
}
