/**
 * Compiles a validated model into the plan the sampler runs: distributions built once, random
 * variables numbered (one column of uniforms each), the network prepared, correlations grouped
 * and factored, the deterministic base computed and the model-level warnings collected.
 * Deterministic: the main thread and every worker compile the same model to the same plan.
 */

import { planCorrelations, type CorrelationGroup } from './correlation/plan';
import { createDistribution, type Distribution } from './distributions';
import { baseDurationOf, baseOf } from './distributions/base';
import { createFixed } from './distributions/fixed';
import { finishOf } from './schedule/base-finish';
import { existenceInput } from './schedule/branches';
import { buildNetwork, type Network } from './schedule/network';
import { streamIdsFor } from './random/stream-ids';
import type { DistSpec, InputKind, Model } from './formats';

export interface CostItemPlan {
  id: string;
  dist: Distribution;
  /** Column of its uniforms, −1 when it has no spread. */
  v: number;
  /** Drivers whose factor multiplies its sampled cost. */
  drivers: Int32Array;
  /** Its part of the base estimate. */
  base: number;
}

export interface RateItemPlan {
  id: string;
  rate: Distribution;
  v: number;
  /** The activity whose duration it runs with, −1 for the project's duration (span "project"). */
  activity: number;
  drivers: Int32Array;
  /** Its part of the base estimate. */
  base: number;
}

export interface ActivityPlan {
  id: string;
  dist: Distribution;
  v: number;
  drivers: Int32Array;
  /** Probability that it happens (a probabilistic branch; 1 for an ordinary activity). */
  existence: number;
  /**
   * Column of its existence uniform u (it happens when u > 1 − existence, as a risk occurs),
   * −1 when existence is 0 or 1.
   */
  vExists: number;
}

/** A risk's probability and impacts in one scenario (before or after mitigation). */
export interface RiskImpact {
  probability: number;
  cost: Distribution | null;
  delay: Distribution | null;
}

export interface RiskPlan {
  id: string;
  /**
   * Column of the risk's uniform u: it occurs when u > 1 − p, sized by F⁻¹((u − (1 − p))/p).
   * −1 when p is 0 or 1 and every impact is fixed.
   */
  v: number;
  /** Column of the delay's own uniform ("sizes": "independent"), else −1. */
  vDelay: number;
  pre: RiskImpact;
  /** After mitigation; null when the risk has no post block. */
  post: RiskImpact | null;
  /** Activities its delay lengthens. */
  activities: Int32Array;
  mitigationCost: Distribution | null;
  vMitigation: number;
  /** Line items its cost belongs to in the allocation of contingency (empty: the risk itself). */
  allocateTo: string[];
}

export interface DriverPlan {
  id: string;
  probability: number;
  factor: Distribution;
  /** Column of its uniform (occurrence and factor, as for a risk), −1 when it needs none. */
  v: number;
}

/** An input of the tornado: its grade (its uniform u) per iteration is stored. */
export interface SensitivityInput {
  id: string;
  kind: InputKind;
  /** The column whose uniforms are its grades. */
  v: number;
  cost: boolean;
  duration: boolean;
  /** Index of the activity (kind "activity"), else −1. */
  activity: number;
}

export interface CorrelationEntry {
  a: string;
  b: string;
  target: number;
  used: number;
  /** Columns of the pair, −1 when the pair is ignored. */
  va: number;
  vb: number;
}

export interface Plan {
  version: 1 | 2;
  variables: number;
  variableIds: string[];
  /** Per column, the id of its random stream (./random/stream-ids). */
  streamIds: Uint32Array;
  costItems: CostItemPlan[];
  rateItems: RateItemPlan[];
  activities: ActivityPlan[];
  risks: RiskPlan[];
  drivers: DriverPlan[];
  /** True when some risk has a post block: both scenarios are computed. */
  hasPost: boolean;
  /** The scenario reported in the headline figures. */
  headline: 'pre' | 'post';
  network: Network | null;
  groups: CorrelationGroup[];
  /** 1 for columns drawn by a correlation group. */
  grouped: Uint8Array;
  maxGroupSize: number;
  correlations: CorrelationEntry[];
  sensitivity: SensitivityInput[];
  base: { cost: number; duration: number | null };
  targets: { cost?: number; duration?: number };
  settings: { jointConfidence: number; contingencyLevel: 'P50' | 'P70' | 'P80' | 'P90' };
  warnings: string[];
  /** Distinct (α, β) of the beta-PERT distributions sampled (their quantile tables). */
  betaShapes: [number, number][];
}

