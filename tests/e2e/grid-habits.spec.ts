// The grids as a spreadsheet user works them: one edit is one save, rows not saved survive a
// reload, formatted figures paste, blocks copy, drop-down cells take typed text, and every
// figure of the line items is in view at 1280 px.
import type { Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { newProject, RegisterPages } from './pages/registers';

const projectFor = (page: Page, prefix: string) =>
  newProject(page, `${prefix}-${Date.now().toString(36).toUpperCase()}`, 'GBP');

async function withLines(page: Page, id: number, lines: Record<string, unknown>[]) {
  const upserts = lines.map((l, i) => ({ key: `k${i}`, distType: 'triangular', ...l }));
  expect((await page.request.post(`/api/projects/${id}/items`, { data: { upserts } })).status()).toBe(200);
}

const line = (n: number, extra: Record<string, unknown> = {}) => ({
  code: `1.${n}`,
  description: `Line ${n}`,
  low: 100,
  mode: 200,
  high: 400,
  ...extra,
});

test.beforeEach(async ({ page }) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
});

test('one Delete in a cell sends exactly one save and raises no conflict', async ({ page }) => {
  const id = await projectFor(page, 'DEL');
  await withLines(page, id, [line(1, { base: 150 }), line(2, { base: 250 })]);
  const grid = new RegisterPages(page);
  await grid.open(id, 'items');

  const saves: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'POST' && r.url().endsWith(`/api/projects/${id}/items`))
      saves.push(r.postData() ?? '');
  });
  const replies: number[] = [];
  page.on('response', (r) => {
    if (r.request().method() === 'POST' && r.url().endsWith(`/api/projects/${id}/items`))
      replies.push(r.status());
  });

  await grid.cell(0, 'base').click();
  await page.keyboard.press('Delete');
  await expect(grid.cell(0, 'base')).toHaveText('(200)');
  await grid.waitSaved();
  // Two quick edits of the same row: each is one save, neither conflicts with the other.
  await grid.cell(1, 'base').click();
  await page.keyboard.press('Delete');
  await grid.typeInto(1, 'description', 'Second line, renamed');
  await grid.waitSaved();
  await page.waitForTimeout(500);

  expect(saves).toHaveLength(3);
  expect(JSON.parse(saves[0]).upserts).toHaveLength(1);
  expect(JSON.parse(saves[0]).upserts[0].base).toBeNull();
  expect(replies).toEqual([200, 200, 200]);
  await expect(page.getByText('Someone else changed these rows')).toHaveCount(0);
  const saved = (await (await page.request.get(`/api/projects/${id}/items`)).json()).rows;
  expect(saved.map((r: { base: number | null }) => r.base)).toEqual([null, null]);
  expect(saved[1].description).toBe('Second line, renamed');
});

test('rows not saved survive a reload, are counted and warned about', async ({ page }) => {
  const id = await projectFor(page, 'DRF');
  await withLines(page, id, [line(1)]);
  const grid = new RegisterPages(page);
  await grid.open(id, 'items');

  // A new line without a description and a refused value on a saved line.
  await page.getByRole('button', { name: 'Add line' }).click();
  await grid.typeInto(0, 'mode', '99999');
  await expect(grid.cell(0, 'mode')).toHaveClass(/cell-invalid/);
  await expect(page.getByTestId('save-state')).toContainText('2 lines not saved');

  const dialogs: string[] = [];
  page.on('dialog', async (d) => {
    dialogs.push(d.type());
    await d.accept();
  });
  await page.reload();
  expect(dialogs).toContain('beforeunload');
  await expect(grid.cell(0, 'mode')).toHaveText('99,999');
  await expect(grid.cell(0, 'mode')).toHaveClass(/cell-invalid/);
  await expect(grid.cell(1, 'code')).toHaveText('1.2');
  await expect(page.getByTestId('save-state')).toContainText('2 lines not saved');
  await expect(page.getByTestId('register-notice')).toContainText('2 rows not saved on your last visit');

  // Leaving for another tab asks first; staying keeps the page.
  dialogs.length = 0;
  page.removeAllListeners('dialog');
  page.once('dialog', async (d) => {
    dialogs.push(d.message());
    await d.dismiss();
  });
  await page.getByRole('link', { name: 'Risk events' }).click();
  expect(dialogs[0]).toContain('2 lines not saved');
  await expect(page).toHaveURL(new RegExp(`/projects/${id}/items$`));

  // Finishing both rows saves them and the count goes.
  await grid.typeInto(0, 'mode', '250');
  await grid.typeInto(1, 'description', 'Fencing');
  await grid.pasteAt(1, 'low', [[10, 20, 30]]);
  await expect(page.getByTestId('save-state')).toContainText('All changes saved');
  const saved = (await (await page.request.get(`/api/projects/${id}/items`)).json()).rows;
  expect(saved.map((r: { code: string; mode: number }) => [r.code, r.mode])).toEqual([
    ['1.1', 250],
    ['1.2', 20],
  ]);
  // Nothing is left over for the next visit.
  await page.reload();
  await expect(grid.cell(1, 'description')).toHaveText('Fencing');
  await expect(page.getByTestId('save-state')).toContainText('All changes saved');
});

