import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

// A phone held upright: 390 x 844 CSS pixels (the size the layout complaint was measured at).
const PHONE = { width: 390, height: 844 };
const org = `/o/${demo.organisation.slug}`;

// A valid 1 x 1 PNG (8-byte signature, IHDR, IDAT, IEND; PNG specification, ISO/IEC 15948): the upload checks the content, not the name.
const ONE_PIXEL_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64');

/** The page itself never scrolls sideways: anything wider scrolls inside its own frame. */
async function expectNoSideScroll(page: Page, where: string) {
  // Measured once the page and its tables have loaded (a table fetching its rows is aria-busy).
  await page.waitForLoadState('load');
  await expect(page.locator('[aria-busy="true"]')).toHaveCount(0);
  const { scrollWidth, innerWidth } = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
  expect(scrollWidth, `${where}: the page is ${scrollWidth} px wide in a ${innerWidth} px window`).toBeLessThanOrEqual(innerWidth);
}

/** The address of the first link on the page whose address matches `pattern` (the demo's names are not relied on). */
async function firstLink(page: Page, pattern: RegExp): Promise<string> {
  const hrefs = await page.locator('main a[href]').evaluateAll((links) => links.map((a) => a.getAttribute('href') ?? ''));
  const href = hrefs.find((h) => pattern.test(h));
  expect(href, `a link matching ${pattern} on ${page.url()}`).toBeTruthy();
  return href!;
}

async function openMenu(page: Page) {
  const menu = page.getByRole('button', { name: 'Menu' });
  await expect(menu).toHaveAttribute('aria-expanded', 'false');
  await menu.click();
  await expect(menu).toHaveAttribute('aria-expanded', 'true');
  const nav = page.getByRole('navigation', { name: 'Organisation' });
  await expect(nav).toBeVisible();
  return nav;
}

