/**
 * The registers of a project as the engine's model file: codes become ids, links by row become
 * links by code. The model file export and every run's input snapshot are built here and nowhere
 * else, so that what a user downloads is exactly what a run reads. See docs/model-format.md.
 *
 * Rules:
 * - a closed risk event is left out (it can no longer occur);
 * - with `riskValues: 'post'` a risk uses its post-mitigation probability and impacts where given;
 * - a correlation is kept only when both its inputs are in the model: one that names a closed
 *   risk (or any code the model does not hold) is left out with a notice, since the engine
 *   refuses a correlation of an unknown input and no run could start.
 */
import { linkToModel, type PredecessorLink } from '@/lib/registers/predecessors';
import {
  existenceInput,
  type DistSpec,
  type Model,
  type ModelActivity,
  type ModelCorrelation,
  type ModelItem,
  type ModelRisk,
} from '@/lib/sim';

export type RiskValues = 'pre' | 'post';

/** The register records, JSON columns parsed and links already resolved to codes. */
export type ItemRecord = {
  code: string;
  description: string;
  base: number | null;
  dist: DistSpec | null;
  ratePerDay: DistSpec | number | null;
  activityCode: string | null;
};

export type RiskRecord = {
  code: string;
  title: string;
  status: string;
  probability: number;
  costImpact: DistSpec | null;
  delayImpact: DistSpec | null;
  postProbability: number | null;
  postCostImpact: DistSpec | null;
  postDelayImpact: DistSpec | null;
  activityCode: string | null;
};

export type ActivityRecord = {
  code: string;
  name: string;
  duration: DistSpec;
  predecessors: PredecessorLink[] | null;
  /** Probability that it happens; null or absent: always. */
  existence?: number | null;
};

export type CorrelationRecord = { aCode: string; bCode: string; rho: number };

export type RegisterRecords = {
  project: { name: string; currency: string };
  items: readonly ItemRecord[];
  risks: readonly RiskRecord[];
  activities: readonly ActivityRecord[];
  correlations: readonly CorrelationRecord[];
};

export type ModelExport = {
  model: Model;
  /** What was left out of the model and why, in words a user reads. */
  notices: string[];
};

function activityOf(a: ActivityRecord): ModelActivity {
  return {
    id: a.code,
    name: a.name,
    duration: a.duration,
    predecessors: (a.predecessors ?? []).map(linkToModel),
    ...(a.existence !== null && a.existence !== undefined ? { existence: a.existence } : {}),
  };
}

function itemOf(i: ItemRecord): ModelItem {
  const item: ModelItem = { id: i.code, name: i.description };
  if (i.base !== null) item.base = i.base;
  if (i.dist) item.dist = i.dist;
  if (i.ratePerDay !== null) {
    item.ratePerDay = i.ratePerDay;
    if (i.activityCode !== null) item.activity = i.activityCode;
  }
  return item;
}

function riskOf(r: RiskRecord, post: boolean): ModelRisk {
  const probability = post && r.postProbability !== null ? r.postProbability : r.probability;
  const cost = post && r.postCostImpact ? r.postCostImpact : r.costImpact;
  const delay = post && r.postDelayImpact ? r.postDelayImpact : r.delayImpact;
  const risk: ModelRisk = { id: r.code, name: r.title, probability };
  if (cost) risk.cost = cost;
  if (delay) risk.delay = delay;
  if (delay && r.activityCode !== null) risk.activity = r.activityCode;
  return risk;
}

/** Why a correlation's input is not in the model. */
function missingReason(code: string, closed: ReadonlySet<string>): string {
  return closed.has(code) ? `risk ${code} is closed` : `no line item, risk or activity has the code ${code}`;
}

export function registersToModel(
  records: RegisterRecords,
  options: { riskValues?: RiskValues } = {},
): ModelExport {
  const post = options.riskValues === 'post';
  const items = records.items.map(itemOf);
  const openRisks = records.risks.filter((r) => r.status !== 'closed');
  const risks = openRisks.map((r) => riskOf(r, post));
  const activities = records.activities.map(activityOf);

  const inModel = new Set([...items, ...risks, ...activities].map((e) => e.id));
  for (const a of activities) if (a.existence !== undefined) inModel.add(existenceInput(a.id));
  const closed = new Set(records.risks.filter((r) => r.status === 'closed').map((r) => r.code));
  const notices: string[] = [];
  const correlations: ModelCorrelation[] = [];
  for (const c of records.correlations) {
    const missing = [c.aCode, c.bCode].filter((code) => !inModel.has(code));
    if (missing.length) {
      const reasons = [...new Set(missing)].map((code) => missingReason(code, closed)).join(' and ');
      notices.push(
        `The correlation ${c.aCode}–${c.bCode} (ρ ${c.rho}) is left out of the model: ${reasons}.`,
      );
      continue;
    }
    correlations.push({ a: c.aCode, b: c.bCode, rho: c.rho });
  }

  const model: Model = {
    format: 'outturn-model',
    version: 1,
    name: records.project.name,
    currency: records.project.currency,
    items,
    risks,
    activities,
    correlations,
  };
  return { model, notices };
}
