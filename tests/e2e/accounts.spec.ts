import { expect, test } from '@playwright/test';
import { demo, demoUser, linkFromInbox, signIn, uniqueEmail } from './helpers';

test('sign up, confirm the e-mail, create an organisation, invite an engineer who accepts', async ({ page, browser }) => {
  const ownerEmail = uniqueEmail('owner');
  await page.goto('/sign-up');
  // Bad input first: errors in place, what was typed is kept.
  await page.getByLabel('Your name').fill('Rhea Quayle');
  await page.getByLabel('Work e-mail').fill(ownerEmail);
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('Use at least 10 characters.')).toBeVisible();
  await expect(page.getByLabel('Work e-mail')).toHaveValue(ownerEmail);
  await page.getByLabel('Password').fill('steel-pile-cathode-88');
  await page.getByRole('button', { name: 'Create account' }).click();
  // The same answer as for an address that already has an account: no session until the link is opened.
  await expect(page.getByText(`Check your e-mail: we sent a message to ${ownerEmail}.`)).toBeVisible();

  const verifyLink = await linkFromInbox(page, ownerEmail, /Confirm your e-mail/);
  // One click: opening the link confirms (the page posts the token itself; a plain GET changes nothing).
  await page.goto(verifyLink);
  await expect(page.getByText('your e-mail address is confirmed')).toBeVisible();

  await page.getByLabel('Organisation name').fill('Brackwater Port Services');
  await page.getByRole('button', { name: 'Create organisation' }).click();
  await expect(page).toHaveURL(/\/o\/brackwater-port-services/);
  // The organisation's name appears twice (the top bar below 1024 px, the sidebar above): the one shown.
  await expect(page.getByText('Brackwater Port Services').filter({ visible: true }).first()).toBeVisible();

  await page.getByRole('link', { name: 'Team' }).click();
  const engineerEmail = uniqueEmail('engineer');
  await page.getByLabel('E-mail').fill(engineerEmail);
  await page.getByLabel('Role', { exact: true }).selectOption('engineer');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation to ${engineerEmail} queued for sending`)).toBeVisible();
  await expect(page.getByRole('table', { name: 'Open invitations' })).toContainText(engineerEmail);

  const inviteLink = await linkFromInbox(page, engineerEmail, /invited you to Brackwater Port Services/);
  const engineer = await browser.newContext();
  const engineerPage = await engineer.newPage();
  await engineerPage.goto(inviteLink);
  await expect(engineerPage.getByRole('heading', { name: 'Join Brackwater Port Services' })).toBeVisible();
  await engineerPage.getByLabel('Your name').fill('Sol Davit');
  await engineerPage.getByLabel('Choose a password').fill('bracelet-anode-set-5');
  await engineerPage.getByRole('button', { name: 'Create my account and join' }).click();
  await expect(engineerPage).toHaveURL(/\/o\/brackwater-port-services/);
  await expect(engineerPage.getByText('Engineer').first()).toBeVisible();
  // The engineer is not an owner: no team page.
  await expect(engineerPage.getByRole('link', { name: 'Team' })).toHaveCount(0);
  await engineer.close();

  // The used link no longer works.
  await page.goto(inviteLink);
  await expect(page.getByText('This invitation was already accepted')).toBeVisible();
});

test('a viewer cannot reach the team page', async ({ page }) => {
  await signIn(page, demoUser('viewer').email);
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.getByRole('link', { name: 'Team' })).toHaveCount(0);
  const response = await page.goto(`/o/${demo.organisation.slug}/team`);
  expect(response?.status()).toBe(404);
  const api = await page.request.get(`/api/orgs/${demo.organisation.slug}/team`);
  expect(api.status()).toBe(403);
});

test('someone outside the organisation gets not-found for its pages and data', async ({ page }) => {
  const email = uniqueEmail('outsider');
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Out Sider');
  await page.getByLabel('Work e-mail').fill(email);
  await page.getByLabel('Password').fill('steel-pile-cathode-88');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText(`Check your e-mail: we sent a message to ${email}.`)).toBeVisible();
  // Opening the link confirms the address (one click).
  await page.goto(await linkFromInbox(page, email, /Confirm your e-mail/));
  await expect(page.getByText('your e-mail address is confirmed')).toBeVisible();
  expect((await page.goto(`/o/${demo.organisation.slug}`))?.status()).toBe(404);
  expect((await page.request.get(`/api/orgs/${demo.organisation.slug}/audit`)).status()).toBe(404);
});

test('a wrong password gives one clear message and keeps the e-mail typed', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demoUser('planner').email);
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert').first()).toContainText('The e-mail address or password is not right.');
  await expect(page.getByLabel('E-mail')).toHaveValue(demoUser('planner').email);
});
