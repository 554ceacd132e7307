/**
 * One block of iterations: the unit of work that a thread computes. Everything in a block is a
 * function of (plan, run key, sampling, block index, block size) only, so the concatenated
 * blocks are the same to the bit whatever the number of threads.
 *
 * Column by column over typed arrays (no per-sample objects), each column of uniforms used while
 * it is still in cache:
 *   1. correlation groups: their columns of uniforms together, by Iman–Conover;
 *   2. activity durations (cut at 0);
 *   3. line items, added to the cost;
 *   4. risks: occurrence (u < p), cost added, delay lengthening its activity;
 *   5. forward pass: project duration and criticality counts;
 *   6. time-dependent items: rate × sampled duration of the activity;
 *   7. tornado grades (16-bit) as each input passes, and the sums behind the achieved correlations.
 * Columns outside the groups are drawn when they are needed, each from its own stream.
 */

import type { Plan } from './compile';
import { allocateInduction, induceGroup, type InductionScratch } from './correlation/iman-conover';
import { fillLatinHypercube, fillMonteCarlo } from './random/columns';
import { Sfc32, streamFor } from './random/sfc32';
import { allocateForwardPass, type ForwardPassBuffers, forwardPass } from './schedule/forward-pass';
import type { Sampling } from './types';

/** Iterations per block; fixed, so that the split does not depend on the thread count. */
export const BLOCK_SIZE = 1000;

/** Value of one step of a stored grade: grades are kept as ⌊g·2¹⁶⌋ and read as (k + ½)/2¹⁶. */
export const GRADE_UNIT = 1 / 65536;

/** Where a block writes its per-iteration outputs (views of length n, n or 0, rows·n). */
export interface BlockSink {
  cost: Float64Array;
  /** Project duration per iteration (empty when the model has no activities). */
  duration: Float64Array;
  /** Tornado grades: input s, iteration i at s·n + i, as ⌊grade·2¹⁶⌋. */
  grades: Uint16Array;
}

/** What a block returns besides its sink: small per-block sums. */
export interface BlockSummary {
  block: number;
  n: number;
  /** Iterations in which each activity was on the critical path. */
  critical: Int32Array;
  /** Per tornado input: Σg and Σg² of its grades g = (stored + ½)/2¹⁶ over the block. */
  gradeSums: Float64Array;
  /** Per correlation entry: Σa, Σb, Σa², Σb², Σab of the pair's uniforms. */
  pairSums: Float64Array;
}

interface Workspace {
  /** Column length: every column view below has this length; a block uses its first n values. */
  stride: number;
  /** Views of the grouped columns, by variable (null for ungrouped variables). */
  groupedColumn: (Float64Array | null)[];
  /** Views per group member, in group order, for the induction. */
  groupColumns: Float64Array[][];
  durations: Float64Array;
  durationColumn: Float64Array[];
  free: Float64Array;
  free2: Float64Array;
  tmp: Float64Array;
  occurred: Uint8Array;
  perm: Int32Array;
  rng: Sfc32;
  induction: InductionScratch;
  schedule: ForwardPassBuffers | null;
  /** Row of each variable / risk in the grades, −1 when not a tornado input. */
  gradeRowOfVariable: Int32Array;
  gradeRowOfRisk: Int32Array;
}

const workspaces = new WeakMap<Plan, Workspace>();

function workspaceFor(plan: Plan, n: number): Workspace {
  const existing = workspaces.get(plan);
  if (existing && existing.stride >= n) return existing;
  const stride = Math.max(n, BLOCK_SIZE);
  const acts = plan.activities.length;
  let slots = 0;
  for (const g of plan.groups) slots += g.k;
  const groupedStore = new Float64Array(slots * stride);
  const groupedColumn: (Float64Array | null)[] = new Array(plan.variables).fill(null);
  let slot = 0;
  const groupColumns = plan.groups.map((g) =>
    Array.from(g.vars, (v) => {
      const view = groupedStore.subarray(slot * stride, ++slot * stride);
      groupedColumn[v] = view;
      return view;
    }),
  );
  const durations = new Float64Array(acts * stride);
  const gradeRowOfVariable = new Int32Array(plan.variables).fill(-1);
  const gradeRowOfRisk = new Int32Array(plan.risks.length).fill(-1);
  plan.sensitivity.forEach((s, row) => {
    if (s.source === 'column') gradeRowOfVariable[s.v] = row;
    else gradeRowOfRisk[s.risk] = row;
  });
  const ws: Workspace = {
    stride,
    groupedColumn,
    groupColumns,
    durations,
    durationColumn: Array.from({ length: acts }, (_, a) => durations.subarray(a * stride, (a + 1) * stride)),
    free: new Float64Array(stride),
    free2: new Float64Array(stride),
    tmp: new Float64Array(stride),
    occurred: new Uint8Array(stride),
    perm: new Int32Array(stride),
    rng: new Sfc32(),
    induction: allocateInduction(plan.maxGroupSize, stride),
    schedule: acts ? allocateForwardPass(acts, stride) : null,
    gradeRowOfVariable,
    gradeRowOfRisk,
  };
  workspaces.set(plan, ws);
  return ws;
}

/** Iterations [block·BLOCK_SIZE, …) of a run of `total` iterations: the block's size. */
export function blockLength(block: number, total: number): number {
  return Math.max(0, Math.min(BLOCK_SIZE, total - block * BLOCK_SIZE));
}

