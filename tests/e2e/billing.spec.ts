import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

test('an owner moves to a larger plan through the checkout page and sees the new plan', async ({ page }) => {
  await signIn(page, demoUser('owner').email);
  await page.goto(`/o/${demo.organisation.slug}/billing`);
  await expect(page.getByTestId('current-plan')).toHaveText('Fleet');
  await page.getByRole('region', { name: 'Armada plan' }).getByRole('button', { name: 'Choose Armada' }).click();
  // The payment service's own page (the local fake).
  await expect(page.getByText('Test checkout')).toBeVisible();
  await page.getByRole('button', { name: /4000 0000 0000 0002/ }).click();
  await expect(page.getByText('Your card was declined.')).toBeVisible();
  await page.getByRole('button', { name: /4242 4242 4242 4242/ }).click();
  await expect(page).toHaveURL(/\/billing\?checkout=success/);
  await expect(page.getByTestId('current-plan')).toHaveText('Armada');
  await expect(page.getByText('Thank you: the payment went through')).toBeVisible();
  await expect(page.getByRole('table', { name: 'Invoices' })).toContainText('paid');
});

test('a planner cannot open the billing page', async ({ page }) => {
  await signIn(page, demoUser('planner').email);
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.getByRole('link', { name: 'Billing' })).toHaveCount(0);
  const response = await page.goto(`/o/${demo.organisation.slug}/billing`);
  expect(response?.status()).toBe(404);
});
