// npm run bench:scale — the app beyond one process, in figures (it prints, it never asserts):
//
//   a) read APIs under load: the projects list, the line items of the demo project ASH-WTP and
//      its runs list, SCALE_CONNECTIONS (50) connections for SCALE_SECONDS (10) s each with
//      autocannon, against one web instance and against two (autocannon spreading its
//      connections over both URLs, no proxy in between): requests/s, p50/p95/p97.5/p99 latency,
//      errors, and the web processes' CPU time per request (the fairer figure on a busy machine);
//   b) runs per minute with 1, 2 and 4 queue workers (`npm run worker`, one run at a time each,
//      one engine thread per run) for a queue of SCALE_RUNS (40) runs of the demo projects,
//      started through the run form's route and polled through the runs lists until all ended;
//   c) one SCALE_BIG_ITERATIONS (10,000,000) iteration run on 1 and on 2 workers: wall time and
//      each worker's peak resident memory (VmHWM, read from /proc before the worker stops).
//
// It sets itself up as `npm test` does, for the slot OUTTURN_TEST_SLOT (default 0): MariaDB
// (scripts/db.sh) with a fresh database outturn_bench_<slot>, the local fakes, migrations and the
// demo data, the production build in the slot's build folder (.next, or .next-test-<slot>), and
// the slot's private Redis on 6400 + slot. The web instances listen on 3100 + 10 × slot and the
// port after it, in queue mode (REDIS_URL set, a fresh OUTTURN_QUEUE_PREFIX). Everything it
// started is stopped at the end, also on Ctrl-C; MariaDB stays up, as after npm test.
//
// b) and c) need the queue mode's worker (`npm run worker`): without it they are skipped, saying
// so. The organisation limit of two runs at once would cap b) at two workers, so the demo
// projects are copied (model file export and import) into SCALE_ORGS − 1 (3) new organisations
// and the runs go round the organisations' projects in turn. SCALE_PARTS=a,b,c picks the parts;
// SCALE_WORKERS=1,2,4, SCALE_RUN_ITERATIONS (10,000) tune b).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import { apiClient, formatLoad, load, newOrganisation, signInCookie, type ApiClient } from './scale-http';
import {
  commandLine,
  cpuTimeMs,
  descendants,
  killAllNow,
  peakMemory,
  start,
  stop,
  tail,
  type Started,
} from './scale-processes';

const ROOT = process.cwd();
type Env = Record<string, string>;
const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const slot = num('OUTTURN_TEST_SLOT', 0);
const SECONDS = num('SCALE_SECONDS', 10);
const CONNECTIONS = num('SCALE_CONNECTIONS', 50);
const RUNS = num('SCALE_RUNS', 40);
const RUN_ITERATIONS = num('SCALE_RUN_ITERATIONS', 10_000);
const BIG_ITERATIONS = num('SCALE_BIG_ITERATIONS', 10_000_000);
const ORGS = Math.max(1, num('SCALE_ORGS', 4));
const WORKER_COUNTS = (process.env.SCALE_WORKERS ?? '1,2,4').split(',').map(Number);
const PARTS = new Set((process.env.SCALE_PARTS ?? 'a,b,c').split(',').map((p) => p.trim()));
const DEMO_OWNER = 'owner@kestrelvale.example';
const TERMINAL = new Set(['succeeded', 'failed', 'cancelled']);

const ports = [3100 + slot * 10, 3101 + slot * 10];
const redisPort = 6400 + slot;
const RUN_DIR = `${ROOT}/.data/run-bench-${slot}`;

type RunView = {
  id: number;
  status: string;
  progress: number;
  startedAt: string | null;
  finishedAt: string | null;
  failureReason: string | null;
};

const MiB = (bytes: number) => `${(bytes / 1048576).toFixed(0)} MiB`;
const loadAverage = () =>
  os
    .loadavg()
    .map((l) => l.toFixed(2))
    .join(' ');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** .env as scripts/env.sh exports it, then this slot's database, build folder, ports and Redis. */
