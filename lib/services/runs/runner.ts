import 'server-only';
/**
 * Executes queued runs in the server process, off the request path: the engine's worker pool
 * does the sampling, this module only moves the run through its states and writes progress
 * (at most every PROGRESS_INTERVAL_MS) and the outcome to the database.
 */

import { availableParallelism } from 'node:os';
import { Op, type InferAttributes } from 'sequelize';
import { SimulationCancelledError, type SimulationResult } from '@/lib/sim';
import { runSimulation } from '@/lib/sim/runtime';
import { Project, SimulationRun, User } from '@/models';
import type { RunSummary } from '@/models/simulation-run';
import { formatMoney } from '@/lib/runs/format';
import { enqueue, setExecutor, type Job } from './queue';
import { CURRENT_ENGINE } from './engine-match';
import { sampleOfRun } from './sample';
import { nonFiniteReason } from './finite';
import { forgetProgress, noteProgress } from './progress-rate';

export const PROGRESS_INTERVAL_MS = 250;

/** Worker threads per run: half the machine (two runs may go at once), at least two. */
function threadsPerRun(): number {
  const configured = Number(process.env.OUTTURN_RUN_THREADS);
  if (Number.isInteger(configured) && configured >= 1) return configured;
  return Math.max(2, Math.floor(availableParallelism() / 2));
}

export function summarize(result: SimulationResult, currency: string | null): RunSummary {
  const pick = (t: SimulationResult['cost']) => ({
    base: t.base,
    P50: t.percentiles.P50,
    P80: t.percentiles.P80,
    P90: t.percentiles.P90,
  });
  return {
    iterations: result.iterations,
    currency,
    cost: pick(result.cost),
    duration: result.duration ? pick(result.duration) : null,
  };
}

/** Progress writes, never more often than the interval, never after the run has left 'running'. */
function progressWriter(runId: number, cap: number | null) {
  let last = 0;
  let pending: Promise<unknown> = Promise.resolve();
  let latest: { done: number; total: number; iterations?: number } | null = null;
  let writing = false;
  const write = () => {
    if (!latest || writing) return;
    const { done, total, iterations } = latest;
    latest = null;
    writing = true;
    last = Date.now();
    pending = SimulationRun.update(
      // With a precision goal the rounds grow as needed, so progress is measured against the cap.
      // A bounded run's work is two passes over its iterations: `iterations` counts them once.
      { progress: Math.min(1, done / (cap ?? total)), iterationsDone: iterations ?? done },
      { where: { id: runId, status: 'running' } },
    )
      .catch((e) => console.error(`run ${runId}: progress not written`, e))
      .finally(() => (writing = false));
  };
  return {
    report(p: { done: number; total: number; iterations?: number }) {
      noteProgress(runId, p.done);
      latest = p;
      if (Date.now() - last >= PROGRESS_INTERVAL_MS) write();
    },
    /** Waits for the write in flight, so that the final state is written after it. */
    settle: () => pending,
  };
}

/** Waits between tries of the final write: a database that blinks must not leave a run 'running'. */
export const FINAL_WRITE_DELAYS_MS = [500, 1000, 2000, 4000, 8000];

async function withRetries<T>(what: string, write: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await write();
    } catch (e) {
      const delay = FINAL_WRITE_DELAYS_MS[attempt];
      if (delay === undefined) throw e;
      console.error(`${what} not written, trying again in ${delay} ms`, e);
      await new Promise((resolve) => setTimeout(resolve, delay));
    }
  }
}

const reasonOf = (e: unknown) =>
  e instanceof Error && e.message ? e.message : 'The engine stopped with an unexpected error.';

