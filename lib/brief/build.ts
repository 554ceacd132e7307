/**
 * Everything the brief shows, assembled from one run (its result and its input snapshot) and
 * its project. Pure: the page, the PDF and the JSON reply all render this one object.
 */
import { checkAgainstClass, type ClassCheck } from './estimate-class';
import { topRiskExposures, type RiskExposure } from './risk-exposure';
import { percentileCurve, topDrivers, type Point } from '@/lib/runs/outcome-data';
import type { Interval, Model, SimulationResult, TotalSummary } from '@/lib/sim';
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

export type DriverBrief = { id: string; name: string; rankCorrelation: number; varianceShare: number };

export type DecisionBrief = {
  id: number;
  decision: 'approved' | 'returned';
  comment: string;
  sponsorName: string;
  decidedAt: string;
  stage: string;
  estimateClass: number;
};

export type BriefProject = {
  id: number;
  name: string;
  code: string;
  currency: string;
  stage: string;
  estimateClass: number;
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
};

export type BriefData = {
  project: BriefProject;
  run: BriefRun;
  cost: TotalBrief;
  duration: TotalBrief | null;
  contingency: Contingency & { level: ContingencyLevel };
  joint: { probability: number; ci95: Interval } | null;
  drivers: DriverBrief[];
  topRisks: RiskExposure[];
  classCheck: ClassCheck | null;
  engineWarnings: string[];
  decision: DecisionBrief | null;
  sentForDecision: { at: string; byName: string } | null;
};

export type BriefSource = {
  project: BriefProject;
  run: Omit<BriefRun, 'iterations' | 'seed' | 'sampling' | 'confidence'> & { confidence?: string | null };
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
  for (const list of [model.items, model.risks ?? [], model.activities ?? []])
    for (const e of list) names.set(e.id, e.name ? `${e.id} ${e.name}` : e.id);
  return names;
}

export function buildBrief(source: BriefSource, { drivers = 10, risks = 8 } = {}): BriefData {
  const { result, snapshot, project } = source;
  const level = (CONFIDENCE_LEVELS as readonly string[]).includes(source.run.confidence ?? '')
    ? (source.run.confidence as ContingencyLevel)
    : 'P80';

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
  let classCheck: ClassCheck | null = null;
  if (result.cost.base > 0 && project.estimateClass >= 1 && project.estimateClass <= 5)
    classCheck = checkAgainstClass(
      project.estimateClass,
      result.cost.base,
      result.cost.percentiles.P10,
      result.cost.percentiles.P90,
    );

  return {
    project,
    run: {
      ...source.run,
      iterations: result.iterations,
      seed: result.seed,
      sampling: result.sampling,
      confidence: level,
    },
    cost,
    duration,
    contingency: { ...contingencyAt(result.cost, level), level },
    joint: result.joint ?? null,
    drivers: topDrivers(result.sensitivity.cost, drivers).map((d) => ({
      ...d,
      name: names.get(d.id) ?? d.id,
    })),
    topRisks: topRiskExposures(snapshot, risks),
    classCheck,
    engineWarnings: result.warnings ?? [],
    decision: source.decision ?? null,
    sentForDecision: source.sentForDecision ?? null,
  };
}
