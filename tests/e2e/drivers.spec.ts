import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { DriversPage } from './pages/drivers';
import { OutcomePage } from './pages/outcome';
import { RunsPages } from './pages/runs';

/** A small building project whose WBS branch 3 holds the substructure lines. */
const MODEL = {
  format: 'outturn-model',
  version: 1,
  items: [
    {
      id: '1.1',
      name: 'Preliminaries',
      dist: { type: 'triangular', low: 180_000, mode: 200_000, high: 260_000 },
    },
    { id: '3.1', name: 'Piling', dist: { type: 'pert', low: 800_000, mode: 900_000, high: 1_300_000 } },
    { id: '3.2', name: 'Ground beams', dist: { type: 'pert', low: 300_000, mode: 350_000, high: 480_000 } },
    {
      id: '4.1',
      name: 'Frame',
      dist: { type: 'triangular', low: 1_500_000, mode: 1_700_000, high: 2_400_000 },
    },
  ],
  activities: [
    {
      id: 'A1',
      name: 'Substructure',
      duration: { type: 'triangular', low: 30, mode: 40, high: 60 },
      predecessors: [],
    },
    {
      id: 'A2',
      name: 'Frame',
      duration: { type: 'triangular', low: 40, mode: 50, high: 70 },
      predecessors: ['A1'],
    },
  ],
};

test('an estimator adds a driver over a WBS branch and starts a run that completes', async ({ page }) => {
  test.setTimeout(120_000);
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const code = `DRV-${Date.now().toString(36).toUpperCase()}`;
  const created = await page.request.post('/api/projects', {
    data: {
      name: `E2E ${code}`,
      code,
      currency: 'EUR',
      estimateClass: 3,
      stage: 'Concept',
      baseDate: '2027-01-04',
    },
  });
  expect(created.status()).toBe(201);
  const projectId = (await created.json()).project.id as number;
  expect((await page.request.post(`/api/projects/${projectId}/import`, { data: MODEL })).status()).toBe(200);

  const drivers = new DriversPage(page);
  await drivers.open(projectId);
  await expect(drivers.panel()).toContainText('Select a driver');
  await page.getByRole('button', { name: 'Add driver' }).click();
  await expect(drivers.cell(0, 'code')).toHaveText('D1');
  await drivers.typeInto(0, 'name', 'Ground conditions');
  // Typed as percentage changes (the default): −5 is a factor of 0.95, 25 one of 1.25.
  await drivers.typeInto(0, 'low', '-5');
  await drivers.typeInto(0, 'mode', '0');
  await drivers.typeInto(0, 'high', '25');
  await drivers.reveal(0, '_factor');
  await expect(drivers.cell(0, '_change')).toHaveText('\u22125% \u2026 +25%');
  await expect(drivers.cell(0, '_factor')).toHaveText('0.95 \u2026 1.25');
  // Nothing to apply to yet: the row waits as a draft and says why.
  await expect(page.getByTestId('register-notice')).toContainText('Not saved');
  await drivers.reveal(0, 'applies');
  await expect(drivers.cell(0, 'applies')).toHaveClass(/cell-invalid/);

  await drivers.cell(0, 'name').click();
  await drivers.pick('3', 'All of 3\\.x');
  await drivers.pick('A1', 'A1');
  await drivers.waitSaved();
  await drivers.reveal(0, 'applies');
  await expect(drivers.cell(0, 'applies')).toHaveText('3.*, A1');
  await expect(drivers.cell(0, '_covers')).toHaveText('2 lines, 1 activity');
  const covers = page.getByTestId('driver-covers');
  await expect(covers).toContainText('3.1');
  await expect(covers).toContainText('3.2');
  await expect(covers).not.toContainText('4.1');

  await page.reload();
  await drivers.reveal(0, 'applies');
  await expect(drivers.cell(0, 'applies')).toHaveText('3.*, A1');
  await drivers.reveal(0, 'high');
  await expect(drivers.cell(0, 'high')).toHaveText('+25%');

  const runs = new RunsPages(page);
  await runs.open(projectId);
  const runId = await runs.start({ iterations: 5_000, seed: 11 });
  await expect(runs.outcome()).toBeVisible({ timeout: 90_000 });
  const snapshot = await (await page.request.get(`/api/projects/${projectId}/runs/${runId}/snapshot`)).json();
  expect(snapshot.drivers).toEqual([
    {
      id: 'D1',
      name: 'Ground conditions',
      factor: { type: 'triangular', low: 0.95, mode: 1, high: 1.25 },
      applies: ['3.1', '3.2', 'A1'],
    },
  ]);

  // The outcome's allocation table adds up to the contingency on screen, lines 3.1 and 3.2 included.
  const outcome = new OutcomePage(page);
  await outcome.open(projectId, runId);
  const { amounts } = await outcome.expectAllocationAddsUp();
  expect(amounts.length).toBeGreaterThan(1);
  await expect(outcome.allocation()).toContainText('3.1');
  await expect(outcome.allocation()).toContainText('3.2');
});
