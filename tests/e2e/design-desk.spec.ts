import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';
import { pdfText } from '../fixtures/pdf-text';

test('an engineer edits a draft, sees the results recomputed, saves; a second engineer approves; a viewer prints the note', async ({ page, browser }) => {
  // Three sign-ins (each now lands on the fleet overview) and a PDF: more than the default minute on a busy machine.
  test.setTimeout(120_000);
  await signIn(page, demoUser('engineer').email);
  await page.goto(`/o/${demo.organisation.slug}/designs`);
  await page.getByRole('link', { name: 'Kittiwake Crossing: anode design' }).click();
  await expect(page.getByRole('heading', { name: /Kittiwake Crossing: anode design/ })).toBeVisible();

  const count = page.getByTestId('anode-count');
  const before = Number(await count.textContent());
  expect(before).toBeGreaterThan(0);
  // Triple the hull bottom: the demand and the count must go up, recomputed without saving.
  const area = page.getByRole('listitem', { name: 'Zone 1' }).getByLabel('Area');
  const bottom = Number(await area.inputValue());
  await area.fill(String(bottom * 3));
  await expect.poll(async () => Number(await count.textContent())).toBeGreaterThan(before);
  await expect(page.getByText('Unsaved changes')).toBeVisible();

  // Bad input: a message in place, the last valid results stay.
  await area.fill('-4');
  await expect(page.getByText('The area must be more than 0 m².')).toBeVisible();
  await area.fill(String(bottom * 3));
  await expect(page.getByText('The area must be more than 0 m².')).toHaveCount(0);

  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByText(/^Saved: “.+”, \d+ zones?, at \d\d:\d\d/)).toBeVisible();
  const saved = Number(await count.textContent());
  const url = page.url();

  // The preparer may not approve their own work.
  await expect(page.getByRole('button', { name: 'Approve revision' })).toHaveCount(0);

  const checker = await browser.newContext();
  const checkerPage = await checker.newPage();
  await signIn(checkerPage, demoUser('engineer').email.replace('engineer@', 'checker@'));
  await checkerPage.goto(url);
  await expect(checkerPage.getByTestId('anode-count')).toHaveText(String(saved));
  checkerPage.once('dialog', (d) => d.accept());
  await checkerPage.getByRole('button', { name: 'Approve revision' }).click();
  await expect(checkerPage.getByText(/approved by you\. It can no longer change\.$/)).toBeVisible();
  await checkerPage.reload();
  await expect(checkerPage.getByRole('button', { name: 'Save draft' })).toHaveCount(0);
  await expect(checkerPage.getByRole('button', { name: 'Make a new revision' })).toBeVisible();
  await checker.close();

  const viewer = await browser.newContext();
  const viewerPage = await viewer.newPage();
  await signIn(viewerPage, demoUser('viewer').email);
  await viewerPage.goto(url);
  await expect(viewerPage.getByText('Approved', { exact: true }).first()).toBeVisible();
  const noteHref = await viewerPage.getByRole('link', { name: 'Print calculation note (PDF)' }).getAttribute('href');
  const note = await viewerPage.request.get(noteHref!);
  expect(note.headers()['content-type']).toBe('application/pdf');
  const text = (await pdfText(await note.body())).replace(/\s+/g, ' ');
  expect(text).toContain('Kittiwake Crossing');
  expect(text).toContain(`${saved} anodes of`);
  expect(text).toContain('Ilse Varga'); // the checker's name in the revision block
  await viewer.close();
});

test('a viewer reads the desk but cannot change it', async ({ page }) => {
  await signIn(page, demoUser('viewer').email);
  await page.goto(`/o/${demo.organisation.slug}/designs`);
  await expect(page.getByRole('heading', { name: 'New design' })).toHaveCount(0);
  await page.getByRole('link', { name: 'Ferry jetty piles, 20-year design' }).click();
  await expect(page.getByTestId('anode-count')).toBeVisible();
  await expect(page.getByRole('listitem', { name: 'Zone 1' }).getByLabel('Area')).toBeDisabled();
  await expect(page.getByRole('button', { name: 'Save draft' })).toHaveCount(0);
});
