/**
 * Shapes a run's result (and its sample of iterations) into the series the outcome charts draw.
 * Pure functions on plain numbers, shared by the server (summaries) and the charts.
 */

import { PERCENTILES } from '@/lib/domain/percentiles';
import type { InputKind, Interval, Model, PercentileKey, SensitivityEntry, TotalSummary } from '@/lib/sim';

export type Point = { x: number; y: number };

export type Histogram = { edges: number[]; counts: number[]; n: number };

/** Equal-width bins over [min, max]; the last bin includes max. */
export function histogram(values: ArrayLike<number>, bins = 40): Histogram {
  const n = values.length;
  if (n === 0) return { edges: [], counts: [], n: 0 };
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    lo = Math.min(lo, values[i]);
    hi = Math.max(hi, values[i]);
  }
  if (hi === lo) return { edges: [lo, lo], counts: [n], n };
  const width = (hi - lo) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) counts[Math.min(bins - 1, Math.floor((values[i] - lo) / width))]++;
  const edges = Array.from({ length: bins + 1 }, (_, k) => lo + k * width);
  return { edges, counts, n };
}

/** The empirical distribution function F(x) = share of values ≤ x, thinned to ~maxPoints. */
export function empiricalCurve(values: ArrayLike<number>, maxPoints = 200): Point[] {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  if (n === 0) return [];
  const step = Math.max(1, Math.floor(n / maxPoints));
  const out: Point[] = [];
  for (let i = step - 1; i < n; i += step) out.push({ x: sorted[i], y: (i + 1) / n });
  if (out[out.length - 1].y !== 1) out.push({ x: sorted[n - 1], y: 1 });
  return [{ x: sorted[0], y: 0 }, ...out];
}

/** The S-curve through the result's own percentiles (all iterations), from min to max. */
export function percentileCurve(summary: TotalSummary): Point[] {
  return [
    { x: summary.min, y: 0 },
    ...PERCENTILES.map(([k, p]) => ({ x: summary.percentiles[k], y: p })),
    { x: summary.max, y: 1 },
  ];
}

/** The strongest drivers first, by the size of their rank correlation. */
export function topDrivers(entries: SensitivityEntry[], count = 15): SensitivityEntry[] {
  return [...entries]
    .sort((a, b) => Math.abs(b.rankCorrelation) - Math.abs(a.rankCorrelation) || a.id.localeCompare(b.id))
    .slice(0, count);
}

export type SampleCharts = {
  /** Iterations in the sample, and in the run. */
  n: number;
  of: number;
  cost: Histogram;
  duration: Histogram | null;
  /** (duration, cost) points for the scatter, thinned evenly to at most `maxPoints`, sorted by duration. */
  scatter: Point[];
};

/** The sample's histograms and scatter points, computed once on the server. */
export function sampleCharts(
  sample: { n: number; of: number; cost: number[]; duration: number[] | null },
  maxPoints = 2500,
): SampleCharts {
  const step = Math.max(1, Math.ceil(sample.n / maxPoints));
  const scatter: Point[] = [];
  if (sample.duration) {
    for (let i = 0; i < sample.n; i += step) scatter.push({ x: sample.duration[i], y: sample.cost[i] });
    // The charts skip parsing for speed, and Chart.js then needs the points sorted along x.
    scatter.sort((a, b) => a.x - b.x);
  }
  return {
    n: sample.n,
    of: sample.of,
    cost: histogram(sample.cost),
    duration: sample.duration ? histogram(sample.duration) : null,
    scatter,
  };
}

/** The S-curve through a scenario's percentiles (P5 … P95; a scenario keeps no min or max). */
export function scenarioCurve(percentiles: Record<PercentileKey, number>): Point[] {
  return PERCENTILES.map(([k, p]) => ({ x: percentiles[k], y: p }));
}

/**
 * What the responses are worth at a level: the pre-mitigation value less the post-mitigation one
 * (post includes the responses' own cost). Both come from the same iterations (common random
 * numbers), so the difference is the responses' effect, not sampling noise.
 */
export function responseValueAt(
  pre: Record<PercentileKey, number>,
  post: Record<PercentileKey, number>,
  level: PercentileKey,
): { pre: number; post: number; saving: number } {
  return { pre: pre[level], post: post[level], saving: pre[level] - post[level] };
}

/**
 * The 95% interval of the contingency at a level: the result's own where it holds one (v2, P50,
 * P80, P90), else the P-value's interval less the base (a constant, so the interval shifts).
 */
export function contingencyInterval(summary: TotalSummary, level: PercentileKey): Interval | null {
  const own = (summary.contingencyCI95 as Partial<Record<PercentileKey, Interval>> | undefined)?.[level];
  if (own) return own;
  const ci = (summary.percentileCI95 as Partial<Record<PercentileKey, Interval>>)[level];
  return ci ? [ci[0] - summary.base, ci[1] - summary.base] : null;
}

export type SwingRow = {
  id: string;
  kind: InputKind | undefined;
  /** The total's mean where the input is in its low tenth and in its high tenth, less the mean. */
  low: number;
  high: number;
};

/** Inputs by the width of their swing, widest first, as changes from the total's mean. */
export function swingRows(entries: SensitivityEntry[], mean: number, count = 15): SwingRow[] {
  return entries
    .filter((e): e is SensitivityEntry & { swing: Interval } => Array.isArray(e.swing))
    .map((e) => ({ id: e.id, kind: e.kind, low: e.swing[0] - mean, high: e.swing[1] - mean }))
    .sort((a, b) => Math.abs(b.high - b.low) - Math.abs(a.high - a.low) || a.id.localeCompare(b.id))
    .slice(0, count);
}

/** What each kind of input is called on screen. */
export const KIND_LABEL: Record<InputKind, string> = {
  item: 'line item',
  activity: 'activity',
  risk: 'risk',
  driver: 'driver',
};

export type CriticalityRow = { id: string; criticality: number; ssi: number | null };

/**
 * Activities by criticality (most critical first) with their schedule sensitivity index where the
 * result holds one (criticality × sd(activity) / sd(project), version 2 results).
 */
export function criticalityRows(
  criticality: Record<string, number>,
  duration: SensitivityEntry[],
  count = 20,
): CriticalityRow[] {
  const ssi = new Map(duration.filter((e) => e.ssi !== undefined).map((e) => [e.id, e.ssi!]));
  return Object.entries(criticality)
    .map(([id, c]) => ({ id, criticality: c, ssi: ssi.get(id) ?? null }))
    .sort((a, b) => b.criticality - a.criticality || (b.ssi ?? 0) - (a.ssi ?? 0) || a.id.localeCompare(b.id))
    .slice(0, count);
}

/** The names of a model's inputs by code: line items, risks, activities and drivers. */
export function inputNames(model: Model): Record<string, string> {
  const names: Record<string, string> = {};
  for (const input of [
    ...model.items,
    ...(model.risks ?? []),
    ...(model.activities ?? []),
    ...(model.drivers ?? []),
  ])
    names[input.id] = input.name ?? '';
  return names;
}
