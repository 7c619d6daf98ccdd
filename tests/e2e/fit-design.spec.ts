import { expect, test, type Page } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

// "Fit this design" on the demo's approved revision (Brindlemoor's hull design, revision 1, approved by the checker
// in the seed and already fitted at the March 2025 docking). The two journeys share the vessel, so they run in order.
// Each journey signs in, submits and visits three pages: more than the default minute on a busy two-core machine.
test.describe.configure({ mode: 'serial', timeout: 180_000 });

const DESIGN = 'Brindlemoor hull anodes to the 2028 docking';

async function openApprovedDesign(page: Page) {
  await page.goto(`/o/${demo.organisation.slug}/designs`);
  await page.getByRole('link', { name: DESIGN }).click();
  await expect(page.getByRole('heading', { name: new RegExp(DESIGN) })).toBeVisible();
  await expect(page.getByText('Approved', { exact: true }).first()).toBeVisible();
  return page.getByRole('form', { name: 'Fit this design' });
}

test('an engineer fits the approved design as installed groups, once for a double submit, and finds them on the asset page', async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  const form = await openApprovedDesign(page);
  // An engineer records installations; booking renewals is a planner's, so that choice is not offered.
  await expect(form.getByLabel('Fitted on a day (installed groups)')).toBeChecked();
  await expect(form.getByLabel('Booked as renewals at a docking')).toHaveCount(0);

  const today = new Date().toISOString().slice(0, 10);
  await form.getByLabel('Fitted on', { exact: true }).fill(today);
  // The revision is already on the vessel (the seed fitted it): without the tick nothing is written and the form says why.
  await form.getByRole('button', { name: 'Fit this design' }).click();
  await expect(form.getByRole('alert').first()).toContainText('is already fitted on Brindlemoor');

  // A second set really going on: tick it, then submit twice before the first answer (a double click that gets through).
  const fresh = await openApprovedDesign(page);
  await fresh.getByLabel('Fitted on', { exact: true }).fill(today);
  await fresh.getByLabel(/Fit it again/).check();
  const posts: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'POST' && r.url().includes('/designs/')) posts.push(r.url());
  });
  await fresh.evaluate((f: HTMLFormElement) => {
    f.requestSubmit();
    f.requestSubmit();
  });
  const day = new Date(`${today}T00:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
  await expect(page.getByRole('status').filter({ hasText: 'recorded as fitted' })).toContainText(new RegExp(`\\d+ × TW-AW-4020 recorded as fitted on ${day} in \\d+ zones? of Brindlemoor\\.`));

  // Both submits reached the server (the second carried the same idempotency key and got the first's answer).
  await expect.poll(() => posts.length).toBe(2);

  // The asset page lists the new groups under their zones' names, each once: a second fit would have added
  // "Hull bottom (design rev 1)" and the like. The seed's sea chest group already has its zone's name, so the
  // new one is "Sea chests (design rev 1)", and a second fit would have made "Sea chests (design rev 1, 2)".
  await page.goto(`/o/${demo.organisation.slug}`);
  await page.getByRole('table', { name: 'Fleet' }).getByRole('link', { name: 'Brindlemoor', exact: true }).click();
  await expect(page.getByRole('heading', { name: /Brindlemoor/ }).first()).toBeVisible();
  const forecast = page.getByRole('table', { name: 'Forecast by group' });
  await expect(forecast.getByRole('row', { name: /^Hull bottom\b/ })).toHaveCount(1);
  await expect(forecast.getByRole('row', { name: /^Boot-top and sides\b/ })).toHaveCount(1);
  await expect(forecast.getByRole('row', { name: /^Sea chests \(design rev 1\)/ })).toHaveCount(1);
  await expect(forecast.getByRole('row', { name: /design rev 1, 2/ })).toHaveCount(0);
  // The seeded groups of March 2025 are still there beside them.
  await expect(forecast.getByRole('row', { name: /^Bottom P\/S\b/ })).toHaveCount(1);
});

test('a planner books the approved design as renewals at the next docking and finds them on the docking page', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  const form = await openApprovedDesign(page);
  // A planner books renewals; recording an installation is an engineer's, so only this choice is offered.
  await expect(form.getByLabel('Fitted on a day (installed groups)')).toHaveCount(0);
  await expect(form.getByLabel('Booked as renewals at a docking')).toBeChecked();
  const docking = form.getByLabel('Docking or campaign');
  await expect(docking).toContainText('Intermediate docking from');
  const chosen = (await docking.locator('option').first().textContent())!;
  await form.getByRole('button', { name: 'Fit this design' }).click();
  const when = chosen.replace(/^Intermediate docking from /, '').replace(/ · .*$/, '');
  await expect(page.getByRole('status').filter({ hasText: 'booked as renewals' })).toContainText(new RegExp(`\\d+ × TW-AW-4020 booked as renewals in \\d+ zones? at the docking from ${when}\\.`));

  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  await page.getByRole('table', { name: 'Planned dockings' }).getByRole('row', { name: /Brindlemoor/ }).getByRole('link').click();
  await expect(page.getByRole('heading', { name: /Brindlemoor: Intermediate docking/ })).toBeVisible();
  const renewals = page.getByRole('table', { name: 'Renewals' });
  // One confirmed renewal of TW-AW-4020 per zone of the design, booked by the planner (reason "other": to the design). The
  // scheduler's proposals for other groups of the zone (the set fitted in the first journey) stay beside them, proposed.
  for (const zone of ['Hull bottom', 'Boot-top and sides']) {
    const booked = renewals.getByRole('row', { name: new RegExp(`^${zone}\\b`) }).filter({ hasText: 'Confirmed' });
    await expect(booked).toHaveCount(1);
    await expect(booked).toContainText('TW-AW-4020');
    await expect(booked).toContainText('Other');
  }
  // Booking again is refused: the groups are already booked, and nothing more is written.
  const again = await openApprovedDesign(page);
  await again.getByRole('button', { name: 'Fit this design' }).click();
  await expect(again.getByRole('alert').first()).toContainText('already booked for renewal; nothing was booked.');
});
