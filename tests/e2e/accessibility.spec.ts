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
  const rows = page.getByRole('table', { name: 'Fleet' }).locator('tbody tr');
  for (const kind of ['vessel', 'structure']) {
    // The kind cell starts with the kind ("vessel · Ro-pax ferry"); a row's whole text runs the cells together.
    const row = rows.filter({ has: page.getByRole('cell', { name: new RegExp(`^${kind}\\b`, 'i') }) }).first();
    await expect(row, `a ${kind} on the fleet overview`).toBeVisible();
    const href = await row.locator(`a[href*="${org}/assets/"]`).first().getAttribute('href');
    found.push({ label: `asset (${kind})`, path: href! });
  }
  return found;
}

// The owner can open every page and sees every control, so every page is scanned as the owner; the other roles see
// the same pages with fewer controls (read-only fields, no forms), so the pages that change with the role are
// scanned for each of them as well.
const ROLES: { email: string; role: string; pages: 'all' | 'role-dependent' }[] = [
  { email: 'owner@gullhaven.example', role: 'owner', pages: 'all' },
  { email: 'engineer@gullhaven.example', role: 'engineer', pages: 'role-dependent' },
  { email: 'checker@gullhaven.example', role: 'checker', pages: 'role-dependent' },
  { email: 'planner@gullhaven.example', role: 'planner', pages: 'role-dependent' },
  { email: 'inspector@gullhaven.example', role: 'inspector', pages: 'role-dependent' },
  { email: 'viewer@gullhaven.example', role: 'viewer', pages: 'role-dependent' },
];

type PageKey = 'orgs' | 'fleet' | 'vessel' | 'structure' | 'register' | 'designs' | 'design' | 'dockings' | 'docking' | 'surveys' | 'survey' | 'catalogue' | 'account' | 'team' | 'billing' | 'audit';
const ALL_PAGES: PageKey[] = ['orgs', 'fleet', 'vessel', 'structure', 'register', 'designs', 'design', 'dockings', 'docking', 'surveys', 'survey', 'catalogue', 'account', 'team', 'billing', 'audit'];
const ROLE_DEPENDENT_PAGES: PageKey[] = ['fleet', 'vessel', 'design', 'docking', 'survey'];

/** The address of each main page; the records (an asset of each kind, a revision, a docking, a survey) are the demo's first. */
async function mainPages(page: Page): Promise<Record<PageKey, string>> {
  const [vessel, structure] = await assetPages(page);
  const first = async (list: string, pattern: RegExp, what: string) => {
    await page.goto(list);
    await page.waitForLoadState('networkidle');
    const href = await firstHref(page, pattern);
    expect(href, `${what} in the demo`).toBeTruthy();
    return href!;
  };
  return {
    orgs: '/orgs',
    fleet: org,
    vessel: vessel.path,
    structure: structure.path,
    register: `${org}/register`,
    designs: `${org}/designs`,
    design: await first(`${org}/designs`, /\/designs\/[0-9a-f-]{36}$/, 'a design revision'),
    dockings: `${org}/dockings`,
    docking: await first(`${org}/dockings`, /\/dockings\/[0-9a-f-]{36}$/, 'a docking'),
    surveys: `${org}/surveys`,
    survey: await first(`${org}/surveys`, /\/surveys\/[0-9a-f-]{36}$/, 'a survey'),
    catalogue: `${org}/catalogue`,
    account: `${org}/account`,
    team: `${org}/team`,
    billing: `${org}/billing`,
    audit: `${org}/audit`,
  };
}

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
    test.describe(`signed in as the ${who.role}`, () => {
      // One signed-in page per role, reused by its tests (a failed test starts a new worker, which signs in again).
      let page: Page;
      let paths: Record<PageKey, string>;
      test.beforeAll(async ({ browser }) => {
        test.setTimeout(120_000);
        page = await (await browser.newContext()).newPage(); // axe needs a page of a context of our own
        await signIn(page, who.email);
        paths = await mainPages(page);
      });
      test.afterAll(async () => {
        await page?.context().close();
      });
      for (const key of who.pages === 'all' ? ALL_PAGES : ROLE_DEPENDENT_PAGES) {
        test(`the ${key} page has no serious or critical violation`, async () => {
          test.setTimeout(240_000);
          const response = await page.goto(paths[key]);
          expect(response?.status(), `${key} (${paths[key]}) opens for the ${who.role}`).toBeLessThan(400);
          const findings = await scan(page, `${who.role}: ${key}`);
          expect(findings, report(findings)).toEqual([]);
        });
      }
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
    await page.locator(`main a[href*="${org}/surveys/"]`).first().click();
    await page.waitForURL(/\/surveys\/[0-9a-f-]{36}$/);
    findings.push(...(await scan(page, 'survey at 390 px')));
    expect(findings, report(findings)).toEqual([]);
  });
});

test.describe('focus after a removal', () => {
  test('removing a zone on the desk moves focus to the zone that took its place, not to the page body', async ({ page }) => {
    await signIn(page, 'engineer@gullhaven.example');
    await page.goto(`${org}/designs`);
    // A row's text runs its cells together, so the draft is found by its status cell.
    const draft = page.getByRole('table').getByRole('row').filter({ has: page.getByRole('cell', { name: 'Draft', exact: true }) }).first();
    await draft.getByRole('link').first().click();
    const zones = page.getByRole('listitem', { name: /^Zone \d+$/ });
    await expect(zones.first()).toBeVisible();
    const before = await zones.count();
    expect(before, 'the demo draft has at least two zones').toBeGreaterThan(1);
    const second = await zones.nth(1).getByLabel('Zone name').inputValue();
    await zones.first().getByRole('button', { name: /^Remove zone / }).click();
    await expect(zones).toHaveCount(before - 1);
    // The zone that was second is now first, and its name field has the focus.
    await expect(zones.first().getByLabel('Zone name')).toBeFocused();
    await expect(zones.first().getByLabel('Zone name')).toHaveValue(second);
  });

  test('"Delete" moves focus to "Keep it", and "Keep it" back to the delete button named for its reading', async ({ page }) => {
    await signIn(page, 'inspector@gullhaven.example');
    await page.goto(`${org}/surveys`);
    // A survey with readings (the others say "No readings yet").
    const withReadings = page.locator('main tbody tr').filter({ hasNotText: 'No readings yet' }).first();
    await withReadings.locator(`a[href*="${org}/surveys/"]`).first().click();
    const remove = page.getByRole('table', { name: 'Readings' }).getByRole('button', { name: /^Delete the reading at / }).first();
    await expect(remove).toBeVisible();
    const name = (await remove.textContent())!.trim();
    await remove.click();
    await expect(page.getByRole('button', { name: 'Keep it' })).toBeFocused();
    await page.getByRole('button', { name: 'Keep it' }).click();
    await expect(page.getByRole('button', { name, exact: true })).toBeFocused();
  });
});
