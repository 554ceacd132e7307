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
import { allocateForwardPass, forwardPass } from './schedule/forward-pass';
import { buildNetwork, type Network } from './schedule/network';
import type { Model } from './formats';

export interface CostItemPlan {
  id: string;
  dist: Distribution;
  /** Column of its uniforms, −1 when it has no spread. */
  v: number;
}

export interface RateItemPlan {
  id: string;
  rate: Distribution;
  v: number;
  activity: number;
}

export interface ActivityPlan {
  id: string;
  dist: Distribution;
  v: number;
}

export interface RiskPlan {
  id: string;
  probability: number;
  /** Column deciding occurrence (u < p), −1 when p is 0 or 1. */
  vOccur: number;
  /** Column of the impact severity shared by cost and delay, −1 when both are fixed. */
  vSeverity: number;
  cost: Distribution | null;
  delay: Distribution | null;
  activity: number;
}

/** An input of the tornado: its grade (probability-scale value) per iteration is stored. */
export interface SensitivityInput {
  id: string;
  /** 'column': the grade is the uniform of column v; 'risk': the mid-distribution grade of risk r. */
  source: 'column' | 'risk';
  v: number;
  risk: number;
  cost: boolean;
  duration: boolean;
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
  variables: number;
  variableIds: string[];
  costItems: CostItemPlan[];
  rateItems: RateItemPlan[];
  activities: ActivityPlan[];
  risks: RiskPlan[];
  network: Network | null;
  groups: CorrelationGroup[];
  /** 1 for columns drawn by a correlation group. */
  grouped: Uint8Array;
  maxGroupSize: number;
  correlations: CorrelationEntry[];
  sensitivity: SensitivityInput[];
  base: { cost: number; duration: number | null };
  targets: { cost?: number; duration?: number };
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
  const newColumn = (id: string, degenerate: boolean) => {
    if (degenerate) return -1;
    variableIds.push(id);
    return variableIds.length - 1;
  };
  const activitiesIn = model.activities ?? [];
  const activityIndex = new Map(activitiesIn.map((a, i) => [a.id, i]));
  const inputColumn = new Map<string, number>();

  const activities: ActivityPlan[] = activitiesIn.map((a) => {
    const dist = createDistribution(a.duration, { where: a.id, field: 'duration' });
    if (dist.cdf(-1e-9) > NEGATIVE_MASS_WARNING) {
      warnings.push(
        `${a.id}: its duration can be negative (P = ${dist.cdf(0).toFixed(3)}); such samples count as 0 days.`,
      );
    }
    const v = newColumn(a.id, dist.degenerate);
    inputColumn.set(a.id, v);
    return { id: a.id, dist, v };
  });

  const baseDurations = new Float64Array(activities.map((a) => baseDurationOf(a.dist)));

  const costItems: CostItemPlan[] = [];
  const rateItems: RateItemPlan[] = [];
  // The deterministic base: item bases, time-dependent rates × base durations, no risk events.
  let costBase = 0;
  for (const item of model.items) {
    if (item.ratePerDay !== undefined) {
      const rate =
        typeof item.ratePerDay === 'number'
          ? createFixed({ value: item.ratePerDay }, { where: item.id, field: 'ratePerDay' })
          : createDistribution(item.ratePerDay, { where: item.id, field: 'ratePerDay' });
      const v = newColumn(item.id, rate.degenerate);
      const activity = activityIndex.get(item.activity!)!;
      rateItems.push({ id: item.id, rate, v, activity });
      costBase += item.base ?? baseOf(rate) * baseDurations[activity];
      inputColumn.set(item.id, v);
    } else {
      const dist = item.dist
        ? createDistribution(item.dist, { where: item.id, field: 'dist' })
        : createFixed({ value: item.base ?? 0 }, { where: item.id, field: 'base' });
      const v = newColumn(item.id, dist.degenerate);
      costItems.push({ id: item.id, dist, v });
      costBase += item.base ?? baseOf(dist);
      inputColumn.set(item.id, v);
    }
  }

  const risks: RiskPlan[] = (model.risks ?? []).map((r) => {
    const cost = r.cost ? createDistribution(r.cost, { where: r.id, field: 'cost' }) : null;
    const delay = r.delay ? createDistribution(r.delay, { where: r.id, field: 'delay' }) : null;
    if (delay && delay.cdf(-1e-12) > NEGATIVE_MASS_WARNING) {
      warnings.push(
        `${r.id}: its delay can be negative (P = ${delay.cdf(0).toFixed(3)}); such samples count as 0 days.`,
      );
    }
    const vSeverity = newColumn(r.id, !((cost && !cost.degenerate) || (delay && !delay.degenerate)));
    const vOccur = newColumn(`${r.id} (occurrence)`, !(r.probability > 0 && r.probability < 1));
    inputColumn.set(r.id, vSeverity);
    if (r.probability === 0) warnings.push(`${r.id}: probability 0, so the risk never occurs.`);
    return {
      id: r.id,
      probability: r.probability,
      vOccur,
      vSeverity,
      cost,
      delay,
      activity: delay && r.activity !== undefined ? activityIndex.get(r.activity)! : -1,
    };
  });

  const network = activitiesIn.length ? buildNetwork(activitiesIn) : null;

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

  // Tornado inputs: what can move each total.
  const timeDependent = new Set(rateItems.map((r) => r.activity));
  const sensitivity: SensitivityInput[] = [];
  for (const c of costItems) if (c.v >= 0) sensitivity.push(columnInput(c.id, c.v, true, false));
  for (const r of rateItems) if (r.v >= 0) sensitivity.push(columnInput(r.id, r.v, true, false));
  activities.forEach((a, i) => {
    if (a.v >= 0) sensitivity.push(columnInput(a.id, a.v, timeDependent.has(i), true));
  });
  risks.forEach((r, i) => {
    if (r.vOccur < 0 && r.vSeverity < 0) return;
    sensitivity.push({
      id: r.id,
      source: 'risk',
      v: -1,
      risk: i,
      cost: r.cost !== null,
      duration: r.delay !== null && r.activity >= 0,
    });
  });

  let durationBase: number | null = null;
  if (network) {
    const total = new Float64Array(1);
    forwardPass(
      network,
      baseDurations,
      1,
      allocateForwardPass(network.size, 1),
      total,
      new Int32Array(network.size),
    );
    durationBase = total[0];
  }

  const shapes = new Map<string, [number, number]>();
  const sampled = [
    ...costItems.map((c) => c.dist),
    ...rateItems.map((r) => r.rate),
    ...activities.map((a) => a.dist),
    ...risks.flatMap((r) => [r.cost, r.delay]),
  ];
  for (const d of sampled)
    if (d?.betaShape) shapes.set(d.betaShape.join(':'), [d.betaShape[0], d.betaShape[1]]);

  return {
    betaShapes: [...shapes.values()],
    variables: variableIds.length,
    variableIds,
    costItems,
    rateItems,
    activities,
    risks,
    network,
    groups: corr.groups,
    grouped,
    maxGroupSize,
    correlations,
    sensitivity,
    base: { cost: costBase, duration: durationBase },
    targets: { ...model.targets },
    warnings,
  };
}

function columnInput(id: string, v: number, cost: boolean, duration: boolean): SensitivityInput {
  return { id, source: 'column', v, risk: -1, cost, duration };
}
