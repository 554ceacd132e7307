// Queue mode from the workers' side. This test process plays the web tier: with REDIS_URL set it
// calls the runs service (start, cancel) as a route would, so the service only adds BullMQ jobs
// and publishes cancels; separate worker processes (the bundle of `npm run worker`) execute the
// runs. Each test has its own queue prefix and its own workers. What is checked is read from the
// database: statuses, the number of runs running at once, the attempts, the stored result.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { buildWorkerBundle, freshPrefix, REDIS_TEST_URL, startWorker, type Child } from './helpers/processes';
import { projectWithRegisters } from './runs-fixtures';
import { cancelRun, startRun } from '@/lib/services/runs';
import { runQueue, runJobId, closeRunQueues } from '@/lib/queue/run-queue';
import { closeRedisConnections } from '@/lib/queue/redis';
import { runSimulation } from '@/lib/sim/runtime';
import { sequelize } from '@/models';

process.env.REDIS_URL = REDIS_TEST_URL;

const workers: Child[] = [];
async function worker(env: Record<string, string>) {
  const child = await startWorker(env);
  workers.push(child);
  return child;
}

beforeAll(buildWorkerBundle);
afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop('SIGKILL')));
  await closeRunQueues();
  await closeRedisConnections();
  await closeDb();
  await sequelize.close();
});

/** Uses a fresh queue prefix here and in the workers started after. */
function usePrefix(label: string) {
  const prefix = freshPrefix(label);
  process.env.OUTTURN_QUEUE_PREFIX = prefix;
  return { OUTTURN_QUEUE_PREFIX: prefix };
}

async function ownerOf(label: string) {
  const org = await newOrganisation(label);
  const [user] = await rows<{ id: number }>('SELECT id FROM Users WHERE email = ?', [org.email]);
  const actor: Actor = {
    userId: user.id,
    organizationId: org.organizationId,
    role: 'owner',
    email: org.email,
    name: `${label} owner`,
  };
  return { actor, projectId: await projectWithRegisters(org.client) };
}

type Row = {
  status: string;
  iterationsDone: number;
  attempts: number;
  result: string | null;
  resultSample: string | null;
  failureReason: string | null;
};
const runRow = async (id: number) =>
  (
    await rows<Row>(
      'SELECT status, iterationsDone, attempts, result, resultSample, failureReason FROM SimulationRuns WHERE id = ?',
      [id],
    )
  )[0];

