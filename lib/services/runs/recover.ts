import 'server-only';
/**
 * Embedded, at server start no run can still be executing: a run left 'running' was interrupted
 * by the restart. It is marked failed with the reason, never left running for ever. In queue
 * mode the workers own running runs (a dead worker's job is handed on by the queue), so the
 * server leaves them alone. Runs still 'queued' go (again) to the executor: adding a run twice
 * is one job, and a queue that lost its jobs gets them back.
 */

import { componentLogger } from '@/lib/log';
import { logUnexpected } from '@/lib/http/log-error';
import { Op, type WhereOptions } from 'sequelize';
import { SimulationRun } from '@/models';
import { runExecutor } from './executor';
import { notifyFinished } from './runner';

export const INTERRUPTED_REASON =
  'The server restarted while this run was in progress, so it did not finish. Start it again: its settings and seed are kept on this page.';

export async function recoverInterruptedRuns(
  options: { organizationId?: number; resumeQueued?: boolean } = {},
): Promise<{ failed: number; resumed: number }> {
  const scope: WhereOptions = options.organizationId ? { organizationId: options.organizationId } : {};
  const executor = runExecutor();
  const running = executor.executesHere
    ? await SimulationRun.findAll({ where: { ...scope, status: 'running' }, attributes: ['id'] })
    : [];
  const ids = running.map((r) => r.id);
  const [failed] = ids.length
    ? await SimulationRun.update(
        { status: 'failed', failureReason: INTERRUPTED_REASON, finishedAt: new Date() },
        { where: { id: ids, status: 'running' } },
      )
    : [0];
  // The person who started each run hears that it did not finish.
  for (const id of ids) await notifyFinished(id);
  let resumed = 0;
  if (options.resumeQueued ?? true) {
    const queued = await SimulationRun.findAll({
      where: { ...scope, status: { [Op.eq]: 'queued' } },
      attributes: ['id', 'organizationId'],
      order: [['id', 'ASC']],
    });
    for (const run of queued) await executor.schedule({ runId: run.id, organizationId: run.organizationId });
    resumed = queued.length;
  }
  return { failed, resumed };
}

export const STALE_REASON =
  'This run stopped reporting (the server lost its database connection or stopped while it ran), so it did not finish. Start it again: its settings and seed are kept on this page.';
/** A running run's row is written at least every few seconds; this long without a write means it is lost. */
export const STALE_AFTER_MS = 10 * 60_000;
export const SWEEP_EVERY_MS = 60_000;

/**
 * Ends runs left 'running' that no executor holds (not in this process's queue, or no live job
 * in queue mode) and whose row has not been written for STALE_AFTER_MS (a final write lost to a
 * database outage leaves exactly that).
 */
export async function sweepStaleRuns(
  options: { organizationId?: number; staleAfterMs?: number } = {},
): Promise<{ failed: number }> {
  const scope: WhereOptions = options.organizationId ? { organizationId: options.organizationId } : {};
  const before = new Date(Date.now() - (options.staleAfterMs ?? STALE_AFTER_MS));
  const stale = await SimulationRun.findAll({
    where: { ...scope, status: 'running', updatedAt: { [Op.lt]: before } },
    attributes: ['id'],
  });
  const executor = runExecutor();
  const ids: number[] = [];
  for (const r of stale) if (!(await executor.isLive(r.id))) ids.push(r.id);
  const [failed] = ids.length
    ? await SimulationRun.update(
        { status: 'failed', failureReason: STALE_REASON, finishedAt: new Date() },
        { where: { id: ids, status: 'running', updatedAt: { [Op.lt]: before } } },
      )
    : [0];
  for (const id of ids) await notifyFinished(id);
  return { failed };
}

/** Sweeps stale runs every SWEEP_EVERY_MS for the life of the server process (started once). */
export function startRunSweeper() {
  const holder = globalThis as unknown as { outturnRunSweeper?: NodeJS.Timeout };
  if (holder.outturnRunSweeper) return;
  holder.outturnRunSweeper = setInterval(() => {
    sweepStaleRuns().catch((e) => logUnexpected(componentLogger('runs'), 'Stale runs not swept', e));
  }, SWEEP_EVERY_MS);
  holder.outturnRunSweeper.unref();
}
