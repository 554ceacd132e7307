import { expect, type APIRequestContext, type Page } from '@playwright/test';

/** A figure as shown on screen ("€1,234,567", "-€12", "−€12") back to a number. */
export function moneyValue(text: string): number {
  const negative = /[-−]/.test(text);
  const digits = text.replace(/[^\d.]/g, '');
  return (negative ? -1 : 1) * Number(digits);
}

/** Page object for a finished run's outcome: the allocation table and the scenario comparison. */
export class OutcomePage {
  constructor(private readonly page: Page) {}

  async open(projectId: number, runId: number) {
    await this.page.goto(`/projects/${projectId}/runs/${runId}`);
    await expect(this.page.getByTestId('run-outcome')).toBeVisible();
  }

  allocation() {
    return this.page.getByTestId('allocation-table');
  }

  /** Every amount of the allocation table's rows (a folded "others" row included). */
  async allocationAmounts(): Promise<number[]> {
    return (await this.allocation().getByTestId('allocation-amount').allTextContents()).map(moneyValue);
  }

  async allocationFigure(which: 'sum' | 'contingency' | 'difference'): Promise<number> {
    return moneyValue(await this.allocation().getByTestId(`allocation-${which}`).innerText());
  }

  mitigation() {
    return this.page.getByTestId('mitigation-compare');
  }
}

/** Starts a run through the API and waits until it has succeeded; its id. */
export async function finishedRun(
  request: APIRequestContext,
  projectId: number,
  settings: Record<string, unknown>,
): Promise<number> {
  const started = await request.post(`/api/projects/${projectId}/runs`, { data: settings });
  expect(started.status()).toBe(201);
  const runId = (await started.json()).run.id as number;
  await expect
    .poll(
      async () => (await (await request.get(`/api/projects/${projectId}/runs/${runId}`)).json()).run.status,
      { timeout: 90_000, intervals: [250] },
    )
    .toBe('succeeded');
  return runId;
}
