import 'server-only';
/**
 * Executes a run, off the request path, in the server process (embedded) or in a queue worker:
 * the engine's worker pool does the sampling, this module only moves the run through its
 * states and writes progress (at most every PROGRESS_INTERVAL_MS) and the outcome to the
 * database.
 */

import { componentLogger, runLogger } from '@/lib/log';
import { logUnexpected } from '@/lib/http/log-error';
import { availableParallelism } from 'node:os';
import type { InferAttributes } from 'sequelize';
import { SimulationCancelledError, type SimulationResult } from '@/lib/sim';
import { runSimulation } from '@/lib/sim/runtime';
import { Project, SimulationRun, User, sequelize } from '@/models';
import type { ProgressMarks, RunSummary } from '@/models/simulation-run';
import type { RunSettings } from '@/lib/validation/runs';
import { formatMoney } from '@/lib/runs/format';
import { CURRENT_ENGINE } from './engine-match';
import { sampleOfRun } from './sample';
import { nonFiniteReason } from './finite';

export const PROGRESS_INTERVAL_MS = 250;

/**
 * Worker threads per run: OUTTURN_RUN_THREADS, else one in a queue worker (a machine scales by
 * running more workers) and half the machine in the server (two runs may go at once), at least two.
 */
function threadsPerRun(): number {
  const configured = Number(process.env.OUTTURN_RUN_THREADS);
  if (Number.isInteger(configured) && configured >= 1) return configured;
  if (process.env.OUTTURN_PROCESS_ROLE === 'worker') return 1;
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

/**
 * Progress writes, never more often than the interval, only while the row still names this
 * attempt. A write that finds the row taken (cancelled from a web instance, or handed to another
 * attempt) calls `lost`, so the engine stops at once rather than running on for nothing.
 */
function progressWriter(runId: number, token: string, planned: number, cap: number | null, lost: () => void) {
  let last = 0;
  let pending: Promise<unknown> = Promise.resolve();
  // The marks of the time left count the share of the work done in planned iterations (a bounded
  // run's two passes would otherwise count twice); with a precision goal, against the cap.
  const share = (done: number, total: number) => Math.min(1, done / (cap ?? total));
  let latest: { done: number; total: number; iterations?: number } | null = null;
  let first: ProgressMarks['first'] | null = null;
  let writing = false;
  const write = () => {
    if (!latest || !first || writing) return;
    const { done, total, iterations } = latest;
    latest = null;
    writing = true;
    last = Date.now();
    pending = SimulationRun.update(
      {
        // With a precision goal the rounds grow as needed, so progress is measured against the cap.
        // A bounded run's work is two passes over its iterations: `iterations` counts them once.
        progress: share(done, total),
        iterationsDone: iterations ?? done,
        progressMarks: { first, latest: { at: last, done: share(done, total) * planned } },
      },
      { where: { id: runId, status: 'running', attemptToken: token } },
    )
      .then(([written]) => {
        if (!written) lost();
      })
      .catch((e) => logUnexpected(runLogger(runId), 'Progress not written', e))
      .finally(() => (writing = false));
  };
  return {
    report(p: { done: number; total: number; iterations?: number }) {
      first ??= { at: Date.now(), done: share(p.done, p.total) * planned };
      latest = p;
      if (Date.now() - last >= PROGRESS_INTERVAL_MS) write();
    },
    /** Waits for the write in flight, so that the final state is written after it. */
    settle: () => pending,
  };
}

/** Waits between tries of the final write: a database that blinks must not leave a run 'running'. */
export const FINAL_WRITE_DELAYS_MS = [500, 1000, 2000, 4000, 8000];

export async function withRetries<T>(what: string, write: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await write();
    } catch (e) {
      const delay = FINAL_WRITE_DELAYS_MS[attempt];
      if (delay === undefined) throw e;
      logUnexpected(componentLogger('runs'), `${what} not written, trying again in ${delay} ms`, e);
      await new Promise((resolve) => setTimeout(resolve, delay));
    }
  }
}

export const reasonOf = (e: unknown) =>
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
    logUnexpected(runLogger(runId), 'Finish notice not queued', e);
  }
}

/**
 * The final write of an attempt: made only while the row is 'running' and names this attempt, so
 * it happens once. When every try fails, the stale-run sweeper (recover.ts) ends the run.
 */
export async function writeOutcome(
  runId: number,
  token: string,
  values: Partial<InferAttributes<SimulationRun>>,
): Promise<void> {
  await withRetries(`run ${runId}: outcome`, () =>
    SimulationRun.update(
      { ...values, finishedAt: new Date(), progressMarks: null },
      { where: { id: runId, status: 'running', attemptToken: token } },
    ),
  ).catch((e) => logUnexpected(runLogger(runId), 'Outcome not written', e));
}

