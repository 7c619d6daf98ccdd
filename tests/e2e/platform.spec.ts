import { expect, test } from '@playwright/test';

test('the landing page tells a naval architect or port engineer what the product does', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('dry-docking');
  await expect(page.getByText('Size the anodes')).toBeVisible();
  await expect(page.getByText(/qualified corrosion engineer/)).toBeVisible();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
});

test('/api/health reports the app, the database and the supervised worker as ok', async ({ page }) => {
  const response = await page.goto('/api/health');
  expect(response?.status()).toBe(200);
  const body = await response!.json();
  expect(body.status).toBe('ok');
  expect(body.database.status).toBe('ok');
  expect(body.worker.status).toBe('ok');
  expect(body.worker.secondsSinceHeartbeat).toBeLessThan(60);
  expect(typeof body.queue.mailWaiting).toBe('number');
});

test('an unknown address shows the not-found page', async ({ page }) => {
  const response = await page.goto('/no/such/page');
  expect(response?.status()).toBe(404);
  await expect(page.getByText('There is nothing at this address.')).toBeVisible();
});