async function waitFor(id: number, done: (row: Row) => boolean, timeoutMs = 120_000): Promise<Row> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const row = await runRow(id);
    if (done(row)) return row;
    if (Date.now() > end) throw new Error(`run ${id} still ${row.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * The engine run again in this process on the run's stored snapshot and settings. Plumbing: it
 * checks that the worker ran the stored snapshot and seed through the same engine and stored its
 * result whole, not the engine's numbers (the engine's own tests check those against references).
 */
async function sameAsHere(runId: number, options: { bounded?: boolean; chunkBlocks?: number } = {}) {
  const [run] = await rows<{ inputSnapshot: string; settings: string | Record<string, any>; result: string }>(
    'SELECT inputSnapshot, settings, result FROM SimulationRuns WHERE id = ?',
    [runId],
  );
  const settings = typeof run.settings === 'string' ? JSON.parse(run.settings) : run.settings;
  const expected = await runSimulation(JSON.parse(run.inputSnapshot), {
    iterations: settings.iterations,
    seed: settings.seed,
    sampling: settings.sampling,
    threads: 1,
    ...options,
  });
  const { elapsedMs: _stored, ...got } = JSON.parse(run.result);
  const { elapsedMs: _here, ...want } = JSON.parse(JSON.stringify(expected));
  expect(got).toEqual(want);
}

describe('runs executed by queue workers', () => {
  it('a run completes through a worker process, with the result of the stored snapshot and seed', async () => {
    const env = usePrefix('complete');
    await worker(env);
    const { actor, projectId } = await ownerOf('queue-complete');
    const run = await startRun(actor, projectId, { iterations: 50_000, seed: 11 });
    expect(run.status).toBe('queued');
    const done = await waitFor(run.id, (r) => r.status === 'succeeded' || r.status === 'failed');
    expect(done.failureReason).toBeNull();
    expect(done.status).toBe('succeeded');
    expect(done.attempts).toBe(1);
    expect(JSON.parse(done.resultSample!).n).toBeGreaterThan(0);
    await sameAsHere(run.id);
    // The job is gone once the run is recorded.
    expect(await runQueue().getJobState(runJobId(run.id))).toBe('unknown');
  });

  it('a cancel reaches the worker: the engine stops, and the worker goes on serving', async () => {
    const env = usePrefix('cancel');
    const { actor, projectId } = await ownerOf('queue-cancel');
    // With no worker yet, a cancelled run's waiting job is taken out of the queue.
    const waiting = await startRun(actor, projectId, { iterations: 20_000, seed: 2 });
    expect(await runQueue().getJobState(runJobId(waiting.id))).toBe('waiting');
    expect((await cancelRun(actor, projectId, waiting.id)).status).toBe('cancelled');
    expect(await runQueue().getJobState(runJobId(waiting.id))).toBe('unknown');

    await worker(env);
    const run = await startRun(actor, projectId, { iterations: 900_000, seed: 3 });
    await waitFor(run.id, (r) => r.status === 'running' && r.iterationsDone > 0);
    const cancelled = await cancelRun(actor, projectId, run.id);
    expect(cancelled.status).toBe('cancelled');
    // The worker's job ends soon after (it is dropped when done): the engine was aborted.
    const end = Date.now() + 10_000;
    while ((await runQueue().getJobState(runJobId(run.id))) === 'active' && Date.now() < end)
      await new Promise((r) => setTimeout(r, 100));
    expect(await runQueue().getJobState(runJobId(run.id))).toBe('unknown');
    const after = await runRow(run.id);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await runRow(run.id)).toEqual(after);
    expect(after.status).toBe('cancelled');
    expect(after.result).toBeNull();
    expect(after.iterationsDone).toBeLessThan(900_000);

    const next = await startRun(actor, projectId, { iterations: 20_000, seed: 4 });
    expect((await waitFor(next.id, (r) => r.status !== 'queued' && r.status !== 'running')).status).toBe(
      'succeeded',
    );
  });

  it('a worker killed mid-run: another worker starts the run again and its result is right', async () => {
    const env = usePrefix('killed');
    const first = await worker(env);
    const { actor, projectId } = await ownerOf('queue-killed');
    const run = await startRun(actor, projectId, { iterations: 900_000, seed: 21 });
    await waitFor(run.id, (r) => r.status === 'running' && r.iterationsDone > 0);
    await first.stop('SIGKILL');
    expect((await runRow(run.id)).status).toBe('running');
    await worker(env);
    // The stalled-job check hands the job on within the lock time and the check interval.
    const done = await waitFor(run.id, (r) => r.status === 'succeeded' || r.status === 'failed', 180_000);
    expect(done.status).toBe('succeeded');
    expect(done.attempts).toBe(2);
    await sameAsHere(run.id);
  });

  it('a worker told to stop hands its run back without using an attempt, and exits 0', async () => {
    const env = usePrefix('shutdown');
    const first = await worker(env);
    const { actor, projectId } = await ownerOf('queue-shutdown');
    const run = await startRun(actor, projectId, { iterations: 900_000, seed: 5 });
    await waitFor(run.id, (r) => r.status === 'running' && r.iterationsDone > 0);
    expect(await first.stop('SIGTERM')).toBe(0);
    const back = await runRow(run.id);
    expect(back).toMatchObject({ status: 'queued', iterationsDone: 0, attempts: 0 });
    expect(await runQueue().getJobState(runJobId(run.id))).toMatch(/^(waiting|delayed)$/);
    await worker(env);
    const done = await waitFor(run.id, (r) => r.status === 'succeeded' || r.status === 'failed');
    expect(done).toMatchObject({ status: 'succeeded', attempts: 1 });
  });

  it('keeps two runs of an organisation and OUTTURN_MAX_RUNNING runs in all at once', async () => {
    const env = { ...usePrefix('limits'), OUTTURN_WORKER_CONCURRENCY: '3', OUTTURN_MAX_RUNNING: '3' };
    await Promise.all([worker(env), worker(env)]);
    const x = await ownerOf('queue-limit-x');
    const y = await ownerOf('queue-limit-y');
    const ids: number[] = [];
    for (let i = 0; i < 3; i++)
      ids.push((await startRun(x.actor, x.projectId, { iterations: 300_000, seed: i + 1 })).id);
    for (let i = 0; i < 2; i++)
      ids.push((await startRun(y.actor, y.projectId, { iterations: 300_000, seed: i + 1 })).id);
    let most = { x: 0, y: 0, all: 0 };
    const end = Date.now() + 180_000;
    for (;;) {
      const states = await rows<{ organizationId: number; status: string }>(
        'SELECT organizationId, status FROM SimulationRuns WHERE id IN (?)',
        [ids],
      );
      const running = (org?: number) =>
        states.filter((s) => s.status === 'running' && (org === undefined || s.organizationId === org))
          .length;
      most = {
        x: Math.max(most.x, running(x.actor.organizationId)),
        y: Math.max(most.y, running(y.actor.organizationId)),
        all: Math.max(most.all, running()),
      };
      if (states.every((s) => s.status !== 'queued' && s.status !== 'running')) {
        expect(states.map((s) => s.status)).toEqual(Array(5).fill('succeeded'));
        break;
      }
      if (Date.now() > end) throw new Error(`runs not done: ${JSON.stringify(states)}`);
      await new Promise((r) => setTimeout(r, 50));
    }
    // Six places across two workers, but never more than two of one organisation, three in all.
    expect(most.x).toBe(2);
    expect(most.y).toBeLessThanOrEqual(2);
    expect(most.all).toBe(3);
  });
});

describe('a big run split across workers', () => {
  // Low thresholds make a small run split: 300,000 iterations are 3 chunks of the bounded form
  // (128,000 iterations each, the last shorter), one part per chunk in each pass.
  const split = { OUTTURN_SPLIT_FROM: '200000', OUTTURN_SPLIT_PARTS: '3' };

  it('merges the parts computed by two workers into the one-process bounded result, to the bit', async () => {
    const env = { ...usePrefix('split'), ...split, OUTTURN_WORKER_CONCURRENCY: '2' };
    await Promise.all([worker(env), worker(env)]);
    const { actor, projectId } = await ownerOf('queue-split');
    const run = await startRun(actor, projectId, { iterations: 300_000, seed: 31 });
    // The run's own job waits for its parts (it is their parent) rather than executing the run.
    const states = new Set<string>();
    let watching = true;
    const watch = (async () => {
      while (watching) {
        states.add(await runQueue().getJobState(runJobId(run.id)));
        await new Promise((r) => setTimeout(r, 50));
      }
    })();
    const done = await waitFor(run.id, (r) => r.status === 'succeeded' || r.status === 'failed');
    watching = false;
    await watch;
    expect(states).toContain('waiting-children');
    expect(done.failureReason).toBeNull();
    expect(done).toMatchObject({ status: 'succeeded', iterationsDone: 300_000, attempts: 1 });
    expect(JSON.parse(done.resultSample!).n).toBeGreaterThan(0);
    // Plumbing: the same engine's bounded form in one process, all fields but elapsedMs.
    await sameAsHere(run.id, { bounded: true });
    expect(await runQueue().getJobCounts('active', 'waiting', 'waiting-children', 'delayed')).toEqual({
      active: 0,
      waiting: 0,
      'waiting-children': 0,
      delayed: 0,
    });
  });

  it('a cancel stops every part, and a part whose worker is killed is computed again', async () => {
    const env = { ...usePrefix('split-stop'), ...split, OUTTURN_SPLIT_FROM: '500000' };
    const [first] = await Promise.all([worker(env), worker(env)]);
    const { actor, projectId } = await ownerOf('queue-split-stop');

    const cancelled = await startRun(actor, projectId, { iterations: 900_000, seed: 41 });
    await waitFor(cancelled.id, (r) => r.status === 'running' && r.iterationsDone > 0);
    expect((await cancelRun(actor, projectId, cancelled.id)).status).toBe('cancelled');
    const end = Date.now() + 20_000;
    const busy = async () => {
      const counts = await runQueue().getJobCounts('active', 'waiting', 'waiting-children', 'delayed');
      return Object.values(counts).reduce((a, b) => a + b, 0);
    };
    while ((await busy()) > 0 && Date.now() < end) await new Promise((r) => setTimeout(r, 200));
    expect(await busy()).toBe(0);
    const after = await runRow(cancelled.id);
    expect(after).toMatchObject({ status: 'cancelled', result: null });
    expect(after.iterationsDone).toBeLessThan(900_000);

    const run = await startRun(actor, projectId, { iterations: 900_000, seed: 42 });
    await waitFor(run.id, (r) => r.status === 'running' && r.iterationsDone > 0);
    await first.stop('SIGKILL');
    const done = await waitFor(run.id, (r) => r.status === 'succeeded' || r.status === 'failed', 180_000);
    expect(done.failureReason).toBeNull();
    expect(done.status).toBe('succeeded');
    // Plumbing, as above: parts computed again give the same merged result.
    await sameAsHere(run.id, { bounded: true });
  });
});