/** The row of a run that succeeded: refused (thrown) when a figure is not a number. */
export async function succeeded(
  snapshot: unknown,
  s: RunSettings,
  result: SimulationResult,
  currency: string | null,
): Promise<Partial<InferAttributes<SimulationRun>>> {
  const unusable = nonFiniteReason(result);
  if (unusable) throw new Error(unusable);
  // The chart sample is computed here, where the run executes, never by the web tier.
  const sample = await sampleOfRun(snapshot, {
    iterations: result.iterations,
    seed: s.seed,
    sampling: s.sampling,
    ...CURRENT_ENGINE,
  });
  return {
    status: 'succeeded',
    progress: 1,
    iterationsDone: result.iterations,
    result: JSON.stringify(result),
    resultSample: JSON.stringify(sample),
    summary: summarize(result, currency),
  };
}

/** What a claim of a run found: started (with this attempt's token), or why not. */
export type Claim =
  | { kind: 'started'; token: string }
  /** Not queued any more (cancelled first, or finished by another attempt): nothing to do. */
  | { kind: 'skip' }
  /** The organisation already runs its limit: try again later. */
  | { kind: 'busy' }
  /** The claim ended the run itself (it failed too often): only the mail is left. */
  | { kind: 'ended' };

export type Attempt = {
  /** Takes the run from 'queued' to 'running' for this attempt, or says why not. */
  claim: () => Promise<Claim>;
  signal: AbortSignal;
  /** True when the abort means "stop and give the run back" (shutdown), not "cancel". */
  handingBack?: () => boolean;
  /** Each progress report, besides the database (a queue job reports to BullMQ too). */
  onProgress?: (progress: number) => void;
};

/** How an attempt ended: the run's outcome was written, or the run was left to someone else. */
export type AttemptOutcome = 'finished' | 'skipped' | 'busy' | 'handed-back';

/** Puts a run that this attempt was executing back in the queue, as if it had never started. */
async function handBack(runId: number, token: string) {
  await withRetries(`run ${runId}: hand-back`, () =>
    SimulationRun.update(
      {
        status: 'queued',
        startedAt: null,
        progress: 0,
        iterationsDone: 0,
        progressMarks: null,
        attemptToken: null,
        attempts: sequelize.literal('GREATEST(attempts, 1) - 1'),
      },
      { where: { id: runId, status: 'running', attemptToken: token } },
    ),
  );
}

/**
 * Executes one attempt of a run: claims it, runs the engine, computes the chart sample and writes
 * the outcome once, on the condition that the row still names this attempt. The same function
 * serves the server's in-process queue and the queue workers.
 */
export async function executeRun(runId: number, attempt: Attempt): Promise<AttemptOutcome> {
  const claim = await attempt.claim();
  if (claim.kind === 'skip') return 'skipped';
  if (claim.kind === 'busy') return 'busy';
  if (claim.kind === 'ended') {
    await notifyFinished(runId);
    return 'finished';
  }
  const { token } = claim;
  const { signal } = attempt;
  const run = await SimulationRun.findByPk(runId);
  if (!run) return 'skipped';
  const project = await Project.findByPk(run.projectId, { attributes: ['currency'] });
  const snapshot = JSON.parse(run.inputSnapshot);
  const s = run.settings;
  // A row taken from this attempt stops the engine as a cancel does; the outcome is not written.
  const lost = new AbortController();
  const stop = AbortSignal.any([signal, lost.signal]);
  const cap = s.precision?.maxIterations ?? null;
  const progress = progressWriter(run.id, token, cap ?? s.iterations, cap, () => lost.abort());
  const finish = async (values: Partial<InferAttributes<SimulationRun>>) => {
    await progress.settle();
    await writeOutcome(run.id, token, values);
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
      signal: stop,
      onProgress: (p) => {
        progress.report(p);
        attempt.onProgress?.(Math.min(1, p.done / (s.precision?.maxIterations ?? p.total)));
      },
    });
    if (stop.aborted) throw new SimulationCancelledError();
    await finish(await succeeded(snapshot, s, result, project?.currency ?? null));
  } catch (e) {
    if (stop.aborted || e instanceof SimulationCancelledError) {
      if (signal.aborted && attempt.handingBack?.()) {
        await progress.settle();
        await handBack(run.id, token);
        return 'handed-back';
      }
      await finish({ status: 'cancelled', failureReason: null });
    } else {
      logUnexpected(runLogger(run.id), 'Run failed', e);
      await finish({ status: 'failed', failureReason: reasonOf(e) });
    }
  }
  await notifyFinished(run.id);
  return 'finished';
}
