import 'server-only';
/**
 * The brief of a run: one read that gathers the run's stored result and input snapshot, the
 * project's notes and the decision, and one write that puts the brief before the sponsors.
 */
import { Op } from 'sequelize';
import { Approval, AuditEntry, Project, SimulationRun, User, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { conflict, forbidden } from '@/lib/errors';
import { notifyBriefReady } from '@/lib/mail';
import { recipientsWithRole } from './notifications';
import { buildBrief, percentileOf, type BriefData, type BriefProject } from '@/lib/brief/build';
import { moneyWithInterval } from '@/lib/brief/format';
import { decisionOnRun } from './approvals';
import { recordAudit } from './audit';
import { notesOf } from './project-notes';
import { findProject } from './projects';
import { getRunOutcome } from './runs';
import type { AwaitingBrief } from '@/lib/view-types/approvals';

const SENT_ACTION = 'request-decision';

/** When the brief was last put before the sponsors, and by whom (from the audit trail). */
async function lastSent(actor: Actor, projectId: number, runId: number) {
  const entry = await AuditEntry.findOne({
    where: {
      organizationId: actor.organizationId,
      projectId,
      entity: 'brief',
      entityId: String(runId),
      action: SENT_ACTION,
    },
    include: [{ model: User, as: 'user', attributes: ['name'] }],
    order: [['id', 'DESC']],
  });
  if (!entry) return null;
  const user = (entry as AuditEntry & { user?: { name: string } }).user;
  return { at: new Date(entry.createdAt).toISOString(), byName: user?.name ?? 'A former member' };
}

export async function getBrief(actor: Actor, projectId: number, runId: number): Promise<BriefData> {
  if (!can(actor.role, 'brief:read')) throw forbidden();
  const project = await findProject(actor, projectId);
  const outcome = await getRunOutcome(actor, project.id, runId, { withSample: false });
  const [decision, sentForDecision] = await Promise.all([
    decisionOnRun(actor, project.id, runId),
    lastSent(actor, project.id, runId),
  ]);
  return buildBrief({
    project: briefProject(project),
    run: {
      id: outcome.run.id,
      number: outcome.run.number,
      inputHash: outcome.run.inputHash,
      startedByName: outcome.run.startedBy?.name ?? null,
      startedAt: outcome.run.startedAt ?? outcome.run.createdAt,
      finishedAt: outcome.run.finishedAt,
      confidence: outcome.run.settings?.confidence ?? null,
      finishTarget: outcome.run.settings?.finishTarget ?? null,
      riskValues: outcome.run.settings?.riskValues ?? null,
      startedById: outcome.run.startedBy?.id ?? null,
      calendar: outcome.run.settings?.calendar ?? null,
    },
    result: outcome.result,
    snapshot: outcome.snapshot,
    decision,
    sentForDecision,
  });
}

/** The project as the brief names it. */
function briefProject(project: Project): BriefProject {
  const { id, name, code, currency, stage, estimateClass, baseDate, version } = project;
  return { id, name, code, currency, stage, estimateClass, baseDate, version, ...notesOf(project) };
}

/**
 * Tells the organisation's sponsors that the brief awaits their decision. Refused once the
 * run has a decision, and when there is no sponsor to tell.
 */
export async function sendBriefToSponsors(
  actor: Actor,
  projectId: number,
  runId: number,
): Promise<{ sponsors: number; sentAt: string }> {
  if (!can(actor.role, 'project:write')) throw forbidden('Estimators and owners put a brief forward.');
  const brief = await getBrief(actor, projectId, runId);
  if (brief.decision)
    throw conflict(
      `Run ${brief.run.number} was already ${brief.decision.decision} by ${brief.decision.sponsorName}.`,
    );
  const p80 = percentileOf(brief.cost, 'P80');
  return sequelize.transaction(async (transaction) => {
    const sponsors = await recipientsWithRole(actor.organizationId, ['sponsor'], transaction);
    if (!sponsors.length)
      throw conflict('There is no sponsor in this organisation yet: invite one from Members first.');
    await notifyBriefReady(
      sponsors,
      {
        projectId: brief.project.id,
        projectName: brief.project.name,
        runId,
        runNumber: brief.run.number,
        p80Text: moneyWithInterval(p80.value, p80.ci95, brief.project.currency),
        preparedByName: actor.name,
      },
      transaction,
    );
    await recordAudit(
      actor,
      {
        entity: 'brief',
        entityId: runId,
        projectId: brief.project.id,
        action: SENT_ACTION,
        before: null,
        after: { sponsors: sponsors.map((s) => s.email) },
      },
      transaction,
    );
    return { sponsors: sponsors.length, sentAt: new Date().toISOString() };
  });
}

/**
 * The briefs put before the sponsors that have no decision yet, most recently sent first: what a
 * sponsor (or an owner) who decides on baselines sees first on signing in. Runs of archived
 * projects are left out; a run this actor started is flagged, since by default they may not
 * approve it themselves.
 */
export async function briefsAwaitingDecision(actor: Actor, limit = 20): Promise<AwaitingBrief[]> {
  if (!can(actor.role, 'baseline:decide')) return [];
  const sent = await AuditEntry.findAll({
    where: { organizationId: actor.organizationId, entity: 'brief', action: SENT_ACTION },
    include: [{ model: User, as: 'user', attributes: ['name'] }],
    attributes: ['id', 'entityId', 'createdAt'],
    order: [['id', 'DESC']],
    limit: 500,
  });
  const latest = new Map<number, { at: Date; byName: string }>();
  for (const entry of sent) {
    const runId = Number(entry.entityId);
    const user = (entry as AuditEntry & { user?: { name: string } }).user;
    if (Number.isInteger(runId) && !latest.has(runId))
      latest.set(runId, { at: new Date(entry.createdAt), byName: user?.name ?? 'A former member' });
  }
  if (!latest.size) return [];
  const runIds = [...latest.keys()];
  const [decided, runs] = await Promise.all([
    Approval.findAll({
      where: { organizationId: actor.organizationId, runId: { [Op.in]: runIds } },
      attributes: ['runId'],
    }),
    SimulationRun.findAll({
      where: { organizationId: actor.organizationId, id: { [Op.in]: runIds }, status: 'succeeded' },
      attributes: ['id', 'projectId', 'startedById'],
      include: [
        {
          model: Project,
          as: 'project',
          attributes: ['id', 'code', 'name'],
          where: { archivedAt: null },
        },
      ],
    }),
  ]);
  const done = new Set(decided.map((a) => a.runId));
  return runs
    .filter((r) => !done.has(r.id))
    .map((r) => {
      const project = (r as SimulationRun & { project: Project }).project;
      const sentAt = latest.get(r.id)!;
      return {
        projectId: project.id,
        projectCode: project.code,
        projectName: project.name,
        runId: r.id,
        sentAt: sentAt.at.toISOString(),
        sentByName: sentAt.byName,
        startedByYou: r.startedById === actor.userId,
      };
    })
    .sort((a, b) => b.sentAt.localeCompare(a.sentAt) || b.runId - a.runId)
    .slice(0, limit);
}
