// Page benchmark: how long each workspace page takes to become interactive in Chromium on the
// demo data, and the 2,000-line grid.
//
//   1. Start the app with the demo data (npm start, or next start after npm run db:seed).
//   2. npm run bench:pages                      (APP_URL defaults to http://localhost:3000)
//      APP_URL=http://localhost:3120 RUNS=5 npm run bench:pages
//
// "Interactive" here is: navigation start (performance.timeOrigin of the page's document) until
// all of (a) the page's main content is visible (a selector per page: the grid's first row, a
// chart's canvas, the table's first row…), (b) no loading skeleton is left in <main>, and
// (c) React has hydrated <main> (its element carries React's fiber key), so a click is answered.
// Each page is loaded RUNS times (default 3) after one warm-up load; the median is printed, and
// the first (cold) load separately, since a server's first render of a page costs more.
//
// It signs in as the demo owner (who may see every page), uses the demo project ASH-WTP, starts
// two small runs on it when it has fewer than two succeeded ones (outcome, brief and compare need
// them), and creates a 2,000-line project BENCH-… for the grid, archived at the end.
import { chromium, type Page } from '@playwright/test';
import { APP_URL, launchOptions, projectWithLines, signIn } from './app';

const RUNS = Number(process.env.RUNS ?? 3);
const PAGE_AIM_MS = 1000;
const GRID_AIM_MS = 1500;
const GRID_LINES = 2000;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

interface PageCase {
  name: string;
  path: string;
  /** Visible once the page's main content is drawn. */
  ready: string;
  aim: number;
}

/** Navigates and returns navigation start → interactive, in milliseconds. */
async function timeToInteractive(page: Page, url: string, ready: string): Promise<number> {
  await page.goto(url, { waitUntil: 'commit' });
  await page.locator(ready).first().waitFor({ state: 'visible', timeout: 30_000 });
  await page.waitForFunction(
    () => {
      const main = document.querySelector('main');
      if (!main || main.querySelector('[aria-busy="true"]')) return false;
      return Object.keys(main).some((k) => k.startsWith('__reactFiber'));
    },
    undefined,
    { polling: 'raf', timeout: 30_000 },
  );
  return page.evaluate(() => performance.now());
}

async function ensureRuns(page: Page, projectId: number): Promise<number[]> {
  const list = async () => {
    const res = await page.request.get(`${APP_URL}/api/projects/${projectId}/runs`);
    const body = await res.json();
    return ((body.runs ?? []) as { id: number; status: string }[])
      .filter((r) => r.status === 'succeeded')
      .map((r) => r.id);
  };
  let done = await list();
  for (let i = done.length; i < 2; i++) {
    const res = await page.request.post(`${APP_URL}/api/projects/${projectId}/runs`, {
      data: { iterations: 5000, seed: 100 + i },
    });
    if (res.status() >= 300) throw new Error(`could not start a run: ${await res.text()}`);
  }
  const deadline = Date.now() + 180_000;
  while (done.length < 2) {
    if (Date.now() > deadline) throw new Error('the bench runs did not finish within 3 minutes');
    await new Promise((r) => setTimeout(r, 500));
    done = await list();
  }
  return done.sort((a, b) => b - a);
}