export function simulateBlock(
  plan: Plan,
  key: Uint32Array,
  sampling: Sampling,
  block: number,
  n: number,
  sink: BlockSink,
): BlockSummary {
  const ws = workspaceFor(plan, n);
  const { tmp, occurred } = ws;
  const rows = plan.sensitivity.length;
  const { grades, cost } = sink;
  cost.fill(0, 0, n);
  const gradeSums = new Float64Array(2 * rows);

  /** The uniforms of variable v: its group's column, or drawn now into `into`. */
  const uniforms = (v: number, into: Float64Array): Float64Array => {
    const grouped = ws.groupedColumn[v];
    if (grouped) return grouped;
    const rng = streamFor(key, block, v, ws.rng);
    if (sampling === 'lhs') fillLatinHypercube(rng, into, n, ws.perm);
    else fillMonteCarlo(rng, into, n);
    return into;
  };
  /** Stores ⌊g·2¹⁶⌋ for row `row` and its block sums Σg, Σg² (g read back as (k + ½)/2¹⁶). */
  const writeGrades = (row: number, g: Float64Array, scale: number) => {
    const off = row * n;
    let s1 = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = g[i] * scale;
      const k = x >= 65535 ? 65535 : x | 0;
      grades[off + i] = k;
      const back = (k + 0.5) * GRADE_UNIT;
      s1 += back;
      s2 += back * back;
    }
    gradeSums[2 * row] = s1;
    gradeSums[2 * row + 1] = s2;
  };
  const column = (v: number, into: Float64Array): Float64Array => {
    const u = uniforms(v, into);
    const row = ws.gradeRowOfVariable[v];
    if (row >= 0) writeGrades(row, u, 65536);
    return u;
  };

  // 1. Correlation groups.
  plan.groups.forEach((g, k) => induceGroup(g, ws.groupColumns[k], n, key, block, sampling, ws.induction));

  // 2. Durations.
  const acts = plan.activities.length;
  for (let a = 0; a < acts; a++) {
    const { dist, v } = plan.activities[a];
    const d = ws.durationColumn[a];
    if (v < 0) d.fill(Math.max(0, dist.mean), 0, n);
    else {
      dist.quantileInto(column(v, ws.free), d, n);
      for (let i = 0; i < n; i++) if (d[i] < 0) d[i] = 0;
    }
  }

  // 3. Line items.
  for (const { dist, v } of plan.costItems) {
    if (v < 0) {
      const x = dist.mean;
      for (let i = 0; i < n; i++) cost[i] += x;
    } else {
      dist.quantileInto(column(v, ws.free), tmp, n);
      for (let i = 0; i < n; i++) cost[i] += tmp[i];
    }
  }

  // 4. Risks. A risk's grade is the mid-distribution value of "impact if it occurs, else 0":
  // (1 − p)/2 when it does not occur, 1 − p + p·u when it does (u its severity).
  for (let r = 0; r < plan.risks.length; r++) {
    const risk = plan.risks[r];
    const p = risk.probability;
    if (p >= 1) occurred.fill(1, 0, n);
    else if (risk.vOccur < 0) occurred.fill(0, 0, n);
    else {
      const u = uniforms(risk.vOccur, ws.free2);
      for (let i = 0; i < n; i++) occurred[i] = u[i] < p ? 1 : 0;
    }
    const sev = risk.vSeverity >= 0 ? uniforms(risk.vSeverity, ws.free) : null;
    if (risk.cost) {
      if (sev) risk.cost.quantileInto(sev, tmp, n);
      else tmp.fill(risk.cost.mean, 0, n);
      for (let i = 0; i < n; i++) if (occurred[i]) cost[i] += tmp[i];
    }
    if (risk.delay && risk.activity >= 0) {
      if (sev) risk.delay.quantileInto(sev, tmp, n);
      else tmp.fill(risk.delay.mean, 0, n);
      const d = ws.durationColumn[risk.activity];
      for (let i = 0; i < n; i++) if (occurred[i] && tmp[i] > 0) d[i] += tmp[i];
    }
    const row = ws.gradeRowOfRisk[r];
    if (row >= 0) {
      const pc = Math.min(1, Math.max(0, p));
      const no = (1 - pc) / 2;
      for (let i = 0; i < n; i++) tmp[i] = occurred[i] ? 1 - pc + pc * (sev ? sev[i] : 0.5) : no;
      writeGrades(row, tmp, 65536);
    }
  }

  // 5. Schedule.
  const critical = new Int32Array(acts);
  if (plan.network && ws.schedule)
    forwardPass(plan.network, ws.durations, n, ws.schedule, sink.duration, critical);

  // 6. Time-dependent items.
  for (const { rate, v, activity } of plan.rateItems) {
    const d = ws.durationColumn[activity];
    if (v < 0) {
      const x = rate.mean;
      for (let i = 0; i < n; i++) cost[i] += x * d[i];
    } else {
      rate.quantileInto(column(v, ws.free), tmp, n);
      for (let i = 0; i < n; i++) cost[i] += tmp[i] * d[i];
    }
  }

  // 7. Sums for the achieved correlations (pairs are always within a group).
  const pairSums = new Float64Array(plan.correlations.length * 5);
  plan.correlations.forEach((c, k) => {
    if (c.va < 0) return;
    const a = ws.groupedColumn[c.va]!;
    const b = ws.groupedColumn[c.vb]!;
    let sa = 0;
    let sb = 0;
    let saa = 0;
    let sbb = 0;
    let sab = 0;
    for (let i = 0; i < n; i++) {
      const x = a[i];
      const y = b[i];
      sa += x;
      sb += y;
      saa += x * x;
      sbb += y * y;
      sab += x * y;
    }
    pairSums.set([sa, sb, saa, sbb, sab], k * 5);
  });

  return { block, n, critical, gradeSums, pairSums };
}
