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

  /**
   * Checks that the allocation table adds up to the contingency shown in the headline figures, and
   * returns its figures. Each figure is rounded to a whole unit of currency on screen, so the rows
   * may miss the printed sum by up to half a unit each (common practice for rounded tables).
   */
  async expectAllocationAddsUp() {
    const amounts = await this.allocationAmounts();
    const sum = await this.allocationFigure('sum');
    const contingency = await this.allocationFigure('contingency');
    const difference = await this.allocationFigure('difference');
    const rounding = 0.5 * (amounts.length + 3);
    expect(Math.abs(amounts.reduce((s, a) => s + a, 0) - sum)).toBeLessThanOrEqual(rounding);
    // The rows add up to the contingency, less the Monte Carlo difference the table states.
    expect(Math.abs(sum - contingency - difference)).toBeLessThanOrEqual(rounding);
    // The allocation's contingency is the one in the headline figures (the P-value less the base).
    expect(contingency).toBe(moneyValue(await this.page.getByTestId('contingency').innerText()));
    // The window's mean lies close to the P-value (Euler allocation, Tasche 1999: the shares add up
    // to the contingency within Monte Carlo error); here within 5 % of it.
    expect(Math.abs(difference)).toBeLessThan(0.05 * Math.abs(contingency));
    return { amounts, sum, contingency, difference };
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
