import { expect, type Page } from '@playwright/test';

/** Page object for a run's brief, the project's trend and its decisions. */
export class BriefPages {
  constructor(private readonly page: Page) {}

  open(projectId: number, runId: number) {
    return this.page.goto(`/projects/${projectId}/runs/${runId}/brief`);
  }

  title() {
    return this.page.getByTestId('brief-title');
  }

  async sendToSponsors() {
    await this.page.getByRole('button', { name: 'Send to sponsors for a decision' }).click();
    await expect(this.page.getByText(/Sent to \d+ sponsor/)).toBeVisible();
  }

  async approve(comment: string) {
    await this.page.getByLabel('Approve as the baseline').check();
    await this.page.getByLabel('Comment (optional)').fill(comment);
    await this.page.getByRole('button', { name: 'Approve this baseline' }).click();
    await expect(this.decisionRecord()).toBeVisible();
  }

  decisionRecord() {
    return this.page.getByTestId('decision-record');
  }

  openTrend(projectId: number) {
    return this.page.goto(`/projects/${projectId}/trend`);
  }
}
