import 'server-only';
/**
 * The BullMQ queue of runs in queue mode, as both sides see it: the web tier adds one job per run
 * and removes a waiting one on cancel; workers take them (lib/queue/run-worker.ts). The run's row
 * in MariaDB stays the record: a job carries only what finds the row.
 */

import { componentLogger } from '@/lib/log';
import { Queue } from 'bullmq';
import { RUN_QUEUE, queuePrefix, redisConnection } from './redis';

/** Where a split run's parent job is: which attempt holds the run, its pass, its parts' chunks. */
export type SplitState = { token: string; pass: 1 | 2; ranges: [number, number][]; startedAt: number };

/**
 * What a job asks a worker to do; the worker dispatches on `kind`. 'run' executes a run (a big
 * one as the parent of its parts, `split` then saying where it is); 'run-part' computes one pass
 * of the bounded form over a range of chunks for its parent (lib/queue/split-run.ts).
 */
export type RunJobData = { kind: 'run'; runId: number; organizationId: number; split?: SplitState };
export type RunPartJobData = {
  kind: 'run-part';
  runId: number;
  organizationId: number;
  /** The attempt of the run the part belongs to: a part of an earlier attempt does nothing. */
  token: string;
  pass: 1 | 2;
  from: number;
  to: number;
};
export type QueueJobData = RunJobData | RunPartJobData;

/** One job per run: adding the same run twice is one job. */
export const runJobId = (runId: number) => `run-${runId}`;

/**
 * Thrown errors (the database away at the claim) are tried again with a growing wait; a worker
 * that dies is handled by the stalled-job check instead (see run-worker.ts), not by attempts.
 */
export const RUN_JOB_ATTEMPTS = 2;

/** The channel on which a web instance tells every worker that a run was cancelled. */
export const cancelChannel = () => `${queuePrefix()}:run-cancelled`;

const holder = globalThis as unknown as { outturnBullQueues?: Map<string, Queue> };
const queues: Map<string, Queue> = (holder.outturnBullQueues ??= new Map());

/** The queue of runs under this process's prefix (one shared instance per prefix). */
export function runQueue(): Queue {
  const prefix = queuePrefix();
  let queue = queues.get(prefix);
  if (!queue) {
    queue = new Queue(RUN_QUEUE, { connection: redisConnection('queue'), prefix });
    queue.on('error', (e) => componentLogger('run-queue').error({ err: e.message }, 'Run queue error'));
    queues.set(prefix, queue);
  }
  return queue;
}

export async function addRunJob(data: RunJobData): Promise<void> {
  await runQueue().add(data.kind, data, {
    jobId: runJobId(data.runId),
    attempts: RUN_JOB_ATTEMPTS,
    backoff: { type: 'exponential', delay: 5_000 },
    // The row is the record: a finished job is dropped, a failed one kept a day for inspection.
    removeOnComplete: true,
    removeOnFail: { age: 24 * 3600 },
  });
}

/** Job states in which a run is still in a worker's hands or waiting for one. */
const LIVE_STATES = new Set(['active', 'waiting', 'delayed', 'prioritized', 'waiting-children']);

export async function isRunJobLive(runId: number): Promise<boolean> {
  return LIVE_STATES.has(await runQueue().getJobState(runJobId(runId)));
}

/**
 * Stops a run wherever it is: a waiting job is removed; every worker hears the cancel and the
 * one executing the run aborts its engine.
 */
export async function cancelRunJob(runId: number): Promise<void> {
  const job = await runQueue().getJob(runJobId(runId));
  // Only a job that waits is removed: an active one is locked by its worker, and a split run's
  // parent waiting for its parts ends when they do; the message below stops them all.
  const state = await job?.getState();
  if (job && (state === 'waiting' || state === 'delayed' || state === 'prioritized'))
    await job.remove().catch(() => undefined);
  await redisConnection('queue').publish(cancelChannel(), String(runId));
}

/** Closes the queues this process opened (graceful shutdown). */
export async function closeRunQueues(): Promise<void> {
  const open = [...queues.values()];
  queues.clear();
  await Promise.all(open.map((q) => q.close().catch(() => undefined)));
}
