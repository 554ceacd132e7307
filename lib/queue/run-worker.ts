import 'server-only';
/**
 * The queue worker: takes run jobs from BullMQ and executes each with the same executeRun as the
 * embedded server; a big run's job instead becomes the parent of 'run-part' jobs that any worker
 * computes (split-run.ts). Limits: OUTTURN_WORKER_CONCURRENCY runs at once in this process, at most
 * OUTTURN_MAX_RUNNING across every worker (BullMQ's global concurrency), and MAX_RUNNING_PER_ORG
 * per organisation (the claim counts in MariaDB; a run of a full organisation goes back to the
 * delayed set without using an attempt). A cancel arrives on a Redis channel and, as a backstop,
 * as a progress write that finds the row no longer this attempt's.
 *
 * A worker killed outright stops renewing its job's lock; within LOCK_MS + STALLED_CHECK_MS
 * another worker's stalled-job check puts the job back in the queue and the run starts again
 * from scratch (the claim limits that to MAX_ATTEMPTS). A worker told to stop (SIGTERM) takes
 * no more jobs, aborts its engines, gives its runs back to the queue and closes.
 */

import { componentLogger, runLogger } from '@/lib/log';
import { logUnexpected } from '@/lib/http/log-error';
import { DelayedError, UnrecoverableError, Worker, type Job } from 'bullmq';
import { Op } from 'sequelize';
import { SimulationRun, sequelize } from '@/models';
import { executeRun } from '@/lib/services/runs/runner';
import { MAX_ATTEMPTS, claimRunForWorker } from '@/lib/services/runs/claim';
import { notifyFinished } from '@/lib/services/runs/runner';
import { splitRangesFor } from '@/lib/services/runs/split';
import { RUN_QUEUE, closeRedisConnections, positiveInt, queuePrefix, redisConnection } from './redis';
import {
  cancelChannel,
  closeRunQueues,
  runQueue,
  type QueueJobData,
  type RunJobData,
  type RunPartJobData,
} from './run-queue';
import { beginSplit, continueSplit, processPart } from './split-run';

/** A job's lock lasts this long unless renewed (every half of it) by a live worker. */
export const LOCK_MS = 15_000;
/** How often workers look for jobs whose lock expired (their worker died). */
export const STALLED_CHECK_MS = 10_000;
/** A run of a full organisation is looked at again after this wait. */
export const BUSY_RETRY_MS = 1_000;
/** BullMQ progress updates, at most this often (the database has its own interval). */
const JOB_PROGRESS_MS = 1_000;

export const workerConcurrency = () => positiveInt('OUTTURN_WORKER_CONCURRENCY', 1);
export const maxRunning = () => positiveInt('OUTTURN_MAX_RUNNING', 8);

export const JOB_FAILED_REASON =
  'The worker could not execute this run (it failed twice before the engine started). Start it again: its settings and seed are kept on this page.';

/** Ends a run whose job failed for good, unless it already ended. */
async function failRun(runId: number) {
  const [ended] = await SimulationRun.update(
    { status: 'failed', failureReason: JOB_FAILED_REASON, finishedAt: new Date(), attemptToken: null },
    { where: { id: runId, status: { [Op.in]: ['queued', 'running'] } } },
  );
  if (ended) await notifyFinished(runId);
}

export type RunWorker = { worker: Worker; close: () => Promise<void> };