/** Probability mass below zero above which a duration or delay warns that it is cut at 0. */
const NEGATIVE_MASS_WARNING = 1e-3;
/** A model with at least this many line items and no correlation gets a warning. */
export const MANY_ITEMS = 10;

export function compileModel(model: Model): Plan {
  const warnings: string[] = [];
  const variableIds: string[] = [];
  const newColumn = (label: string, degenerate: boolean) => {
    if (degenerate) return -1;
    variableIds.push(label);
    return variableIds.length - 1;
  };
  const version = model.version;
  const activitiesIn = model.activities ?? [];
  const activityIndex = new Map(activitiesIn.map((a, i) => [a.id, i]));
  const inputColumn = new Map<string, number>();

  // Drivers first: every other input lists the drivers that scale it.
  const driversIn = model.drivers ?? [];
  const driversOf = new Map<string, number[]>();
  const drivers: DriverPlan[] = driversIn.map((d, k) => {
    const factor = createDistribution(d.factor, { where: d.id, field: 'factor' });
    const probability = d.probability ?? 1;
    for (const target of d.applies) driversOf.set(target, [...(driversOf.get(target) ?? []), k]);
    const v = newColumn(d.id, probability <= 0 || (probability >= 1 && factor.degenerate));
    inputColumn.set(d.id, v);
    if (probability === 0) warnings.push(`${d.id}: probability 0, so the driver never acts.`);
    return { id: d.id, probability, factor, v };
  });
  // Drivers, like risks, act only in the simulation: the base stays the deterministic estimate.
  const driverList = (id: string) => Int32Array.from(driversOf.get(id) ?? []);

  const activities: ActivityPlan[] = activitiesIn.map((a) => {
    const dist = createDistribution(a.duration, { where: a.id, field: 'duration' });
    if (dist.cdf(-1e-9) > NEGATIVE_MASS_WARNING) {
      warnings.push(
        `${a.id}: its duration can be negative (P = ${dist.cdf(0).toFixed(3)}); such samples count as 0 days.`,
      );
    }
    const v = newColumn(a.id, dist.degenerate);
    inputColumn.set(a.id, v);
    const existence = a.existence ?? 1;
    const vExists = newColumn(existenceInput(a.id), existence <= 0 || existence >= 1);
    inputColumn.set(existenceInput(a.id), vExists);
    if (existence === 0) warnings.push(`${a.id}: existence 0, so the activity never happens (0 days).`);
    return { id: a.id, dist, v, drivers: driverList(a.id), existence, vExists };
  });

  // A probabilistic branch is left out of the base, as risk events are: the base is the plan
  // without the events that may or may not happen.
  const baseDurations = new Float64Array(
    activities.map((a) => (a.existence < 1 ? 0 : baseDurationOf(a.dist))),
  );
  const network = activitiesIn.length ? buildNetwork(activitiesIn) : null;
  let durationBase: number | null = null;
  if (network) durationBase = finishOf(network, baseDurations);

  const costItems: CostItemPlan[] = [];
  const rateItems: RateItemPlan[] = [];
  // The deterministic base: item bases, rates × base durations, no risk events, no drivers.
  let costBase = 0;
  for (const item of model.items) {
    if (item.ratePerDay !== undefined) {
      const rate =
        typeof item.ratePerDay === 'number'
          ? createFixed({ value: item.ratePerDay }, { where: item.id, field: 'ratePerDay' })
          : createDistribution(item.ratePerDay, { where: item.id, field: 'ratePerDay' });
      const v = newColumn(item.id, rate.degenerate);
      const projectSpan = item.span === 'project';
      const activity = projectSpan ? -1 : activityIndex.get(item.activity!)!;
      const days = projectSpan ? (durationBase ?? 0) : baseDurations[activity];
      const base = item.base ?? baseOf(rate) * days;
      rateItems.push({ id: item.id, rate, v, activity, drivers: driverList(item.id), base });
      costBase += base;
      inputColumn.set(item.id, v);
    } else {
      const dist = item.dist
        ? createDistribution(item.dist, { where: item.id, field: 'dist' })
        : createFixed({ value: item.base ?? 0 }, { where: item.id, field: 'base' });
      warnFittedBelowZero(item.id, 'dist', item.dist, dist, warnings);
      const v = newColumn(item.id, dist.degenerate);
      const base = item.base ?? baseOf(dist);
      costItems.push({ id: item.id, dist, v, drivers: driverList(item.id), base });
      costBase += base;
      inputColumn.set(item.id, v);
    }
  }

  const hasPost = (model.risks ?? []).some((r) => r.post !== undefined);
  const risks: RiskPlan[] = (model.risks ?? []).map((r) => {
    const cost = r.cost ? createDistribution(r.cost, { where: r.id, field: 'cost' }) : null;
    const delay = r.delay ? createDistribution(r.delay, { where: r.id, field: 'delay' }) : null;
    if (version === 1 && delay && delay.cdf(-1e-12) > NEGATIVE_MASS_WARNING) {
      warnings.push(
        `${r.id}: its delay can be negative (P = ${delay.cdf(0).toFixed(3)}); such samples count as 0 days.`,
      );
    }
    const pre: RiskImpact = { probability: r.probability, cost, delay };
    const post: RiskImpact | null = r.post
      ? {
          probability: r.post.probability ?? r.probability,
          cost: r.post.cost ? createDistribution(r.post.cost, { where: r.id, field: 'post.cost' }) : cost,
          delay: r.post.delay
            ? createDistribution(r.post.delay, { where: r.id, field: 'post.delay' })
            : delay,
        }
      : null;
    const independent = r.sizes === 'independent' && cost !== null && delay !== null;
    const spread = (x: RiskImpact | null) =>
      x !== null &&
      ((x.probability > 0 && x.probability < 1) ||
        (x.probability > 0 && !!x.cost && !x.cost.degenerate) ||
        (x.probability > 0 && !independent && !!x.delay && !x.delay.degenerate));
    const v = newColumn(r.id, !(spread(pre) || spread(post)));
    const delaySpread = (x: RiskImpact | null) => x !== null && !!x.delay && !x.delay.degenerate;
    const vDelay = independent ? newColumn(`${r.id} (delay)`, !(delaySpread(pre) || delaySpread(post))) : -1;
    const mitigationCost =
      r.mitigationCost === undefined
        ? null
        : typeof r.mitigationCost === 'number'
          ? createFixed({ value: r.mitigationCost }, { where: r.id, field: 'mitigationCost' })
          : createDistribution(r.mitigationCost, { where: r.id, field: 'mitigationCost' });
    const vMitigation = mitigationCost ? newColumn(`${r.id} (mitigation)`, mitigationCost.degenerate) : -1;
    inputColumn.set(r.id, v);
    if (r.probability === 0 && !(post && post.probability > 0))
      warnings.push(`${r.id}: probability 0, so the risk never occurs.`);
    const acts = r.activities ?? (r.activity !== undefined ? [r.activity] : []);
    return {
      id: r.id,
      v,
      vDelay,
      pre,
      post,
      activities: Int32Array.from(delay ? acts.map((a) => activityIndex.get(a)!) : []),
      mitigationCost,
      vMitigation,
      allocateTo: r.items ?? [],
    };
  });

  // Correlations: pairs whose both ends have spread go to the groups; the rest are reported.
  const requested = model.correlations ?? [];
  const live: { a: number; b: number; rho: number; entry: number }[] = [];
  const correlations: CorrelationEntry[] = requested.map((c, entry) => {
    const va = inputColumn.get(c.a) ?? -1;
    const vb = inputColumn.get(c.b) ?? -1;
    if (va < 0 || vb < 0) {
      const flat = va < 0 ? c.a : c.b;
      warnings.push(`${c.a}–${c.b}: ${flat} has no spread, so this correlation is ignored.`);
      return { a: c.a, b: c.b, target: c.rho, used: 0, va: -1, vb: -1 };
    }
    live.push({ a: va, b: vb, rho: c.rho, entry });
    return { a: c.a, b: c.b, target: c.rho, used: c.rho, va, vb };
  });
  const corr = planCorrelations(live, (v) => variableIds[v]);
  live.forEach((l, i) => (correlations[l.entry].used = corr.used[i]));
  warnings.push(...corr.warnings);
  const grouped = new Uint8Array(variableIds.length);
  let maxGroupSize = 0;
  for (const g of corr.groups) {
    for (const v of g.vars) grouped[v] = 1;
    maxGroupSize = Math.max(maxGroupSize, g.k);
  }
  if (model.items.length >= MANY_ITEMS && requested.length === 0) {
    warnings.push(
      `The model has ${model.items.length} line items and no correlations: an uncorrelated roll-up ` +
        `understates the spread of the total (items that share a cause, a market or a contractor ` +
        `usually move together).`,
    );
  }

  const sensitivity = tornadoInputs({ costItems, rateItems, activities, risks, drivers, driversIn });

  const shapes = new Map<string, [number, number]>();
  const sampled = [
    ...costItems.map((c) => c.dist),
    ...rateItems.map((r) => r.rate),
    ...activities.map((a) => a.dist),
    ...risks.flatMap((r) => [r.pre.cost, r.pre.delay, r.post?.cost, r.post?.delay, r.mitigationCost]),
    ...drivers.map((d) => d.factor),
  ];
  for (const d of sampled)
    if (d?.betaShape) shapes.set(d.betaShape.join(':'), [d.betaShape[0], d.betaShape[1]]);

  const settings = model.settings ?? {};
  return {
    version,
    betaShapes: [...shapes.values()],
    variables: variableIds.length,
    variableIds,
    streamIds: streamIdsFor(variableIds),
    costItems,
    rateItems,
    activities,
    risks,
    drivers,
    hasPost,
    headline: settings.mitigation ?? (hasPost ? 'post' : 'pre'),
    network,
    groups: corr.groups,
    grouped,
    maxGroupSize,
    correlations,
    sensitivity,
    base: { cost: costBase, duration: durationBase },
    targets: { ...model.targets },
    settings: {
      jointConfidence: settings.jointConfidence ?? 0.7,
      contingencyLevel: settings.contingencyLevel ?? 'P80',
    },
    warnings,
  };
}

