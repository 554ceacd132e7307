/**
 * The registers of a project as the engine's model file (version 2): codes become ids, links by
 * row become links by code. The model file export and every run's input snapshot are built here
 * and nowhere else, so that what a user downloads is exactly what a run reads. See
 * docs/model-format.md.
 *
 * Rules (each one a notice in words a user reads when it leaves something out or changes it):
 * - a closed risk event is left out (it can no longer occur), and so is every correlation that
 *   names it;
 * - an occurred risk event counts as certain, probability 1 before and after its response, until
 *   it is moved into the base estimate (then closed);
 * - a risk's post-mitigation values and its response's cost travel as the risk's `post` block and
 *   `mitigationCost`, so one run computes both scenarios from the same random numbers;
 *   `riskValues` chooses which one is the headline (`settings.mitigation`);
 * - a correlation is kept only when both its inputs are in the model: one that names a closed
 *   risk (or any code the model does not hold) is left out with a notice, since the engine
 *   refuses a correlation of an unknown input and no run could start;
 * - a risk driver's codes and WBS branches ("3.*") are resolved to the line items and activities
 *   they cover now; codes that cover nothing are left out with a notice, and so is a driver that
 *   covers nothing at all. A model with drivers is a version 2 model.
 */
import { resolveApplies } from '@/lib/registers/driver-applies';
import { linkToModel, type PredecessorLink } from '@/lib/registers/predecessors';
import {
  existenceInput,
  type DistSpec,
  type Model,
  type ModelActivity,
  type ModelCorrelation,
  type ModelDriver,
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
  /** "project": the rate runs with the whole project's duration. */
  span?: 'project' | null;
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
  /** The activities its delay lengthens. */
  activityCodes: string[];
  /** The line items its cost belongs to (for the allocation of contingency). */
  itemCodes?: string[];
  sizes?: 'linked' | 'independent';
  mitigationCost?: DistSpec | number | null;
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

export type DriverRecord = {
  code: string;
  name: string;
  probability: number;
  factor: DistSpec;
  /** Codes and WBS branches as the estimator typed them. */
  applies: readonly string[];
};

export type RegisterRecords = {
  project: { name: string; currency: string; stage?: string; estimateClass?: number; baseDate?: string };
  items: readonly ItemRecord[];
  risks: readonly RiskRecord[];
  activities: readonly ActivityRecord[];
  correlations: readonly CorrelationRecord[];
  /** Absent in records read before the drivers register existed. */
  drivers?: readonly DriverRecord[];
};

export type ModelExport = {
  model: Model;
  /** What was left out of the model or changed on its way in, and why, in words a user reads. */
  notices: string[];
};

/** The status rules, as the registers state them on screen. */
export const STATUS_RULES = {
  occurred: 'An occurred risk counts as certain (probability 100%) until it is moved into the base estimate.',
  closed: 'A closed risk and its correlations are left out of the model.',
} as const;

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
    if (i.span === 'project') item.span = 'project';
    else if (i.activityCode !== null) item.activity = i.activityCode;
  }
  return item;
}

/** The risk's block after its response, or undefined when it has no post value and no response cost. */
function postOf(r: RiskRecord, certain: boolean): ModelRisk['post'] {
  const hasMitigationCost = r.mitigationCost !== null && r.mitigationCost !== undefined;
  if (r.postProbability === null && !r.postCostImpact && !r.postDelayImpact && !hasMitigationCost)
    return undefined;
  const post: NonNullable<ModelRisk['post']> = {};
  if (r.postProbability !== null) post.probability = certain ? 1 : r.postProbability;
  if (r.postCostImpact && r.costImpact) post.cost = r.postCostImpact;
  if (r.postDelayImpact && r.delayImpact) post.delay = r.postDelayImpact;
  return post;
}

function riskOf(r: RiskRecord): ModelRisk {
  const certain = r.status === 'occurred';
  const risk: ModelRisk = { id: r.code, name: r.title, probability: certain ? 1 : r.probability };
  if (r.costImpact) risk.cost = r.costImpact;
  if (r.delayImpact) {
    risk.delay = r.delayImpact;
    if (r.activityCodes.length) risk.activities = [...r.activityCodes];
  }
  if (r.costImpact && r.itemCodes?.length) risk.items = [...r.itemCodes];
  if (r.sizes === 'independent' && r.costImpact && r.delayImpact) risk.sizes = 'independent';
  const post = postOf(r, certain);
  if (post) risk.post = post;
  if (r.mitigationCost !== null && r.mitigationCost !== undefined) risk.mitigationCost = r.mitigationCost;
  return risk;
}

/** Why a correlation's input is not in the model. */
function missingReason(code: string, closed: ReadonlySet<string>): string {
  return closed.has(code)
    ? `risk ${code} is closed`
    : `no line item, risk, activity or driver has the code ${code}`;
}

/** The drivers with what they cover now; notices for what covers nothing. */
function driversOf(records: RegisterRecords, notices: string[]): ModelDriver[] {
  const targets = {
    items: records.items.map((i) => i.code),
    activities: records.activities.map((a) => a.code),
  };
  const out: ModelDriver[] = [];
  for (const d of records.drivers ?? []) {
    const { codes, problems } = resolveApplies(d.applies, targets);
    if (codes.length === 0) {
      notices.push(`The driver ${d.code} is left out of the model: it applies to no line item or activity.`);
      continue;
    }
    for (const p of problems) notices.push(`The driver ${d.code} skips ${p.token}: ${p.message}`);
    const driver: ModelDriver = { id: d.code, name: d.name, factor: d.factor, applies: codes };
    if (d.probability !== 1) driver.probability = d.probability;
    out.push(driver);
  }
  return out;
}

/** The notices of the status rules: which risks were left out, which count as certain. */
function statusNotices(risks: readonly RiskRecord[]): string[] {
  const notices: string[] = [];
  for (const r of risks) {
    if (r.status === 'closed')
      notices.push(`Risk ${r.code} (${r.title}) is closed: it is left out of the model.`);
    else if (r.status === 'occurred' && (r.probability !== 1 || (r.postProbability ?? 1) !== 1))
      notices.push(
        `Risk ${r.code} (${r.title}) has occurred: it counts as certain (probability 100%) until it is moved into the base estimate.`,
      );
  }
  return notices;
}

export function registersToModel(
  records: RegisterRecords,
  options: { riskValues?: RiskValues } = {},
): ModelExport {
  const items = records.items.map(itemOf);
  const risks = records.risks.filter((r) => r.status !== 'closed').map(riskOf);
  const activities = records.activities.map(activityOf);
  const notices = statusNotices(records.risks);
  const drivers = driversOf(records, notices);

  const inModel = new Set([...items, ...risks, ...activities, ...drivers].map((e) => e.id));
  for (const a of activities) if (a.existence !== undefined) inModel.add(existenceInput(a.id));
  const closed = new Set(records.risks.filter((r) => r.status === 'closed').map((r) => r.code));
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
    version: 2,
    name: records.project.name,
    currency: records.project.currency,
    items,
    risks,
    activities,
    correlations,
  };
  const { stage, estimateClass, baseDate } = records.project;
  if (stage || estimateClass || baseDate) model.project = { stage, estimateClass, baseDate };
  if (drivers.length) model.drivers = drivers;
  // The headline scenario, when there is a second one to choose from.
  if (risks.some((r) => r.post)) model.settings = { mitigation: options.riskValues ?? 'pre' };
  return { model, notices };
}
