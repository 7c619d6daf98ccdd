import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

test('an owner moves to a larger plan: the one subscription is updated and the difference invoiced, no second checkout', async ({ page }) => {
  await signIn(page, demoUser('owner').email);
  await page.goto(`/o/${demo.organisation.slug}/billing`);
  await expect(page.getByTestId('current-plan')).toHaveText('Fleet');
  // With a live subscription no plan offers a checkout: each one changes the subscription.
  await expect(page.getByRole('button', { name: /^Choose / })).toHaveCount(0);
  await page.getByRole('region', { name: 'Armada plan' }).getByRole('button', { name: 'Change to Armada' }).click();
  await expect(page.getByText('The plan is now Armada.')).toBeVisible();
  await page.reload();
  await expect(page.getByTestId('current-plan')).toHaveText('Armada');
  // The first month's invoice and the prorated difference, both paid.
  await expect(page.getByRole('table', { name: 'Invoices' }).locator('tbody tr')).toHaveCount(2);
  await expect(page.getByRole('table', { name: 'Invoices' })).not.toContainText('open');
});

test('a planner cannot open the billing page', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.getByRole('link', { name: 'Billing' })).toHaveCount(0);
  const response = await page.goto(`/o/${demo.organisation.slug}/billing`);
  expect(response?.status()).toBe(404);
});
