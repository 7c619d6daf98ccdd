import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from './helpers';

test('an inspector records a diver survey, uploads readings as CSV and sees an under-protected pile flagged', async ({ page }) => {
  await signIn(page, demoUser('inspector').email);
  await page.goto(`/o/${demo.organisation.slug}/surveys`);
  await page.getByLabel('Asset', { exact: true }).selectOption({ label: 'Dolphin South' });
  await page.getByLabel('Surveyed on').fill('2026-11-20');
  await page.getByLabel('Method', { exact: true }).selectOption('diver');
  await page.getByLabel('Surveyor or contractor').fill('Harbour dive team');
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page.getByRole('heading', { name: /Dolphin South: Diver survey of 20 Nov 2026/ })).toBeVisible();

  // A file with a bad row first: the line is named and nothing is imported.
  const bad = 'location,potential_v,electrode,remaining\nDS-1,-0.99,ag-agcl-seawater,\nDS-2,minus,ag-agcl-seawater,\n';
  await page.getByLabel('CSV file of readings (at most 5 MB)').setInputFiles({ name: 'dolphin.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
  await page.getByRole('button', { name: 'Upload readings' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'nothing was imported' })).toBeVisible();
  await expect(page.getByText(/Line 3/)).toBeVisible();
  await expect(page.getByRole('table', { name: 'Readings' })).toContainText('No readings yet');

  const good = 'location,potential_v,electrode,anode_group,remaining,comment\nDS-1,-0.99,ag-agcl-seawater,Dolphin S bracelets,65%,\nDS-4,-0.74,ag-agcl-seawater,,,"bracelet missing, check"\nDS-6,-1.04,cse,,,\n';
  await page.getByLabel('CSV file of readings (at most 5 MB)').setInputFiles({ name: 'dolphin.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
  await page.getByRole('button', { name: 'Upload readings' }).click();
  await expect(page.getByText(/3 readings imported; 1 under-protected/)).toBeVisible();
  const row = page.getByRole('table', { name: 'Readings' }).getByRole('row', { name: /DS-4/ });
  await expect(row).toContainText('Under-protected');
  await expect(row).toContainText('-0.740 V');
  await expect(page.getByText('1 under-protected', { exact: true })).toBeVisible();
  // The inspector may not change the asset register.
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.getByText('Add a vessel or structure')).toHaveCount(0);
});

test('an engineer adds a zone and records a fitted anode group on a vessel', async ({ page }) => {
  await signIn(page, demoUser('engineer').email);
  await page.goto(`/o/${demo.organisation.slug}`);
  await expect(page.getByText('Add a vessel or structure')).toBeVisible();
  await page.getByRole('link', { name: 'Tern Ledger' }).click();
  await expect(page.getByRole('heading', { name: 'Tern Ledger' })).toBeVisible();

  await page.getByText('Add a zone').click();
  const zoneForm = page.locator('form').filter({ has: page.getByRole('button', { name: 'Add zone' }) });
  await zoneForm.getByLabel('Zone name').fill('Kort nozzles');
  await zoneForm.getByLabel('Kind', { exact: true }).selectOption('other');
  await zoneForm.getByLabel('Wetted area').fill('-3');
  await zoneForm.getByRole('button', { name: 'Add zone' }).click();
  await expect(zoneForm.getByText('The area must be more than 0 m².')).toBeVisible();
  await expect(zoneForm.getByLabel('Zone name')).toHaveValue('Kort nozzles');
  await zoneForm.getByLabel('Wetted area').fill('14.5');
  await zoneForm.getByLabel('Coating', { exact: true }).selectOption('I');
  await zoneForm.getByRole('button', { name: 'Add zone' }).click();
  await expect(page.getByText('Zone "Kort nozzles" added.')).toBeVisible();
  await expect(page.getByRole('table', { name: 'Zones' })).toContainText('Kort nozzles');

  await page.getByText('Record a fitted group').click();
  const groupForm = page.locator('form').filter({ has: page.getByRole('button', { name: 'Record the fitted group' }) });
  await groupForm.getByLabel('Group label').fill('Nozzle rims');
  await groupForm.getByLabel('Zone', { exact: true }).selectOption({ label: 'Kort nozzles' });
  await groupForm.getByLabel('Anode model').selectOption({ label: 'TW-ZW-2010 (Zinc, 3.1 kg net)' });
  await groupForm.getByLabel('Quantity').fill('6');
  await groupForm.getByLabel('Installed on').fill('2026-11-02');
  await groupForm.getByLabel('Mean current (optional)').fill('0.8');
  await groupForm.getByLabel('Positions').fill('Nozzle rims P and S, 3 each');
  await groupForm.getByRole('button', { name: 'Record the fitted group' }).click();
  await expect(page.getByText('6 × TW-ZW-2010 recorded as "Nozzle rims".')).toBeVisible();
  const register = page.getByRole('table', { name: 'Anode register' });
  await expect(register).toContainText('Nozzle rims');
  await expect(register).toContainText('18.6 kg'); // 6 x 3.1 kg net
  await expect(page.getByRole('table', { name: 'Forecast by group' })).toContainText('Nozzle rims');
});
