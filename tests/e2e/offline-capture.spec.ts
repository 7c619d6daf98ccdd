import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

// Survey capture on the quay without signal: the survey page opens from the service worker's copy, readings and
// photos wait on the phone, and each reaches the server exactly once when the connection returns.
const PHONE = { width: 390, height: 844 };
const org = `/o/${demo.organisation.slug}`;
// Valid 1 x 1 images (PNG specification, ISO/IEC 15948; a baseline JFIF JPEG): the upload checks the content, not the name.
const ONE_PIXEL_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64');
const ONE_PIXEL_JPEG = Buffer.from(
  '/9j/4AAQSkZJRgABAQEASABIAAD/2wBDAP//////////////////////////////////////////////////////////////////////////////////////wgALCAABAAEBAREA/8QAFBABAAAAAAAAAAAAAAAAAAAAAP/aAAgBAQABPxA=',
  'base64',
);

/** A new survey of the first asset, dated `day`, opened on its page; returns its address. */
async function newSurvey(page: Page, day: string, surveyor: string) {
  await page.goto(`${org}/surveys`);
  await page.getByLabel('Surveyed on').fill(day);
  await page.getByLabel('Surveyor or contractor').fill(surveyor);
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page).toHaveURL(/\/surveys\/[0-9a-f-]{36}$/);
  return new URL(page.url()).pathname;
}

const status = (page: Page) => page.getByTestId('capture-status');
/** The readings table's cells holding exactly this location: one per recorded reading. */
const readingRows = (page: Page, location: string) => page.getByRole('table', { name: 'Readings' }).getByRole('cell', { name: location, exact: true });

async function saveReading(page: Page, values: { location?: string; potential?: string; remaining?: string; group?: boolean; comment?: string }) {
  const form = page.getByRole('form', { name: 'Capture a reading' });
  if (values.location !== undefined) await form.getByLabel('Location').fill(values.location);
  if (values.potential !== undefined) await form.getByLabel('Potential').fill(values.potential);
  if (values.remaining !== undefined) await form.getByLabel('Remaining').fill(values.remaining);
  if (values.comment !== undefined) await form.getByLabel('Comment').fill(values.comment);
  if (values.group) {
    const options = await form.getByLabel('Anode group').locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value).filter(Boolean));
    if (options.length) await form.getByLabel('Anode group').selectOption(options[0]);
  }
  await form.getByRole('button', { name: 'Save reading' }).click();
}

