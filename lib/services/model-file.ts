import { Activity, CostItem, Correlation, RiskEvent } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import type { Model, ModelActivity, ModelItem, ModelRisk } from '@/lib/sim/types';
import { findProject } from './projects';

export type RiskValues = 'pre' | 'post';

/**
 * The project's registers as the engine's model file (DESIGN.md, "The engine contract"):
 * codes become ids, links by row id become links by code. With `riskValues: 'post'` each
 * risk uses its post-mitigation probability and impacts where they are given.
 */
export async function exportModel(
  actor: Actor,
  projectId: number,
  options: { riskValues?: RiskValues } = {},
): Promise<Model> {
  const project = await findProject(actor, projectId);
  const where = { projectId: project.id, organizationId: actor.organizationId };
  const order: [string, string][] = [
    ['sortOrder', 'ASC'],
    ['id', 'ASC'],
  ];
  const [activities, items, risks, correlations] = await Promise.all([
    Activity.findAll({ where, order }),
    CostItem.findAll({ where, order }),
    RiskEvent.findAll({ where, order }),
    Correlation.findAll({ where, order: [['id', 'ASC']] }),
  ]);
  const activityCode = new Map(activities.map((a) => [a.id, a.code]));
  const post = options.riskValues === 'post';

  const modelActivities: ModelActivity[] = activities.map((a) => ({
    id: a.code,
    name: a.name,
    duration: a.duration,
    predecessors: (a.predecessors ?? []).map((p) => (p.lag ? { id: p.code, lag: p.lag } : p.code)),
  }));

  const modelItems: ModelItem[] = items.map((i) => {
    const item: ModelItem = { id: i.code, name: i.description };
    if (i.base !== null && i.base !== undefined) item.base = i.base;
    if (i.dist) item.dist = i.dist;
    if (i.ratePerDay !== null && i.ratePerDay !== undefined) {
      item.ratePerDay = i.ratePerDay;
      if (i.activityId) item.activity = activityCode.get(i.activityId);
    }
    return item;
  });

  const modelRisks: ModelRisk[] = risks
    .filter((r) => r.status !== 'closed')
    .map((r) => {
      const probability = post && r.postProbability !== null ? r.postProbability : r.probability;
      const cost = post && r.postCostImpact ? r.postCostImpact : r.costImpact;
      const delay = post && r.postDelayImpact ? r.postDelayImpact : r.delayImpact;
      const risk: ModelRisk = { id: r.code, name: r.title, probability };
      if (cost) risk.cost = cost;
      if (delay) risk.delay = delay;
      if (r.activityId && delay) risk.activity = activityCode.get(r.activityId);
      return risk;
    });

  const model: Model = {
    format: 'outturn-model',
    version: 1,
    name: project.name,
    currency: project.currency,
    items: modelItems,
    risks: modelRisks,
    activities: modelActivities,
    correlations: correlations.map((c) => ({ a: c.aCode, b: c.bCode, rho: c.rho })),
  };
  return model;
}
