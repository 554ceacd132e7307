import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { RunsPages, projectIdByCode } from './pages/runs';
import { FIXTURE_MODEL } from '../integration/runs-fixtures';

test('an estimator runs the demo project, watches it progress and reads the outcome', async ({ page }) => {
  test.setTimeout(120_000);
  const auth = new AuthPages(page);
  await auth.signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const projectId = await projectIdByCode(page.request, 'ASH-WTP');
  const items = await (await page.request.get(`/api/projects/${projectId}/items`)).json();
  if (items.rows.length === 0) {
    // Only while the demo seed has not filled the project's registers: fill them from a model file.
    const imported = await page.request.post(`/api/projects/${projectId}/import`, { data: FIXTURE_MODEL });
    expect(imported.status()).toBe(200);
  }

  const runs = new RunsPages(page);
  await runs.open(projectId);
  // Enough iterations that the run lasts a few seconds and its progress can be seen moving.
  const runId = await runs.start({
    iterations: 1_000_000,
    seed: 20261201,
    costTarget: '56000000',
    finishTarget: '2030-03-29',
  });

  const bar = runs.progressBar();
  await expect(bar).toBeVisible();
  const seen = new Set<number>();
  await expect
    .poll(
      async () => {
        const now = await bar.getAttribute('aria-valuenow').catch(() => null);
        if (now !== null) seen.add(Number(now));
        return [...seen].filter((v) => v > 0 && v < 100).length;
      },
      { timeout: 60_000, intervals: [100] },
    )
    .toBeGreaterThanOrEqual(2);
  await expect(page.getByTestId('run-iterations')).toContainText('iterations done');

  await expect(runs.outcome()).toBeVisible({ timeout: 90_000 });
  // The S-curves and the density map are drawn as SVG, the bar and line charts on a canvas.
  for (const [chart, element] of [
    ['chart-cost-histogram', 'svg[role="img"]'],
    ['chart-finish-curve', 'svg[role="img"]'],
    ['chart-scatter', 'svg[role="img"]'],
    ['chart-swing-cost', 'canvas'],
    ['chart-swing-duration', 'canvas'],
    ['chart-rank-cost', 'canvas'],
    ['chart-convergence-cost', 'canvas'],
    ['chart-criticality', 'canvas'],
  ]) {
    const drawn = page.getByTestId(chart).locator(element);
    await expect(drawn).toBeVisible();
    const box = await drawn.boundingBox();
    expect(box!.height).toBeGreaterThan(100);
  }
  await expect(page.getByText('Read these figures with care').first()).toBeVisible();

  // The P80 on screen is the stored one, formatted in the project's currency.
  const stored = await (await page.request.get(`/api/projects/${projectId}/runs/${runId}/result`)).json();
  const p80 = stored.result.cost.percentiles.P80 as number;
  const formatted = new Intl.NumberFormat('en-GB', {
    style: 'currency',
    currency: 'EUR',
    maximumFractionDigits: 0,
  }).format(p80);
  await expect(page.getByTestId('cost-p80')).toHaveText(formatted);
  await expect(page.getByTestId('cost-ptable-P80')).toHaveText(formatted);

  await page.screenshot({ path: 'test-results/runs-outcome.png', fullPage: true });
});