/**
 * Tornado inputs: what can move each total. Cost moves with items, with activities that carry
 * time-dependent costs (every activity when a cost runs with the project's duration), with risks
 * that cost money or delay such activities, and with drivers of any of these.
 */
function tornadoInputs(p: {
  costItems: CostItemPlan[];
  rateItems: RateItemPlan[];
  activities: ActivityPlan[];
  risks: RiskPlan[];
  drivers: DriverPlan[];
  driversIn: NonNullable<Model['drivers']>;
}): SensitivityInput[] {
  const projectSpan = p.rateItems.some((r) => r.activity < 0);
  const costlyActivity = new Uint8Array(p.activities.length);
  for (const r of p.rateItems) {
    if (r.activity >= 0) costlyActivity[r.activity] = 1;
    else costlyActivity.fill(1);
  }
  const activityIds = new Map(p.activities.map((a, i) => [a.id, i]));
  const out: SensitivityInput[] = [];
  const add = (id: string, kind: InputKind, v: number, cost: boolean, duration: boolean, activity = -1) => {
    if (v >= 0 && (cost || duration)) out.push({ id, kind, v, cost, duration, activity });
  };
  for (const c of p.costItems) add(c.id, 'item', c.v, true, false);
  for (const r of p.rateItems) add(r.id, 'item', r.v, true, false);
  p.activities.forEach((a, i) => add(a.id, 'activity', a.v, costlyActivity[i] === 1, true, i));
  for (const r of p.risks) {
    const delays = r.activities.length > 0;
    const costly =
      r.pre.cost !== null || (delays && (projectSpan || r.activities.some((a) => costlyActivity[a])));
    add(r.id, 'risk', r.v, costly, delays);
  }
  p.drivers.forEach((d, k) => {
    const targets = p.driversIn[k].applies;
    const acts = targets.filter((t) => activityIds.has(t)).map((t) => activityIds.get(t)!);
    const costly = targets.length > acts.length || acts.some((a) => costlyActivity[a]);
    add(d.id, 'driver', d.v, costly, acts.length > 0);
  });
  return out;
}

/** A cost given as a P10–P90 range whose fitted lower bound falls below zero (while P10 ≥ 0). */
function warnFittedBelowZero(
  id: string,
  field: string,
  spec: DistSpec | undefined,
  dist: Distribution,
  warnings: string[],
): void {
  if (!spec || !('range' in spec) || spec.range !== 'p10-p90') return;
  if (spec.low >= 0 && dist.support[0] < 0) {
    warnings.push(
      `${id}: the ${field} fitted to P10 ${spec.low} and P90 ${spec.high} has its lower bound ` +
        `below zero (${dist.support[0].toPrecision(4)}), so some samples are negative costs.`,
    );
  }
}
