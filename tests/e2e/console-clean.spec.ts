/**
 * Every page, for every role, opens without an error in the browser console, an uncaught error
 * or a React hydration warning (the suite's console guard, tests/e2e/fixtures.ts, fails the test
 * on any of them). Pages a role may not open are visited too: their forbidden page must be
 * clean as well.
 */
import { expect, test } from './fixtures';
import type { Page } from '@playwright/test';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { projectIdByCode } from './pages/runs';

/** Two succeeded runs of the demo project, so that the outcome, brief and compare pages have content. */
async function twoRuns(page: Page, projectId: number): Promise<[number, number]> {
  const ids: number[] = [];
  for (const seed of [3, 4]) {
    const res = await page.request.post(`/api/projects/${projectId}/runs`, {
      data: { iterations: 2000, seed, costTarget: 60_000_000 },
    });
    expect(res.status()).toBe(201);
    const body = await res.json();
    ids.push(body.run?.id ?? body.id);
  }
  for (const id of ids) {
    await expect
      .poll(
        async () =>
          (await (await page.request.get(`/api/projects/${projectId}/runs/${id}`)).json()).run.status,
        { timeout: 60_000 },
      )
      .toBe('succeeded');
  }
  return [ids[0], ids[1]];
}

/** The workspace's pages, with their paths for the demo project and its runs. */
function workspacePages(projectId: number, older: number, newer: number): string[] {
  const p = `/projects/${projectId}`;
  return [
    '/projects',
    `${p}/items`,
    `${p}/risks`,
    `${p}/drivers`,
    `${p}/schedule`,
    `${p}/correlations`,
    `${p}/runs`,
    `${p}/runs/${newer}`,
    `${p}/runs/${newer}/brief`,
    `${p}/runs/compare?a=${older}&b=${newer}`,
    `${p}/trend`,
    `${p}/decisions`,
    `${p}/audit`,
    '/settings/members',
    '/settings/organization',
    '/settings/calendar',
    '/settings/billing',
    '/settings/notifications',
  ];
}

let runs: { projectId: number; older: number; newer: number } | undefined;

test.describe.configure({ mode: 'serial' });

test.beforeAll(async ({ browser }) => {
  const page = await browser.newPage();
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const projectId = await projectIdByCode(page.request, 'ASH-WTP');
  const [older, newer] = await twoRuns(page, projectId);
  runs = { projectId, older, newer };
  await page.close();
});

for (const role of ['owner', 'estimator', 'sponsor', 'billing'] as const) {
  test(`every page opens without a console error or hydration warning for the ${role}`, async ({ page }) => {
    test.setTimeout(120_000);
    // The guard of ./fixtures fails the test on any console error or hydration warning.
    await new AuthPages(page).signIn(demoEmail(role), DEMO_PASSWORD);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    const { projectId, older, newer } = runs!;
    for (const path of workspacePages(projectId, older, newer)) {
      await page.goto(path);
      // Hydrated and settled: the page's own requests (grids, lists) have answered.
      await page.waitForLoadState('networkidle');
      await expect(page.locator('main')).toBeVisible();
    }
  });
}

test('the console guard fails a test whose page logs an error', async ({ page }) => {
  // Expected to fail: the guard of ./fixtures must turn the planted error into a failure.
  test.fail();
  await page.goto('/sign-in');
  await page.evaluate(() => console.error('a planted console error'));
});
