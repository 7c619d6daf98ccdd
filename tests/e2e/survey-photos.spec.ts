import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

// Survey photos go from the browser straight to the object storage (presigned PUT), are checked and recorded by
// the app, and are shown back from the storage (redirect to a presigned GET), within the page's CSP.

const org = `/o/${demo.organisation.slug}`;
// A valid 1 x 1 PNG (PNG specification, ISO/IEC 15948).
const ONE_PIXEL_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64');
const storage = (state: 'down' | 'up') => fetch(`${process.env.S3_ENDPOINT}/_fake/${state}`, { method: 'POST' });

async function newSurvey(page: Page, surveyor: string) {
  await page.goto(`${org}/surveys`);
  await page.getByLabel('Surveyed on').fill('2026-11-20');
  await page.getByLabel('Surveyor or contractor').fill(surveyor);
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page).toHaveURL(/\/surveys\/[0-9a-f-]{36}$/);
}

test.afterEach(async () => {
  await storage('up');
});

test('an inspector attaches a photo that goes to the storage and is shown from it; a file that is not a photo is refused', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) violations.push(message.text());
  });
  await signIn(page, demoUser('inspector').email);
  await newSurvey(page, 'Storage check');

  const upload = page.waitForRequest((req) => req.method() === 'PUT' && req.url().startsWith(`${process.env.S3_ENDPOINT}/`));
  await page.getByLabel('Photo or report').setInputFiles({ name: 'stern-anode.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
  await page.getByLabel('Caption').fill('Stern anode, half wasted');
  await page.getByRole('button', { name: 'Attach' }).click();
  await upload; // the file went to the storage, not through the app
  await expect(page.getByRole('status').filter({ hasText: 'stern-anode.png attached.' })).toBeVisible();

  // The thumbnail loads from the storage through the app's redirect.
  const thumbnail = page.getByRole('img', { name: 'Stern anode, half wasted' });
  await expect(thumbnail).toBeVisible();
  await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1);
  const href = await page.getByRole('link', { name: 'stern-anode.png' }).getAttribute('href');
  const served = await page.request.get(href!, { maxRedirects: 0 });
  expect(served.status()).toBe(302);
  expect(served.headers().location.startsWith(`${process.env.S3_ENDPOINT}/`)).toBe(true);

  // A web page named .png: the storage takes it (it was signed as a PNG), the app's check of its bytes refuses it.
  await page.getByLabel('Photo or report').setInputFiles({ name: 'not-a-photo.png', mimeType: 'image/png', buffer: Buffer.from('<html><body>hello</body></html>') });
  await page.getByRole('button', { name: 'Attach' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'Only JPEG and PNG photos and PDF reports can be attached.' })).toBeVisible();
  await page.reload();
  await expect(page.getByText('not-a-photo')).toHaveCount(0);
  expect(violations).toEqual([]);
});

test('with the storage down the upload says so and records nothing; pressing Attach again later attaches it once', async ({ page }) => {
  await signIn(page, demoUser('inspector').email);
  await newSurvey(page, 'Outage check');
  await page.getByLabel('Photo or report').setInputFiles({ name: 'bow-anode.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
  await page.getByLabel('Caption').fill('Bow anode during the outage');
  expect((await storage('down')).ok).toBe(true);
  await page.getByRole('button', { name: 'Attach' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'The file storage cannot be reached just now; nothing was recorded. Try again in a few minutes. Press Attach again to retry.' })).toBeVisible();
  // The rest of the page still works while the storage is down.
  await page.reload();
  await expect(page.getByRole('table', { name: 'Readings' })).toBeVisible();
  await expect(page.getByText('Bow anode during the outage')).toHaveCount(0);

  await page.getByLabel('Photo or report').setInputFiles({ name: 'bow-anode.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
  await page.getByLabel('Caption').fill('Bow anode during the outage');
  await storage('up');
  await page.getByRole('button', { name: 'Attach' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'bow-anode.png attached.' })).toBeVisible();
  await page.reload();
  await expect(page.getByRole('img', { name: 'Bow anode during the outage' })).toHaveCount(1);
});
