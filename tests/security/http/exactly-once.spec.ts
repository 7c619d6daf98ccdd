import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from '../../e2e/helpers';

// A double submit in the browser: the form is sent twice before the first answer arrives (a double click,
// or a click and Enter). The form carries one idempotency key until it is answered, so one docking is planned.
test('a docking form submitted twice at once plans one docking', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  const yard = `Double Click Yard ${Date.now().toString(36)}`;
  const panel = page.locator('form').filter({ has: page.getByRole('button', { name: 'Plan it' }) }).first();
  await panel.getByLabel('Vessel or structure').selectOption({ label: 'Brindlemoor (vessel)' });
  await panel.getByLabel('Planned start').fill('2031-05-04');
  await panel.getByLabel('Yard or contractor').fill(yard);
  // The key is made in the browser once the page is hydrated.
  await expect(panel.locator('input[name="idempotencyKey"]')).toHaveValue(/^[0-9a-f-]{36}$/);
  await panel.evaluate((form: HTMLFormElement) => {
    form.requestSubmit();
    form.requestSubmit();
  });
  await expect(page).toHaveURL(/\/dockings\/[0-9a-f-]{36}$/);
  await page.goto(`/o/${demo.organisation.slug}/dockings`);
  await expect(page.getByRole('cell', { name: yard, exact: true })).toHaveCount(1);
});
