import 'server-only';
/**
 * Claims of a queued run by the attempt that will execute it. Each claim writes a fresh token to
 * the row; the attempt's progress and final writes require the row to still hold it, so a run
 * handed to another attempt (its worker died) or cancelled meanwhile is never written twice.
 */

import { randomUUID } from 'node:crypto';
import { Op, QueryTypes } from 'sequelize';
import { SimulationRun, sequelize } from '@/models';
import { CURRENT_ENGINE } from './engine-match';
import { MAX_RUNNING_PER_ORG } from './queue';
import type { Claim } from './runner';

/** How many times a worker may start one run before it is failed (a run that kills its worker). */
export const MAX_ATTEMPTS = 2;

export const WORKER_LOST_REASON =
  `The worker executing this run stopped ${MAX_ATTEMPTS} times before it finished, so it was not started again. ` +
  'Start it again: its settings and seed are kept on this page.';

const started = () => ({
  status: 'running' as const,
  startedAt: new Date(),
  progress: 0,
  iterationsDone: 0,
  progressMarks: null,
  attemptToken: randomUUID(),
  ...CURRENT_ENGINE,
});

/** In the server's own queue, which keeps the organisation's limit in memory: queued → running. */
export async function claimQueuedRun(runId: number): Promise<Claim> {
  const values = started();
  const [claimed] = await SimulationRun.update(
    { ...values, attempts: sequelize.literal('attempts + 1') },
    // Only a run still queued starts: a cancel may have come first.
    { where: { id: runId, status: 'queued' } },
  );
  return claimed ? { kind: 'started', token: values.attemptToken } : { kind: 'skip' };
}

/**
 * For a queue worker: in one transaction that holds the organisation's row, so that two workers
 * claiming runs of one organisation at once count each other, the run starts only while fewer
 * than MAX_RUNNING_PER_ORG others run. A run found 'running' was held by a worker that died (the
 * queue handed its job on): it starts again from scratch, unless it has had MAX_ATTEMPTS.
 */
export async function claimRunForWorker(runId: number): Promise<Claim> {
  return sequelize.transaction(async (transaction) => {
    const run = await SimulationRun.findByPk(runId, {
      attributes: ['id', 'organizationId', 'status', 'attempts'],
      transaction,
    });
    if (!run || (run.status !== 'queued' && run.status !== 'running')) return { kind: 'skip' };
    await sequelize.query('SELECT id FROM Organizations WHERE id = ? FOR UPDATE', {
      replacements: [run.organizationId],
      type: QueryTypes.SELECT,
      transaction,
    });
    const current = await SimulationRun.findByPk(runId, {
      attributes: ['id', 'status', 'attempts'],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!current || (current.status !== 'queued' && current.status !== 'running')) return { kind: 'skip' };
    if (current.status === 'running' && current.attempts >= MAX_ATTEMPTS) {
      await SimulationRun.update(
        { status: 'failed', failureReason: WORKER_LOST_REASON, finishedAt: new Date(), attemptToken: null },
        { where: { id: runId, status: 'running' }, transaction },
      );
      return { kind: 'ended' };
    }
    const running = await SimulationRun.count({
      where: { organizationId: run.organizationId, status: 'running', id: { [Op.ne]: runId } },
      transaction,
    });
    if (running >= MAX_RUNNING_PER_ORG) {
      // A run its dead worker left 'running' waits as queued, not holding one of the places.
      if (current.status === 'running') {
        await SimulationRun.update(
          { status: 'queued', startedAt: null, progress: 0, iterationsDone: 0, attemptToken: null },
          { where: { id: runId }, transaction },
        );
      }
      return { kind: 'busy' };
    }
    const values = started();
    await SimulationRun.update(
      { ...values, attempts: current.attempts + 1 },
      { where: { id: runId }, transaction },
    );
    return { kind: 'started', token: values.attemptToken };
  });
}
