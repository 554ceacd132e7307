import 'server-only';
/**
 * The in-process queue of runs. At most MAX_RUNNING_PER_ORG runs of one organisation go at
 * once; the others wait in order of arrival. The queue lives on globalThis because the server
 * may load this module more than once (one copy per route bundle) and all must share one queue.
 * What is queued is also in the database (status 'queued'), so a restart can pick it up again.
 */

import { runLogger } from '@/lib/log';
import { logUnexpected } from '@/lib/http/log-error';

export const MAX_RUNNING_PER_ORG = 2;

export type Job = { runId: number; organizationId: number };

type Active = { organizationId: number; controller: AbortController; settled: Promise<void> };

type QueueState = {
  waiting: Job[];
  active: Map<number, Active>;
  execute: ((job: Job, signal: AbortSignal) => Promise<void>) | null;
};

const holder = globalThis as unknown as { outturnRunQueue?: QueueState };
const state: QueueState = (holder.outturnRunQueue ??= { waiting: [], active: new Map(), execute: null });

/** Installs the function that executes one job (set once by the runner). */
export function setExecutor(execute: QueueState['execute']) {
  state.execute = execute;
}

function runningFor(organizationId: number): number {
  let n = 0;
  for (const a of state.active.values()) if (a.organizationId === organizationId) n++;
  return n;
}

function pump() {
  const execute = state.execute;
  if (!execute) return;
  for (let i = 0; i < state.waiting.length;) {
    const job = state.waiting[i];
    if (runningFor(job.organizationId) >= MAX_RUNNING_PER_ORG) {
      i++;
      continue;
    }
    state.waiting.splice(i, 1);
    const controller = new AbortController();
    const settled = execute(job, controller.signal)
      .catch((e) => logUnexpected(runLogger(job.runId), 'Run stopped unexpectedly', e))
      .finally(() => {
        state.active.delete(job.runId);
        pump();
      });
    state.active.set(job.runId, { organizationId: job.organizationId, controller, settled });
  }
}

export function enqueue(job: Job) {
  if (state.active.has(job.runId) || state.waiting.some((w) => w.runId === job.runId)) return;
  state.waiting.push(job);
  pump();
}

/** Takes a waiting job out of the queue; false when it was not waiting here. */
export function dequeue(runId: number): boolean {
  const i = state.waiting.findIndex((w) => w.runId === runId);
  if (i < 0) return false;
  state.waiting.splice(i, 1);
  return true;
}

/** Aborts an active job and waits (up to `waitMs`) for it to wind down; false when not active. */
export async function abortActive(runId: number, waitMs = 10_000): Promise<boolean> {
  const active = state.active.get(runId);
  if (!active) return false;
  active.controller.abort();
  await Promise.race([active.settled, new Promise((resolve) => setTimeout(resolve, waitMs))]);
  return true;
}

export function isActive(runId: number): boolean {
  return state.active.has(runId);
}

/** How many runs wait and how many execute in this process (read-only, for the health check). */
export function queueCounts(): { waiting: number; active: number } {
  return { waiting: state.waiting.length, active: state.active.size };
}
