import { expect, type Page } from '@playwright/test';
import fs from 'node:fs';
import path from 'node:path';

export const demo = JSON.parse(fs.readFileSync(path.join(import.meta.dirname, '..', '..', 'scripts', 'demo-sign-ins.json'), 'utf8')) as {
  organisation: { slug: string; name: string };
  password: string;
  users: { email: string; name: string; role: string }[];
};

export const demoUser = (role: string) => demo.users.find((u) => u.role === role)!;

export async function signIn(page: Page, email: string, password = demo.password) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).not.toHaveURL(/\/sign-in/);
}

/** Opens the dev inbox until a message to `to` whose subject matches arrives; returns the first link in it. */
export async function linkFromInbox(page: Page, to: string, subject: RegExp): Promise<string> {
  let href: string | null = null;
  await expect(async () => {
    await page.goto('/dev/inbox');
    const message = page.getByTestId('inbox-message').filter({ hasText: to }).filter({ hasText: subject }).first();
    await expect(message).toBeVisible({ timeout: 1000 });
    href = await message.locator('a').first().getAttribute('href');
    expect(href).toBeTruthy();
  }).toPass({ timeout: 20_000, intervals: [500, 1000] });
  return href!;
}

export const uniqueEmail = (label: string) => `${label}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@e2e.example`;