test.describe('offline capture at 390 x 844', () => {
  test.use({ viewport: PHONE, serviceWorkers: 'allow' });

  test('the survey page opens without signal; five readings and two photos wait, then reach the server once each', async ({ page, context }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-21', 'Offline pontoon check');
    // The service worker has kept this page (it says so on <html>) before the signal goes.
    await expect(page.locator('html')).toHaveAttribute('data-offline-ready', 'true', { timeout: 30_000 });
    const heading = await page.getByRole('heading', { level: 1 }).textContent();

    await context.setOffline(true);
    const reloaded = await page.reload();
    expect(reloaded?.fromServiceWorker(), 'the page came from the service worker').toBe(true);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText(heading!);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    await expect(status(page)).toContainText('Everything captured here is sent.');
    // The copy says how old it is.
    await expect(page.getByTestId('offline-copy')).toContainText('No connection. This page shows what the server sent on ');
    await expect(page.getByTestId('offline-copy')).toContainText('Readings and photos you capture are saved on this phone');
    // The way back to the survey list works offline too (it was opened before the worker ran: kept with the survey page).
    const list = await page.goto(org + '/surveys');
    expect(list?.fromServiceWorker(), 'the list came from the service worker').toBe(true);
    await expect(page.getByRole('heading', { level: 1, name: 'Surveys' })).toBeVisible();
    // With its data (kept with the survey page): surveys are listed, not "No surveys yet".
    await expect(page.getByRole('table', { name: 'Surveys' }).getByRole('link').first()).toBeVisible();
    await expect(page.getByText('No surveys yet.')).toHaveCount(0);
    await expect(page.getByTestId('offline-copy')).not.toContainText('Readings and photos you capture');
    await page.goto(surveyPath);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText(heading!);

    const form = page.getByRole('form', { name: 'Capture a reading' });
    // Large targets for a gloved finger.
    for (const name of ['Location', 'Potential', 'Remaining']) expect((await form.getByLabel(name).boundingBox())!.height).toBeGreaterThanOrEqual(44);
    expect((await form.getByRole('button', { name: 'Save reading' }).boundingBox())!.height).toBeGreaterThanOrEqual(44);

    await saveReading(page, { location: 'Fr 20 P', potential: '-0.95', group: true });
    await expect(status(page)).toContainText('Saved on this phone — 1 waiting to send');
    await saveReading(page, { location: 'Fr 22 P', potential: '-0.97', remaining: '65' });
    // The next location is proposed from the step between the last two.
    await expect(form.getByLabel('Location')).toHaveValue('Fr 24 P');
    await saveReading(page, { potential: '-0.93', comment: 'Bracelet loose' });
    await expect(form.getByLabel('Location')).toHaveValue('Fr 26 P');
    await saveReading(page, { potential: '-0.91' });
    // Kept before the next is typed, as an inspector sees it (typing into the form while it is cleared raced it).
    await expect(status(page)).toContainText('4 waiting to send');
    // A mistake is shown at once, offline too, and nothing is queued for it.
    await saveReading(page, { location: 'Fr 28 P', potential: '-7' });
    await expect(form.getByText('A potential below -2.0 V is not plausible.')).toBeVisible();
    await expect(status(page)).toContainText('4 waiting to send');
    await saveReading(page, { potential: '-0.90' });
    await expect(status(page)).toContainText('5 waiting to send');

    const photo = page.getByRole('form', { name: 'Capture a photo' });
    await expect(photo.getByLabel('Photo', { exact: true })).toHaveAttribute('capture', 'environment');
    await photo.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'offline-fr-20.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
    await photo.getByLabel('What the photo shows').fill('Anode at Fr 20 P');
    await photo.getByRole('button', { name: 'Save photo' }).click();
    await expect(status(page)).toContainText('6 waiting to send');
    await photo.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'offline-fr-24.jpg', mimeType: 'image/jpeg', buffer: ONE_PIXEL_JPEG });
    await photo.getByRole('button', { name: 'Save photo' }).click();
    await expect(status(page)).toContainText('Saved on this phone — 7 waiting to send');
    await expect(page.getByTestId('capture-item')).toHaveCount(7);

    // Still offline: "Send now" keeps everything and says why.
    await page.getByRole('button', { name: 'Send now' }).click();
    await expect(status(page)).toContainText('No connection');
    await expect(status(page)).toContainText('7 waiting to send');

    await context.setOffline(false);
    await expect(status(page)).toContainText('Everything captured here is sent.', { timeout: 30_000 });
    await expect(page.getByTestId('capture-item')).toHaveCount(0);

    // On the server, each exactly once.
    await page.goto(surveyPath);
    for (const location of ['Fr 20 P', 'Fr 22 P', 'Fr 24 P', 'Fr 26 P', 'Fr 28 P']) await expect(readingRows(page, location)).toHaveCount(1);
    await expect(page.getByRole('link', { name: 'offline-fr-20.png' })).toHaveCount(1);
    await expect(page.getByRole('link', { name: 'offline-fr-24.jpg' })).toHaveCount(1);
    await expect(page.getByText('Anode at Fr 20 P')).toHaveCount(1);
  });
});

test.describe('a cut connection mid-send', () => {
  // page.route sees the page's own requests only when no service worker stands between.
  test.use({ viewport: PHONE, serviceWorkers: 'block' });

  test('the answer lost on the way back: the reading waits, is sent again and recorded once', async ({ page }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-22', 'Cut connection check');
    let cut = 0;
    // The first capture request reaches the server, which records the reading; its answer never arrives.
    await page.route('**/capture', async (route) => {
      if (cut++ === 0) {
        await route.fetch();
        await route.abort('connectionreset');
      } else await route.continue();
    });
    await saveReading(page, { location: 'Pile B7', potential: '-0.96' });
    await expect(status(page)).toContainText('Saved on this phone — 1 waiting to send');
    await expect(status(page)).toContainText('No connection');
    await expect(page.getByTestId('capture-item')).toContainText('Saved on this phone, waiting to send');

    await page.getByRole('button', { name: 'Send now' }).click();
    await expect(status(page)).toContainText('Everything captured here is sent.');
    await expect(status(page)).toContainText('1 sent.');
    expect(cut).toBe(2);
    await page.goto(surveyPath);
    await expect(readingRows(page, 'Pile B7')).toHaveCount(1);
    // The next location follows the last one.
    await expect(page.getByRole('form', { name: 'Capture a reading' }).getByLabel('Location')).toHaveValue('Pile B8');
  });

  test('the app closed while sending: the reading is sent on the next open and recorded once', async ({ page }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-23', 'Restart check');
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let calls = 0;
    // The first send is held until the page has gone; the server still records it.
    await page.route('**/capture', async (route) => {
      calls += 1;
      if (calls === 1) {
        await held;
        await route.continue().catch(() => undefined);
      } else await route.continue();
    });
    await saveReading(page, { location: 'Dolphin 4', potential: '-0.99' });
    await expect.poll(() => calls).toBe(1);
    await page.reload();
    release();
    await expect(status(page)).toContainText('Everything captured here is sent.', { timeout: 20_000 });
    await page.goto(surveyPath);
    await expect(readingRows(page, 'Dolphin 4')).toHaveCount(1);
  });
});

