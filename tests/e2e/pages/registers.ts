import { expect, type Locator, type Page } from '@playwright/test';

/** A new project of the signed-in user's organisation, made through the API; returns its id. */
export async function newProject(page: Page, code: string, currency = 'EUR'): Promise<number> {
  const res = await page.request.post('/api/projects', {
    data: { name: `E2E ${code}`, code, currency, estimateClass: 4, stage: 'Concept', baseDate: '2027-01-04' },
  });
  expect(res.status()).toBe(201);
  return (await res.json()).project.id as number;
}

/** Page object for a project's register grids (AG Grid). */
export class RegisterPages {
  constructor(private readonly page: Page) {}

  async open(projectId: number, tab: 'items' | 'risks' | 'schedule' | 'correlations') {
    await this.page.goto(`/projects/${projectId}/${tab}`);
    await expect(
      this.page
        .locator('.ag-grid-scrolling-rows .ag-row')
        .first()
        .or(this.page.getByText(/^0 lines\b/)),
    ).toBeVisible();
  }

  grid(label = 'Line items'): Locator {
    return this.page.getByRole('region', { name: label });
  }

  /** A body cell (not the pinned total row) by row index and field. */
  cell(row: number, field: string, label = 'Line items'): Locator {
    return this.grid(label).locator(
      `.ag-grid-scrolling-rows .ag-row[row-index="${row}"] [col-id="${field}"]`,
    );
  }

  async typeInto(row: number, field: string, text: string) {
    await this.cell(row, field).dblclick();
    const editor = this.grid().locator('.ag-cell-inline-editing input');
    await editor.fill(text);
    await editor.press('Enter');
  }

  /** Pastes tab-separated text at the focused cell, as a spreadsheet's copy would. */
  async pasteAt(row: number, field: string, rows: (string | number)[][]) {
    await this.cell(row, field).click();
    const text = rows.map((r) => r.join('\t')).join('\n');
    await this.page.evaluate((t) => {
      const data = new DataTransfer();
      data.setData('text/plain', t);
      document.activeElement!.dispatchEvent(
        new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
      );
    }, text);
  }

  async waitSaved() {
    await expect(this.page.getByText('All changes saved')).toBeVisible();
  }

  cellStatus() {
    return this.page.getByTestId('cell-status');
  }
}
