import { expect, type APIRequestContext, type Page } from '@playwright/test';

/** Page object for a project's runs: the settings form, the progress of a run, its outcome. */
export class RunsPages {
  constructor(private readonly page: Page) {}

  async open(projectId: number) {
    await this.page.goto(`/projects/${projectId}/runs`);
    await expect(this.page.getByRole('heading', { name: 'Runs', exact: true })).toBeVisible();
  }

  async start(values: { iterations: number; seed?: number; costTarget?: string; finishTarget?: string }) {
    const form = this.page.getByRole('form', { name: 'Run settings' });
    await form.getByLabel('Iterations', { exact: true }).fill(String(values.iterations));
    if (values.seed !== undefined) await form.getByLabel('Seed', { exact: true }).fill(String(values.seed));
    if (values.costTarget) await form.getByLabel(/Cost target/).fill(values.costTarget);
    if (values.finishTarget) await form.getByLabel('Finish target').fill(values.finishTarget);
    await form.getByRole('button', { name: 'Start run' }).click();
    await expect(this.page).toHaveURL(/\/runs\/\d+$/);
    return Number(this.page.url().split('/').pop());
  }

  progressBar() {
    return this.page.getByRole('progressbar', { name: 'Run progress' });
  }

  outcome() {
    return this.page.getByTestId('run-outcome');
  }
}

/** The id of a demo project by its code, read through the API with the page's session. */
export async function projectIdByCode(request: APIRequestContext, code: string): Promise<number> {
  const res = await request.get('/api/projects');
  expect(res.status()).toBe(200);
  const project = ((await res.json()).projects as { id: number; code: string }[]).find(
    (p) => p.code === code,
  );
  if (!project) throw new Error(`no project ${code}`);
  return project.id;
}
