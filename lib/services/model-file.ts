import 'server-only';
import { Activity, CostItem, Correlation, Project, RiskDriver, RiskEvent, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, forbidden } from '@/lib/errors';
import { linkFromModel } from '@/lib/registers/predecessors';
import { validateModel, type DistSpec, type Model } from '@/lib/sim';
import { recordAudit } from './audit';
import { findProject } from './projects';
import { json, riskActivityCodes } from './registers/rows';
import { assertWritable } from './write-access';
import {
  registersToModel,
  type ModelExport,
  type RegisterRecords,
  type RiskValues,
} from '@/lib/domain/model-export';
import { registerRuleIssues, rowLimitIssues } from './model-import-rules';

export type { RiskValues };

/** The project's register records, JSON columns parsed and links by row id resolved to codes. */
async function loadRecords(actor: Actor, projectId: number): Promise<RegisterRecords> {
  const project = await findProject(actor, projectId);
  const where = { projectId: project.id, organizationId: actor.organizationId };
  const order: [string, string][] = [
    ['sortOrder', 'ASC'],
    ['id', 'ASC'],
  ];
  const [activities, items, risks, correlations, drivers] = await Promise.all([
    Activity.findAll({ where, order }),
    CostItem.findAll({ where, order }),
    RiskEvent.findAll({ where, order }),
    Correlation.findAll({ where, order: [['id', 'ASC']] }),
    RiskDriver.findAll({ where, order }),
  ]);
  const codeOf = new Map(activities.map((a) => [a.id, a.code]));
  const activityCode = (id: number | null | undefined) => (id ? (codeOf.get(id) ?? null) : null);
  return {
    project: {
      name: project.name,
      currency: project.currency,
      stage: project.stage,
      estimateClass: project.estimateClass,
      baseDate: project.baseDate,
    },
    activities: activities.map((a) => ({
      code: a.code,
      name: a.name,
      duration: json(a.duration),
      predecessors: json(a.predecessors),
      existence: a.existence ?? null,
    })),
    items: items.map((i) => ({
      code: i.code,
      description: i.description,
      base: i.base ?? null,
      dist: json(i.dist) ?? null,
      ratePerDay: json(i.ratePerDay) ?? null,
      activityCode: activityCode(i.activityId),
      span: i.span === 'project' ? ('project' as const) : null,
    })),
    risks: risks.map((r) => ({
      code: r.code,
      title: r.title,
      status: r.status,
      probability: r.probability,
      costImpact: json(r.costImpact) ?? null,
      delayImpact: json(r.delayImpact) ?? null,
      postProbability: r.postProbability ?? null,
      postCostImpact: json(r.postCostImpact) ?? null,
      postDelayImpact: json(r.postDelayImpact) ?? null,
      activityCodes: riskActivityCodes(r, codeOf),
      itemCodes: json<string[] | null>(r.itemCodes) ?? [],
      sizes: r.sizes ?? 'linked',
      mitigationCost: json<DistSpec | number | null>(r.mitigationCost) ?? null,
    })),
    correlations: correlations.map((c) => ({ aCode: c.aCode, bCode: c.bCode, rho: c.rho })),
    drivers: drivers.map((d) => ({
      code: d.code,
      name: d.name,
      probability: d.probability,
      factor: json(d.factor),
      applies: json(d.applies),
    })),
  };
}

/**
 * The project's registers as the engine's model file, with notices of what was left out (the
 * rules live in lib/domain/model-export). With `riskValues: 'post'` each risk uses its
 * post-mitigation probability and impacts where they are given.
 */
export async function exportModelFile(
  actor: Actor,
  projectId: number,
  options: { riskValues?: RiskValues } = {},
): Promise<ModelExport> {
  return registersToModel(await loadRecords(actor, projectId), options);
}

/** The model file alone (see exportModelFile). */
export async function exportModel(
  actor: Actor,
  projectId: number,
  options: { riskValues?: RiskValues } = {},
): Promise<Model> {
  return (await exportModelFile(actor, projectId, options)).model;
}

/**
 * Creates or replaces the project's registers from a model file, in one transaction:
 * the file is checked with the engine's own schema first (messages name the entry), nothing is
 * written when it fails. The audit trail keeps the registers before and after.
 */
export async function importModel(
  actor: Actor,
  projectId: number,
  input: unknown,
): Promise<{ items: number; risks: number; activities: number; correlations: number; drivers: number }> {
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
    for (const model of [Correlation, RiskDriver, RiskEvent, CostItem, Activity] as const) {
      await (model as typeof Correlation).destroy({ where: scope, transaction });
    }
    // What every imported row shares: its scope, its code (the input's id), its place, version 1.
    const placed = <T extends { id: string }, R>(inputs: T[], columns: (input: T) => R) =>
      inputs.map((input, i) => ({ ...scope, code: input.id, sortOrder: i, version: 1, ...columns(input) }));
    await Activity.bulkCreate(
      placed(model.activities ?? [], (a) => ({
        name: a.name || a.id,
        duration: a.duration,
        predecessors: (a.predecessors ?? []).map(linkFromModel),
        existence: a.existence ?? null,
      })),
      { transaction },
    );
    const saved = await Activity.findAll({ where: scope, attributes: ['id', 'code'], transaction });
    const activityId = new Map(saved.map((a) => [a.code, a.id]));
    await CostItem.bulkCreate(
      placed(model.items, (item) => ({
        description: item.name || item.id,
        base: item.base ?? null,
        dist: item.dist ?? null,
        ratePerDay: item.ratePerDay ?? null,
        activityId: item.activity ? (activityId.get(item.activity) ?? null) : null,
        span: item.span ?? null,
        ownerName: null,
        notes: null,
      })),
      { transaction },
    );
    await RiskEvent.bulkCreate(
      placed(model.risks ?? [], (r) => ({
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
        activityId: null,
        activityCodes: r.activities ?? (r.activity !== undefined ? [r.activity] : []),
        itemCodes: r.items ?? [],
        sizes: r.sizes ?? 'linked',
        postProbability: r.post?.probability ?? null,
        postCostImpact: r.post?.cost ?? null,
        postDelayImpact: r.post?.delay ?? null,
        mitigationCost: r.mitigationCost ?? null,
      })),
      { transaction },
    );
    // A driver's list comes back as the codes it covered when the file was written.
    await RiskDriver.bulkCreate(
      placed(model.drivers ?? [], (d) => ({
        name: d.name || d.id,
        standsFor: null,
        probability: d.probability ?? 1,
        factor: d.factor,
        entry: 'factor' as const,
        applies: d.applies,
      })),
      { transaction },
    );
    const correlations = model.correlations ?? [];
    await Correlation.bulkCreate(
      correlations.map((c) => ({ ...scope, aCode: c.a, bCode: c.b, rho: c.rho, version: 1 })),
      { transaction },
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
      risks: model.risks?.length ?? 0,
      activities: model.activities?.length ?? 0,
      correlations: correlations.length,
      drivers: model.drivers?.length ?? 0,
    };
  });
}