function benchEnv(): Env {
  const dump = execFileSync('bash', ['-c', 'source scripts/env.sh && env -0'], { cwd: ROOT });
  const env: Record<string, string> = {};
  for (const entry of dump.toString().split('\0')) {
    const eq = entry.indexOf('=');
    if (eq > 0) env[entry.slice(0, eq)] = entry.slice(eq + 1);
  }
  return {
    ...env,
    DB_NAME: `outturn_bench_${slot}`,
    NEXT_DIST_DIR: slot === 0 ? '.next' : `.next-test-${slot}`,
    MAIL_UI_PORT: String(2581 + slot * 10),
    SMTP_PORT: String(2526 + slot * 10),
    STRIPE_FAKE_PORT: String(12112 + slot * 10),
    RUN: RUN_DIR,
    TRUSTED_PROXIES: '127.0.0.1,::1',
    REDIS_URL: `redis://127.0.0.1:${redisPort}`,
    OUTTURN_QUEUE_PREFIX: `outturn-bench-${Date.now().toString(36)}`,
    NEXT_TELEMETRY_DISABLED: '1',
  };
}

const env = benchEnv();
/** The same, typed as child_process wants it (Next.js's types make NODE_ENV required there). */
const childEnv = env as unknown as NodeJS.ProcessEnv;

function step(what: string, command: string, args: string[]) {
  const log = `${RUN_DIR}/setup.log`;
  fs.appendFileSync(log, `\n== ${what}\n`);
  const out = fs.openSync(log, 'a');
  try {
    execFileSync(command, args, { cwd: ROOT, env: childEnv, stdio: ['ignore', out, out] });
  } catch {
    throw new Error(`${what} failed; see ${log}:\n${tail(log, 25)}`);
  } finally {
    fs.closeSync(out);
  }
}

function setUp() {
  fs.mkdirSync(RUN_DIR, { recursive: true });
  fs.writeFileSync(`${RUN_DIR}/setup.log`, '');
  console.log(
    `Setting up slot ${slot}: database ${env.DB_NAME}, build ${env.NEXT_DIST_DIR}, Redis :${redisPort}…`,
  );
  step('MariaDB', 'bash', ['scripts/db.sh', 'start']);
  step('fresh database', 'mariadb', [
    '--no-defaults',
    `--socket=${ROOT}/.data/mariadb/mysqld.sock`,
    '-uroot',
    '-e',
    `DROP DATABASE IF EXISTS \`${env.DB_NAME}\``,
  ]);
  step('database', 'bash', ['scripts/db.sh', 'start', env.DB_NAME]);
  step('local fakes', 'bash', ['scripts/services.sh', 'start']);
  step('Redis', 'bash', ['scripts/redis.sh', 'start', String(redisPort)]);
  step('migrations and demo data', 'bash', ['scripts/migrate.sh']);
  step('production build', 'bash', ['scripts/build.sh']);
}

let tornDown = false;
/** Stops what the benchmark started: processes first, then the fakes and Redis. Synchronous, for exit too. */
function tearDown() {
  if (tornDown) return;
  tornDown = true;
  killAllNow();
  for (const args of [
    ['scripts/services.sh', 'stop'],
    ['scripts/redis.sh', 'stop', String(redisPort)],
  ]) {
    try {
      execFileSync('bash', args, { cwd: ROOT, env: childEnv, stdio: 'ignore' });
    } catch {
      // Best effort: report nothing more on the way out.
    }
  }
}
process.on('exit', tearDown);
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    console.log(`\n${signal}: stopping everything the benchmark started.`);
    tearDown();
    process.exit(130);
  });
}

async function waitForHttp(url: string, timeoutMs: number, p: Started) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (p.child.exitCode !== null) throw new Error(`${p.name} exited; see ${p.log}:\n${tail(p.log)}`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // Not listening yet.
    }
    await sleep(300);
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s; see ${p.log}`);
}

async function startWeb(port: number): Promise<Started> {
  const url = `http://localhost:${port}`;
  const web = start(
    `web :${port}`,
    process.execPath,
    ['node_modules/next/dist/bin/next', 'start', '-p', String(port)],
    { ...env, PORT: String(port), APP_URL: url, NEXTAUTH_URL: url },
    `${RUN_DIR}/web-${port}.log`,
  );
  await waitForHttp(`${url}/sign-in`, 120_000, web);
  return web;
}

