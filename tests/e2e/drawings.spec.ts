import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';
import { pdfText } from '../fixtures/pdf-text';

// The drawings of where each anode sits: the demo ferry's hull from both sides and the demo jetty's pile plan, a
// group or a pile opened from the drawing, the drawing in the calculation note and on the anode list, and axe clean.

const org = `/o/${demo.organisation.slug}`;
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

async function seriousViolations(page: Page): Promise<string[]> {
  await page.waitForLoadState('networkidle');
  const result = await new AxeBuilder({ page }).include('main').withTags(TAGS).analyze();
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')})`);
}

async function openAsset(page: Page, name: string) {
  await page.goto(org);
  await page.getByRole('table', { name: 'Fleet' }).getByRole('link', { name, exact: true }).first().click();
  await expect(page).toHaveURL(/\/assets\//);
}

test('a frame spacing nobody entered is shown in the particulars as the estimate the drawing uses, with where it came from', async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  await openAsset(page, 'Kittiwake Crossing');
  // 68 m between perpendiculars: 0.002 × 68 + 0.48 = 0.616, rounded to 0.62 m (common practice, from memory).
  await expect(page.getByText('0.62 m (estimated from the length, 0.002 L + 0.48 m, common practice)', { exact: true })).toBeVisible();
  await expect(page.getByText('frames every 0.62 m (estimated from the length, 0.002 L + 0.48 m, common practice)')).toBeVisible();
});

test('an engineer opens the demo ferry drawing, clicks a group and finds the drawing in the calculation note', async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  await openAsset(page, 'Brindlemoor');
  const starboard = page.getByRole('group', { name: 'Starboard side' });
  const port = page.getByRole('group', { name: 'Port side' });
  await expect(starboard).toBeVisible();
  await expect(port).toBeVisible();
  // The text alternative lists every group with its position, count and remaining fraction in words.
  const list = page.getByRole('table', { name: 'Anode groups on the drawing' });
  await expect(list.getByRole('row', { name: /Bottom P\/S/ })).toContainText('Hull bottom, frames 20–130, port and starboard, 0.4 m above keel');
  await expect(list.getByRole('row', { name: /Bottom P\/S/ })).toContainText(/\d+ % left/);
  await expect(list.getByRole('row', { name: /Rudders/ })).toContainText('Rudder P: -0.93 V, protected');
  // The readings are marked on the drawing with value and word: the view is drawn from its own SVG image (kept by
  // the browser until it changes), which the page names with its version.
  const portImage = await port.locator('image').getAttribute('href');
  expect(portImage).toMatch(/\/figures\/port\?v=[0-9a-f]{14}$/);
  const served = await page.request.get(portImage!);
  expect(served.headers()['content-type']).toBe('image/svg+xml; charset=utf-8');
  expect(served.headers()['cache-control']).toBe('private, max-age=86400, immutable');
  expect(await served.text()).toContain('>-0.96 V, protected</text>');
  // The browser decodes it as an image of the view's size under the page's own policy (img-src 'self').
  const decoded = await page.evaluate(async (src) => {
    const img = new Image();
    img.src = src;
    await img.decode();
    return [img.naturalWidth, img.naturalHeight];
  }, portImage!);
  expect(decoded).toEqual([Number(await port.evaluate((svg) => svg.getAttribute('viewBox')!.split(' ')[2])), Number(await port.evaluate((svg) => svg.getAttribute('viewBox')!.split(' ')[3]))]);
  // The reading is in the words under the drawing as well, with the group it was taken at.
  await expect(list.getByRole('row', { name: /Bottom P\/S/ })).toContainText('Fr 40 P: -0.96 V, protected');

  // Clicking a group opens its row.
  await port.getByRole('link', { name: /^Sea chests: 1 anode on this side, \d+ % left$/ }).click();
  await expect(page).toHaveURL(/#drawing-group-[0-9a-f-]{36}$/);
  const target = page.locator('tr:target');
  await expect(target).toHaveCount(1);
  await expect(target).toContainText('Sea chest, aft, port');
  expect(await seriousViolations(page)).toEqual([]);

  // The calculation note of the approved design ends with the drawing.
  await page.getByRole('link', { name: /Rev\. 1: Brindlemoor hull anodes/ }).click();
  const noteHref = await page.getByRole('link', { name: 'Print calculation note (PDF)' }).getAttribute('href');
  const note = await page.request.get(noteHref!);
  expect(note.headers()['content-type']).toBe('application/pdf');
  const noteText = (await pdfText(await note.body())).replace(/\s+/g, ' ');
  expect(noteText).toContain('Where the anodes are: Brindlemoor');
  expect(noteText).toContain('Starboard side (bow right)');
  expect(noteText).toContain('The groups fitted from this revision');
});

