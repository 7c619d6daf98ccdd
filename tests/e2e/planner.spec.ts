import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';
import { pdfPages, pdfText } from '../fixtures/pdf-text';

test('a planner opens a docking, confirms the proposed renewals and prints the anode list', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  await expect(page.getByRole('figure', { name: 'Docking timeline' })).toBeVisible();
  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('row', { name: /Wavecrest Minnow/ }).getByRole('link').click();
  await expect(page.getByRole('heading', { name: /Wavecrest Minnow: Unplanned docking/ })).toBeVisible();

  const renewals = page.getByRole('table', { name: 'Renewals' });
  await expect(renewals).toContainText('Proposed');
  // The yard fits 6 of the 8: an edited proposal becomes the planner's own (confirmed).
  await page.getByLabel('Quantity to renew, Hulls P/S').fill('6');
  await renewals.getByRole('row', { name: /Hulls P\/S/ }).getByRole('button', { name: 'Save' }).click();
  await expect(renewals.getByRole('row', { name: /Hulls P\/S/ })).toContainText('Confirmed');
  const proposed = await page.getByRole('button', { name: /^Confirm renewal of / }).count();
  for (let i = 0; i < proposed; i++) {
    await page.getByRole('button', { name: /^Confirm renewal of / }).first().click();
    await expect(page.getByRole('button', { name: /^Confirm renewal of / })).toHaveCount(proposed - i - 1);
  }
  await expect(renewals).not.toContainText('Proposed');
  await expect(renewals).toContainText('Confirmed');

  // 6 x TW-ZB-2510 at 4.7 kg net each (the demo's crew boat, quantity set above) = 28.2 kg; the model is 250 x 100 x 30 mm (lib/cp built-in catalogue).
  const href = await page.getByRole('link', { name: 'Print the dry-dock anode list (PDF)' }).getAttribute('href');
  const response = await page.request.get(href!);
  expect(response.headers()['content-type']).toBe('application/pdf');
  const text = (await pdfText(await response.body())).replace(/\s+/g, ' ');
  expect(text).toContain('Wavecrest Minnow');
  expect(text).toMatch(/TW-ZB-2510 250 × 100 × 30 Zinc Flush, bolt-on 6 4\.7 5\.0 28\.2 30\.0/);
  expect(text).toContain('Gullhaven Graving Dock');

  const csv = await page.request.get(href!.replace('format=pdf', 'format=csv'));
  expect(await csv.text()).toContain('TW-ZB-2510');
});

test('an engineer may read the planner but not confirm renewals', async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  await expect(page.getByRole('heading', { name: 'Plan a docking or campaign' })).toHaveCount(0);
  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('row', { name: /Tern Ledger/ }).getByRole('link').click();
  await expect(page.getByRole('table', { name: 'Renewals' })).toContainText('TW-ZB-2510');
  await expect(page.getByRole('button', { name: /^Confirm renewal of / })).toHaveCount(0);
});

test('a planner opens the next docking of an overdue vessel, finds its renewal proposed and prints the list on A4', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  // The demo's Kittiwake Crossing: its hull group's renew-by date passed about seven weeks ago, its docking is 75 days ahead.
  const row = page.getByRole('table', { name: 'Renew-by dates' }).getByRole('row', { name: /Kittiwake Crossing/ });
  await expect(row).toContainText('Overdue');
  await expect(row).toContainText(/Proposed at the docking of \d{1,2} [A-Z][a-z]{2} \d{4} \(overdue; plan an earlier docking by /);
  await expect(row).toContainText(/less 6 months\) has passed/);
  // The earlier unplanned docking is offered with its date.
  await expect(page.getByRole('list', { name: 'Suggested dockings' })).toContainText(/Kittiwake Crossing: Unplanned docking by \d{1,2} [A-Z][a-z]{2} \d{4}/);

  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('row', { name: /Kittiwake Crossing/ }).getByRole('link').click();
  await expect(page.getByRole('heading', { name: /Kittiwake Crossing: Intermediate docking/ })).toBeVisible();
  const hull = page.getByRole('table', { name: 'Renewals' }).getByRole('row', { name: /Hull P\/S/ });
  await expect(hull).toContainText('Proposed');
  // The scheduler's reason, with the margin, is on the page (not only in a tooltip).
  await expect(hull).toContainText(/has passed, so the group is renewed at the next docking/);

  const href = await page.getByRole('link', { name: 'Print the dry-dock anode list (PDF)' }).getAttribute('href');
  const response = await page.request.get(href!);
  expect(response.headers()['content-type']).toBe('application/pdf');
  const body = await response.body();
  const text = (await pdfText(body)).replace(/\s+/g, ' ');
  expect(text).toContain('Kittiwake Crossing');
  expect(text).toContain('TW-ZW-3015');
  // A4 landscape, 841.89 x 595.28 pt (ISO 216), on every page.
  const pages = await pdfPages(body);
  expect(pages.length).toBeGreaterThan(0);
  for (const p of pages) expect([p.width.toFixed(2), p.height.toFixed(2)]).toEqual(['841.89', '595.28']);

  // The asset page says the same: overdue, and the same words for the group.
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  await page.getByRole('table', { name: 'Renew-by dates' }).getByRole('link', { name: 'Kittiwake Crossing' }).click();
  await expect(page.getByLabel('Protection outlook')).toHaveText('Overdue');
  await expect(page.getByRole('table', { name: 'Forecast by group' }).getByRole('row', { name: /Hull P\/S/ })).toContainText(/Proposed at the docking of .* \(overdue; plan an earlier docking by /);
});