// ---------------------------------------------------------------- workers (queue mode)

const hasWorker = Boolean(
  (JSON.parse(fs.readFileSync(`${ROOT}/package.json`, 'utf8')) as { scripts?: Record<string, string> })
    .scripts?.worker,
);

async function startWorkers(count: number): Promise<Started[]> {
  const workerEnv = { ...env, OUTTURN_WORKER_CONCURRENCY: '1', OUTTURN_RUN_THREADS: '1' };
  const workers = Array.from({ length: count }, (_, i) =>
    start(
      `worker ${i + 1}`,
      'npm',
      ['run', '--silent', 'worker'],
      workerEnv,
      `${RUN_DIR}/worker-${i + 1}.log`,
    ),
  );
  await Promise.all(workers.map((w) => w.waitFor(/ready/i, 180_000)));
  return workers;
}

/** The worker's own node process below npm and its shell (the one whose memory counts). */
function workerPid(w: Started): number {
  const node = [w.child.pid!, ...descendants(w.child.pid!)].filter((pid) => {
    const cmd = commandLine(pid);
    return /(^|\/)node\s/.test(cmd) && !/npm|build-worker/.test(cmd);
  });
  if (node.length === 0) throw new Error(`no node process found below ${w.name}; see ${w.log}`);
  return node[node.length - 1];
}

// ---------------------------------------------------------------- the demo data

type Target = { client: ApiClient; projectId: number; label: string };
type ProjectView = {
  id: number;
  code: string;
  name: string;
  currency: string;
  estimateClass: number;
  stage: string;
  baseDate: string;
};

async function demoProjects(client: ApiClient): Promise<ProjectView[]> {
  const { projects } = await client.get<{ projects: ProjectView[] }>('/api/projects');
  if (!projects.some((p) => p.code === 'ASH-WTP'))
    throw new Error('the demo project ASH-WTP is missing: the demo seeders did not run');
  return projects;
}

/** The demo projects, and copies of them in ORGS − 1 new organisations, in turn by organisation. */
async function runTargets(appUrl: string, owner: ApiClient, projects: ProjectView[]): Promise<Target[]> {
  const byOrg: Target[][] = [
    projects.map((p) => ({ client: owner, projectId: p.id, label: `demo ${p.code}` })),
  ];
  for (let k = 1; k < ORGS; k++) {
    const client = await newOrganisation(appUrl, `bench-org-${k}`);
    const copies: Target[] = [];
    for (const p of projects) {
      const model = await owner.get<unknown>(`/api/projects/${p.id}/export?format=model`);
      const { name, code, currency, estimateClass, stage, baseDate } = p;
      const made = await client.post<{ project: { id: number } }>(
        '/api/projects',
        { name, code, currency, estimateClass, stage, baseDate },
        201,
      );
      await client.post(`/api/projects/${made.project.id}/import`, model);
      copies.push({ client, projectId: made.project.id, label: `org ${k + 1} ${p.code}` });
    }
    byOrg.push(copies);
  }
  const out: Target[] = [];
  for (let i = 0; i < Math.max(...byOrg.map((o) => o.length)); i++)
    for (const org of byOrg) if (org[i]) out.push(org[i]);
  return out;
}

// ---------------------------------------------------------------- a) read APIs

