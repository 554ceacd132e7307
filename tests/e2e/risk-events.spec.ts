import type { Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { QUAY_WALL } from '../fixtures/registers/quay-wall-v2';

/** A project filled from the version 2 fixture through the app's own routes. */
async function quayWall(page: Page): Promise<number> {
  const code = `QW-${Date.now().toString(36).toUpperCase()}`;
  const created = await page.request.post('/api/projects', {
    data: {
      name: `Quay wall ${code}`,
      code,
      currency: 'EUR',
      estimateClass: 3,
      stage: 'Feasibility',
      baseDate: '2027-03-01',
    },
  });
  expect(created.status()).toBe(201);
  const id = (await created.json()).project.id as number;
  expect((await page.request.post(`/api/projects/${id}/import`, { data: QUAY_WALL })).status()).toBe(200);
  return id;
}

const risksGrid = (page: Page) => page.getByRole('region', { name: 'Risk events' });
const cell = (page: Page, row: number, field: string) =>
  risksGrid(page).locator(`.ag-grid-scrolling-rows .ag-row[row-index="${row}"] [col-id="${field}"]`);

/** Scrolls the grid sideways until a cell is drawn (the grid draws only the columns in view). */
async function reveal(page: Page, row: number, field: string) {
  const target = cell(page, row, field);
  for (let step = 0; step < 30 && (await target.count()) === 0; step++) {
    await risksGrid(page)
      .locator('.ag-body-horizontal-scroll-viewport')
      .evaluate((el) => {
        el.scrollLeft += 250;
        el.dispatchEvent(new Event('scroll'));
      });
    await page.waitForTimeout(50);
  }
  await target.scrollIntoViewIfNeeded();
  return target;
}

test('an estimator reads opportunities and the status rules, and picks a risk’s activities', async ({
  page,
}) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const id = await quayWall(page);
  const shot = process.env.SCREENSHOT_DIR;

  await page.goto(`/projects/${id}/risks`);
  await expect(cell(page, 0, 'code')).toHaveText('R1');
  await expect(page.getByTestId('risk-status-rules')).toContainText('counts as certain');
  await expect(page.getByTestId('risk-status-rules')).toContainText('closed risk and its correlations');
  // R2 saves money and time: an opportunity, in its own tone, never the invalid red.
  await expect(cell(page, 1, '_direction')).toHaveText('Opportunity');
  await expect(cell(page, 1, '_direction')).toHaveClass(/text-opportunity/);
  if (shot) await page.screenshot({ path: `${shot}/risks-1280.png`, fullPage: true });
  const saving = await reveal(page, 1, 'delayLow');
  await expect(saving).toHaveText('−10'); // a true minus sign
  await expect(saving).toHaveClass(/text-opportunity/);
  await expect(saving).not.toHaveClass(/cell-invalid/);
  await expect(await reveal(page, 0, 'activityCodes')).toHaveText('A2, A3');
  if (shot) await page.screenshot({ path: `${shot}/risks-scrolled.png` });

  // The multi-pick: tick A1 for R1, by the filter and Enter.
  await cell(page, 0, 'activityCodes').dblclick();
  const picker = page.getByTestId('code-pick-editor');
  await expect(picker).toBeVisible();
  if (shot) await page.screenshot({ path: `${shot}/risks-picker.png` });
  await picker.getByLabel('Filter activities').fill('A1');
  await picker.getByLabel('Filter activities').press('Enter');
  await expect(picker).toContainText('3 picked');
  await picker.getByRole('button', { name: 'Done' }).click();
  await expect(cell(page, 0, 'activityCodes')).toHaveText('A2, A3, A1');
  await expect(page.getByText('All changes saved')).toBeVisible();

  // Closing R3 leaves it and its correlation out, said above the grid.
  const r3 = (await (await page.request.get(`/api/projects/${id}/risks`)).json()).rows[2];
  expect(
    (
      await page.request.put(`/api/projects/${id}/risks/${r3.id}`, { data: { ...r3, status: 'closed' } })
    ).status(),
  ).toBe(200);
  await page.reload();
  await expect(await reveal(page, 0, 'activityCodes')).toHaveText('A2, A3, A1');
  await expect(page.getByTestId('risk-status-effect')).toContainText(
    'Left out of the model now: R3 and the correlation R1–R3',
  );

  if (shot) {
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.screenshot({ path: `${shot}/risks-1440.png`, fullPage: true });
  }
  // The line paid per project day, beside lump sums and per-activity-day lines.
  await page.goto(`/projects/${id}/items`);
  const lines = page.getByRole('region', { name: 'Line items' });
  await expect(lines.locator('.ag-grid-scrolling-rows .ag-row[row-index="3"] [col-id="basis"]')).toHaveText(
    'Per project day',
  );
  if (shot) await page.screenshot({ path: `${shot}/items.png`, fullPage: true });
  // The run form lists what the status rules leave out of the next run.
  await page.goto(`/projects/${id}/runs`);
  await expect(page.getByTestId('model-notices')).toContainText('Risk R3 (Tidal window lost) is closed');
  if (shot) await page.screenshot({ path: `${shot}/runs.png`, fullPage: true });
});
