import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { RunsPages, projectIdByCode } from './pages/runs';

const runForm = (page: import('@playwright/test').Page) => page.getByRole('form', { name: 'Run settings' });

test("the run form starts with the demo project's targets", async ({ page }) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const runs = new RunsPages(page);
  await runs.open(await projectIdByCode(page.request, 'ASH-WTP'));
  // The sponsor's targets the demo's assumptions state: €60 m, handover by 29 March 2030.
  await expect(runForm(page).getByLabel(/Cost target/)).toHaveValue('60000000');
  await expect(runForm(page).getByLabel('Finish target')).toHaveValue('2030-03-29');
});

test('targets set in the project settings prefill the run form', async ({ page }) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const code = `TGT-${Date.now().toString(36).toUpperCase()}`;
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

  await page.goto('/projects');
  await page.getByRole('button', { name: `Edit ${code}` }).click();
  const dialog = page.getByRole('dialog', { name: `Edit ${code}` });
  await dialog.getByLabel('Cost target (EUR)').fill('4,750,000');
  await dialog.getByLabel('Finish target').fill('2026-12-31');
  await dialog.getByRole('button', { name: 'Save project' }).click();
  // A finish before the base date is refused where it was typed.
  await expect(
    dialog.getByText('The finish target must be on or after the base date, 2027-01-04.'),
  ).toBeVisible();
  await dialog.getByLabel('Finish target').fill('2028-06-30');
  await dialog.getByRole('button', { name: 'Save project' }).click();
  await expect(dialog).toBeHidden();

  await new RunsPages(page).open(projectId);
  await expect(runForm(page).getByLabel(/Cost target/)).toHaveValue('4750000');
  await expect(runForm(page).getByLabel('Finish target')).toHaveValue('2028-06-30');
  await expect(runForm(page).getByText("The project's target; change it for this run").first()).toBeVisible();
});
