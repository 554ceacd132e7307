/**
 * Shapes a run's result (and its sample of iterations) into the series the outcome charts draw.
 * Pure functions on plain numbers, shared by the server (summaries) and the charts.
 */

import { PERCENTILES } from '@/lib/domain/percentiles';
import type { SensitivityEntry, TotalSummary } from '@/lib/sim';

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

/** Share of sample points with cost ≤ costTarget and duration ≤ durationTarget. */
export function shareWithin(
  cost: number[],
  duration: number[],
  costTarget: number,
  durationTarget: number,
): number {
  let k = 0;
  for (let i = 0; i < cost.length; i++) if (cost[i] <= costTarget && duration[i] <= durationTarget) k++;
  return cost.length ? k / cost.length : 0;
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