test.describe('signing out on a shared phone', () => {
  test.use({ viewport: PHONE, serviceWorkers: 'allow' });

  test('asks before deleting unsent items, then leaves no cached survey page and no queue behind', async ({ page }) => {
    await signIn(page, demoUser('inspector').email);
    await newSurvey(page, '2026-10-18', 'Sign-out check');
    await expect(page.locator('html')).toHaveAttribute('data-offline-ready', 'true', { timeout: 30_000 });
    // Kept in this member's own cache (named with the member's id).
    expect((await page.evaluate(() => caches.keys())).filter((name) => /^tidewarden-survey-pages:.+/.test(name))).toHaveLength(1);
    // The capture request never gets through, whoever sends it: the reading stays on the phone. (The browser
    // context's route also stops the service worker's own Background Sync send, which the page's would not.)
    await page.context().route('**/capture', (route) => route.abort('internetdisconnected'));
    await saveReading(page, { location: 'Bollard 3', potential: '-0.94' });
    await expect(status(page)).toContainText('Saved on this phone — 1 waiting to send');

    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page.getByRole('alert').filter({ hasText: '1 captured item has not been sent. Signing out deletes it from this phone.' })).toBeVisible();
    await page.getByRole('button', { name: 'Keep them and stay signed in' }).click();
    await expect(status(page)).toContainText('1 waiting to send');
    await expect(page).toHaveURL(/\/surveys\/[0-9a-f-]{36}$/);

    // Without a connection the session cannot end: nothing is deleted, and the form says so.
    await page.context().setOffline(true);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'No connection: signing out needs the connection. Nothing was deleted and you are still signed in.' })).toBeVisible();
    await page.getByRole('button', { name: 'Stay signed in' }).click();
    await expect(status(page)).toContainText('1 waiting to send');
    expect((await page.evaluate(() => caches.keys())).filter((name) => /^tidewarden-survey-pages:.+/.test(name))).toHaveLength(1);
    await page.context().setOffline(false);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Delete and sign out' }).click();
    await expect(page).toHaveURL(/\/sign-in/);
    expect((await page.evaluate(() => caches.keys())).filter((name) => name.startsWith('tidewarden-survey-pages'))).toEqual([]);
    const left = await page.evaluate(
      () =>
        new Promise<number>((resolve, reject) => {
          const open = indexedDB.open('tidewarden-capture');
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const db = open.result;
            if (!db.objectStoreNames.contains('items')) return resolve(0);
            const count = db.transaction('items').objectStore('items').count();
            count.onsuccess = () => resolve(count.result);
            count.onerror = () => reject(count.error);
          };
        }),
    );
    expect(left).toBe(0);
  });
});

