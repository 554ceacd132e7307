import 'server-only';
/**
 * Where runs execute, chosen once by REDIS_URL: embedded (the server's own in-process queue and
 * engine pool, no Redis) or queue mode (the server only adds a BullMQ job per run; worker
 * processes execute them, see lib/queue/run-worker.ts). The services speak to this interface only.
 */

import { redisUrl } from '@/lib/queue/redis';
import { addRunJob, cancelRunJob, isRunJobLive } from '@/lib/queue/run-queue';
import { abortActive, dequeue, enqueue, isActive, setExecutor, type Job } from './queue';
import { executeRun } from './runner';
import { claimQueuedRun } from './claim';

export type RunExecutor = {
  /** Hands a queued run to whatever executes runs (twice is once). */
  schedule(job: Job): Promise<void>;
  /** Takes a waiting run out and stops an executing one; resolves once the stop is passed on. */
  stop(runId: number): Promise<void>;
  /** Whether the run waits or executes somewhere alive (the stale-run sweeper leaves it alone). */
  isLive(runId: number): Promise<boolean>;
  /**
   * Whether this server process executes the runs: then a run left 'running' at its start was
   * interrupted by the restart. In queue mode the workers own them.
   */
  executesHere: boolean;
};

// The in-process queue executes each job as one attempt; it keeps the organisation's limit itself.
setExecutor(async (job, signal) => {
  await executeRun(job.runId, { claim: () => claimQueuedRun(job.runId), signal });
});

const embedded: RunExecutor = {
  schedule: async (job) => enqueue(job),
  async stop(runId) {
    dequeue(runId);
    if (isActive(runId)) await abortActive(runId);
  },
  isLive: async (runId) => isActive(runId),
  executesHere: true,
};

const queued: RunExecutor = {
  schedule: (job) => addRunJob({ kind: 'run', runId: job.runId, organizationId: job.organizationId }),
  stop: cancelRunJob,
  isLive: isRunJobLive,
  executesHere: false,
};

export function runExecutor(): RunExecutor {
  return redisUrl() ? queued : embedded;
}

/** Hands a queued run to the executor of this mode. */
export function schedule(job: Job): Promise<void> {
  return runExecutor().schedule(job);
}
