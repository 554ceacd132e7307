import 'server-only';
/**
 * Sponsors' decisions on runs: approve a run as the project's baseline, or return it with a
 * comment. A decision is written once and never changed: there is no update, and a second
 * decision on the same run is refused (409), by this check and by the table's unique key.
 */
import { UniqueConstraintError } from 'sequelize';
import { z } from 'zod';
import { Approval, SimulationRun, sequelize } from '@/models';
import { DECISIONS } from '@/models/approval';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { conflict, forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { notifyDecision } from '@/lib/mail';
import { recipientsWithRole } from './notifications';
import { moneyWithInterval } from '@/lib/brief/format';
import { selfApprovalRefusal } from '@/lib/brief/wording';
import { trendRows, type BaselineSource, type TrendRow } from '@/lib/brief/trend';
import type { RunSummary } from '@/models/simulation-run';
import type { SimulationResult } from '@/lib/sim';
import { recordAudit } from './audit';
import { selfApprovalAllowed } from './organization-settings';
import { findProject } from './projects';
import type { DecisionView } from '@/lib/view-types/approvals';

export const COMMENT_MAX_LENGTH = 4000;

/** Reads with this include bring the run's number along. */
const withRunNumber = { model: SimulationRun, as: 'run', attributes: ['id', 'number'] };

export function toDecisionView(a: Approval, runNumber = a.run?.number ?? 0): DecisionView {
  return {
    id: a.id,
    runId: a.runId,
    runNumber,
    decision: a.decision,
    comment: a.comment,
    sponsorName: a.sponsorName,
    stage: a.stage,
    estimateClass: a.estimateClass,
    decidedAt: new Date(a.createdAt).toISOString(),
    selfApproved: Boolean(a.selfApproved),
  };
}

export const decisionSchema = z
  .object({
    runId: z.number({ message: 'Say which run (runId) the decision is on.' }).int().positive(),
    decision: z.enum(DECISIONS, { message: 'The decision is "approved" or "returned".' }),
    comment: z
      .string({ message: 'The comment must be text.' })
      .max(COMMENT_MAX_LENGTH, {
        message: `The comment may be at most ${COMMENT_MAX_LENGTH.toLocaleString('en')} characters.`,
      })
      .optional()
      .default('')
      .transform((v) => v.trim()),
  })
  .superRefine((d, ctx) => {
    // The estimators need to know what to rework: a return without a reason helps nobody.
    if (d.decision === 'returned' && !d.comment)
      ctx.addIssue({
        code: 'custom',
        path: ['comment'],
        message: 'Say why the run is returned, so that it can be reworked.',
      });
  });

function assertMayRead(actor: Actor) {
  if (!can(actor.role, 'project:read')) throw forbidden();
}

/** A project's decisions, newest first. */
export async function listDecisions(actor: Actor, projectId: number): Promise<DecisionView[]> {
  assertMayRead(actor);
  const project = await findProject(actor, projectId);
  const rows = await Approval.findAll({
    where: { projectId: project.id, organizationId: actor.organizationId },
    include: [withRunNumber],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  return rows.map(toDecisionView);
}

export async function getDecision(
  actor: Actor,
  projectId: number,
  decisionId: number,
): Promise<DecisionView> {
  assertMayRead(actor);
  const project = await findProject(actor, projectId);
  const row = await Approval.findOne({
    where: { id: decisionId, projectId: project.id, organizationId: actor.organizationId },
    include: [withRunNumber],
  });
  if (!row) throw notFound('Decision');
  return toDecisionView(row);
}

/** The decision on one run, or null while it awaits one. */
export async function decisionOnRun(
  actor: Actor,
  projectId: number,
  runId: number,
): Promise<DecisionView | null> {
  assertMayRead(actor);
  const row = await Approval.findOne({
    where: { runId, projectId, organizationId: actor.organizationId },
    include: [withRunNumber],
  });
  return row ? toDecisionView(row) : null;
}

/** Records a sponsor's decision on a succeeded run and tells the project's estimators. */
export async function decideOnRun(actor: Actor, projectId: number, input: unknown): Promise<DecisionView> {
  if (!can(actor.role, 'baseline:decide')) throw forbidden('Only sponsors and owners decide on a baseline.');
  const data = parseOrThrow(decisionSchema, input);
  const project = await findProject(actor, projectId);
  const run = await SimulationRun.findOne({
    where: { id: data.runId, projectId: project.id, organizationId: actor.organizationId },
    attributes: ['id', 'number', 'status', 'result', 'startedById'],
  });
  if (!run) throw notFound('Run');
  if (run.status !== 'succeeded' || !run.result)
    throw conflict(`Run ${run.number} is ${run.status}: only a run that succeeded can be decided on.`);
  const earlier = await Approval.findOne({ where: { runId: run.id }, attributes: ['id'] });
  if (earlier) throw conflict(`Run ${run.number} already has a decision; a decision cannot be changed.`);
  const selfApproved = data.decision === 'approved' && run.startedById === actor.userId;
  if (selfApproved && !(await selfApprovalAllowed(actor.organizationId)))
    throw forbidden(selfApprovalRefusal(run.number));

  const result = JSON.parse(run.result) as SimulationResult;
  try {
    return await sequelize.transaction(async (transaction) => {
      const approval = await Approval.create(
        {
          organizationId: actor.organizationId,
          projectId: project.id,
          runId: run.id,
          sponsorId: actor.userId,
          sponsorName: actor.name,
          decision: data.decision,
          comment: data.comment,
          stage: project.stage,
          estimateClass: project.estimateClass,
          selfApproved,
        },
        { transaction },
      );
      const view = toDecisionView(approval, run.number);
      await recordAudit(
        actor,
        {
          entity: 'approval',
          entityId: approval.id,
          projectId: project.id,
          action: data.decision,
          before: null,
          after: view,
        },
        transaction,
      );
      // Queued in the same transaction: the mail goes if, and only if, the decision is kept.
      await notifyDecision(
        await recipientsWithRole(actor.organizationId, ['estimator'], transaction),
        {
          projectId: project.id,
          projectName: project.name,
          runId: run.id,
          runNumber: run.number,
          decision: data.decision,
          comment: data.comment,
          decidedByName: actor.name,
          p80Text: moneyWithInterval(
            result.cost.percentiles.P80,
            result.cost.percentileCI95.P80,
            project.currency,
          ),
        },
        transaction,
      );
      return view;
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError)
      throw conflict(`Run ${run.number} already has a decision; a decision cannot be changed.`);
    throw error;
  }
}

/** The figures of a run's stored summary that the trend reads (base, P50, P80, P90 of cost). */
function trendFigures(summary: RunSummary): BaselineSource['result'] {
  const figures = (t: NonNullable<RunSummary['duration']>) => ({
    base: t.base,
    percentiles: { P50: t.P50, P80: t.P80, P90: t.P90 },
  });
  return {
    cost: figures(summary.cost),
    ...(summary.duration ? { duration: figures(summary.duration) } : {}),
  } as unknown as BaselineSource['result'];
}

/** The approved baselines in date order with their figures, for the trend. */
export async function listBaselines(actor: Actor, projectId: number): Promise<TrendRow[]> {
  assertMayRead(actor);
  const project = await findProject(actor, projectId);
  const approvals = await Approval.findAll({
    where: { projectId: project.id, organizationId: actor.organizationId, decision: 'approved' },
    // The run's stored summary holds the base, P50 and P80 of cost and duration the trend reads:
    // the whole result (megabytes for a large run) is not loaded.
    include: [{ model: SimulationRun, as: 'run', attributes: ['id', 'number', 'summary', 'settings'] }],
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return trendRows(
    approvals
      .filter((a) => a.run?.summary)
      .map((a) => ({
        approvalId: a.id,
        runId: a.runId,
        runNumber: a.run!.number,
        decidedAt: new Date(a.createdAt).toISOString(),
        stage: a.stage,
        estimateClass: a.estimateClass,
        sponsorName: a.sponsorName,
        selfApproved: Boolean(a.selfApproved),
        riskValues: a.run!.settings?.riskValues ?? null,
        result: trendFigures(a.run!.summary!),
      })),
  );
}