/** Queues the "run finished" mail to whoever started the run. */
export async function notifyFinished(runId: number) {
  try {
    const run = await SimulationRun.findByPk(runId, {
      attributes: [
        'id',
        'number',
        'projectId',
        'status',
        'settings',
        'summary',
        'failureReason',
        'startedById',
      ],
    });
    if (!run || !run.startedById) return;
    const [project, user] = await Promise.all([
      Project.findByPk(run.projectId, { attributes: ['id', 'name', 'currency'] }),
      User.findByPk(run.startedById, { attributes: ['id', 'email', 'name'] }),
    ]);
    if (!project || !user) return;
    const outcome =
      run.status === 'succeeded' ? 'succeeded' : run.status === 'cancelled' ? 'cancelled' : 'failed';
    const s = run.settings;
    const { notifyRunFinished } = await import('@/lib/mail');
    await notifyRunFinished(
      { userId: user.id, email: user.email, name: user.name },
      {
        projectId: project.id,
        projectName: project.name,
        runId: run.id,
        runNumber: run.number,
        outcome,
        p80Text: run.summary ? formatMoney(run.summary.cost.P80, project.currency) : undefined,
        settingsText: `${s.iterations.toLocaleString('en-GB')} iterations, ${s.sampling.toUpperCase()}, seed ${s.seed}`,
        failureText: outcome === 'failed' ? (run.failureReason ?? undefined) : undefined,
      },
    );
  } catch (e) {
    // A mail that cannot be queued must not change the run's outcome.
    console.error(`run ${runId}: finish notice not queued`, e);
  }
}

async function execute(job: Job, signal: AbortSignal): Promise<void> {
  const now = new Date();
  // Only a run still queued starts: a cancel may have come first.
  const [started] = await SimulationRun.update(
    { status: 'running', startedAt: now, progress: 0, iterationsDone: 0, ...CURRENT_ENGINE },
    { where: { id: job.runId, status: 'queued' } },
  );
  if (!started) return;
  const run = await SimulationRun.findByPk(job.runId);
  if (!run) return;
  const project = await Project.findByPk(run.projectId, { attributes: ['currency'] });
  const snapshot = JSON.parse(run.inputSnapshot);
  const s = run.settings;
  const progress = progressWriter(run.id, s.precision?.maxIterations ?? null);
  const finish = async (values: Partial<InferAttributes<SimulationRun>>) => {
    forgetProgress(run.id);
    await progress.settle();
    // When every try fails, the stale-run sweeper (recover.ts) ends the run with a reason.
    await withRetries(`run ${run.id}: outcome`, () =>
      SimulationRun.update(
        { ...values, finishedAt: new Date() },
        { where: { id: run.id, status: { [Op.in]: ['running', 'queued'] } } },
      ),
    ).catch((e) => console.error(`run ${run.id}: outcome not written`, e));
  };
  try {
    const result = await runSimulation(snapshot, {
      iterations: s.iterations,
      seed: s.seed,
      sampling: s.sampling,
      precision: s.precision
        ? { relative: s.precision.relativePercent / 100, maxIterations: s.precision.maxIterations }
        : undefined,
      threads: threadsPerRun(),
      signal,
      onProgress: (p) => progress.report(p),
    });
    if (signal.aborted) throw new SimulationCancelledError();
    const unusable = nonFiniteReason(result);
    if (unusable) throw new Error(unusable);
    const sample = await sampleOfRun(snapshot, {
      iterations: result.iterations,
      seed: s.seed,
      sampling: s.sampling,
      ...CURRENT_ENGINE,
    });
    await finish({
      status: 'succeeded',
      progress: 1,
      iterationsDone: result.iterations,
      result: JSON.stringify(result),
      resultSample: JSON.stringify(sample),
      summary: summarize(result, project?.currency ?? null),
    });
  } catch (e) {
    if (signal.aborted || e instanceof SimulationCancelledError) {
      await finish({ status: 'cancelled', failureReason: null });
    } else {
      console.error(`run ${run.id} failed:`, e);
      await finish({ status: 'failed', failureReason: reasonOf(e) });
    }
  }
  await notifyFinished(run.id);
}

setExecutor(execute);

/** Hands a queued run to the queue of this server process. */
export function schedule(job: Job) {
  enqueue(job);
}
