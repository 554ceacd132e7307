/**
 * The JSON shapes of a bounded run's parts (./index). A part covers whole chunks [from, to); every
 * floating sum is kept per chunk (reduced over the chunk's blocks in block order) so that the
 * finish adds chunks in chunk order whatever the split. Integer counts and histograms are merged
 * over the part, which is exact in any order. Everything is plain numbers and arrays.
 */

import type { HistogramJson } from './histogram';

/** The run's totals: headline cost and duration, and the other mitigation scenario's. */
export type TotalName = 'cost' | 'duration' | 'altCost' | 'altDuration';
export const TOTAL_NAMES: TotalName[] = ['cost', 'duration', 'altCost', 'altDuration'];

/** A value per total, null for a total the model does not have. */
export type PerTotal<T> = { cost: T; duration: T | null; altCost: T | null; altDuration: T | null };

/** What the first pass keeps of one chunk. */
export interface FirstPassChunk {
  chunk: number;
  /** Iterations in the chunk. */
  n: number;
  /** Σ of each total (per block in iteration order, then over blocks in block order). */
  sums: PerTotal<number>;
  /** The blocks' small sums, added over the chunk's blocks in block order (../block BlockSummary). */
  critical: number[];
  gradeSums: number[];
  pairSums: number[];
  durationSums: number[];
  swingSums: number[];
  /** Coarse histograms (./keys) of the headline totals in this chunk, for the convergence series. */
  coarse: { cost: HistogramJson; duration: HistogramJson | null };
}

export interface FirstPassPart {
  format: 'outturn-bounded-first';
  iterations: number;
  chunkBlocks: number;
  fromChunk: number;
  toChunk: number;
  chunks: FirstPassChunk[];
  /** Fine histograms (./keys) of every total over the part. */
  fine: PerTotal<HistogramJson>;
  min: PerTotal<number>;
  max: PerTotal<number>;
  /** Iterations with cost ≤ its target, duration ≤ its target, both (0 without targets). */
  withinTarget: { cost: number; duration: number; both: number };
}

/** What the second pass needs to know of the whole run, from the merged first parts. */
export interface SecondPassRequest {
  format: 'outturn-bounded-request';
  iterations: number;
  chunkBlocks: number;
  /** Mean of the headline totals (for Σ(x − mean)²). */
  mean: { cost: number; duration: number | null };
  /** Fine keys of the buckets whose values the second pass keeps, per total. */
  keep: PerTotal<number[]>;
  /** The merged fine histograms of the headline totals: each bucket's mid-rank. */
  ranks: { cost: BucketRanks; duration: BucketRanks | null };
  /** Fine keys of the buckets holding the allocation window's ends. */
  window: { loKey: number; hiKey: number };
  joint: JointRequest | null;
}

export interface BucketRanks {
  keys: number[];
  midRanks: number[];
}

export interface JointRequest {
  /** Per P-level of jointAtPLevels (P50, P70, P80, P90): the fine keys of the two P-values. */
  levels: { costKey: number; durationKey: number }[];
  /** The frontier's durations, ascending, and its level. */
  thresholds: number[];
  level: number;
}

/** What the second pass keeps of one chunk (floating sums only; see SecondPassPart). */
export interface SecondPassChunk {
  chunk: number;
  /** Σ(x − mean)² of the headline totals. */
  squares: { cost: number; duration: number | null };
  /** Per tornado row: Σ k·R with cost, with duration (../run-data blockCrossSums, grouped ranks). */
  cross: number[];
  /** Allocation sums over the window's inner buckets (slots, then the count). */
  allocation: number[];
  /** Iterations in the window's end buckets, in iteration order: their cost and allocation sums. */
  edges: { cost: number; sums: number[] }[];
}

export interface SecondPassPart {
  format: 'outturn-bounded-second';
  fromChunk: number;
  toChunk: number;
  chunks: SecondPassChunk[];
  /** Distinct values with their counts in the requested buckets, per total, values ascending. */
  kept: PerTotal<{ values: number[]; counts: number[] }>;
  joint: {
    /** Per level: iterations surely within both P-values, and the pairs on a boundary bucket. */
    levels: { sure: number; pairs: number[] }[];
    /** Per frontier duration j: coarse histogram of the cost of iterations with duration in (t_{j−1}, t_j]. */
    frontier: HistogramJson[];
  } | null;
}