async function readApis(urls: string[], cookie: string, ashId: number, webs: Started[]) {
  const apis = [
    { name: 'projects list', path: '/api/projects' },
    { name: 'line items (ASH-WTP)', path: `/api/projects/${ashId}/items` },
    { name: 'runs list (ASH-WTP)', path: `/api/projects/${ashId}/runs` },
  ];
  const runs = (await apiClient(urls[0], cookie).get<{ runs: unknown[] }>(apis[2].path)).runs.length;
  console.log(
    `\na) Read APIs: ${CONNECTIONS} connections, ${SECONDS} s each (ASH-WTP has ${runs} run(s)); ` +
      'two instances: autocannon spreads its connections over both URLs.',
  );
  for (const config of [
    { name: '1 instance', urls: urls.slice(0, 1) },
    { name: '2 instances', urls },
  ]) {
    console.log(`  ${config.name} (${config.urls.map((u) => u.replace('http://localhost', '')).join(', ')})`);
    for (const api of apis) {
      const targets = config.urls.map((u) => u + api.path);
      await load(targets, cookie, { connections: 10, seconds: 2 });
      const cpu0 = webs.map((w) => cpuTimeMs(w.child.pid!));
      const f = await load(targets, cookie, { connections: CONNECTIONS, seconds: SECONDS });
      const cpu = webs.reduce((sum, w, i) => sum + cpuTimeMs(w.child.pid!) - cpu0[i], 0);
      console.log(
        `    ${formatLoad(api.name, f)}  web CPU ${(cpu / Math.max(1, f.total)).toFixed(2)} ms/req  load ${loadAverage()}`,
      );
    }
  }
}

// ---------------------------------------------------------------- b) runs per minute

async function runsOf(target: Target): Promise<RunView[]> {
  return (await target.client.get<{ runs: RunView[] }>(`/api/projects/${target.projectId}/runs`)).runs;
}

async function runsPerMinute(targets: Target[], workerCount: number) {
  const workers = await startWorkers(workerCount);
  const loadBefore = loadAverage();
  const t0 = Date.now();
  const posted = new Map<number, Target>();
  try {
    for (let i = 0; i < RUNS; i++) {
      const target = targets[i % targets.length];
      const { run } = await target.client.post<{ run: RunView }>(
        `/api/projects/${target.projectId}/runs`,
        { iterations: RUN_ITERATIONS, seed: 1000 + i },
        201,
      );
      posted.set(run.id, target);
    }
    const deadline = t0 + num('SCALE_RUN_TIMEOUT_S', 1800) * 1000;
    let ended: RunView[] = [];
    for (;;) {
      const seen = (await Promise.all([...new Set(posted.values())].map(runsOf))).flat();
      ended = seen.filter((r) => posted.has(r.id) && TERMINAL.has(r.status));
      if (ended.length === posted.size) break;
      if (Date.now() > deadline)
        throw new Error(
          `${posted.size - ended.length} of ${posted.size} runs had not ended by the time limit`,
        );
      await sleep(500);
    }
    const last = Math.max(...ended.map((r) => Date.parse(r.finishedAt ?? new Date().toISOString())));
    const minutes = (last - t0) / 60_000;
    const ok = ended.filter((r) => r.status === 'succeeded');
    const each = ok.map((r) => Date.parse(r.finishedAt!) - Date.parse(r.startedAt!)).sort((a, b) => a - b);
    console.log(
      `  ${String(workerCount).padStart(2)} worker(s): ${(ok.length / minutes).toFixed(1).padStart(6)} runs/min  ` +
        `(${ok.length} of ${posted.size} succeeded in ${(minutes * 60).toFixed(1)} s; ` +
        `median run ${(each[Math.floor(each.length / 2)] / 1000).toFixed(1)} s)  ` +
        `load ${loadBefore} → ${loadAverage()}` +
        (ok.length < posted.size
          ? `  FAILED: ${ended.find((r) => r.status !== 'succeeded')?.failureReason}`
          : ''),
    );
  } finally {
    await Promise.all(workers.map((w) => stop(w)));
  }
}

// ---------------------------------------------------------------- c) one huge run

