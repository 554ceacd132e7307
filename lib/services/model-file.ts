import { Activity, CostItem, Correlation, Project, RiskEvent, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, forbidden } from '@/lib/errors';
import type { Model, ModelActivity, ModelItem, ModelRisk } from '@/lib/sim/types';
import { validateModel } from '@/lib/sim/validate';
import { recordAudit } from './audit';
import { findProject } from './projects';
import { insertRows } from './registers/insert';
import { json } from './registers/rows';
import { assertWritable } from './write-access';
import { registerRuleIssues, rowLimitIssues } from './model-import-rules';

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
    duration: json(a.duration),
    predecessors: (json<{ code: string; lag: number }[] | null>(a.predecessors) ?? []).map((p) =>
      p.lag ? { id: p.code, lag: p.lag } : p.code,
    ),
  }));

  const modelItems: ModelItem[] = items.map((i) => {
    const item: ModelItem = { id: i.code, name: i.description };
    if (i.base !== null && i.base !== undefined) item.base = i.base;
    const dist = json<ModelItem['dist'] | null>(i.dist);
    const rate = json<ModelItem['ratePerDay'] | null>(i.ratePerDay);
    if (dist) item.dist = dist;
    if (rate !== null && rate !== undefined) {
      item.ratePerDay = rate;
      if (i.activityId) item.activity = activityCode.get(i.activityId);
    }
    return item;
  });

  const modelRisks: ModelRisk[] = risks
    .filter((r) => r.status !== 'closed')
    .map((r) => {
      const probability = post && r.postProbability !== null ? r.postProbability : r.probability;
      const cost = json<ModelRisk['cost'] | null>(post && r.postCostImpact ? r.postCostImpact : r.costImpact);
      const delay = json<ModelRisk['delay'] | null>(
        post && r.postDelayImpact ? r.postDelayImpact : r.delayImpact,
      );
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

/**
 * Creates or replaces the project's four registers from a model file, in one transaction:
 * the file is checked with the engine's own schema first (messages name the entry), nothing is
 * written when it fails. The audit trail keeps the registers before and after.
 */
export async function importModel(
  actor: Actor,
  projectId: number,
  input: unknown,
): Promise<{ items: number; risks: number; activities: number; correlations: number }> {
  if (!can(actor.role, 'project:write')) throw forbidden();
  const refuse = (issues: { path: string; message: string }[]) =>
    badRequest(
      `The model file was not imported: ${issues
        .slice(0, 5)
        .map((i) => i.message)
        .join('; ')}`,
      issues,
    );
  const tooMany = rowLimitIssues(input);
  if (tooMany.length) throw refuse(tooMany);
  const checked = validateModel(input);
  if (!checked.ok)
    throw refuse(checked.issues.map((i) => ({ path: i.path, message: `${i.path}: ${i.message}` })));
  // The engine's rules first, then the registers' own (codes, lengths, durations).
  const broken = registerRuleIssues(checked.model);
  if (broken.length) throw refuse(broken);
  const model = checked.model;
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  const before = await exportModel(actor, projectId);
  const scope = { projectId: project.id, organizationId: actor.organizationId };
  return sequelize.transaction(async (transaction) => {
    await Project.findOne({ where: { id: project.id }, lock: transaction.LOCK.UPDATE, transaction });
    for (const model of [Correlation, RiskEvent, CostItem, Activity] as const) {
      await (model as typeof Correlation).destroy({ where: scope, transaction });
    }
    const activities = model.activities ?? [];
    await insertRows(
      'Activities',
      activities.map((a, i) => ({
        ...scope,
        code: a.id,
        name: a.name || a.id,
        duration: a.duration,
        predecessors: (a.predecessors ?? []).map((p) =>
          typeof p === 'string' ? { code: p, lag: 0 } : { code: p.id, lag: p.lag ?? 0 },
        ),
        sortOrder: i,
        version: 1,
      })),
      transaction,
    );
    const saved = await Activity.findAll({ where: scope, attributes: ['id', 'code'], transaction });
    const activityId = new Map(saved.map((a) => [a.code, a.id]));
    await insertRows(
      'CostItems',
      model.items.map((item, i) => ({
        ...scope,
        code: item.id,
        description: item.name || item.id,
        base: item.base ?? null,
        dist: item.dist ?? null,
        ratePerDay: item.ratePerDay ?? null,
        version: 1,
        activityId: item.activity ? (activityId.get(item.activity) ?? null) : null,
        ownerName: null,
        notes: null,
        sortOrder: i,
      })),
      transaction,
    );
    const risks = model.risks ?? [];
    await insertRows(
      'RiskEvents',
      risks.map((r, i) => ({
        ...scope,
        code: r.id,
        title: r.name || r.id,
        cause: null,
        event: null,
        effect: null,
        ownerName: null,
        status: 'open' as const,
        response: 'reduce' as const,
        probability: r.probability,
        costImpact: r.cost ?? null,
        delayImpact: r.delay ?? null,
        activityId: r.activity ? (activityId.get(r.activity) ?? null) : null,
        postProbability: null,
        postCostImpact: null,
        postDelayImpact: null,
        mitigationCost: null,
        sortOrder: i,
        version: 1,
      })),
      transaction,
    );
    const correlations = model.correlations ?? [];
    await insertRows(
      'Correlations',
      correlations.map((c) => ({ ...scope, aCode: c.a, bCode: c.b, rho: c.rho, version: 1 })),
      transaction,
    );
    await recordAudit(
      actor,
      {
        entity: 'model',
        entityId: project.id,
        projectId: project.id,
        action: 'import',
        before,
        after: model,
      },
      transaction,
    );
    return {
      items: model.items.length,
      risks: risks.length,
      activities: activities.length,
      correlations: correlations.length,
    };
  });
}
