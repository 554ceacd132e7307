import { expect, test } from './fixtures';
import ExcelJS from 'exceljs';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';
import { newProject, RegisterPages } from './pages/registers';

test('an estimator edits a cell, pastes a 3×20 block, is refused an invalid value and finds the data after reload', async ({
  page,
}) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const id = await newProject(page, `E2E-${Date.now().toString(36).toUpperCase()}`);
  const upserts = Array.from({ length: 20 }, (_, i) => ({
    key: `k${i}`,
    code: `1.${i + 1}`,
    description: `Line ${i + 1}`,
    distType: 'triangular',
    low: 10,
    mode: 20,
    high: 30,
  }));
  expect((await page.request.post(`/api/projects/${id}/items`, { data: { upserts } })).status()).toBe(200);

  const grid = new RegisterPages(page);
  await grid.open(id, 'items');
  await grid.typeInto(0, 'description', 'Bulk excavation');
  await expect(grid.cell(0, 'description')).toHaveText('Bulk excavation');
  await grid.waitSaved();

  const block = Array.from({ length: 20 }, (_, i) => [1000 + i, 2000 + i, 4000 + i]);
  await grid.pasteAt(0, 'low', block);
  await expect(grid.cell(19, 'high')).toHaveText('4,019');
  await grid.waitSaved();

  await grid.typeInto(3, 'mode', '99999');
  await expect(grid.cell(3, 'mode')).toHaveClass(/cell-invalid/);
  await grid.cell(3, 'mode').click();
  await expect(grid.cellStatus()).toContainText('must lie between low and high');
  await expect(page.getByTestId('register-notice')).toContainText('Not saved');

  // The refused value is kept in this browser, marked, until it is fixed; the saved rows reload.
  page.on('dialog', (d) => d.accept());
  await page.reload();
  await expect(grid.cell(0, 'description')).toHaveText('Bulk excavation');
  await expect(grid.cell(19, 'low')).toHaveText('1,019');
  await expect(grid.cell(19, 'high')).toHaveText('4,019');
  await expect(grid.cell(3, 'mode')).toHaveText('99,999');
  await expect(grid.cell(3, 'mode')).toHaveClass(/cell-invalid/);
  const saved = (await (await page.request.get(`/api/projects/${id}/items`)).json()).rows;
  expect(saved[3].mode).toBe(2003);
});

test('an estimator imports an XLSX file and exports the registers back', async ({ page }) => {
  await new AuthPages(page).signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const id = await newProject(page, `XL-${Date.now().toString(36).toUpperCase()}`);

  const wb = new ExcelJS.Workbook();
  const sheet = wb.addWorksheet('Line items');
  sheet.addRow(['WBS code', 'Description', 'Distribution', 'Low', 'Most likely', 'High', 'Notes']);
  sheet.addRow(['2.1', 'Piling', 'pert', 800000, 900000, 1300000, '=cmd']);
  sheet.addRow(['2.2', 'Frame', 'triangular', 1500000, 1700000, 2400000, null]);
  sheet.addRow(['2.3', 'Roof', 'uniform', 300000, null, 420000, null]);
  const file = path.join(os.tmpdir(), `import-${Date.now()}.xlsx`);
  await wb.xlsx.writeFile(file);

  const grid = new RegisterPages(page);
  await grid.open(id, 'items');
  await page.getByRole('button', { name: 'Import…' }).click();
  await page.getByLabel('File').setInputFiles(file);
  await expect(page.getByText('3 rows · 3 new · 0 update · no problems')).toBeVisible();
  await page.getByRole('button', { name: 'Import 3 rows' }).click();
  await expect(page.getByText('Line items: 3 added, 0 updated')).toBeVisible();
  await page.getByRole('button', { name: 'Close' }).click();
  await expect(grid.cell(2, 'description')).toHaveText('Roof');

  const download = page.waitForEvent('download');
  await page.getByRole('link', { name: 'XLSX' }).click();
  const saved = path.join(os.tmpdir(), `export-${Date.now()}.xlsx`);
  await (await download).saveAs(saved);
  const back = new ExcelJS.Workbook();
  await back.xlsx.readFile(saved);
  const items = back.getWorksheet('Line items')!;
  expect(items.getRow(2).getCell(1).value).toBe('2.1');
  expect(items.getRow(2).getCell(9).value).toBe(1300000);
  // Text that a spreadsheet would run as a formula comes back escaped.
  expect(items.getRow(2).getCell(14).value).toBe("'=cmd");
  expect(items.getRow(4).getCell(2).value).toBe('Roof');
  fs.rmSync(file);
  fs.rmSync(saved);
});

test('a sponsor sees the registers read only', async ({ page }) => {
  await new AuthPages(page).signIn(demoEmail('sponsor'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  await page.getByRole('link', { name: 'ASH-WTP' }).click();
  await expect(page).toHaveURL(/\/items$/);
  const grid = new RegisterPages(page);
  await expect(grid.cell(0, 'description')).not.toBeEmpty();
  await expect(page.getByText('Read only: your role can read and download this register.')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add line' })).toHaveCount(0);
  await grid.cell(0, 'description').dblclick();
  await expect(grid.grid().locator('.ag-cell-inline-editing')).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'XLSX' })).toBeVisible();
  await page.getByRole('link', { name: 'Schedule' }).click();
  await expect(page.getByText('Read only: your role can read and download this register.')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add activity' })).toHaveCount(0);
});
