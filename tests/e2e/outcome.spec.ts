import { createHash } from 'node:crypto';
import type { Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { projectIdByCode } from './pages/runs';
import { finishedRun, moneyValue, OutcomePage } from './pages/outcome';
import { closeDb, execute } from '../integration/helpers/db';
import {
  firstIterationBlocks,
  simulateSync,
  type Model,
  type SimulationResult,
  type TotalSummary,
} from '@/lib/sim';
import { canonicalJson } from '@/lib/runs/canonical-json';

const SETTINGS = { iterations: 5000, seed: 20261202, costTarget: 56_000_000, finishTarget: '2030-03-29' };

test.afterAll(async () => {
  await closeDb();
});

async function demoProject(page: Page) {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  return projectIdByCode(page.request, 'ASH-WTP');
}

/** Full-page screenshots at the two widths the product must read well at. */
async function shoot(page: Page, name: string) {
  for (const width of [1280, 1440]) {
    await page.setViewportSize({ width, height: 900 });
    await page.waitForTimeout(200);
    await page.screenshot({ path: `test-results/${name}-${width}.png`, fullPage: true });
  }
}

test('the contingency allocated to lines and risks adds up to the contingency on screen', async ({
  page,
}) => {
  test.setTimeout(150_000);
  const errors: string[] = [];
  page.on('console', (m) => (m.type() === 'error' ? errors.push(m.text()) : undefined));
  const projectId = await demoProject(page);
  const runId = await finishedRun(page.request, projectId, SETTINGS);
  const outcome = new OutcomePage(page);
  await outcome.open(projectId, runId);

  const { amounts, sum } = await outcome.expectAllocationAddsUp();
  expect(amounts.length).toBeGreaterThan(3);

  // Summed by top-level WBS, the rows add up to the same sum.
  await page.getByRole('button', { name: 'Top-level WBS' }).click();
  const branches = await outcome.allocationAmounts();
  expect(branches.length).toBeLessThan(amounts.length);
  expect(Math.abs(branches.reduce((s, a) => s + a, 0) - sum)).toBeLessThanOrEqual(
    0.5 * (branches.length + 1),
  );
  await page.getByRole('button', { name: 'Lines and risks' }).click();

  // The download holds every row, and they add up to the same sum.
  const csv = await page.request.get(`/api/projects/${projectId}/runs/${runId}/allocation?format=csv`);
  expect(csv.status()).toBe(200);
  const lines = (await csv.text()).trim().split('\r\n').slice(1);
  const body = lines.slice(0, -3).map((l) => Number(l.split(',').at(-2)));
  expect(Math.abs(body.reduce((s, v) => s + v, 0) - sum)).toBeLessThanOrEqual(1);

  const xlsx = await page.request.get(`/api/projects/${projectId}/runs/${runId}/allocation?format=xlsx`);
  expect(xlsx.status()).toBe(200);
  expect(xlsx.headers()['content-disposition']).toMatch(/allocation-P80\.xlsx/);
  // An XLSX file is a zip archive: it starts with "PK" (ECMA-376 Part 2, Open Packaging).
  expect((await xlsx.body()).subarray(0, 2).toString()).toBe('PK');

  // The charts of the outcome are drawn: the S-curve with its strip, the density map, the swings.
  for (const id of ['chart-cost-histogram', 'chart-finish-curve', 'chart-scatter']) {
    const svg = page.getByTestId(id).locator('svg[role="img"]');
    await expect(svg).toBeVisible();
    expect((await svg.boundingBox())!.height).toBeGreaterThan(200);
  }
  await expect(page.getByTestId('density-quadrants')).toContainText('within both');
  for (const id of ['chart-swing-cost', 'chart-rank-cost', 'chart-criticality'])
    await expect(page.getByTestId(id).locator('canvas')).toBeVisible();
  await expect(page.getByTestId('joint-levels')).toContainText('P80');
  await shoot(page, 'outcome-allocation');
  expect(errors).toEqual([]);
});

test('a model with responses shows the figures before and after them', async ({ page }) => {
  test.setTimeout(150_000);
  const projectId = await demoProject(page);
  const runId = await finishedRun(page.request, projectId, { ...SETTINGS, riskValues: 'post' });

  // The registers do not yet write post-mitigation blocks into the model, so the run's snapshot
  // is given responses here and its result computed by the engine, as a run would store it.
  const snapshot = (await (
    await page.request.get(`/api/projects/${projectId}/runs/${runId}/snapshot`)
  ).json()) as Model;
  const risks = snapshot.risks ?? [];
  expect(risks.length).toBeGreaterThan(2);
  const model: Model = {
    ...snapshot,
    version: 2,
    risks: risks.map((r, i) =>
      i < 3 && r.cost ? { ...r, post: { probability: r.probability / 3 }, mitigationCost: 40_000 } : r,
    ),
    settings: { ...snapshot.settings, mitigation: 'post' },
  };
  const options = { iterations: SETTINGS.iterations, seed: SETTINGS.seed, sampling: 'lhs' as const };
  const result = simulateSync(model, options);
  expect(result.mitigation).toBeDefined();
  const cost: number[] = [];
  const duration: number[] = [];
  for (const block of firstIterationBlocks(model, options, 5000)) {
    cost.push(...block.cost);
    duration.push(...(block.duration ?? []));
  }
  await execute(
    'UPDATE SimulationRuns SET inputSnapshot = ?, inputHash = ?, result = ?, resultSample = ? WHERE id = ?',
    [
      JSON.stringify(model),
      createHash('sha256').update(canonicalJson(model)).digest('hex'),
      JSON.stringify(result),
      JSON.stringify({ n: cost.length, of: result.iterations, cost, duration }),
      runId,
    ],
  );

  const outcome = new OutcomePage(page);
  await outcome.open(projectId, runId);
  await expect(page.getByTestId('scenario')).toContainText('after the responses');
  const table = outcome.mitigation();
  await expect(table).toBeVisible();
  const row = table.getByTestId('mitigation-cost-P80');
  const [pre, post] = (await row.locator('td').allInnerTexts()).slice(1, 3).map(moneyValue);
  // The stored scenarios, as the engine computed them from the same iterations.
  expect(pre).toBe(Math.round(result.mitigation!.pre.cost.percentiles.P80));
  expect(post).toBe(Math.round(result.mitigation!.post.cost.percentiles.P80));
  // Both curves are drawn over each other, and the key lists both scenarios.
  await expect(page.getByTestId('chart-cost-histogram').locator('path title')).toHaveText([
    'Before the responses',
    'After the responses',
  ]);
  await expect(page.getByTestId('cost-level-key')).toContainText('Before');
  await shoot(page, 'outcome-mitigation');
});

test('a stored version 1 result still shows what it holds', async ({ page }) => {
  test.setTimeout(150_000);
  const errors: string[] = [];
  page.on('console', (m) => (m.type() === 'error' ? errors.push(m.text()) : undefined));
  const projectId = await demoProject(page);
  const runId = await finishedRun(page.request, projectId, SETTINGS);
  // A version 1 result (docs/result-format.md) is a version 2 one without the version 2 fields.
  const stored = (await (await page.request.get(`/api/projects/${projectId}/runs/${runId}/result`)).json())
    .result as SimulationResult;
  const keep = ['P10', 'P50', 'P80', 'P90'] as const;
  const v1Total = (t: TotalSummary): TotalSummary => {
    const { contingencyCI95: _dropped, ...rest } = t;
    return {
      ...rest,
      percentileCI95: Object.fromEntries(
        keep.map((k) => [k, t.percentileCI95[k]]),
      ) as TotalSummary['percentileCI95'],
    };
  };
  const v1: SimulationResult = {
    ...stored,
    version: 1,
    cost: v1Total(stored.cost),
    duration: stored.duration ? v1Total(stored.duration) : undefined,
    joint: stored.joint ? { probability: stored.joint.probability, ci95: stored.joint.ci95 } : undefined,
    mitigation: undefined,
    allocation: undefined,
    sensitivity: {
      cost: stored.sensitivity.cost.map(({ id, rankCorrelation, varianceShare }) => ({
        id,
        rankCorrelation,
        varianceShare,
      })),
      duration: stored.sensitivity.duration.map(({ id, rankCorrelation, varianceShare }) => ({
        id,
        rankCorrelation,
        varianceShare,
      })),
    },
  };
  await execute('UPDATE SimulationRuns SET result = ? WHERE id = ?', [JSON.stringify(v1), runId]);

  const outcome = new OutcomePage(page);
  await outcome.open(projectId, runId);
  await expect(page.getByTestId('cost-p80')).toBeVisible();
  await expect(page.getByTestId('cost-ptable-P80-ci')).toContainText('–');
  await expect(page.getByTestId('cost-ptable-P20-ci')).toHaveText('no interval kept');
  await expect(page.getByTestId('chart-rank-cost').locator('canvas')).toBeVisible();
  await expect(page.getByTestId('chart-swing-cost')).toContainText('run it again');
  await expect(page.getByTestId('allocation')).toContainText('run it again');
  await expect(page.getByTestId('joint-levels')).toContainText('run it again');
  await expect(page.getByTestId('density-quadrants')).toContainText('within both');
  await expect(outcome.mitigation()).toHaveCount(0);
  // Nothing to download: the reply says why rather than sending an empty file.
  const download = await page.request.get(`/api/projects/${projectId}/runs/${runId}/allocation?format=csv`);
  expect(download.status()).toBe(409);
  expect((await download.json()).error.message).toContain('run it again');
  await shoot(page, 'outcome-v1');
  expect(errors).toEqual([]);
});
