// The web tier across instances in queue mode: two `next start` instances (the slot's build) with
// REDIS_URL and one queue worker. A run started on instance A is executed by the worker, and
// instance B — which never saw the request — shows it queued, progressing and finished, because
// every page and route reads the run's row in the database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { APP_URL, newOrganisation } from './helpers/http';
import { closeDb } from './helpers/db';
import {
  buildWorkerBundle,
  freshPrefix,
  startWebInstance,
  startWorker,
  type Child,
} from './helpers/processes';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

const children: Child[] = [];
// Long enough on the small test model (a few seconds in bounded memory) for several progress
// writes, which come every 250 ms; at 1,000,000 it can finish between two polls.
const ITERATIONS = 10_000_000;
const port = Number(new URL(APP_URL).port);
const urlA = `http://localhost:${port + 1}`;
const urlB = `http://localhost:${port + 2}`;

beforeAll(async () => {
  buildWorkerBundle();
  // One job per run (no split), so that the run's progress is the worker's own writes.
  const env = { OUTTURN_QUEUE_PREFIX: freshPrefix('web'), OUTTURN_SPLIT_FROM: String(ITERATIONS + 1) };
  const started = await Promise.allSettled([
    startWebInstance(port + 1, env),
    startWebInstance(port + 2, env),
    startWorker(env),
  ]);
  for (const s of started) if (s.status === 'fulfilled') children.push(s.value);
  for (const s of started) if (s.status === 'rejected') throw s.reason;
}, 300_000);

afterAll(async () => {
  await Promise.all(children.map((c) => c.stop('SIGTERM')));
  await closeDb();
});

describe('two web instances and a worker', () => {
  it('a run started on instance A is seen progressing and finished on instance B', async () => {
    const { client } = await newOrganisation('queue-web');
    const projectId = await projectWithRegisters(client);
    const onA = client.copy(urlA);
    const onB = client.copy(urlB);

    const started = await onA.post(`/api/projects/${projectId}/runs`, { iterations: ITERATIONS, seed: 17 });
    expect(started.status).toBe(201);
    const runId = started.json.run.id;

    // B reports the worker's progress as it is written: at least two different counts short of the end.
    const seen = new Set<number>();
    await waitForRun(
      onB,
      projectId,
      runId,
      (r) => {
        if (r.status === 'running' && r.iterationsDone > 0 && r.iterationsDone < ITERATIONS)
          seen.add(r.iterationsDone);
        return seen.size >= 2 || r.status === 'succeeded' || r.status === 'failed';
      },
      120_000,
    );
    expect(seen.size).toBe(2);

    const done = await waitForRun(onB, projectId, runId, (r) => r.status !== 'running', 180_000);
    expect(done.status).toBe('succeeded');
    expect(done.progress).toBe(1);
    const result = await onB.get(`/api/projects/${projectId}/runs/${runId}/result`);
    expect(result.status).toBe(200);
    const list = await onA.get(`/api/projects/${projectId}/runs`);
    expect(list.json.runs.find((r: { id: number }) => r.id === runId).status).toBe('succeeded');
  });
});
