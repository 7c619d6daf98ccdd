import { expect, test } from '@playwright/test';
import { demo, demoUser, linkFromInbox, signIn } from './helpers';

// Against zinc, steel is protected at about +0.25 V and more positive readings are under-protected
// (zinc about -1.05 V vs Ag/AgCl/seawater; lib/cp reference table, from memory): +0.30 V and +0.28 V are low, +0.20 V is protected.
test('an inspector records a survey against zinc with two low readings and corrects one', async ({ page }) => {
  await signIn(page, demoUser('inspector').email);
  await page.goto(`/o/${demo.organisation.slug}/surveys`);
  await page.getByLabel('Asset', { exact: true }).selectOption({ label: 'Dolphin North' });
  await page.getByLabel('Surveyed on').fill('2026-11-24');
  await page.getByLabel('Method', { exact: true }).selectOption('drop-cell');
  await page.getByLabel('Surveyor or contractor').fill('Berth 2 drop cell');
  await page.getByLabel('Reference electrode used').selectOption('zinc');
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page.getByRole('heading', { name: /Dolphin North: Drop cell survey of 24 Nov 2026/ })).toBeVisible();

  const add = page.getByRole('form', { name: 'Add a reading' });
  // The survey's electrode is the reading's default, and stays chosen after a refused submit.
  await expect(add.getByLabel('Electrode')).toHaveValue('zinc');
  await add.getByLabel('Potential').fill('0.30');
  await add.getByRole('button', { name: 'Add reading' }).click();
  await expect(add.getByText('Enter where the reading was taken.')).toBeVisible();
  await expect(add.getByLabel('Electrode')).toHaveValue('zinc');
  await expect(add.getByLabel('Potential')).toHaveValue('0.30');

  await add.getByLabel('Location').fill('DN-1');
  await add.getByRole('button', { name: 'Add reading' }).click();
  await expect(add.getByText(/Reading added: it is under-protected; the engineers have been told\./)).toBeVisible();
  await expect(add.getByLabel('Electrode')).toHaveValue('zinc');
  await add.getByLabel('Location').fill('DN-2');
  await add.getByLabel('Potential').fill('0.28');
  await add.getByRole('button', { name: 'Add reading' }).click();
  // The second low reading is saved too (it used to be refused as "already exists").
  await expect(add.getByText(/Reading added: it is under-protected; the engineers were already told about this survey/)).toBeVisible();
  const table = page.getByRole('table', { name: 'Readings' });
  await expect(table.getByRole('row', { name: /DN-1/ })).toContainText('Zn');
  await expect(table.getByRole('row', { name: /DN-2/ })).toContainText('Under-protected');
  await expect(page.getByText('2 under-protected', { exact: true })).toBeVisible();

  // DN-1 was misread: it was +0.20 V against zinc.
  await table.getByRole('button', { name: 'Edit the reading at DN-1' }).click();
  const edit = page.getByRole('form', { name: 'Correct the reading at DN-1' });
  await expect(edit.getByLabel('Electrode')).toHaveValue('zinc');
  await edit.getByLabel('Potential').fill('0.20');
  await edit.getByRole('button', { name: 'Save the correction' }).click();
  await expect(edit.getByText('Reading at DN-1 corrected. A correction has been sent to the engineers who were told about it.')).toBeVisible();
  await expect(table.getByRole('row', { name: /DN-1/ })).toContainText('Protected');
  await expect(page.getByText('1 under-protected', { exact: true })).toBeVisible();

  // The engineers who had the alert get the correction.
  await linkFromInbox(page, demoUser('engineer').email, /Correction: readings of Dolphin North/);
});

test('an inspector deletes a survey after confirming; an engineer restores it from the list', async ({ page }) => {
  await signIn(page, demoUser('inspector').email);
  await page.goto(`/o/${demo.organisation.slug}/surveys`);
  await page.getByLabel('Asset', { exact: true }).selectOption({ label: 'Dolphin North' });
  await page.getByLabel('Surveyed on').fill('2026-11-25');
  await page.getByLabel('Method', { exact: true }).selectOption('rov');
  await page.getByRole('button', { name: 'Record the survey' }).click();
  await expect(page.getByRole('heading', { name: /Dolphin North: ROV survey of 25 Nov 2026/ })).toBeVisible();

  await page.getByRole('button', { name: 'Delete the survey' }).click();
  await expect(page.getByText('Delete this survey with its 0 readings and 0 attachments? An engineer can restore it within 30 days.')).toBeVisible();
  await page.getByRole('button', { name: 'Yes, delete' }).click();
  await expect(page).toHaveURL(/\/surveys\?deleted=[0-9a-f-]{36}$/);
  await expect(page.getByRole('status').filter({ hasText: 'Survey deleted. An engineer can restore it within 30 days.' })).toBeVisible();
  // An inspector deletes but does not restore.
  await expect(page.getByText('Deleted surveys (restorable for 30 days)')).toHaveCount(0);

  await page.context().clearCookies();
  await signIn(page, demoUser('engineer').email);
  await page.goto(`/o/${demo.organisation.slug}/surveys`);
  const binned = page.getByRole('listitem').filter({ hasText: 'Dolphin North: ROV survey of 25 Nov 2026' });
  await expect(binned).toContainText(`Deleted by ${demoUser('inspector').email}`);
  await binned.getByRole('button', { name: 'Restore' }).click();
  await expect(page.getByText('Survey of Dolphin North on 25 Nov 2026 restored.')).toBeVisible();
  await expect(page.getByRole('table', { name: 'Surveys' }).getByRole('row', { name: /25 Nov 2026/ })).toContainText('Dolphin North');
});
