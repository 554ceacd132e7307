/**
 * One block of iterations: the unit of work that a thread computes. Everything in a block is a
 * function of (plan, run key, sampling, block index, block size) only, so the concatenated
 * blocks are the same to the bit whatever the number of threads.
 *
 * Per block, column by column over typed arrays (no per-sample objects):
 *   1. uniforms: correlation groups by Iman–Conover, every other column by LHS or plain sampling;
 *   2. activity durations (cut at 0), risk occurrences (u < p), risk costs and delays;
 *   3. forward pass: project duration and criticality counts;
 *   4. cost = items + occurred risk costs + rate × sampled duration of the activity;
 *   5. tornado grades (16-bit) and the sums behind each pair's achieved correlation.
 */

import type { Plan } from './compile';
import { allocateInduction, induceGroup, type InductionScratch } from './correlation/iman-conover';
import { fillLatinHypercube, fillMonteCarlo } from './random/columns';
import { streamFor } from './random/sfc32';
import { allocateForwardPass, type ForwardPassBuffers, forwardPass } from './schedule/forward-pass';
import type { Sampling } from './types';

/** Iterations per block; fixed, so that the split does not depend on the thread count. */
export const BLOCK_SIZE = 1000;

export interface BlockOutput {
  block: number;
  n: number;
  cost: Float64Array;
  /** Project duration per iteration, empty when the model has no activities. */
  duration: Float64Array;
  /** Iterations in which each activity was on the critical path. */
  critical: Int32Array;
  /** Tornado grades: input s, iteration i at s·n + i, as round-down of grade·2¹⁶. */
  grades: Uint16Array;
  /** Per correlation entry: Σa, Σb, Σa², Σb², Σab of the pair's uniforms. */
  pairSums: Float64Array;
}

interface Workspace {
  capacity: number;
  U: Float64Array;
  durations: Float64Array;
  tmp: Float64Array;
  occurred: Uint8Array;
  perm: Int32Array;
  induction: InductionScratch;
  schedule: ForwardPassBuffers | null;
}

const workspaces = new WeakMap<Plan, Workspace>();

function workspaceFor(plan: Plan, n: number): Workspace {
  let ws = workspaces.get(plan);
  if (!ws || ws.capacity < n) {
    const cap = Math.max(n, BLOCK_SIZE);
    const acts = plan.activities.length;
    ws = {
      capacity: cap,
      U: new Float64Array(plan.variables * cap),
      durations: new Float64Array(acts * cap),
      tmp: new Float64Array(cap),
      occurred: new Uint8Array(cap),
      perm: new Int32Array(cap),
      induction: allocateInduction(plan.maxGroupSize, cap),
      schedule: acts ? allocateForwardPass(acts, cap) : null,
    };
    workspaces.set(plan, ws);
  }
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
): BlockOutput {
  const ws = workspaceFor(plan, n);
  const { U, tmp, occurred } = ws;
  const col = (v: number) => U.subarray(v * n, v * n + n);

  // 1. Uniforms.
  for (const g of plan.groups) induceGroup(g, U, n, key, block, sampling, ws.induction);
  for (let v = 0; v < plan.variables; v++) {
    if (plan.grouped[v]) continue;
    const rng = streamFor(key, block, v);
    if (sampling === 'lhs') fillLatinHypercube(rng, col(v), n, ws.perm);
    else fillMonteCarlo(rng, col(v), n);
  }

  // 2. Durations and risks.
  const acts = plan.activities.length;
  const durations = ws.durations.subarray(0, acts * n);
  for (let a = 0; a < acts; a++) {
    const { dist, v } = plan.activities[a];
    const d = durations.subarray(a * n, a * n + n);
    if (v < 0) d.fill(Math.max(0, dist.mean));
    else {
      dist.quantileInto(col(v), d, n);
      for (let i = 0; i < n; i++) if (d[i] < 0) d[i] = 0;
    }
  }
  const cost = new Float64Array(n);
  for (const { dist, v } of plan.costItems) {
    if (v < 0) {
      const x = dist.mean;
      for (let i = 0; i < n; i++) cost[i] += x;
    } else {
      dist.quantileInto(col(v), tmp, n);
      for (let i = 0; i < n; i++) cost[i] += tmp[i];
    }
  }
  for (const r of plan.risks) {
    if (r.probability >= 1) occurred.fill(1, 0, n);
    else if (r.vOccur < 0) occurred.fill(0, 0, n);
    else {
      const u = col(r.vOccur);
      const p = r.probability;
      for (let i = 0; i < n; i++) occurred[i] = u[i] < p ? 1 : 0;
    }
    const sev = r.vSeverity >= 0 ? col(r.vSeverity) : null;
    if (r.cost) {
      if (sev) r.cost.quantileInto(sev, tmp, n);
      else tmp.fill(r.cost.mean, 0, n);
      for (let i = 0; i < n; i++) if (occurred[i]) cost[i] += tmp[i];
    }
    if (r.delay && r.activity >= 0) {
      if (sev) r.delay.quantileInto(sev, tmp, n);
      else tmp.fill(r.delay.mean, 0, n);
      const off = r.activity * n;
      for (let i = 0; i < n; i++) if (occurred[i] && tmp[i] > 0) durations[off + i] += tmp[i];
    }
  }

  // 3. Schedule.
  const duration = new Float64Array(plan.network ? n : 0);
  const critical = new Int32Array(acts);
  if (plan.network && ws.schedule) forwardPass(plan.network, durations, n, ws.schedule, duration, critical);

  // 4. Time-dependent items.
  for (const { rate, v, activity } of plan.rateItems) {
    const off = activity * n;
    if (v < 0) {
      const x = rate.mean;
      for (let i = 0; i < n; i++) cost[i] += x * durations[off + i];
    } else {
      rate.quantileInto(col(v), tmp, n);
      for (let i = 0; i < n; i++) cost[i] += tmp[i] * durations[off + i];
    }
  }

  // 5. Grades for the tornado and sums for the achieved correlations.
  const grades = new Uint16Array(plan.sensitivity.length * n);
  plan.sensitivity.forEach((s, k) => {
    const g = grades.subarray(k * n, k * n + n);
    if (s.source === 'column') {
      const u = col(s.v);
      for (let i = 0; i < n; i++) g[i] = (u[i] * 65536) | 0;
    } else {
      // Mid-distribution grade of "impact if it occurs, else 0": (1−p)/2 when it does not occur,
      // 1 − p + p·u when it does (u its severity), the probability-scale value that ties share.
      const r = plan.risks[s.risk];
      const p = Math.min(1, Math.max(0, r.probability));
      const sev = r.vSeverity >= 0 ? col(r.vSeverity) : null;
      const noG = ((1 - p) / 2) * 65536;
      if (r.probability >= 1) occurred.fill(1, 0, n);
      else if (r.vOccur < 0) occurred.fill(0, 0, n);
      else {
        const u = col(r.vOccur);
        for (let i = 0; i < n; i++) occurred[i] = u[i] < p ? 1 : 0;
      }
      for (let i = 0; i < n; i++) {
        const x = occurred[i] ? (1 - p + p * (sev ? sev[i] : 0.5)) * 65536 : noG;
        g[i] = x >= 65535 ? 65535 : x | 0;
      }
    }
  });
  const pairSums = new Float64Array(plan.correlations.length * 5);
  plan.correlations.forEach((c, k) => {
    if (c.va < 0) return;
    const a = col(c.va);
    const b = col(c.vb);
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

  return { block, n, cost, duration, critical, grades, pairSums };
}
