import 'server-only';
// The runs of a project: start, read, cancel, and the stored snapshot and result.

import { randomInt } from 'node:crypto';
import { Op, QueryTypes } from 'sequelize';
import { Project, SimulationRun, User, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can, type Action } from '@/lib/auth/roles';
import { badRequest, conflict, forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { MAX_SEED, runSettingsInputSchema, type RunSettings } from '@/lib/validation/runs';
import { validateModel, type Model, type SimulationResult } from '@/lib/sim';
import { workingDaysThrough, type WorkCalendar } from '@/lib/runs/working-days';
import { formatDate } from '@/lib/format';
import { snapshotHash } from '@/lib/runs/snapshot-hash';
import { recordAudit } from '../audit';
import { calendarForDates } from '../calendar';
import { exportModelFile } from '../model-file';
import { jointConfidenceOf } from '../organization-settings';
import { findProject } from '../projects';
import { assertWritable } from '../write-access';
import { runExecutor } from './executor';
import type { RunSample } from './sample';
import { toRunView, type RunView } from './view';

function assertMay(actor: Actor, action: Action) {
  if (!can(actor.role, action)) throw forbidden();
}

const LIST_ATTRIBUTES = [
  'id',
  'organizationId',
  'projectId',
  'number',
  'startedById',
  'status',
  'settings',
  'progress',
  'iterationsDone',
  'failureReason',
  'inputHash',
  'summary',
  'engineVersion',
  'modelNotices',
  'blockSize',
  'progressMarks',
  'startedAt',
  'finishedAt',
  'createdAt',
  'updatedAt',
] as const;

const withStarter = { model: User, as: 'startedBy', attributes: ['id', 'name'] };

/** Place of each queued run in its organisation's queue (1 = next to start). */
async function queuePositions(organizationId: number): Promise<Map<number, number>> {
  const queued = await SimulationRun.findAll({
    where: { organizationId, status: 'queued' },
    attributes: ['id'],
    order: [['id', 'ASC']],
  });
  return new Map(queued.map((r, i) => [r.id, i + 1]));
}

/** The columns read: the list's, or with the snapshot and result (and the chart sample, unless not wanted). */
type Columns = 'list' | 'full' | 'without-sample';
const COLUMNS: Record<Columns, string[] | undefined> = {
  list: [...LIST_ATTRIBUTES],
  full: undefined,
  'without-sample': [...LIST_ATTRIBUTES, 'inputSnapshot', 'result'],
};

async function findRun(
  actor: Actor,
  projectId: number,
  runId: number,
  columns: Columns | boolean = 'list',
): Promise<SimulationRun> {
  const which: Columns = columns === true ? 'full' : columns === false ? 'list' : columns;
  const run = Number.isInteger(runId)
    ? await SimulationRun.findOne({
        where: { id: runId, projectId, organizationId: actor.organizationId },
        attributes: COLUMNS[which],
        include: [withStarter],
      })
    : null;
  if (!run) throw notFound('Run');
  return run;
}

async function viewOf(run: SimulationRun): Promise<RunView> {
  const positions = run.status === 'queued' ? await queuePositions(run.organizationId) : new Map();
  return toRunView(run, positions.get(run.id) ?? null);
}

/**
 * The settings as stored: the seed drawn when none was given, the finish target in working days
 * of the organisation's calendar, and that calendar from the base date on (so that the run's dates
 * stay what they were when the calendar changes later).
 */
function resolveSettings(input: unknown, baseDate: string, calendar: WorkCalendar): RunSettings {
  const data = parseOrThrow(runSettingsInputSchema, input ?? {});
  if (data.finishTarget && data.finishTarget < baseDate) {
    throw badRequest(
      `finishTarget: the finish target must be on or after the base date, ${formatDate(baseDate)}.`,
      [
        {
          path: 'finishTarget',
          message: `Must be on or after the project's base date, ${formatDate(baseDate)}.`,
        },
      ],
    );
  }
  return {
    iterations: data.iterations,
    seed: data.seed ?? randomInt(1, MAX_SEED + 1),
    sampling: data.sampling,
    riskValues: data.riskValues,
    confidence: data.confidence,
    costTarget: data.costTarget ?? null,
    finishTarget: data.finishTarget ?? null,
    durationTarget: data.finishTarget ? workingDaysThrough(baseDate, data.finishTarget, calendar) : null,
    precision: data.precision ?? null,
    calendar: { weekdays: [...calendar.weekdays], holidays: calendar.holidays.filter((d) => d >= baseDate) },
  };
}

/** The model file the run will read: the registers, the targets and the run's settings. */
function snapshotOf(model: Model, settings: RunSettings, jointConfidence: number): Model {
  const targets: Model['targets'] = {};
  if (settings.costTarget !== null) targets.cost = settings.costTarget;
  if (settings.durationTarget !== null) targets.duration = settings.durationTarget;
  return {
    ...model,
    ...(Object.keys(targets).length ? { targets } : {}),
    // The model's own settings (the headline mitigation scenario) stay; the run's override the rest.
    settings: {
      ...model.settings,
      iterations: settings.iterations,
      seed: settings.seed,
      sampling: settings.sampling,
      // The contingency is allocated at the level the run was asked for.
      contingencyLevel: settings.confidence,
      // The frontier of cost and finish pairs is drawn at the organisation's chosen joint confidence.
      jointConfidence,
    },
  };
}

/** The run, and the notices of what the model left out of the registers (shown with the reply). */
export async function startRun(
  actor: Actor,
  projectId: number,
  input: unknown,
): Promise<RunView & { notices: string[] }> {
  assertMay(actor, 'run:start');
  const project = await findProject(actor, projectId);
  const settings = resolveSettings(input, project.baseDate, await calendarForDates(actor.organizationId));
  await assertWritable(actor.organizationId);
  const { model, notices } = await exportModelFile(actor, project.id, { riskValues: settings.riskValues });
  if (model.items.length === 0 && (model.risks ?? []).length === 0 && (model.activities ?? []).length === 0) {
    throw badRequest('There is nothing to simulate yet: add line items, risk events or activities first.');
  }
  const snapshot = snapshotOf(model, settings, await jointConfidenceOf(actor.organizationId));
  const checked = validateModel(snapshot);
  if (!checked.ok) {
    const shown = checked.issues.slice(0, 5).map((i) => `${i.path}: ${i.message}`);
    const more = checked.issues.length > 5 ? ` (and ${checked.issues.length - 5} more)` : '';
    throw badRequest(`The registers cannot be simulated yet. ${shown.join('; ')}${more}`, checked.issues);
  }
  const run = await sequelize.transaction(async (transaction) => {
    // The project's row is locked while its next run number is taken, so two runs started at
    // once get two numbers (the unique index on projectId and number holds it too).
    await Project.findOne({ where: { id: project.id }, lock: transaction.LOCK.UPDATE, transaction });
    const last = await SimulationRun.max<number | null, SimulationRun>('number', {
      where: { projectId: project.id },
      transaction,
    });
    const created = await SimulationRun.create(
      {
        organizationId: actor.organizationId,
        projectId: project.id,
        number: (last ?? 0) + 1,
        startedById: actor.userId,
        settings,
        inputSnapshot: JSON.stringify(snapshot),
        inputHash: snapshotHash(snapshot),
        modelNotices: notices,
      },
      { transaction },
    );
    await recordAudit(
      actor,
      {
        entity: 'run',
        entityId: created.id,
        projectId: project.id,
        action: 'start',
        before: null,
        after: settings,
      },
      transaction,
    );
    return created;
  });
  await runExecutor().schedule({ runId: run.id, organizationId: actor.organizationId });
  return { ...(await viewOf(await findRun(actor, project.id, run.id))), notices };
}

export async function listRuns(actor: Actor, projectId: number, { limit = 100 } = {}): Promise<RunView[]> {
  assertMay(actor, 'run:read');
  const project = await findProject(actor, projectId);
  const runs = await SimulationRun.findAll({
    where: { projectId: project.id, organizationId: actor.organizationId },
    attributes: [...LIST_ATTRIBUTES],
    include: [withStarter],
    order: [['id', 'DESC']],
    limit,
  });
  // Places in the queue only matter to queued runs: most lists have none, and skip the read.
  const positions = runs.some((r) => r.status === 'queued')
    ? await queuePositions(actor.organizationId)
    : new Map<number, number>();
  return runs.map((r) => toRunView(r, positions.get(r.id) ?? null));
}

export async function getRun(actor: Actor, projectId: number, runId: number): Promise<RunView> {
  assertMay(actor, 'run:read');
  const project = await findProject(actor, projectId);
  return viewOf(await findRun(actor, project.id, runId));
}

export type RunOutcome = {
  run: RunView;
  result: SimulationResult;
  sample: RunSample | null;
  snapshot: Model;
};

/**
 * The stored result of a run that succeeded (409 while it has none). `withSample: false` leaves
 * out the sample the outcome's charts draw from (large, and not read by the comparison).
 */
export async function getRunOutcome(
  actor: Actor,
  projectId: number,
  runId: number,
  { withSample = true }: { withSample?: boolean } = {},
): Promise<RunOutcome> {
  assertMay(actor, 'run:read');
  const project = await findProject(actor, projectId);
  const run = await findRun(actor, project.id, runId, withSample ? 'full' : 'without-sample');
  if (run.status !== 'succeeded' || !run.result) {
    throw conflict(`Run ${run.id} has no result: it is ${run.status}.`, { status: run.status });
  }
  return {
    run: await viewOf(run),
    result: JSON.parse(run.result) as SimulationResult,
    sample: run.resultSample ? (JSON.parse(run.resultSample) as RunSample) : null,
    snapshot: JSON.parse(run.inputSnapshot) as Model,
  };
}

/** The model file a run read, exactly as stored, for download and for reproducing the run. */
export async function getRunSnapshot(
  actor: Actor,
  projectId: number,
  runId: number,
): Promise<{ run: RunView; snapshot: Model; projectCode: string }> {
  assertMay(actor, 'run:read');
  const project = await findProject(actor, projectId);
  const run = await findRun(actor, project.id, runId, true);
  return {
    run: await viewOf(run),
    snapshot: JSON.parse(run.inputSnapshot) as Model,
    projectCode: project.code,
  };
}

export async function cancelRun(actor: Actor, projectId: number, runId: number): Promise<RunView> {
  assertMay(actor, 'run:cancel');
  const project = await findProject(actor, projectId);
  const run = await findRun(actor, project.id, runId);
  await assertWritable(actor.organizationId);
  if (run.status !== 'queued' && run.status !== 'running') {
    throw conflict(`Run ${run.id} is already ${run.status}; only a queued or running run can be cancelled.`, {
      status: run.status,
    });
  }
  // Embedded, the engine has stopped and its runner marked the run when this returns; in queue
  // mode the worker hears of it, and the row is marked here (its runner's writes then miss).
  await runExecutor().stop(run.id);
  await sequelize.transaction(async (transaction) => {
    // A queued run, or one no engine executes any more, is cancelled here.
    await SimulationRun.update(
      { status: 'cancelled', finishedAt: new Date() },
      { where: { id: run.id, status: { [Op.in]: ['queued', 'running'] } }, transaction },
    );
    await recordAudit(
      actor,
      {
        entity: 'run',
        entityId: run.id,
        projectId: project.id,
        action: 'cancel',
        before: run.status,
        after: 'cancelled',
      },
      transaction,
    );
  });
  return viewOf(await findRun(actor, project.id, run.id));
}

export type LatestRunSummary = {
  runId: number;
  finishedAt: string | null;
  costP50: number;
  costP80: number;
  durationP50: number | null;
  durationP80: number | null;
};

/** The latest successful run of each project (for the projects list); absent when none. */
export async function latestRunSummaries(
  actor: Actor,
  projectIds: number[],
): Promise<Record<number, LatestRunSummary>> {
  if (!can(actor.role, 'run:read') || projectIds.length === 0) return {};
  const latest = await sequelize.query<{ id: number }>(
    `SELECT MAX(id) AS id FROM SimulationRuns
      WHERE organizationId = ? AND status = 'succeeded' AND projectId IN (?)
      GROUP BY projectId`,
    { replacements: [actor.organizationId, projectIds], type: QueryTypes.SELECT },
  );
  if (latest.length === 0) return {};
  const runs = await SimulationRun.findAll({
    where: { id: latest.map((r) => Number(r.id)), organizationId: actor.organizationId },
    attributes: ['id', 'projectId', 'summary', 'finishedAt'],
  });
  const out: Record<number, LatestRunSummary> = {};
  for (const r of runs) {
    if (!r.summary) continue;
    out[r.projectId] = {
      runId: r.id,
      finishedAt: r.finishedAt ? new Date(r.finishedAt).toISOString() : null,
      costP50: r.summary.cost.P50,
      costP80: r.summary.cost.P80,
      durationP50: r.summary.duration?.P50 ?? null,
      durationP80: r.summary.duration?.P80 ?? null,
    };
  }
  return out;
}
