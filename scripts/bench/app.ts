// What the browser benchmarks share: signing in as a demo account, and a project of many lines.
import type { Page } from '@playwright/test';

export const APP_URL = process.env.APP_URL ?? 'http://localhost:3000';

export async function launchOptions() {
  return {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--no-first-run'],
  };
}

export async function signIn(page: Page, email: string) {
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('demo-outturn-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/projects/);
}

/** A project BENCH-… of `lines` line items of mixed distributions, made through the API. */
export async function projectWithLines(page: Page, lines: number, name: string): Promise<number> {
  const code = `BENCH-${Date.now().toString(36).toUpperCase()}`;
  const created = await page.request.post(`${APP_URL}/api/projects`, {
    data: { name, code, currency: 'EUR', estimateClass: 4, stage: 'Concept', baseDate: '2027-01-04' },
  });
  if (created.status() !== 201)
    throw new Error(`could not create the bench project: ${await created.text()}`);
  const projectId = (await created.json()).project.id as number;
  const types = ['triangular', 'pert', 'uniform', 'normal', 'lognormal'];
  const upserts = Array.from({ length: lines }, (_, i) => {
    const base = 10_000 + ((i * 7919) % 90_000);
    const type = types[i % types.length];
    const params =
      type === 'normal'
        ? { mean: base, sd: base * 0.1 }
        : type === 'lognormal'
          ? { low: base * 0.8, high: base * 1.4 }
          : type === 'uniform'
            ? { low: base * 0.9, high: base * 1.3 }
            : { low: base * 0.85, mode: base, high: base * 1.5 };
    return {
      code: `${1 + Math.floor(i / 100)}.${(i % 100) + 1}`,
      description: `Line ${i + 1}`,
      distType: type,
      ...params,
    };
  });
  const seeded = await page.request.post(`${APP_URL}/api/projects/${projectId}/items`, { data: { upserts } });
  if (seeded.status() !== 200) throw new Error(`could not create the lines: ${await seeded.text()}`);
  return projectId;
}