test('pasted figures keep their spreadsheet formats: £, €, m, spaces, % and apostrophes', async ({
  page,
}) => {
  const id = await projectFor(page, 'PST');
  await withLines(page, id, [line(1), line(2)]);
  const grid = new RegisterPages(page);
  await grid.open(id, 'items');
  await grid.pasteAt(0, 'low', [
    ['£95,000', '€1.2m', '1 500 000'],
    ["'40000", '45k', 'GBP 60,000'],
  ]);
  await expect(grid.cell(0, 'mode')).toHaveText('1,200,000');
  await expect(grid.cell(1, 'high')).toHaveText('60,000');
  await grid.waitSaved();
  const saved = (await (await page.request.get(`/api/projects/${id}/items`)).json()).rows;
  expect(saved.map((r: { low: number; mode: number; high: number }) => [r.low, r.mode, r.high])).toEqual([
    [95_000, 1_200_000, 1_500_000],
    [40_000, 45_000, 60_000],
  ]);

  const risk = await page.request.post(`/api/projects/${id}/risks`, {
    data: {
      upserts: [
        {
          key: 'r',
          code: 'R1',
          title: 'Ground',
          status: 'open',
          response: 'reduce',
          probability: 0.1,
          costType: 'triangular',
          costLow: 100,
          costMode: 200,
          costHigh: 400,
        },
      ],
    },
  });
  expect(risk.status()).toBe(200);
  await page.goto(`/projects/${id}/risks`);
  const risks = new RegisterPages(page);
  await risks.cell(0, 'probability', 'Risk events').click();
  await page.evaluate(() => {
    const data = new DataTransfer();
    data.setData('text/plain', '30%');
    document.activeElement!.dispatchEvent(
      new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
    );
  });
  await expect(risks.cell(0, 'probability', 'Risk events')).toHaveText('30 %'); // shown in the one percentage style
  await risks.waitSaved();
  const riskRows = (await (await page.request.get(`/api/projects/${id}/risks`)).json()).rows;
  expect(riskRows[0].probability).toBeCloseTo(0.3, 10);
});

test('Ctrl+C copies a marked block as tab-separated text, and typing picks a drop-down option', async ({
  page,
}) => {
  const id = await projectFor(page, 'CPY');
  await withLines(page, id, [line(1), line(2, { low: 150.5 }), line(3)]);
  const grid = new RegisterPages(page);
  await grid.open(id, 'items');
  await page.context().grantPermissions(['clipboard-read', 'clipboard-write']);
  const clipboard = () => page.evaluate(() => navigator.clipboard.readText());

  await grid.cell(0, 'code').click();
  await grid.cell(1, 'description').click({ modifiers: ['Shift'] });
  await expect(grid.cell(1, 'description')).toHaveClass(/cell-in-block/);
  await page.keyboard.press('Control+c');
  expect(await clipboard()).toBe('1.1\tLine 1\n1.2\tLine 2');
  // Shift+arrows extend a block too; figures go out in full.
  await grid.cell(1, 'low').click();
  await page.keyboard.press('Shift+ArrowRight');
  await page.keyboard.press('Shift+ArrowDown');
  await expect(grid.cell(2, 'mode')).toHaveClass(/cell-in-block/);
  await page.keyboard.press('Control+c');
  expect(await clipboard()).toBe('150.5\t200\n100\t200');

  // A letter typed on a drop-down cell starts typing; Enter picks the option it begins.
  await grid.cell(2, 'distType').click();
  await page.keyboard.type('pe');
  await page.keyboard.press('Enter');
  await expect(grid.cell(2, 'distType')).toHaveText('PERT');
  await grid.waitSaved();
  const saved = (await (await page.request.get(`/api/projects/${id}/items`)).json()).rows;
  expect(saved[2].distType).toBe('pert');
});

test('the empty grid speaks our words and shows no library text', async ({ page }) => {
  const id = await projectFor(page, 'EMP');
  await page.goto(`/projects/${id}/items`);
  await expect(page.locator('.ag-overlay-no-rows-center')).toHaveText(
    'No line items yet. Add a line, paste lines from a spreadsheet, or import a file.',
  );
  await expect(page.getByText('No Rows To Show')).toHaveCount(0);
  const visible = await page.evaluate(() => document.body.innerText);
  expect(visible).not.toMatch(/Press (Space|Enter)|to toggle|Column Header|Row Selection/i);
});

test('at 1280 px the line items show Base, Line mean, P10, P90 and their totals in view', async ({
  page,
}) => {
  await page.setViewportSize({ width: 1280, height: 860 });
  await page.getByRole('link', { name: 'ASH-WTP' }).first().click();
  await expect(page).toHaveURL(/\/items$/);
  const grid = new RegisterPages(page);
  await expect(grid.cell(0, 'description')).not.toBeEmpty();
  const region = grid.grid();
  const box = (await region.boundingBox())!;
  for (const header of ['Base (EUR)', 'Line mean (EUR)', 'P10', 'P90']) {
    const cell = region.locator('.ag-header-cell', { hasText: header }).first();
    await expect(cell).toBeVisible();
    const b = (await cell.boundingBox())!;
    expect(b.x).toBeGreaterThanOrEqual(box.x);
    expect(b.x + b.width).toBeLessThanOrEqual(Math.min(box.x + box.width, 1280) + 1);
  }
  // No two columns share a header.
  const headers = await region.locator('.ag-header-cell-text').allInnerTexts();
  expect(new Set(headers).size).toBe(headers.length);
  // The totals: in view, filled, and right-aligned under their columns.
  for (const field of ['base', '_mean']) {
    const total = region.locator(`.ag-grid-pinned-bottom-rows [col-id="${field}"]`).first();
    await expect(total).toBeVisible();
    await expect(total).toHaveText(/^\d{1,3}(,\d{3})+$/);
    expect(await total.evaluate((el) => getComputedStyle(el).textAlign)).toBe('right');
    const b = (await total.boundingBox())!;
    expect(b.x + b.width).toBeLessThanOrEqual(1280);
  }
});
