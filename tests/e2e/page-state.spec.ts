import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, linkFromInbox, signIn, uniqueEmail } from './helpers';

// Honest page state: what an action changed shows at once (no reload), what was saved is said, a removal
// can be undone for a few seconds, the desk asks before unsaved work is left; and a new organisation is
// guided from its first sign-in.

const checkerEmail = () => demoUser('engineer').email.replace('engineer@', 'checker@');

/** A fresh draft on the first asset the desk offers, prepared by whoever is signed in on `page`. */
async function openFreshDraft(page: Page, title: string) {
  await page.goto(`/o/${demo.organisation.slug}/designs`);
  await page.getByLabel('Design title (optional)').fill(title);
  await page.getByRole('button', { name: 'Open a new design' }).click();
  await expect(page.getByRole('heading', { name: new RegExp(title) })).toBeVisible();
  return page.url();
}

test('a checker signs and an engineer approves: each sees the new state without reloading', async ({ page, browser }) => {
  // Three people sign in and the desk recomputes for each: more than the default minute on a busy machine.
  test.setTimeout(120_000);
  await signIn(page, demoUser('engineer').email);
  const url = await openFreshDraft(page, `State check ${Date.now()}`);
  await expect(page.getByRole('heading').getByText('Draft', { exact: true })).toBeVisible();

  const checker = await browser.newContext();
  const checkerPage = await checker.newPage();
  await signIn(checkerPage, checkerEmail());
  await checkerPage.goto(url);
  await checkerPage.getByRole('button', { name: 'Sign as checker' }).click();
  // No reload: the badge, the revision block and the buttons follow at once.
  await expect(checkerPage.getByText(/signed by you as checker\. It now waits for approval\.$/)).toBeVisible();
  await expect(checkerPage.getByRole('heading').getByText('Checked', { exact: true })).toBeVisible();
  await expect(checkerPage.getByRole('table', { name: 'Revision block' })).toContainText('Ilse Varga');
  await expect(checkerPage.getByRole('button', { name: 'Sign as checker' })).toHaveCount(0);
  await checker.close();

  // The preparer may not approve; the owner (another engineer's signature) does, from a page opened before.
  const owner = await browser.newContext();
  const ownerPage = await owner.newPage();
  await signIn(ownerPage, demoUser('owner').email);
  await ownerPage.goto(url);
  await expect(ownerPage.getByRole('button', { name: 'Save draft' })).toBeVisible();
  ownerPage.once('dialog', (d) => d.accept());
  await ownerPage.getByRole('button', { name: 'Approve revision' }).click();
  await expect(ownerPage.getByText(/approved by you\. It can no longer change\.$/)).toBeVisible();
  await expect(ownerPage.getByRole('heading').getByText('Approved', { exact: true })).toBeVisible();
  // Read-only at once: no title field, no save button, every desk input disabled; the fit panel appears.
  await expect(ownerPage.getByRole('button', { name: 'Save draft' })).toHaveCount(0);
  await expect(ownerPage.getByLabel('Design title')).toHaveCount(0);
  await expect(ownerPage.getByRole('listitem', { name: 'Zone 1' }).getByLabel('Area')).toBeDisabled();
  await expect(ownerPage.getByRole('button', { name: 'Approve revision' })).toHaveCount(0);
  await expect(ownerPage.getByRole('heading', { name: 'Fit this design' })).toBeVisible();
  await owner.close();
});

test("the desk asks before unsaved changes are left by a link, and a removed zone can be put back", async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  const url = await openFreshDraft(page, `State guard ${Date.now()}`);
  const zones = page.getByRole('listitem', { name: /^Zone \d+$/ });
  const before = await zones.count();
  expect(before).toBeGreaterThan(1);

  // Remove the first zone: the confirmation names it and offers Undo; Undo brings it back.
  const firstName = await page.getByRole('listitem', { name: 'Zone 1' }).getByLabel('Zone name').inputValue();
  await page.getByRole('button', { name: `Remove zone ${firstName}` }).click();
  await expect(zones).toHaveCount(before - 1);
  await expect(page.getByTestId('notice')).toContainText(`Removed zone “${firstName}” (not saved yet).`);
  await page.getByRole('button', { name: /^Undo: put zone .+ back/ }).click();
  await expect(zones).toHaveCount(before);
  await expect(page.getByRole('listitem', { name: 'Zone 1' }).getByLabel('Zone name')).toHaveValue(firstName);

  // Unsaved: a sidebar link asks; "stay" keeps the page and the edits.
  await expect(page.getByText('Unsaved changes')).toBeVisible();
  let asked = '';
  page.once('dialog', (d) => {
    asked = d.message();
    void d.dismiss();
  });
  await page.getByRole('link', { name: 'Fleet overview' }).click();
  await expect.poll(() => asked).toContain('unsaved changes');
  expect(page.url()).toBe(url);
  await expect(page.getByText('Unsaved changes')).toBeVisible();

  // Saved: the confirmation says what was saved, and the link no longer asks.
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByText(/^Saved: “State guard \d+”, \d+ zones, at \d\d:\d\d/)).toBeVisible();
  let askedAgain = false;
  page.on('dialog', (d) => {
    askedAgain = true;
    void d.dismiss();
  });
  await page.getByRole('link', { name: 'Fleet overview' }).click();
  await expect(page).toHaveURL(new RegExp(`/o/${demo.organisation.slug}$`));
  expect(askedAgain).toBe(false);
});

