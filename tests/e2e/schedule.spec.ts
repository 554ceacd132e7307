import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { RegisterPages } from './pages/registers';
import { deckModel } from '../fixtures/deck-links-model';

// The deck pour (typed links, a lead, a branch, A5 with open ends): the health check names the
// lead and the open ends; a link typed in the grid is checked as it is entered.
const model = deckModel;

test('a planner types links in the notation and reads the health check on the schedule and run form', async ({
  page,
}) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const created = await page.request.post('/api/projects', {
    data: {
      name: 'E2E deck links',
      code: `E2E-${Date.now().toString(36).toUpperCase()}`,
      currency: 'EUR',
      estimateClass: 4,
      stage: 'Concept',
      baseDate: '2027-01-04',
    },
  });
  const projectId = (await created.json()).project.id as number;
  expect((await page.request.post(`/api/projects/${projectId}/import`, { data: model })).status()).toBe(200);

  const grid = new RegisterPages(page);
  await grid.open(projectId, 'schedule');
  const cell = (row: number, field: string) => grid.cell(row, field, 'Schedule');
  await expect(cell(1, 'predecessors')).toHaveText('A1 SS+2, A1 FF+7');
  await expect(cell(3, 'predecessors')).toHaveText('A3, A2-1, A1 SF+20');
  await expect(cell(2, 'existence')).toHaveText('25 %'); // the one percentage style

  const health = page.getByRole('region', { name: 'Health check of the network' });
  await expect(health).toContainText('A2 → A4 (FS−1)');
  await expect(health).toContainText('A5 has no predecessor');
  await page.screenshot({ path: 'test-results/schedule-1280.png', fullPage: true });

  // A link type that is not one of the four: the cell says how to write it.
  await cell(4, 'predecessors').dblclick();
  const editor = grid.grid('Schedule').locator('.ag-cell-inline-editing input');
  await editor.fill('A1 XS+2');
  await editor.press('Enter');
  await cell(4, 'predecessors').click();
  await expect(page.getByTestId('cell-status')).toContainText('e.g. A2, A3 SS+2, A4 FF-1');

  // A valid one: saved, and the open start is gone from the health check.
  await cell(4, 'predecessors').dblclick();
  await editor.fill('A1 SS+3');
  await editor.press('Enter');
  await grid.waitSaved();
  await expect(health).not.toContainText('A5 has no predecessor');

  await page.setViewportSize({ width: 1440, height: 900 });
  await page.screenshot({ path: 'test-results/schedule-1440.png', fullPage: true });

  await page.goto(`/projects/${projectId}/runs`);
  const runHealth = page.getByRole('region', { name: "The schedule's health check before this run" });
  await expect(runHealth).toContainText('The run can go ahead');
  await expect(runHealth).toContainText('A2 → A4 (FS−1)');
  await page.screenshot({ path: 'test-results/runs-form-1440.png', fullPage: true });

  // The diagram: the base critical path before a run, the run's most critical path after it.
  await page.goto(`/projects/${projectId}/schedule`);
  const diagram = page.getByRole('region', { name: 'Network diagram' });
  await expect(diagram).toContainText('the critical path of the base schedule');
  const started = await page.request.post(`/api/projects/${projectId}/runs`, {
    data: { iterations: 2000, seed: 3, sampling: 'lhs' },
  });
  expect(started.status()).toBe(201);
  const runId = (await started.json()).run.id as number;
  await expect
    .poll(
      async () =>
        (await (await page.request.get(`/api/projects/${projectId}/runs/${runId}`)).json()).run.status,
    )
    .toBe('succeeded');
  await page.reload();
  await expect(diagram).toContainText(`most often critical in run ${runId}`);
  await diagram.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/schedule-diagram-1440.png', fullPage: true });
  await page.setViewportSize({ width: 1280, height: 860 });
  await page.screenshot({ path: 'test-results/schedule-diagram-1280.png', fullPage: true });
});
