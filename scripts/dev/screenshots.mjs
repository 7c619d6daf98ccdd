// Developer aid: signs in as a demo user and saves screenshots of the given paths.
// node scripts/dev/screenshots.mjs <email> <outdir> <path> [<path> ...]   (BASE_URL defaults to http://127.0.0.1:3000;
// VIEWPORT, e.g. 390x844 for a phone, defaults to 1440x900)
import { chromium } from '@playwright/test';
import fs from 'node:fs';

const [email, outDir, ...paths] = process.argv.slice(2);
const base = process.env.BASE_URL ?? 'http://127.0.0.1:3000';
const password = JSON.parse(fs.readFileSync(new URL('../demo-sign-ins.json', import.meta.url))).password;
fs.mkdirSync(outDir, { recursive: true });
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--no-first-run', '--disable-quic'] });
const [width, height] = (process.env.VIEWPORT ?? '1440x900').split('x').map(Number);
const page = await browser.newPage({ viewport: { width, height } });
if (email !== '-') {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}
for (const [i, p] of paths.entries()) {
  await page.goto(`${base}${p}`);
  await page.waitForLoadState('load');
  await page.waitForTimeout(800);
  const file = `${outDir}/${String(i).padStart(2, '0')}-${p.replace(/[^a-z0-9]+/gi, '_')}.png`;
  await page.screenshot({ path: file, fullPage: true });
  console.log(file);
}
await browser.close();
