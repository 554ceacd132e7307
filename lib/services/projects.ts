import 'server-only';
import { OptimisticLockError, type InferAttributes } from 'sequelize';
import { Project, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, conflict, forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { projectSchema, projectUpdateSchema } from '@/lib/validation/project';
import { recordAudit } from './audit';
import { assertWritable } from './write-access';
import { baseEstimatesOf } from './registers/base-estimates';
import type { ProjectView } from '@/lib/view-types/projects';

export type { ProjectView };

/** A row of the projects list: the project, its base estimate and (once runs exist) its latest run. */
export type ProjectListEntry = ProjectView & {
  baseEstimate: number;
  lineCount: number;
  /** Filled by the runs feature: the latest completed run's P50 and P80 of cost. */
  latestRun: { P50: number; P80: number; at: string } | null;
};

export function toProjectView(p: Project): ProjectView {
  return {
    id: p.id,
    name: p.name,
    code: p.code,
    currency: p.currency,
    estimateClass: p.estimateClass,
    stage: p.stage,
    baseDate: p.baseDate,
    description: p.description ?? null,
    costTarget: p.costTarget ?? null,
    finishTarget: p.finishTarget ?? null,
    archived: Boolean(p.archivedAt),
    version: p.version,
  };
}

function assertMay(actor: Actor, action: 'project:read' | 'project:write') {
  if (!can(actor.role, action)) throw forbidden();
}

export async function listProjects(actor: Actor, { includeArchived = false } = {}): Promise<ProjectView[]> {
  assertMay(actor, 'project:read');
  const where: Record<string, unknown> = { organizationId: actor.organizationId };
  if (!includeArchived) where.archivedAt = null;
  const rows = await Project.findAll({ where, order: [['code', 'ASC']] });
  return rows.map(toProjectView);
}

/**
 * The list with each project's base estimate: the sum of line bases by the one base rule
 * (lib/domain/base-estimate), the figure the grid's total row shows and a run starts from.
 */
export async function listProjectsWithEstimates(
  actor: Actor,
  options: { includeArchived?: boolean } = {},
): Promise<ProjectListEntry[]> {
  const projects = await listProjects(actor, options);
  // Two reads for the whole list (lines and activities, only what a base reads), not every
  // register of every project.
  const estimates = await baseEstimatesOf(
    actor.organizationId,
    projects.map((p) => p.id),
  );
  return projects.map((p) => ({
    ...p,
    baseEstimate: estimates.get(p.id)?.baseEstimate ?? 0,
    lineCount: estimates.get(p.id)?.lineCount ?? 0,
    latestRun: null,
  }));
}

/** A project of the actor's organisation; any other id is "not found", never its data. */
export async function findProject(actor: Actor, projectId: number): Promise<Project> {
  assertMay(actor, 'project:read');
  const project = Number.isInteger(projectId)
    ? await Project.findOne({ where: { id: projectId, organizationId: actor.organizationId } })
    : null;
  if (!project) throw notFound('Project');
  return project;
}

export async function getProject(actor: Actor, projectId: number): Promise<ProjectView> {
  return toProjectView(await findProject(actor, projectId));
}

async function assertCodeFree(actor: Actor, code: string, exceptId?: number) {
  const clash = await Project.findOne({ where: { organizationId: actor.organizationId, code } });
  if (clash && clash.id !== exceptId) {
    throw badRequest(`Project code ${code} is already used.`, [
      { path: 'code', message: 'Already used by another project.' },
    ]);
  }
}

export async function createProject(actor: Actor, input: unknown): Promise<ProjectView> {
  assertMay(actor, 'project:write');
  const data = parseOrThrow(projectSchema, input);
  await assertWritable(actor.organizationId);
  await assertCodeFree(actor, data.code);
  return sequelize.transaction(async (transaction) => {
    const project = await Project.create({ ...data, organizationId: actor.organizationId }, { transaction });
    await recordAudit(
      actor,
      {
        entity: 'project',
        entityId: project.id,
        projectId: project.id,
        action: 'create',
        before: null,
        after: data,
      },
      transaction,
    );
    return toProjectView(project);
  });
}

export async function updateProject(actor: Actor, projectId: number, input: unknown): Promise<ProjectView> {
  assertMay(actor, 'project:write');
  const { version, ...data } = parseOrThrow(projectUpdateSchema, input);
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  await assertCodeFree(actor, data.code, project.id);
  await updateAudited(actor, project, 'project', toProjectView(project), data, version);
  return toProjectView(project);
}

/**
 * Updates a project and records the change (`before` → the changes) in one transaction. The
 * client says which version it read: a project changed since (by anyone) is refused with 409,
 * never overwritten; the model's optimistic lock catches a change between the read and the write.
 */
export async function updateAudited(
  actor: Actor,
  project: Project,
  entity: string,
  before: unknown,
  changes: Partial<InferAttributes<Project>>,
  readVersion: number,
): Promise<void> {
  if (project.version !== readVersion) throw staleProject(project);
  await sequelize.transaction(async (transaction) => {
    try {
      await project.update(changes, { transaction });
    } catch (e) {
      if (e instanceof OptimisticLockError) throw staleProject(await project.reload());
      throw e;
    }
    const change = {
      entity,
      entityId: project.id,
      projectId: project.id,
      action: 'update',
      before,
      after: changes,
    };
    await recordAudit(actor, change, transaction);
  });
}

function staleProject(project: Project) {
  return conflict(
    'Someone else changed this project since you opened it. Reload to see their change, then edit again.',
    { current: toProjectView(project) },
  );
}

export async function setArchived(actor: Actor, projectId: number, archived: boolean): Promise<ProjectView> {
  assertMay(actor, 'project:write');
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  return sequelize.transaction(async (transaction) => {
    await project.update({ archivedAt: archived ? new Date() : null }, { transaction });
    await recordAudit(
      actor,
      {
        entity: 'project',
        entityId: project.id,
        projectId: project.id,
        action: archived ? 'archive' : 'restore',
        before: null,
        after: null,
      },
      transaction,
    );
    return toProjectView(project);
  });
}