async function main() {
  const browser = await chromium.launch(await launchOptions());
  const page = await browser.newPage({ viewport: { width: 1280, height: 860 } });
  await signIn(page, 'owner@kestrelvale.example');

  const projects = (await (await page.request.get(`${APP_URL}/api/projects`)).json()).projects as {
    id: number;
    code: string;
  }[];
  const demo = projects.find((p) => p.code === 'ASH-WTP');
  if (!demo) throw new Error('the demo project ASH-WTP is missing: run npm run db:seed');
  const p = `/projects/${demo.id}`;
  const [latest, earlier] = await ensureRuns(page, demo.id);
  const gridId = await projectWithLines(page, GRID_LINES, 'Page benchmark');

  const grid = '.ag-row[row-index="0"] [col-id]';
  const cases: PageCase[] = [
    {
      name: 'Projects list',
      path: '/projects',
      ready: 'main [data-testid="project-ASH-WTP"] a',
      aim: PAGE_AIM_MS,
    },
    { name: 'Line items', path: `${p}/items`, ready: `main ${grid}`, aim: PAGE_AIM_MS },
    { name: 'Risk events', path: `${p}/risks`, ready: `main ${grid}`, aim: PAGE_AIM_MS },
    { name: 'Schedule', path: `${p}/schedule`, ready: `main ${grid}`, aim: PAGE_AIM_MS },
    {
      name: 'Correlations',
      path: `${p}/correlations`,
      ready: 'main table tbody tr, main canvas',
      aim: PAGE_AIM_MS,
    },
    { name: 'Runs', path: `${p}/runs`, ready: `main a[href="${p}/runs/${latest}"]`, aim: PAGE_AIM_MS },
    { name: 'Run outcome', path: `${p}/runs/${latest}`, ready: 'main canvas', aim: PAGE_AIM_MS },
    { name: 'Brief', path: `${p}/runs/${latest}/brief`, ready: 'main svg', aim: PAGE_AIM_MS },
    { name: 'Trend', path: `${p}/trend`, ready: 'main h2, main canvas, main table', aim: PAGE_AIM_MS },
    {
      name: 'Compare',
      path: `${p}/runs/compare?a=${earlier}&b=${latest}`,
      ready: 'main canvas',
      aim: PAGE_AIM_MS,
    },
    { name: 'Audit trail', path: `${p}/audit`, ready: 'main table tbody tr', aim: PAGE_AIM_MS },
    { name: 'Decisions', path: `${p}/decisions`, ready: 'main h1, main h2', aim: PAGE_AIM_MS },
    { name: 'Members', path: '/settings/members', ready: 'main table tbody tr', aim: PAGE_AIM_MS },
    { name: 'Billing', path: '/settings/billing', ready: 'main h1, main h2', aim: PAGE_AIM_MS },
    { name: 'Notifications', path: '/settings/notifications', ready: 'main input', aim: PAGE_AIM_MS },
    {
      name: `Grid of ${GRID_LINES.toLocaleString('en-GB')} lines`,
      path: `/projects/${gridId}/items`,
      ready: `main ${grid}`,
      aim: GRID_AIM_MS,
    },
  ];

  const rows: string[] = [];
  let over = 0;
  for (const c of cases) {
    let cold: number;
    const times: number[] = [];
    try {
      cold = await timeToInteractive(page, `${APP_URL}${c.path}`, c.ready);
      for (let i = 0; i < RUNS; i++)
        times.push(await timeToInteractive(page, `${APP_URL}${c.path}`, c.ready));
    } catch (e) {
      over++;
      console.log(`${c.name.padEnd(24)} not ready: ${(e as Error).message.split('\n')[0]}`);
      continue;
    }
    const m = median(times);
    if (m > c.aim) over++;
    rows.push(
      `${c.name.padEnd(24)} ${(m / 1000).toFixed(2).padStart(5)} s   first ${(cold / 1000).toFixed(2)} s   ` +
        `runs ${times.map((t) => (t / 1000).toFixed(2)).join(', ')}   aim ≤ ${(c.aim / 1000).toFixed(1)} s${m > c.aim ? '  OVER' : ''}`,
    );
    console.log(rows[rows.length - 1]);
  }
  await page.request.patch(`${APP_URL}/api/projects/${gridId}`, { data: { archived: true } });
  await browser.close();
  const load = (await import('node:os')).loadavg().map((l) => l.toFixed(2));
  console.log(
    `\n${cases.length - over} of ${cases.length} pages within their aim; load average ${load.join(' ')}`,
  );
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
