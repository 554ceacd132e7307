/**
 * Everything the brief shows, assembled from one run (its result and its input snapshot) and
 * its project. Pure: the page, the PDF and the JSON reply all render this one object.
 */
import { checkAgainstClass, isEstimateClass, type ClassCheck } from '@/lib/domain/estimate-class';
import { finishDate, MONDAY_TO_FRIDAY, type WorkCalendar } from '@/lib/runs/working-days';
import { allocationByTopWbs, type AllocationBrief } from './allocation';
import { finishBrief, type FinishBrief } from './finish';
import { scheduleHealth, type HealthFinding } from '@/lib/domain/schedule-health';
import { topRiskExposures, type RiskExposure } from './risk-exposure';
import { scenarioBrief, type Scenario, type ScenarioBrief } from './scenario';
import { percentileCurve, topDrivers, type Point } from '@/lib/runs/outcome-data';
import type { InputKind, Interval, Model, SensitivityEntry, SimulationResult, TotalSummary } from '@/lib/sim';
import { contingencyAt, type Contingency } from '@/lib/domain/contingency';
import { CONFIDENCE_LEVELS, type ConfidenceLevel } from '@/lib/validation/runs';

export const BRIEF_LEVELS = ['P10', 'P50', 'P80', 'P90'] as const;
export type BriefLevel = (typeof BRIEF_LEVELS)[number];
type ContingencyLevel = ConfidenceLevel;

export type PercentileRow = { level: BriefLevel; value: number; ci95: Interval };

export type TotalBrief = {
  base: number;
  mean: number;
  percentiles: PercentileRow[];
  /** The S-curve through the result's percentiles. */
  curve: Point[];
  target: { value: number; probability: number; ci95: Interval } | null;
};

export type DriverBrief = {
  id: string;
  /** "C1 Sheet piling": the code and the name. */
  name: string;
  /** Line item, activity, risk event or risk driver (version 1 results do not say). */
  kind: InputKind | null;
  rankCorrelation: number;
  varianceShare: number;
  /** Mean total where the input is at its low and its high tenth (version 2 results). */
  swing: Interval | null;
};

export type DecisionBrief = {
  id: number;
  decision: 'approved' | 'returned';
  comment: string;
  sponsorName: string;
  decidedAt: string;
  stage: string;
  estimateClass: number;
  /** Approved by the person who started the run (the organisation allows it). */
  selfApproved: boolean;
};

export type BriefProject = {
  id: number;
  name: string;
  code: string;
  currency: string;
  stage: string;
  estimateClass: number;
  /** The day work starts: finish dates count working days from it. */
  baseDate: string;
  assumptions: string | null;
  exclusions: string | null;
  /** The project's version when the brief was read: editing its notes sends it back. */
  version: number;
};

export type BriefRun = {
  id: number;
  /** The run's number within its project, the name the brief reads. */
  number: number;
  iterations: number;
  seed: number | string;
  sampling: string;
  inputHash: string;
  startedByName: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  /** The confidence level the run was started to fund at. */
  confidence: ContingencyLevel;
  finishTarget: string | null;
  /** The risk values the run was started with (a version 2 result may carry both). */
  riskValues: Scenario;
  startedById: number | null;
  /** The working calendar stored with the run (Monday to Friday for runs made before calendars). */
  calendar: WorkCalendar;
};

export type BriefData = {
  project: BriefProject;
  run: BriefRun;
  cost: TotalBrief;
  duration: TotalBrief | null;
  contingency: Contingency & { level: ContingencyLevel };
  joint: { probability: number; ci95: Interval } | null;
  scenario: ScenarioBrief;
  /** Calendar dates of the finish, when the run has a schedule. */
  finish: FinishBrief | null;
  drivers: DriverBrief[];
  finishDrivers: DriverBrief[];
  allocation: AllocationBrief | null;
  topRisks: RiskExposure[];
  classCheck: ClassCheck | null;
  /** The schedule health check of the network the run read (empty without a schedule). */
  scheduleHealth: { findings: HealthFinding[]; activityCount: number };
  engineWarnings: string[];
  decision: DecisionBrief | null;
  sentForDecision: { at: string; byName: string } | null;
};

export type BriefSource = {
  project: BriefProject;
  run: Omit<BriefRun, 'iterations' | 'seed' | 'sampling' | 'confidence' | 'riskValues' | 'calendar'> & {
    confidence?: string | null;
    riskValues?: string | null;
    calendar?: WorkCalendar | null;
  };
  result: SimulationResult;
  snapshot: Model;
  decision?: DecisionBrief | null;
  sentForDecision?: { at: string; byName: string } | null;
};

