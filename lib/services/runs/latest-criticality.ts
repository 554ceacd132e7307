import 'server-only';
// The criticality of each activity in the project's latest successful run, for the network
// diagram: which path was most often critical.
import { SimulationRun } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { forbidden } from '@/lib/errors';
import type { SimulationResult } from '@/lib/sim';
import { findProject } from '../projects';

export type LatestCriticality = {
  runId: number;
  finishedAt: string | null;
  criticality: Record<string, number>;
};

export async function latestCriticality(actor: Actor, projectId: number): Promise<LatestCriticality | null> {
  if (!can(actor.role, 'run:read')) throw forbidden('Your role cannot read runs.');
  const project = await findProject(actor, projectId);
  const run = await SimulationRun.findOne({
    where: { projectId: project.id, organizationId: actor.organizationId, status: 'succeeded' },
    attributes: ['id', 'result', 'finishedAt'],
    order: [['id', 'DESC']],
  });
  if (!run?.result) return null;
  const result = JSON.parse(run.result) as SimulationResult;
  return {
    runId: run.id,
    finishedAt: run.finishedAt ? run.finishedAt.toISOString() : null,
    criticality: result.criticality ?? {},
  };
}
