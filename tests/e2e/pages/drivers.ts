import { expect, type Locator, type Page } from '@playwright/test';

/** Page object for a project's drivers register: the grid and the "applies to" panel beside it. */
export class DriversPage {
  constructor(private readonly page: Page) {}

  async open(projectId: number) {
    await this.page.goto(`/projects/${projectId}/drivers`);
    await expect(this.page.getByRole('button', { name: 'Add driver' })).toBeVisible();
  }

  grid(): Locator {
    return this.page.getByRole('region', { name: 'Drivers' });
  }

  cell(row: number, field: string): Locator {
    return this.grid().locator(`.ag-grid-scrolling-rows .ag-row[row-index="${row}"] [col-id="${field}"]`);
  }

  /** Moves the keyboard focus along the row from its name until the cell is rendered. */
  async reveal(row: number, field: string) {
    await this.cell(row, 'name').click();
    for (let i = 0; i < 16 && !(await this.cell(row, field).isVisible()); i++)
      await this.page.keyboard.press('ArrowRight');
    await expect(this.cell(row, field)).toBeVisible();
  }

  async typeInto(row: number, field: string, text: string) {
    await this.cell(row, field).dblclick();
    const editor = this.grid().locator('.ag-cell-inline-editing input');
    await editor.fill(text);
    await editor.press('Enter');
  }

  panel(): Locator {
    return this.page.getByRole('complementary', { name: 'Applies to' });
  }

  /** Finds an option of the pick list by search and ticks it. */
  async pick(search: string, option: string) {
    await this.panel().getByRole('searchbox').fill(search);
    await this.panel()
      .getByRole('checkbox', { name: new RegExp(option) })
      .check();
  }

  async waitSaved() {
    await expect(this.page.getByText('All changes saved')).toBeVisible();
  }
}
