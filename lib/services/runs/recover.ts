import 'server-only';
/**
 * At server start, no run can still be executing: a run left 'running' was interrupted by the
 * restart. It is marked failed with the reason, never left running for ever. Runs still
 * 'queued' never started; they go back into this process's queue.
 */

import { Op, type WhereOptions } from 'sequelize';
import { SimulationRun } from '@/models';
import { notifyFinished, schedule } from './runner';

export const INTERRUPTED_REASON =
  'The server restarted while this run was in progress, so it did not finish. Start it again: its settings and seed are kept on this page.';

export async function recoverInterruptedRuns(
  options: { organizationId?: number; resumeQueued?: boolean } = {},
): Promise<{ failed: number; resumed: number }> {
  const scope: WhereOptions = options.organizationId ? { organizationId: options.organizationId } : {};
  const running = await SimulationRun.findAll({ where: { ...scope, status: 'running' }, attributes: ['id'] });
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
    for (const run of queued) schedule({ runId: run.id, organizationId: run.organizationId });
    resumed = queued.length;
  }
  return { failed, resumed };
}
