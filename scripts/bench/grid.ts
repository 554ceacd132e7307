// Grid benchmark: how long a 2,000-line register takes to become interactive in Chromium, and
// how long a 500-row paste takes to save.
//
//   1. Start the app with the demo data (npm start, or next start after npm run db:seed).
//   2. npm run bench:grid                      (APP_URL defaults to http://localhost:3000)
//      APP_URL=http://localhost:3120 npm run bench:grid   to point at another server.
//
// It signs in as the demo estimator, creates a project BENCH-… with 2,000 line items through
// the API, opens its Line items tab and times (a) navigation start → first rows drawn and a
// cell's editor opening on double-click, and (b) a pasted 3×500 block → "All changes saved"
// (the one-transaction batch save included), then (c) the save alone: 500 changed rows posted
// through the API, without the browser. The bench project is archived at the end.
import { chromium } from '@playwright/test';
import { APP_URL, launchOptions, projectWithLines, signIn } from './app';

const LINES = 2000;
const PASTE_ROWS = 500;
const RUNS = Number(process.env.RUNS ?? 3);

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function main() {
  const browser = await chromium.launch(await launchOptions());
  const page = await browser.newPage({ viewport: { width: 1280, height: 860 } });
  await signIn(page, 'estimator@kestrelvale.example');
  const projectId = await projectWithLines(page, LINES, 'Grid benchmark');

  const interactive: number[] = [];
  const saves: number[] = [];
  const cell = (row: number, field: string) =>
    page.locator(
      `[aria-label="Line items"] .ag-grid-scrolling-rows .ag-row[row-index="${row}"] [col-id="${field}"]`,
    );
  for (let run = 0; run < RUNS; run++) {
    await page.goto(`${APP_URL}/projects/${projectId}/items`, { waitUntil: 'commit' });
    const start = await page.evaluate(() => performance.timeOrigin);
    await cell(0, 'description').waitFor();
    await cell(0, 'description').dblclick();
    await page.locator('[aria-label="Line items"] .ag-cell-inline-editing input').waitFor();
    const ready = await page.evaluate(() => performance.timeOrigin + performance.now());
    interactive.push(ready - start);
    await page.keyboard.press('Escape');

    await cell(0, 'low').click();
    const block = Array.from({ length: PASTE_ROWS }, (_, i) =>
      [8000 + i + run, 9000 + i + run, 20000 + i + run].join('\t'),
    ).join('\n');
    const saved = page.waitForResponse(
      (r) => r.url().endsWith(`/api/projects/${projectId}/items`) && r.request().method() === 'POST',
    );
    const t0 = await page.evaluate((text) => {
      const data = new DataTransfer();
      data.setData('text/plain', text);
      const t = performance.now();
      document.activeElement!.dispatchEvent(
        new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
      );
      return t;
    }, block);
    const response = await saved;
    if (response.status() !== 200)
      throw new Error(`the paste was not saved: ${response.status()} ${await response.text()}`);
    await page.getByText('All changes saved').waitFor();
    saves.push((await page.evaluate(() => performance.now())) - t0);
  }
  // The server's part: the same size of batch posted straight to the API.
  const apiSaves: number[] = [];
  for (let run = 0; run < RUNS; run++) {
    const listed = await page.request.get(`${APP_URL}/api/projects/${projectId}/items`);
    const rows = (await listed.json()).rows as Record<string, unknown>[];
    const changed = rows
      .slice(PASTE_ROWS, 2 * PASTE_ROWS)
      .map((r, i) => ({ ...r, base: 1000 + 10 * i + run }));
    const t0 = performance.now();
    const response = await page.request.post(`${APP_URL}/api/projects/${projectId}/items`, {
      data: { upserts: changed },
    });
    if (response.status() !== 200)
      throw new Error(`the API save failed: ${response.status()} ${await response.text()}`);
    apiSaves.push(performance.now() - t0);
  }
  await page.request.patch(`${APP_URL}/api/projects/${projectId}`, { data: { archived: true } });
  await browser.close();

  const fmt = (xs: number[]) =>
    `${(median(xs) / 1000).toFixed(2)} s (runs: ${xs.map((x) => (x / 1000).toFixed(2)).join(', ')})`;
  console.log(
    `Grid of ${LINES.toLocaleString('en-GB')} lines interactive: ${fmt(interactive)}   aim ≤ 1.5 s`,
  );
  console.log(`Paste of ${PASTE_ROWS} rows × 3 cells saved:      ${fmt(saves)}   aim ≤ 1 s`);
  console.log(`  of which the server (${PASTE_ROWS} rows posted):  ${fmt(apiSaves)}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