test.describe('one phone, two members', () => {
  test.use({ viewport: PHONE, serviceWorkers: 'block' });

  test("a tab left open from one member's session never records that member's readings under another member's session", async ({ page, context }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-24', 'Shared phone check');
    await page.route('**/capture', (route) => route.abort('internetdisconnected'));
    await saveReading(page, { location: 'Mooring 1', potential: '-0.95' });
    await expect(status(page)).toContainText('Saved on this phone — 1 waiting to send');

    // The inspector's session ends; the engineer signs in on the same phone, in another tab.
    await context.clearCookies();
    const other = await context.newPage();
    await signIn(other, demoUser('engineer').email);
    // The inspector's tab sends its queue with the engineer's cookie: refused, kept on the phone, and said why.
    await page.unroute('**/capture');
    await page.getByRole('button', { name: 'Send now' }).click();
    const item = page.getByTestId('capture-item');
    await expect(item).toContainText('Not accepted: needs you');
    await expect(item).toContainText('Captured by another member on this phone; sign in as them to send.');
    await other.goto(surveyPath);
    await expect(other.getByRole('form', { name: 'Capture a reading' })).toBeVisible();
    await expect(readingRows(other, 'Mooring 1')).toHaveCount(0);
    // The engineer's own page does not show (or send) the inspector's item.
    await expect(other.getByTestId('capture-item')).toHaveCount(0);
    await other.close();

    // Back as the inspector: "Send again" records it, once.
    await context.clearCookies();
    await signIn(page, demoUser('inspector').email);
    await page.goto(surveyPath);
    await page.getByRole('button', { name: 'Send again' }).click();
    await expect(status(page)).toContainText('Everything captured here is sent.');
    await page.goto(surveyPath);
    await expect(readingRows(page, 'Mooring 1')).toHaveCount(1);
  });

  test('a double tap saves one reading and one photo; a reading the phone could not store is said to be NOT saved', async ({ page }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-25', 'Double tap check');
    // Before the page has started, Save does nothing: the server's HTML has it disabled.
    const html = await (await page.request.get(surveyPath)).text();
    const buttons = html.match(/<button[^>]*>(?:(?!<\/button>)[\s\S])*<\/button>/g) ?? [];
    for (const name of ['Save reading', 'Save photo']) {
      const button = buttons.find((b) => b.includes(name));
      expect(button, name).toBeDefined();
      expect(button!, name).toMatch(/\sdisabled(=""|\s|>)/);
    }

    await page.route('**/capture', (route) => route.abort('internetdisconnected'));
    await page.route('**/attachments', (route) => route.abort('internetdisconnected'));
    const form = page.getByRole('form', { name: 'Capture a reading' });
    await expect(form.getByRole('button', { name: 'Save reading' })).toBeEnabled();
    // A text keyboard on phones, whose decimal pad has no minus sign.
    await expect(form.getByLabel('Potential')).toHaveAttribute('inputmode', 'text');
    await form.getByLabel('Location').fill('Quay 7');
    await form.getByLabel('Potential').fill('-0.94');
    // Two submits before the page could answer the first (a gloved double tap).
    await form.evaluate((f: HTMLFormElement) => {
      f.requestSubmit();
      f.requestSubmit();
    });
    await expect(status(page)).toContainText('Saved on this phone — 1 waiting to send');
    const photo = page.getByRole('form', { name: 'Capture a photo' });
    await photo.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'quay-7.png', mimeType: 'image/png', buffer: ONE_PIXEL_PNG });
    await photo.evaluate((f: HTMLFormElement) => {
      f.requestSubmit();
      f.requestSubmit();
    });
    await expect(status(page)).toContainText('Saved on this phone — 2 waiting to send');
    await expect(page.getByTestId('capture-item')).toHaveCount(2);

    // The phone's storage refuses the next one: the screen says so and keeps what was typed.
    await page.evaluate(() => {
      IDBObjectStore.prototype.put = function refused() {
        throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
      };
    });
    await saveReading(page, { location: 'Quay 8', potential: '-0.93' });
    await expect(page.getByRole('alert').filter({ hasText: 'NOT saved on this phone' })).toBeVisible();
    await expect(status(page)).not.toContainText('Saved on this phone: reading at Quay 8');
    await expect(form.getByLabel('Location')).toHaveValue('Quay 8');
    await expect(page.getByTestId('capture-item')).toHaveCount(2);
  });
});

test.describe('cached survey pages on a shared phone', () => {
  test.use({ viewport: PHONE, serviceWorkers: 'allow' });

  test("one member's kept survey page is never served to the next member, and is deleted when they sign in", async ({ page, context }) => {
    await signIn(page, demoUser('inspector').email);
    const surveyPath = await newSurvey(page, '2026-10-26', 'Kept page check');
    await expect(page.locator('html')).toHaveAttribute('data-offline-ready', 'true', { timeout: 30_000 });
    const kept = (await page.evaluate(() => caches.keys())).filter((name) => name.startsWith('tidewarden-survey-pages:'));
    expect(kept).toHaveLength(1);

    // The inspector's session ends without signing out; the engineer signs in on the same phone.
    await context.clearCookies();
    await signIn(page, demoUser('engineer').email);
    await expect.poll(async () => (await page.evaluate(() => caches.keys())).filter((name) => kept.includes(name))).toEqual([]);

    // Without signal the inspector's copy is not there to open.
    await context.setOffline(true);
    const opened = await page.goto(surveyPath).then(
      (response) => response?.fromServiceWorker() ?? false,
      () => false,
    );
    expect(opened).toBe(false);
    await context.setOffline(false);
  });
});