test('a planner opens the demo jetty plan, chooses a pile for its elevation and finds the plan on the anode list', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await openAsset(page, 'Gullhaven Ferry Jetty');
  const plan = page.getByRole('group', { name: 'Plan: 4 rows × 12 bents' });
  await expect(plan).toBeVisible();
  await expect(page.getByRole('table', { name: 'Anode groups on the drawing' }).getByRole('row', { name: /Bents 7-12/ })).toContainText('B11-C, -2 m CD: -0.78 V, under-protected');

  await plan.getByRole('link', { name: /^Pile bent 11 row C: 1 anode, \d+ % left; -0\.78 V, under-protected$/ }).click();
  await expect(page).toHaveURL(/#pile-11-C$/);
  const elevation = page.getByRole('group', { name: 'Elevation of pile bent 11 row C' });
  await expect(elevation).toBeVisible();
  await expect(elevation.getByText('-0.78 V, under-protected')).toBeVisible();
  await expect(elevation.getByText(/^Bents 7-12 · 1 · \d+ % left$/)).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);

  await page.goto(`${org}/dockings`);
  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('row', { name: /Gullhaven Ferry Jetty/ }).getByRole('link').first().click();
  const href = await page.getByRole('link', { name: 'Print the anode list, diving campaign (PDF)' }).getAttribute('href');
  const response = await page.request.get(href!);
  expect(response.headers()['content-type']).toBe('application/pdf');
  const text = (await pdfText(await response.body())).replace(/\s+/g, ' ');
  expect(text).toContain('Where the anodes go: Gullhaven Ferry Jetty');
  expect(text).toContain('Plan: 4 rows × 12 bents');
});

test("the vessel page's closed editors open with the asset's own data, and its design and survey links open in the page", async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  await openAsset(page, 'Brindlemoor');
  await page.getByText('Edit particulars', { exact: true }).click();
  await expect(page.getByLabel('Name', { exact: true })).toHaveValue('Brindlemoor');

  await page.getByText('Edit a fitted group', { exact: true }).click();
  const edit = page.locator('form').filter({ has: page.getByRole('button', { name: 'Save the group' }) });
  await expect(edit.getByLabel('Group to edit')).toBeVisible();
  const groups = await edit.getByLabel('Group to edit').locator('option').allTextContents();
  expect(groups).toEqual(expect.arrayContaining(['Bottom P/S', 'Sea chests']));
  await edit.getByLabel('Group to edit').selectOption({ label: 'Sea chests' });
  await expect(edit.getByLabel('Group label')).toHaveValue('Sea chests');
  await expect(edit.getByLabel('Quantity')).not.toHaveValue('');

  await page.getByText('Close a group (removed, lost or renewed)', { exact: true }).click();
  const close = page.locator('form').filter({ has: page.getByLabel('Removed on') });
  await expect(close.getByLabel('Group', { exact: true })).toBeVisible();
  expect(await close.getByLabel('Group', { exact: true }).locator('option').allTextContents()).toEqual(groups);

  // The static lists' links open their page in the page, as a link of the app does (no full reload).
  await page.evaluate(() => ((window as unknown as { keptAcross: boolean }).keptAcross = true));
  await page.getByRole('link', { name: /Rev\. 1: Brindlemoor hull anodes/ }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  expect(await page.evaluate(() => (window as unknown as { keptAcross?: boolean }).keptAcross)).toBe(true);
});