export async function startRunWorker(): Promise<RunWorker> {
  const concurrency = workerConcurrency();
  await runQueue().setGlobalConcurrency(maxRunning());

  // The engines this process runs (whole runs and parts), by run id: a cancel or a shutdown aborts them.
  const active = new Map<number, Set<AbortController>>();
  let closing = false;
  const track = (runId: number) => {
    const controller = new AbortController();
    if (!active.has(runId)) active.set(runId, new Set());
    active.get(runId)!.add(controller);
    if (closing) controller.abort();
    return {
      signal: controller.signal,
      done: () => {
        active.get(runId)?.delete(controller);
        if (active.get(runId)?.size === 0) active.delete(runId);
      },
    };
  };

  const subscriber = redisConnection('cancel-subscriber');
  await subscriber.subscribe(cancelChannel());
  subscriber.on('message', (channel, message) => {
    if (channel !== cancelChannel()) return;
    for (const controller of active.get(Number(message)) ?? []) controller.abort();
  });

  /** Back to the delayed set without using an attempt; `afterMs` 0: another worker may take it now. */
  async function putBack(job: Job, token: string, afterMs: number): Promise<never> {
    await job.moveToDelayed(Date.now() + afterMs, token);
    throw new DelayedError();
  }

  async function processRun(job: Job<RunJobData>, token: string) {
    const { runId } = job.data;
    // A split run's parent, resumed when its parts are done.
    if (job.data.split) return continueSplit(job, token);
    const claim = await claimRunForWorker(runId);
    if (claim.kind === 'busy') return putBack(job, token, BUSY_RETRY_MS);
    if (claim.kind === 'started') {
      const ranges = await splitRangesFor(runId);
      if (ranges) return beginSplit(job, token, claim.token, ranges);
    }
    const tracked = track(runId);
    let lastProgress = 0;
    try {
      const outcome = await executeRun(runId, {
        claim: async () => claim,
        signal: tracked.signal,
        handingBack: () => closing,
        onProgress: (p) => {
          if (Date.now() - lastProgress < JOB_PROGRESS_MS) return;
          lastProgress = Date.now();
          job.updateProgress(Math.round(p * 1000) / 10).catch(() => undefined);
        },
      });
      if (outcome === 'handed-back') return putBack(job, token, 0);
      return outcome;
    } finally {
      tracked.done();
    }
  }

  async function processRunPart(job: Job<RunPartJobData>, token: string) {
    const tracked = track(job.data.runId);
    try {
      const part = await processPart(job, tracked.signal);
      // Stopped by a shutdown rather than a cancel: the part is computed again elsewhere.
      if (part === null && closing) return putBack(job, token, 0);
      return part;
    } finally {
      tracked.done();
    }
  }

  const worker = new Worker<QueueJobData>(
    RUN_QUEUE,
    async (job, token) => {
      if (!token) throw new Error(`job ${job.id}: no lock token`);
      switch (job.data.kind) {
        case 'run':
          return processRun(job as Job<RunJobData>, token);
        case 'run-part':
          return processRunPart(job as Job<RunPartJobData>, token);
        default:
          throw new UnrecoverableError(
            `job ${job.id}: unknown kind "${(job.data as { kind: string }).kind}"`,
          );
      }
    },
    {
      connection: redisConnection('worker'),
      prefix: queuePrefix(),
      concurrency,
      lockDuration: LOCK_MS,
      stalledInterval: STALLED_CHECK_MS,
      // One more hand-over than attempts: the claim then finds the run started MAX_ATTEMPTS times
      // and fails it with the reason, rather than the queue dropping it silently.
      maxStalledCount: MAX_ATTEMPTS,
    },
  );
  worker.on('error', (e) => componentLogger('run-worker').error({ err: e.message }, 'Run worker error'));
  worker.on('failed', (job, error) => {
    if (!job) return;
    runLogger(job.data.runId).warn(
      { jobId: job.id, attempt: job.attemptsMade, err: error.message },
      'Job failed',
    );
    // A part that fails for good is the parent's to report (split-run.ts).
    if (job.data.kind !== 'run') return;
    if (job.attemptsMade >= (job.opts.attempts ?? 1) || error instanceof UnrecoverableError) {
      failRun(job.data.runId).catch((e) =>
        logUnexpected(runLogger(job.data.runId), 'Run not marked failed', e),
      );
    }
  });

  return {
    worker,
    async close() {
      closing = true;
      for (const controllers of active.values()) for (const c of controllers) c.abort();
      // Stops taking jobs and waits for the active ones, which hand their runs back.
      await worker.close();
      await subscriber.unsubscribe().catch(() => undefined);
      await closeRunQueues();
      await closeRedisConnections();
      await sequelize.close();
    },
  };
}