/** One confidence level's row of a total (every level of BRIEF_LEVELS is always present). */
export function percentileOf(total: TotalBrief, level: BriefLevel): PercentileRow {
  return total.percentiles.find((p) => p.level === level)!;
}

function totalBrief(summary: TotalSummary): TotalBrief {
  return {
    base: summary.base,
    mean: summary.mean,
    percentiles: BRIEF_LEVELS.map((level) => ({
      level,
      value: summary.percentiles[level],
      ci95: summary.percentileCI95[level],
    })),
    curve: percentileCurve(summary),
    target: null,
  };
}

/** The names of the model's inputs by id, for the tornado's labels. */
function inputNames(model: Model): Map<string, string> {
  const names = new Map<string, string>();
  for (const list of [model.items, model.risks ?? [], model.activities ?? [], model.drivers ?? []])
    for (const e of list) names.set(e.id, e.name ? `${e.id} ${e.name}` : e.id);
  return names;
}

function driversOf(entries: SensitivityEntry[], names: Map<string, string>, count: number): DriverBrief[] {
  return topDrivers(entries, count).map((d) => ({
    id: d.id,
    name: names.get(d.id) ?? d.id,
    kind: d.kind ?? null,
    rankCorrelation: d.rankCorrelation,
    varianceShare: d.varianceShare,
    swing: d.swing ?? null,
  }));
}

export function buildBrief(source: BriefSource, { drivers = 10, risks = 8 } = {}): BriefData {
  const { result, snapshot, project } = source;
  const level = (CONFIDENCE_LEVELS as readonly string[]).includes(source.run.confidence ?? '')
    ? (source.run.confidence as ContingencyLevel)
    : 'P80';

  const calendar = source.run.calendar ?? MONDAY_TO_FRIDAY;
  const scenario = scenarioBrief(result, snapshot, source.run.riskValues === 'post' ? 'post' : 'pre');
  const cost = totalBrief(result.cost);
  const within = result.cost.probabilityWithinTarget;
  if (within && snapshot.targets?.cost !== undefined)
    cost.target = { value: snapshot.targets.cost, probability: within.value, ci95: within.ci95 };
  let duration: TotalBrief | null = null;
  if (result.duration) {
    duration = totalBrief(result.duration);
    const onTime = result.duration.probabilityWithinTarget;
    if (onTime && snapshot.targets?.duration !== undefined)
      duration.target = { value: snapshot.targets.duration, probability: onTime.value, ci95: onTime.ci95 };
  }

  const names = inputNames(snapshot);
  const { P10, P50, P90 } = result.cost.percentiles;
  const classCheck: ClassCheck | null =
    isEstimateClass(project.estimateClass) && P50 > 0
      ? checkAgainstClass(project.estimateClass, P10, P50, P90)
      : null;
  const finishTarget = duration?.target
    ? {
        days: duration.target.value,
        date: source.run.finishTarget ?? finishDate(project.baseDate, duration.target.value, calendar),
      }
    : null;

  return {
    project,
    run: {
      ...source.run,
      iterations: result.iterations,
      seed: result.seed,
      sampling: result.sampling,
      confidence: level,
      riskValues: source.run.riskValues === 'post' ? 'post' : 'pre',
      calendar,
    },
    cost,
    duration,
    contingency: { ...contingencyAt(result.cost, level), level },
    joint: result.joint ? { probability: result.joint.probability, ci95: result.joint.ci95 } : null,
    scenario,
    finish: result.duration
      ? finishBrief(result.duration, project.baseDate, level, finishTarget, calendar)
      : null,
    drivers: driversOf(result.sensitivity.cost, names, drivers),
    finishDrivers: result.duration ? driversOf(result.sensitivity.duration, names, drivers) : [],
    allocation: result.allocation ? allocationByTopWbs(result.allocation, snapshot) : null,
    topRisks: topRiskExposures(snapshot, risks, scenario.used),
    classCheck,
    scheduleHealth: {
      findings: scheduleHealth(snapshot.activities ?? []),
      activityCount: (snapshot.activities ?? []).length,
    },
    engineWarnings: result.warnings ?? [],
    decision: source.decision ?? null,
    sentForDecision: source.sentForDecision ?? null,
  };
}