test('a saved role change stays chosen; a removed member can be restored with Undo', async ({ page }) => {
  const viewer = demoUser('viewer');
  await signIn(page, demoUser('owner').email);
  await page.goto(`/o/${demo.organisation.slug}/team`);
  const members = page.getByRole('table', { name: 'Members' });
  const role = page.getByRole('combobox', { name: `Role of ${viewer.email}` });
  await expect(role).toHaveValue('viewer');

  await role.selectOption('inspector');
  await page.getByRole('button', { name: `Save the role of ${viewer.email}` }).click();
  await expect(page.getByRole('status').filter({ hasText: `Saved: ${viewer.name} is now inspector.` })).toBeVisible();
  // It stays (the list is fetched again, and the select follows it) and is still there after a reload.
  await expect(role).toHaveValue('inspector');
  await page.waitForTimeout(1500);
  await expect(role).toHaveValue('inspector');
  await page.reload();
  await expect(page.getByRole('combobox', { name: `Role of ${viewer.email}` })).toHaveValue('inspector');
  // Back as it was, for the other journeys.
  await page.getByRole('combobox', { name: `Role of ${viewer.email}` }).selectOption('viewer');
  await page.getByRole('button', { name: `Save the role of ${viewer.email}` }).click();
  await expect(page.getByRole('status').filter({ hasText: `Saved: ${viewer.name} is now viewer.` })).toBeVisible();
  await expect(page.getByRole('combobox', { name: `Role of ${viewer.email}` })).toHaveValue('viewer');

  // Remove, then Undo within the few seconds offered: the same member comes back in the same role.
  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: `Remove ${viewer.name} (${viewer.email})` }).click();
  await expect(page.getByTestId('notice')).toContainText(`Removed ${viewer.name} (${viewer.email}).`);
  await expect(members).not.toContainText(viewer.email);
  await page.getByRole('button', { name: /^Undo the removal/ }).click();
  await expect(page.getByTestId('notice')).toContainText(`Restored: ${viewer.name} is a member again, as viewer.`);
  await expect(members).toContainText(viewer.email);
  await expect(page.getByRole('combobox', { name: `Role of ${viewer.email}` })).toHaveValue('viewer');
});

