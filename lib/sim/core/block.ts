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
import type { Sampling } from './formats';

/** Iterations per block; fixed, so that the split does not depend on the thread count. */
export const BLOCK_SIZE = 2000;

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

// Small loops as functions of their own: each is optimised once, quickly, whatever the model;
// one large function holding them all would be recompiled as it meets new distributions.

function addInto(acc: Float64Array, x: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x[i];
}

function addConstant(acc: Float64Array, x: number, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x;
}

function addProduct(acc: Float64Array, x: Float64Array, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x[i] * y[i];
}

function addScaled(acc: Float64Array, x: number, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x * y[i];
}

function clampAtZero(x: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) if (x[i] < 0) x[i] = 0;
}

function occurrences(u: Float64Array, p: number, out: Uint8Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = u[i] < p ? 1 : 0;
}

function addWhere(acc: Float64Array, x: Float64Array, mask: Uint8Array, n: number): void {
  for (let i = 0; i < n; i++) if (mask[i]) acc[i] += x[i];
}

function addPositiveWhere(acc: Float64Array, x: Float64Array, mask: Uint8Array, n: number): void {
  for (let i = 0; i < n; i++) if (mask[i] && x[i] > 0) acc[i] += x[i];
}

/**
 * A risk's grade, the mid-distribution value of "impact if it occurs, else 0": (1 − p)/2 when it
 * does not occur, 1 − p + p·u when it does (u its severity, ½ when the impact is fixed).
 */
function riskGrades(
  mask: Uint8Array,
  severity: Float64Array | null,
  p: number,
  out: Float64Array,
  n: number,
): void {
  const none = (1 - p) / 2;
  for (let i = 0; i < n; i++) out[i] = mask[i] ? 1 - p + p * (severity ? severity[i] : 0.5) : none;
}

/** Stores k = ⌊g·2¹⁶⌋ at grades[off…] and Σg, Σg² of the stored values read back as (k + ½)/2¹⁶. */
function storeGrades(
  g: Float64Array,
  grades: Uint16Array,
  off: number,
  sums: Float64Array,
  row: number,
  n: number,
) {
  // Integer sums (exact in double precision for any block size used here), scaled once.
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    const x = g[i] * 65536;
    const k = x >= 65535 ? 65535 : x | 0;
    grades[off + i] = k;
    s1 += k;
    s2 += k * k;
  }
  // Σ(k + ½) = Σk + n/2 and Σ(k + ½)² = Σk² + Σk + n/4.
  sums[2 * row] = (s1 + n / 2) * GRADE_UNIT;
  sums[2 * row + 1] = (s2 + s1 + n / 4) * GRADE_UNIT * GRADE_UNIT;
}

/** Σa, Σb, Σa², Σb², Σab into out[at…at+4]. */
function pairSumsInto(a: Float64Array, b: Float64Array, n: number, out: Float64Array, at: number): void {
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
  out[at] = sa;
  out[at + 1] = sb;
  out[at + 2] = saa;
  out[at + 3] = sbb;
  out[at + 4] = sab;
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
  /** Uniforms of variable v, their grades stored when v is a tornado input. */
  const column = (v: number, into: Float64Array): Float64Array => {
    const u = uniforms(v, into);
    const row = ws.gradeRowOfVariable[v];
    if (row >= 0) storeGrades(u, grades, row * n, gradeSums, row, n);
    return u;
  };

  // 1. Correlation groups.
  for (let k = 0; k < plan.groups.length; k++) {
    induceGroup(plan.groups[k], ws.groupColumns[k], n, key, block, sampling, ws.induction);
  }

  // 2. Durations.
  const acts = plan.activities.length;
  for (let a = 0; a < acts; a++) {
    const { dist, v } = plan.activities[a];
    const d = ws.durationColumn[a];
    if (v < 0) d.fill(Math.max(0, dist.mean), 0, n);
    else {
      dist.quantileInto(column(v, ws.free), d, n);
      clampAtZero(d, n);
    }
  }

  // 3. Line items.
  for (const { dist, v } of plan.costItems) {
    if (v < 0) addConstant(cost, dist.mean, n);
    else {
      dist.quantileInto(column(v, ws.free), tmp, n);
      addInto(cost, tmp, n);
    }
  }

  // 4. Risks.
  for (let r = 0; r < plan.risks.length; r++) {
    const risk = plan.risks[r];
    const p = risk.probability;
    if (p >= 1) occurred.fill(1, 0, n);
    else if (risk.vOccur < 0) occurred.fill(0, 0, n);
    else occurrences(uniforms(risk.vOccur, ws.free2), p, occurred, n);
    const sev = risk.vSeverity >= 0 ? uniforms(risk.vSeverity, ws.free) : null;
    if (risk.cost) {
      if (sev) risk.cost.quantileInto(sev, tmp, n);
      else tmp.fill(risk.cost.mean, 0, n);
      addWhere(cost, tmp, occurred, n);
    }
    if (risk.delay && risk.activity >= 0) {
      if (sev) risk.delay.quantileInto(sev, tmp, n);
      else tmp.fill(risk.delay.mean, 0, n);
      addPositiveWhere(ws.durationColumn[risk.activity], tmp, occurred, n);
    }
    const row = ws.gradeRowOfRisk[r];
    if (row >= 0) {
      riskGrades(occurred, sev, Math.min(1, Math.max(0, p)), tmp, n);
      storeGrades(tmp, grades, row * n, gradeSums, row, n);
    }
  }

  // 5. Schedule.
  const critical = new Int32Array(acts);
  if (plan.network && ws.schedule)
    forwardPass(plan.network, ws.durations, n, ws.schedule, sink.duration, critical);

  // 6. Time-dependent items.
  for (const { rate, v, activity } of plan.rateItems) {
    const d = ws.durationColumn[activity];
    if (v < 0) addScaled(cost, rate.mean, d, n);
    else {
      rate.quantileInto(column(v, ws.free), tmp, n);
      addProduct(cost, tmp, d, n);
    }
  }

  // 7. Sums for the achieved correlations (pairs are always within a group).
  const pairSums = new Float64Array(plan.correlations.length * 5);
  plan.correlations.forEach((c, k) => {
    if (c.va >= 0) pairSumsInto(ws.groupedColumn[c.va]!, ws.groupedColumn[c.vb]!, n, pairSums, 5 * k);
  });

  return { block, n, critical, gradeSums, pairSums };
}