test.describe('at 390 x 844', () => {
  test.use({ viewport: PHONE });

  test('the sign-in and sign-up pages fit the width', async ({ page }) => {
    for (const path of ['/sign-in', '/sign-up', '/reset']) {
      await page.goto(path);
      await expectNoSideScroll(page, path);
    }
  });

  test('every main page fits the width, each as the role that works there', async ({ page, context }) => {
    // Seventeen pages and four sign-ins: more than the default minute on a busy machine.
    test.setTimeout(180_000);
    const visit = async (path: string) => {
      await page.goto(path);
      await expect(page.locator('main#content')).toBeVisible();
      await expectNoSideScroll(page, path);
    };
    const as = async (role: string, paths: (string | (() => Promise<void>))[]) => {
      await context.clearCookies();
      await signIn(page, demoUser(role).email);
      for (const p of paths) await (typeof p === 'string' ? visit(p) : p());
    };

    await as('owner', [
      '/orgs',
      org,
      `${org}/team`,
      `${org}/billing`,
      `${org}/audit`,
      `${org}/account`,
    ]);
    await as('engineer', [
      `${org}/register`,
      async () => visit(await firstLink(page, /\/assets\/[0-9a-f-]{36}$/)),
      `${org}/designs`,
      async () => visit(await firstLink(page, /\/designs\/[0-9a-f-]{36}$/)),
      `${org}/catalogue`,
    ]);
    await as('planner', [`${org}/dockings`, async () => visit(await firstLink(page, /\/dockings\/[0-9a-f-]{36}$/))]);
    await as('inspector', [`${org}/surveys`, async () => visit(await firstLink(page, /\/surveys\/[0-9a-f-]{36}$/))]);
  });

  test('the menu opens the navigation, closes on Escape with focus back on the button, and closes after following a link', async ({ page }) => {
    await signIn(page, demoUser('viewer').email);
    await page.goto(org);
    const nav = page.getByRole('navigation', { name: 'Organisation' });
    await expect(nav).toBeHidden();
    const menu = page.getByRole('button', { name: 'Menu' });
    await expect(menu).toHaveAttribute('aria-controls', /.+/);
    const controlled = await menu.getAttribute('aria-controls');
    await expect(page.locator(`#${controlled}`)).toBeHidden();

    await openMenu(page);
    await expect(page.locator(`#${controlled}`)).toBeVisible();
    // Focus moves into the navigation it opened.
    await expect(nav.getByRole('link').first()).toBeFocused();
    await page.keyboard.press('Escape');
    await expect(nav).toBeHidden();
    await expect(menu).toHaveAttribute('aria-expanded', 'false');
    await expect(menu).toBeFocused();

    await (await openMenu(page)).getByRole('link', { name: 'Catalogue' }).click();
    await expect(page).toHaveURL(new RegExp(`${org}/catalogue$`));
    await expect(nav).toBeHidden();
    await expect(menu).toHaveAttribute('aria-expanded', 'false');
    await expectNoSideScroll(page, 'catalogue');
  });

  test('an inspector on the quay records a survey with a reading and a photo', async ({ page }) => {
    await signIn(page, demoUser('inspector').email);
    await page.goto(org);
    await expectNoSideScroll(page, 'fleet');
    await (await openMenu(page)).getByRole('link', { name: 'Surveys' }).click();
    await expect(page).toHaveURL(new RegExp(`${org}/surveys$`));
    await expectNoSideScroll(page, 'surveys');

    const record = page.getByRole('button', { name: 'Record the survey' });
    // Touch targets: at least 44 px high (WCAG 2.2 success criterion 2.5.5, enhanced target size).
    expect((await record.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    expect((await page.getByLabel('Surveyed on').boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await page.getByLabel('Surveyed on').fill('2026-11-26');
    await page.getByLabel('Surveyor or contractor').fill('Quay phone check');
    await record.click();
    await expect(page).toHaveURL(/\/surveys\/[0-9a-f-]{36}$/);
    await expect(page.getByRole('heading', { level: 1 })).toContainText('26 Nov 2026');
    await expectNoSideScroll(page, 'the new survey');

    const add = page.getByRole('form', { name: 'Add a reading' });
    for (const name of ['Location', 'Potential']) expect((await add.getByLabel(name).boundingBox())!.height).toBeGreaterThanOrEqual(44);
    expect((await add.getByRole('button', { name: 'Add reading' }).boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await add.getByLabel('Location').fill('QP-1');
    await add.getByLabel('Potential').fill('-0.95');
    await add.getByRole('button', { name: 'Add reading' }).click();
    await expect(add.getByText(/^Reading added/)).toBeVisible();
    await expect(page.getByRole('table', { name: 'Readings' }).getByRole('row', { name: /QP-1/ })).toBeVisible();
    await expectNoSideScroll(page, 'after the reading');

    await page.getByLabel('Photo or report').setInputFiles({ name: 'anode-qp-1.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
    await page.getByLabel('Caption').fill('Anode at QP-1');
    const attach = page.getByRole('button', { name: 'Attach' });
    expect((await attach.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await attach.click();
    await expect(page.getByRole('status').filter({ hasText: 'anode-qp-1.png attached.' })).toBeVisible();
    await expect(page.getByText('Anode at QP-1').first()).toBeVisible();
    await page.reload();
    await expect(page.getByRole('table', { name: 'Readings' }).getByRole('row', { name: /QP-1/ })).toBeVisible();
    await expect(page.getByText('Anode at QP-1').first()).toBeVisible();
    await expectNoSideScroll(page, 'after the photo');
  });

  test('a planner in the yard confirms the proposed renewals of a docking and downloads the anode list', async ({ page }) => {
    await signIn(page, demoUser('planner').email);
    await page.goto(org);
    await (await openMenu(page)).getByRole('link', { name: 'Docking planner' }).click();
    await expect(page).toHaveURL(new RegExp(`${org}/dockings$`));
    await expectNoSideScroll(page, 'planner');

    // A vessel's docking (not a structure's campaign) with a renewal still proposed. The list is in date order; the
    // latest is tried first so that the earlier ones stay as the seed left them for the planner journey at 1440 px.
    const planned = page.getByRole('table', { name: 'Planned dockings' });
    const rows = await planned.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => ({ text: tr.textContent ?? '', href: tr.querySelector('a[href*="/dockings/"]')?.getAttribute('href') ?? '' })));
    const hrefs = rows.filter((r) => r.href && !/campaign/i.test(r.text)).map((r) => r.href).reverse();
    expect(hrefs.length).toBeGreaterThan(0);
    let found = false;
    for (const href of hrefs) {
      await page.goto(href);
      await expect(page.getByRole('table', { name: 'Renewals' })).toBeVisible();
      if (await page.getByRole('button', { name: /^Confirm renewal of / }).count()) {
        found = true;
        break;
      }
    }
    expect(found, 'a docking with a proposed renewal in the demo scenario').toBe(true);
    await expectNoSideScroll(page, 'the docking');

    const renewals = page.getByRole('table', { name: 'Renewals' });
    // The renewals table scrolls inside its own frame, which a keyboard can reach.
    const frame = page.getByRole('region', { name: 'Renewals' });
    await expect(frame).toHaveAttribute('tabindex', '0');
    expect(await frame.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
    // Its first column stays in view while the rest scrolls.
    await expect(renewals.locator('tbody tr > td:first-child').first()).toHaveCSS('position', 'sticky');

    const proposed = await page.getByRole('button', { name: /^Confirm renewal of / }).count();
    expect((await page.getByRole('button', { name: /^Confirm renewal of / }).first().boundingBox())!.height).toBeGreaterThanOrEqual(44);
    for (let i = 0; i < proposed; i++) {
      await page.getByRole('button', { name: /^Confirm renewal of / }).first().click();
      await expect(page.getByRole('button', { name: /^Confirm renewal of / })).toHaveCount(proposed - i - 1);
    }
    await expect(renewals).not.toContainText('Proposed');
    await expect(renewals).toContainText('Confirmed');
    await expectNoSideScroll(page, 'after confirming');

    const list = page.getByRole('link', { name: 'Print the dry-dock anode list (PDF)' });
    await expect(list).toBeVisible();
    const response = await page.request.get((await list.getAttribute('href'))!);
    expect(response.headers()['content-type']).toBe('application/pdf');
    // Every PDF file starts with "%PDF-" (ISO 32000-1, 7.5.2 File header).
    expect((await response.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });
});

test.describe('at 1440 x 900', () => {
  test.use({ viewport: { width: 1440, height: 900 } });

  test('the sidebar is shown and there is no menu button', async ({ page }) => {
    await signIn(page, demoUser('viewer').email);
    await page.goto(org);
    await expect(page.getByRole('navigation', { name: 'Organisation' })).toBeVisible();
    await expect(page.getByRole('button', { name: 'Menu' })).toBeHidden();
    await expectNoSideScroll(page, 'fleet at 1440');
  });
});

test('the first Tab on a page reaches "Skip to content", which moves focus to the main content', async ({ page }) => {
  for (const [path, role] of [['/sign-in', null], [org, 'viewer']] as const) {
    if (role) await signIn(page, demoUser(role).email);
    await page.goto(path);
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    await expect(skip).toBeFocused();
    await expect(skip).toBeVisible();
    await page.keyboard.press('Enter');
    await expect(page.locator('main#content')).toBeFocused();
  }
});
