import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { demo, signIn } from './helpers';

// axe over every main page, for each demo role, signed out too. A page passes with no serious or critical
// violation of WCAG 2.1 A/AA; a failure lists each violation (rule, impact, the elements) so it can be read.

const org = `/o/${demo.organisation.slug}`;
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

interface Finding {
  page: string;
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

async function scan(page: Page, label: string): Promise<Finding[]> {
  await page.waitForLoadState('networkidle');
  const result = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ page: label, id: v.id, impact: v.impact ?? '', help: v.help, targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) }));
}

function report(findings: Finding[]): string {
  return findings.map((f) => `${f.page}: ${f.id} (${f.impact}) ${f.help}\n    ${f.targets.join('\n    ')}`).join('\n');
}

/** The first link on the page whose address matches, e.g. the first survey of the surveys list. */
async function firstHref(page: Page, pattern: RegExp): Promise<string | null> {
  const hrefs = await page.locator('main a[href]').evaluateAll((links) => links.map((a) => a.getAttribute('href') ?? ''));
  return hrefs.find((h) => pattern.test(h)) ?? null;
}

/** The asset page of the first vessel and the first structure listed on the fleet overview. */
async function assetPages(page: Page): Promise<{ label: string; path: string }[]> {
  await page.goto(org);
  const found: { label: string; path: string }[] = [];
  const rows = page.getByRole('table', { name: 'Fleet' }).getByRole('row').filter({ has: page.locator(`a[href*="${org}/assets/"]`) });
  await expect(rows.first()).toBeVisible();
  for (const kind of ['vessel', 'structure']) {
    const row = rows.filter({ hasText: new RegExp(`\\b${kind}\\b`, 'i') }).first();
    expect(await row.count(), `a ${kind} on the fleet overview`).toBe(1);
    const href = await row.locator(`a[href*="${org}/assets/"]`).first().getAttribute('href');
    found.push({ label: `asset (${kind})`, path: href! });
  }
  return found;
}

const ROLES: { email: string; role: string; manages: boolean }[] = [
  { email: 'owner@gullhaven.example', role: 'owner', manages: true },
  { email: 'engineer@gullhaven.example', role: 'engineer', manages: false },
  { email: 'checker@gullhaven.example', role: 'checker', manages: false },
  { email: 'planner@gullhaven.example', role: 'planner', manages: false },
  { email: 'inspector@gullhaven.example', role: 'inspector', manages: false },
  { email: 'viewer@gullhaven.example', role: 'viewer', manages: false },
];

test.describe('accessibility (axe, WCAG 2.1 AA)', () => {
  test('signed-out pages have no serious or critical violation', async ({ page }) => {
    const findings: Finding[] = [];
    for (const path of ['/sign-in', '/sign-up', '/reset']) {
      await page.goto(path);
      findings.push(...(await scan(page, path)));
    }
    expect(findings, report(findings)).toEqual([]);
  });

  for (const who of ROLES) {
    test(`every main page for the ${who.role} has no serious or critical violation`, async ({ page }) => {
      test.setTimeout(300_000);
      await signIn(page, who.email);
      const findings: Finding[] = [];
      const visit = async (label: string, path: string) => {
        const response = await page.goto(path);
        expect(response?.status(), `${label} (${path}) opens for the ${who.role}`).toBeLessThan(400);
        findings.push(...(await scan(page, label)));
      };
      await visit('organisations', '/orgs');
      await visit('fleet overview', org);
      for (const asset of await assetPages(page)) await visit(asset.label, asset.path);
      await visit('register', `${org}/register`);
      await visit('design desk', `${org}/designs`);
      const design = await firstHref(page, /\/designs\/[0-9a-f-]{36}$/);
      expect(design, 'a design revision in the demo').toBeTruthy();
      await visit('design revision', design!);
      await visit('docking planner', `${org}/dockings`);
      const docking = await firstHref(page, /\/dockings\/[0-9a-f-]{36}$/);
      expect(docking, 'a docking in the demo').toBeTruthy();
      await visit('docking', docking!);
      await visit('surveys', `${org}/surveys`);
      const survey = await firstHref(page, /\/surveys\/[0-9a-f-]{36}$/);
      expect(survey, 'a survey in the demo').toBeTruthy();
      await visit('survey', survey!);
      await visit('catalogue', `${org}/catalogue`);
      await visit('account', `${org}/account`);
      if (who.manages) {
        await visit('team', `${org}/team`);
        await visit('billing', `${org}/billing`);
        await visit('audit log', `${org}/audit`);
      }
      expect(findings, report(findings)).toEqual([]);
    });
  }

  test('the main pages at 390 x 844 have no serious or critical violation', async ({ page }) => {
    test.setTimeout(180_000);
    await page.setViewportSize({ width: 390, height: 844 });
    await signIn(page, 'owner@gullhaven.example');
    const findings: Finding[] = [];
    const pages: [string, string][] = [
      ['fleet overview', org],
      ['docking planner', `${org}/dockings`],
      ['surveys', `${org}/surveys`],
    ];
    for (const [label, path] of pages) {
      await page.goto(path);
      findings.push(...(await scan(page, `${label} at 390 px`)));
    }
    await page.goto(`${org}/surveys`);
    const survey = await firstHref(page, /\/surveys\/[0-9a-f-]{36}$/);
    await page.goto(survey!);
    findings.push(...(await scan(page, 'survey at 390 px')));
    expect(findings, report(findings)).toEqual([]);
  });
});