async function hugeRun(owner: ApiClient, ashId: number, workerCount: number) {
  const workers = await startWorkers(workerCount);
  const pids = workers.map(workerPid);
  const peaks = pids.map(() => 0);
  const sample = () =>
    pids.forEach((pid, i) => {
      const m = peakMemory(pid);
      if (m !== null) peaks[i] = Math.max(peaks[i], m);
    });
  const sampler = setInterval(sample, 500);
  const cpu0 = pids.map(cpuTimeMs);
  const loadBefore = loadAverage();
  try {
    const t0 = Date.now();
    const { run } = await owner.post<{ run: RunView }>(
      `/api/projects/${ashId}/runs`,
      { iterations: BIG_ITERATIONS, seed: 42 },
      201,
    );
    const deadline = t0 + num('SCALE_BIG_TIMEOUT_S', 3600) * 1000;
    let view = run;
    let reported = t0;
    while (!TERMINAL.has(view.status)) {
      if (Date.now() > deadline) throw new Error(`run ${run.id} had not ended by the time limit`);
      await sleep(1000);
      view = (await owner.get<{ run: RunView }>(`/api/projects/${ashId}/runs/${run.id}`)).run;
      if (Date.now() - reported > 30_000) {
        reported = Date.now();
        console.log(
          `    … ${view.status}, ${(view.progress * 100).toFixed(0)} % after ${((reported - t0) / 1000).toFixed(0)} s`,
        );
      }
    }
    const wall = Date.now() - t0;
    // VmHWM only grows: read before the workers stop, it is each one's peak over the whole run.
    sample();
    const own =
      view.startedAt && view.finishedAt ? Date.parse(view.finishedAt) - Date.parse(view.startedAt) : NaN;
    console.log(
      `  ${workerCount} worker(s): ${view.status}${view.failureReason ? ` (${view.failureReason})` : ''}, ` +
        `wall ${(wall / 1000).toFixed(1)} s from the request (${(own / 1000).toFixed(1)} s started → finished)  ` +
        `load ${loadBefore} → ${loadAverage()}`,
    );
    pids.forEach((pid, i) =>
      console.log(
        `    worker ${i + 1} (pid ${pid}): peak ${MiB(peaks[i])}, CPU ${((cpuTimeMs(pid) - cpu0[i]) / 1000).toFixed(1)} s` +
          (peaks[i] > 512 * 1048576 ? '  over 512 MiB' : ''),
      ),
    );
  } finally {
    clearInterval(sampler);
    await Promise.all(workers.map((w) => stop(w)));
  }
}

// ---------------------------------------------------------------- main

async function main() {
  console.log(
    `Scale benchmark, ${new Date().toISOString()}, ${os.cpus().length} CPUs, load ${loadAverage()}`,
  );
  setUp();
  const urls = ports.map((p) => `http://localhost:${p}`);
  const webs = [];
  for (const port of ports) webs.push(await startWeb(port));
  console.log(
    `Web instances on ${ports.join(' and ')} with REDIS_URL ${env.REDIS_URL}, prefix ${env.OUTTURN_QUEUE_PREFIX}.`,
  );
  const cookie = await signInCookie(urls[0], DEMO_OWNER);
  const owner = apiClient(urls[0], cookie);
  const projects = await demoProjects(owner);
  const ashId = projects.find((p) => p.code === 'ASH-WTP')!.id;

  const queueParts = ['b', 'c'].filter((p) => PARTS.has(p));
  if (queueParts.length && !hasWorker) {
    console.log(
      `\n${queueParts.map((p) => `${p})`).join(' and ')} skipped: this checkout has no \`npm run worker\` (queue mode's worker).`,
    );
  } else {
    if (PARTS.has('b')) {
      const targets = await runTargets(urls[0], owner, projects);
      console.log(
        `\nb) Runs per minute: ${RUNS} runs of ${RUN_ITERATIONS.toLocaleString('en')} iterations over ` +
          `${targets.length} copies of the demo projects in ${ORGS} organisation(s); each worker runs one at a time, 1 engine thread.`,
      );
      for (const count of WORKER_COUNTS) {
        try {
          await runsPerMinute(targets, count);
        } catch (e) {
          console.log(`  ${count} worker(s): not measured: ${(e as Error).message}`);
        }
      }
    }
    if (PARTS.has('c')) {
      console.log(`\nc) One run of ${BIG_ITERATIONS.toLocaleString('en')} iterations on ASH-WTP:`);
      for (const count of [1, 2]) {
        try {
          await hugeRun(owner, ashId, count);
        } catch (e) {
          console.log(`  ${count} worker(s): not measured: ${(e as Error).message}`);
        }
      }
    }
  }
  if (PARTS.has('a')) await readApis(urls, cookie, ashId, webs);

  for (const web of webs) await stop(web);
  tearDown();
  console.log(`\nDone; load ${loadAverage()}. Logs in ${RUN_DIR}.`);
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  tearDown();
  process.exit(1);
});