test('a new owner confirms the e-mail in one click, is guided through the first steps, and later signs straight into the organisation', async ({ page }) => {
  const email = uniqueEmail('firstrun');
  const password = 'tide-gauge-zinc-41';
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Noor Halyard');
  await page.getByLabel('Work e-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText(`Check your e-mail: we sent a message to ${email}.`)).toBeVisible();

  // Opening the link is enough: no button to press.
  await page.goto(await linkFromInbox(page, email, /Confirm your e-mail/));
  await expect(page.getByText('your e-mail address is confirmed')).toBeVisible();

  const orgName = `Saltmere Quay Works ${Date.now().toString(36)}`;
  await page.getByLabel('Organisation name').fill(orgName);
  await page.getByRole('button', { name: 'Create organisation' }).click();
  await expect(page).toHaveURL(/\/o\/saltmere-quay-works/);
  const fleet = page.url();

  const guide = page.getByRole('region', { name: /Getting started/ });
  await expect(guide).toContainText('4 steps to go');
  const step = (key: string) => guide.locator(`li[data-step="${key}"]`);
  for (const key of ['asset', 'design', 'fit', 'docking']) await expect(step(key)).toHaveAttribute('data-done', 'no');

  // Step 1 from the guide: the form is open for an empty organisation.
  await guide.getByRole('link', { name: /Add one below/ }).click();
  await page.getByLabel('Kind').selectOption({ label: 'Vessel' });
  await page.getByLabel('Name', { exact: true }).fill('Brinewick Tender');
  await page.getByLabel('Vessel type', { exact: true }).fill('Workboat');
  await page.getByLabel('Length between perpendiculars', { exact: true }).fill('28');
  await page.getByLabel('Beam', { exact: true }).fill('8');
  await page.getByLabel('Draught', { exact: true }).fill('2.4');
  await page.getByLabel('Block coefficient', { exact: true }).fill('0.55');
  await page.getByRole('button', { name: 'Add the asset' }).click();
  await expect(page).toHaveURL(/\/assets\//);

  // On its page: a zone archived by mistake comes back with Undo, from the page's notice.
  await page.getByText('Add a zone', { exact: true }).click();
  await page.getByLabel('Zone name').last().fill('Flat bottom');
  await page.getByLabel('Wetted area').last().fill('140');
  await page.getByRole('button', { name: 'Add zone' }).click();
  const zoneRows = page.getByRole('table', { name: 'Zones' }).getByRole('row').filter({ hasText: 'Flat bottom' });
  await expect(zoneRows).toHaveCount(1);
  // Edit opens the zone's form under the table; saving keeps it open with its message, and the row shows the change.
  const edit = zoneRows.getByRole('button', { name: 'Edit the zone Flat bottom' });
  await expect(edit).toHaveAttribute('aria-expanded', 'false');
  await edit.click();
  const editor = page.getByRole('region', { name: 'Edit the zone Flat bottom' });
  await expect(editor).toBeFocused();
  await expect(edit).toHaveAttribute('aria-expanded', 'true');
  await expect(editor.getByLabel('Zone name')).toHaveValue('Flat bottom');
  await editor.getByLabel('Wetted area').fill('152');
  await editor.getByRole('button', { name: 'Save zone' }).click();
  await expect(editor.getByRole('status')).toHaveText('Zone "Flat bottom" saved.');
  await expect(zoneRows).toContainText('152.0');
  await expect(zoneRows.getByRole('button', { name: 'Edit the zone Flat bottom' })).toHaveAttribute('aria-expanded', 'true');
  await editor.getByRole('button', { name: /^Close/ }).click();
  await expect(editor).toHaveCount(0);
  await expect(zoneRows.getByRole('button', { name: 'Edit the zone Flat bottom' })).toBeFocused();
  page.once('dialog', (d) => d.accept());
  await zoneRows.getByRole('button', { name: 'Archive' }).click();
  await expect(page.getByTestId('notice')).toContainText('Zone "Flat bottom" archived.');
  await expect(zoneRows).toHaveCount(0);
  await page.getByRole('button', { name: /^Undo: restore the zone Flat bottom/ }).click();
  await expect(page.getByTestId('notice')).toContainText('Zone "Flat bottom" restored.');
  await expect(zoneRows).toHaveCount(1);

  await page.goto(fleet);
  await expect(guide).toContainText('3 steps to go');
  await expect(step('asset')).toHaveAttribute('data-done', 'yes');
  await expect(step('asset')).toContainText('Done');
  await expect(step('design')).toHaveAttribute('data-done', 'no');
  await expect(guide.getByRole('link', { name: /Open the design desk/ })).toHaveAttribute('href', /\/designs$/);

  // Signing in again with one organisation goes straight into it, not to the list.
  await page.context().clearCookies();
  await signIn(page, email, password);
  await expect(page).toHaveURL(fleet);
});

test("Tidewarden's own icons and social image are served to anyone; every page's head names the icons, the public pages' the social card", async ({ page, request }) => {
  for (const [path, type] of [
    ['/favicon.ico', /image\/(x-icon|vnd\.microsoft\.icon)/],
    ['/icon.svg', /image\/svg\+xml/],
    ['/icon-192.png', /image\/png/],
    ['/icon-512.png', /image\/png/],
    ['/apple-touch-icon.png', /image\/png/],
    ['/og-image.png', /image\/png/],
    ['/manifest.webmanifest', /application\/manifest\+json|application\/json/],
  ] as const) {
    // Not signed in: no redirect to the sign-in page.
    const response = await request.get(path, { maxRedirects: 0 });
    expect(response.status(), path).toBe(200);
    expect(response.headers()['content-type'], path).toMatch(type);
  }
  // The public pages carry the social card; every page names the icons and the manifest.
  for (const path of ['/', '/sign-in', '/sign-up']) {
    await page.goto(path);
    await expect(page.locator('link[rel="icon"][href^="/favicon.ico"]'), path).toHaveCount(1);
    await expect(page.locator('link[rel="apple-touch-icon"]'), path).toHaveAttribute('href', /\/apple-touch-icon\.png/);
    await expect(page.locator('link[rel="manifest"]'), path).toHaveAttribute('href', '/manifest.webmanifest');
    await expect(page.locator('meta[property="og:image"]'), path).toHaveAttribute('content', /\/og-image\.png$/);
    await expect(page.locator('meta[property="og:title"]'), path).toHaveAttribute('content', 'Tidewarden');
  }
  // A signed-in page: the icons and the manifest (the phone's installed app), no social card (whoever follows a
  // link to it gets the sign-in page, which has one).
  await signIn(page, demoUser('viewer').email);
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.locator('link[rel="icon"][href^="/favicon.ico"]')).toHaveCount(1);
  await expect(page.locator('link[rel="manifest"]')).toHaveAttribute('href', '/manifest.webmanifest');
  await expect(page.locator('meta[property="og:image"]')).toHaveCount(0);
});

// Against zinc, +0.20 V on steel is protected (zinc about -1.05 V vs Ag/AgCl/seawater; as in surveys-corrections.spec.ts, common practice).
test('an inspector deletes a reading and puts it back with Undo; a deleted survey comes back from the list', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, demoUser('inspector').email);
  await page.goto(`/o/${demo.organisation.slug}/surveys`);
  await page.getByLabel('Asset', { exact: true }).selectOption({ label: 'Dolphin North' });
  await page.getByLabel('Surveyed on').fill('2026-11-23');
  await page.getByLabel('Method', { exact: true }).selectOption('drop-cell');
  await page.getByLabel('Reference electrode used').selectOption('zinc');
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page.getByRole('heading', { name: /Dolphin North: Drop cell survey of 23 Nov 2026/ })).toBeVisible();

  const add = page.getByRole('form', { name: 'Add a reading' });
  await add.getByLabel('Location').fill('UN-7');
  await add.getByLabel('Potential').fill('0.20');
  await add.getByLabel('Comment').fill('Fender frame, scraped');
  await add.getByRole('button', { name: 'Add reading' }).click();
  await expect(add.getByText(/^Reading added at UN-7/)).toBeVisible();
  // A second reading below it: when UN-7 goes, UN-8 moves up into its row and must not inherit its open question.
  await add.getByLabel('Location').fill('UN-8');
  await add.getByLabel('Potential').fill('0.21');
  await add.getByRole('button', { name: 'Add reading' }).click();
  await expect(add.getByText(/^Reading added at UN-8/)).toBeVisible();
  const table = page.getByRole('table', { name: 'Readings' });
  const row = table.getByRole('row', { name: /UN-7/ });
  await expect(row).toContainText('Fender frame, scraped');
  const asStored = (await row.textContent()) ?? '';

  await row.getByRole('button', { name: 'Delete the reading at UN-7' }).click();
  await page.getByRole('button', { name: 'Yes, delete' }).click();
  await expect(page.getByTestId('notice')).toContainText('Reading at UN-7 deleted.');
  await expect(table.getByRole('row', { name: /UN-7/ })).toHaveCount(0);
  await expect(table.getByRole('button', { name: 'Yes, delete' })).toHaveCount(0);
  await page.getByRole('button', { name: /^Undo: put back the reading at UN-7/ }).click();
  await expect(page.getByTestId('notice')).toContainText('Reading at UN-7 put back: +0.200 V against');
  // Back without a reload, with the values it had.
  await expect(table.getByRole('row', { name: /UN-7/ })).toHaveText(asStored);

  // The survey's delete navigates to the list, whose notice offers the Undo.
  await page.getByRole('button', { name: 'Delete the survey' }).click();
  await page.getByRole('button', { name: 'Yes, delete' }).click();
  await expect(page.getByTestId('notice')).toContainText('Survey deleted.');
  await page.getByRole('button', { name: /^Undo: put the survey back/ }).click();
  await expect(page.getByTestId('notice').filter({ hasText: 'Survey of Dolphin North on 23 Nov 2026 put back.' })).toBeVisible();
  await expect(page).toHaveURL(/\/surveys$/);
  await expect(page.getByRole('table', { name: 'Surveys' }).getByRole('row', { name: /23 Nov 2026/ })).toContainText('Dolphin North');
});
