/**
 * Forward and backward passes of the critical path method over one block of iterations,
 * vectorised over the iterations: activity by activity in topological order. The precedence
 * diagramming method's forward-pass rules, for a link p → a with lag L (negative: a lead) and
 * durations d:
 *
 *   FS: ES_a ≥ EF_p + L        SS: ES_a ≥ ES_p + L
 *   FF: EF_a ≥ EF_p + L        SF: EF_a ≥ ES_p + L
 *
 *   ES_a = max(0, every bound above, the finish bounds less d_a),   EF_a = ES_a + d_a,
 *   project duration T = max_a EF_a  (over every activity, so leads and SS/FF links are safe);
 *
 * then in reverse order, late finishes from T (the same rules turned round):
 *
 *   FS: LF_p ≤ LS_a − L        SS: LF_p ≤ LS_a − L + d_p
 *   FF: LF_p ≤ LF_a − L        SF: LF_p ≤ LF_a − L + d_p,     LF_p ≤ T,  LS_a = LF_a − d_a,
 *
 * total float_a = LF_a − EF_a. An activity is critical in an iteration when its total float is
 * zero (within 1e-9 of T), so every tied path counts and the order of predecessors does not
 * matter. Criticality index: the share of iterations in which it is critical.
 * Kelley & Walker (1959), "Critical-path planning and scheduling", Proc. Eastern Joint Computer
 * Conference, pp. 160–173; precedence diagramming: Fondahl (1961), "A non-computer approach to
 * the critical path method for the construction industry", Stanford University Technical Report
 * 9; the criticality index: Van Slyke (1963), Operations Research 11(5):839–860.
 */

import { LINK, type Network } from './network';

/** Relative tolerance of "zero total float". */
export const FLOAT_TOLERANCE = 1e-9;

export interface ForwardPassBuffers {
  /** Distance between activity columns (≥ the block size). */
  stride: number;
  /** Column-major by activity: finish[a·stride + i]. */
  finish: Float64Array;
  /** Late finish, same layout. */
  late: Float64Array;
  /** Per iteration, the float below which an activity counts as critical. */
  tolerance: Float64Array;
}

export function allocateForwardPass(size: number, stride: number): ForwardPassBuffers {
  return {
    stride,
    finish: new Float64Array(size * stride),
    late: new Float64Array(size * stride),
    tolerance: new Float64Array(stride),
  };
}

/**
 * duration[a·stride + i], i < n → total[i] (project duration) and critical[a] += iterations in
 * which a is critical; with critical null, the project duration alone (no backward pass).
 * Finish-to-start networks (the common case) take a route without the link-type tests.
 * Durations are finite and ≥ 0 (the callers cut them at 0).
 *
 * `changed` (1 per activity whose finish may differ from the last pass over these buffers: its
 * duration differs, or a predecessor's finish may) lets a second pass over nearly the same
 * durations recompute those activities alone; the others keep their finishes and only take part
 * in T, in the same order, so T is the same to the bit as a full pass.
 *
 * T leaves out the activities that cannot finish last (Network.canFinishLast): each has a
 * successor that finishes no earlier, so the maximum is the same number; at 0 its sign comes
 * from the first activity in the order, which has no predecessor and is never left out.
 *
 * The maxima over predecessors are taken without a branch (see larger).
 */
export function forwardPass(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  critical: Int32Array | null,
  changed?: Uint8Array,
): void {
  total.fill(-Infinity, 0, n);
  if (net.mixedLinks) forwardMixed(net, duration, n, buf, total, changed);
  else forwardFinishToStart(net, duration, n, buf, total, changed);
  if (!critical) return;
  const { tolerance } = buf;
  for (let i = 0; i < n; i++) tolerance[i] = FLOAT_TOLERANCE * Math.max(1, Math.abs(total[i]));
  if (net.mixedLinks) backwardMixed(net, duration, n, buf, total, critical);
  else backwardFinishToStart(net, duration, n, buf, total, critical);
}

/**
 * max(c, b) for a bound b ≥ +0 and c finite, without a branch (the comparison goes either way at
 * random, and a mispredicted branch costs more than the arithmetic): with m = 1 when c > b, else
 * 0, c·m + b·(1 − m) is c or b exactly, since the other term is ±0, and adding it leaves a
 * positive number as it is and b = +0 as +0.
 */
function larger(c: number, b: number): number {
  const m = +(c > b);
  return c * m + b * (1 - m);
}

/** T = max(T, the activity's finish). */
function latestInto(finish: Float64Array, base: number, total: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) {
    const f = finish[base + i];
    if (f > total[i]) total[i] = f;
  }
}

/** 1 for the activities in `from` and every activity that follows one of them through links. */
export function downstreamOf(net: Network, from: Iterable<number>): Uint8Array {
  const out = new Uint8Array(net.size);
  for (const a of from) out[a] = 1;
  // In topological order, an activity is reached when one of its predecessors is.
  for (let k = 0; k < net.size; k++) {
    const a = net.order[k];
    for (let j = net.predStart[a]; j < net.predStart[a + 1] && !out[a]; j++)
      if (out[net.predIndex[j]]) out[a] = 1;
  }
  return out;
}

/** The forward pass of a finish-to-start network. */
function forwardFinishToStart(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  changed?: Uint8Array,
): void {
  const { finish, stride } = buf;
  const { order, canFinishLast } = net;
  for (let k = 0; k < net.size; k++) {
    const a = order[k];
    const base = a * stride;
    if (!changed || changed[a]) earlyFinishInto(a, base, net, duration, n, finish, stride);
    if (canFinishLast[a]) latestInto(finish, base, total, n);
  }
}

/**
 * Activity a's early finish in a finish-to-start network. One loop for an activity with up to
 * three predecessors (each loop reads and writes memory, and its overhead counts); with more,
 * the first link writes the start bound, the others raise it, and a last loop adds the duration.
 * The first bound is at least 0: a finish plus a lag is rarely below 0, so that branch is
 * predictable.
 */
function earlyFinishInto(
  a: number,
  base: number,
  net: Network,
  duration: Float64Array,
  n: number,
  finish: Float64Array,
  stride: number,
): void {
  const { predStart, predIndex, predLag } = net;
  const s = predStart[a];
  const links = predStart[a + 1] - s;
  if (links === 0) {
    finish.set(duration.subarray(base, base + n), base);
    return;
  }
  const pb = predIndex[s] * stride;
  const lp = predLag[s];
  if (links === 1) {
    for (let i = 0; i < n; i++) {
      const c = finish[pb + i] + lp;
      finish[base + i] = (c > 0 ? c : 0) + duration[base + i];
    }
    return;
  }
  const qb = predIndex[s + 1] * stride;
  const lq = predLag[s + 1];
  if (links === 2) {
    for (let i = 0; i < n; i++) {
      const cp = finish[pb + i] + lp;
      const b = cp > 0 ? cp : 0;
      finish[base + i] = larger(finish[qb + i] + lq, b) + duration[base + i];
    }
    return;
  }
  const rb = predIndex[s + 2] * stride;
  const lr = predLag[s + 2];
  if (links === 3) {
    for (let i = 0; i < n; i++) {
      const cp = finish[pb + i] + lp;
      const bp = cp > 0 ? cp : 0;
      const b = larger(finish[qb + i] + lq, bp);
      finish[base + i] = larger(finish[rb + i] + lr, b) + duration[base + i];
    }
    return;
  }
  for (let i = 0; i < n; i++) {
    const c = finish[pb + i] + lp;
    finish[base + i] = c > 0 ? c : 0;
  }
  for (let j = s + 1; j < s + links; j++) {
    const jb = predIndex[j] * stride;
    const lj = predLag[j];
    for (let i = 0; i < n; i++) {
      finish[base + i] = larger(finish[jb + i] + lj, finish[base + i]);
    }
  }
  for (let i = 0; i < n; i++) finish[base + i] += duration[base + i];
}

/**
 * The forward pass with every link type. While an activity's links are read, finish[a] holds the
 * bound on its start (0 first: nothing starts before time 0); a predecessor's start is
 * EF_p − d_p, and a bound on the finish becomes one on the start by taking d_a off.
 */
function forwardMixed(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  changed?: Uint8Array,
) {
  const { finish, stride } = buf;
  const { order, predStart, predIndex, predLag, predType, canFinishLast } = net;
  for (let k = 0; k < net.size; k++) {
    const a = order[k];
    const base = a * stride;
    if (!changed || changed[a]) {
      for (let i = 0; i < n; i++) finish[base + i] = 0;
      for (let j = predStart[a]; j < predStart[a + 1]; j++) {
        const pb = predIndex[j] * stride;
        const lag = predLag[j];
        const type = predType[j];
        // Which of the predecessor's dates the bound starts from, and which of a's it bounds.
        const fromStart = type === LINK.SS || type === LINK.SF;
        const onFinish = type === LINK.FF || type === LINK.SF;
        for (let i = 0; i < n; i++) {
          let c = finish[pb + i] + lag;
          if (fromStart) c -= duration[pb + i];
          if (onFinish) c -= duration[base + i];
          finish[base + i] = larger(c, finish[base + i]);
        }
      }
      for (let i = 0; i < n; i++) finish[base + i] += duration[base + i];
    }
    if (canFinishLast[a]) latestInto(finish, base, total, n);
  }
}

/**
 * The backward pass, any link type (LF_p from LS_a for FS and SS, from LF_a for FF and SF; see
 * above), counting each activity's critical iterations as soon as its late finish is final (its
 * successors all come later in the order). An activity's late finish starts at T: written by
 * its first successor's link in this order (Network.firstLink), or by itself when it has none.
 */
function backwardMixed(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  critical: Int32Array,
): void {
  const { late, finish, tolerance, stride } = buf;
  const { order, predStart, predIndex, predLag, predType, firstLink, isSink } = net;
  for (let k = net.size - 1; k >= 0; k--) {
    const a = order[k];
    const base = a * stride;
    if (isSink[a]) late.set(total.subarray(0, n), base);
    critical[a] += criticalIn(late, finish, tolerance, base, n);
    for (let j = predStart[a]; j < predStart[a + 1]; j++) {
      const pb = predIndex[j] * stride;
      const type = predType[j];
      // The bound on LF_p is LF_a − lag − shift, where shift = d_a (from a's start) − d_p (to p's start).
      const lag = predLag[j];
      if (type === LINK.FS) {
        if (firstLink[j]) {
          for (let i = 0; i < n; i++) {
            const c = late[base + i] - duration[base + i] - lag;
            late[pb + i] = c < total[i] ? c : total[i];
          }
        } else {
          for (let i = 0; i < n; i++) {
            const c = late[base + i] - duration[base + i] - lag;
            if (c < late[pb + i]) late[pb + i] = c;
          }
        }
        continue;
      }
      // A loop per link type: a test inside the loop would run per iteration.
      if (firstLink[j]) late.set(total.subarray(0, n), pb);
      if (type === LINK.SS) {
        for (let i = 0; i < n; i++) {
          const c = late[base + i] - lag - duration[base + i] + duration[pb + i];
          if (c < late[pb + i]) late[pb + i] = c;
        }
      } else if (type === LINK.SF) {
        for (let i = 0; i < n; i++) {
          const c = late[base + i] - lag + duration[pb + i];
          if (c < late[pb + i]) late[pb + i] = c;
        }
      } else {
        for (let i = 0; i < n; i++) {
          const c = late[base + i] - lag;
          if (c < late[pb + i]) late[pb + i] = c;
        }
      }
    }
  }
}

/**
 * The iterations in which the activity at `base` is critical, counted without a branch (critical
 * or not goes either way at random).
 */
function criticalIn(
  late: Float64Array,
  finish: Float64Array,
  tolerance: Float64Array,
  base: number,
  n: number,
): number {
  let count = 0;
  for (let i = 0; i < n; i++) count += +(late[base + i] - finish[base + i] <= tolerance[i]);
  return count;
}

/**
 * The backward pass of a finish-to-start network: LF_p ≤ LS_a − lag. A predecessor's late
 * finish is set to T before its first link lowers it (a copy costs less than a loop). An
 * activity with up to three predecessors takes one loop: its critical count and every link
 * (each loop reads and writes memory, and its overhead counts). The minima keep their branch:
 * the forward pass's arithmetic select measured no faster here.
 */
function backwardFinishToStart(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  critical: Int32Array,
): void {
  const { late, finish, tolerance, stride } = buf;
  const { order, predStart, predIndex, predLag, firstLink, isSink } = net;
  const projectFinish = total.subarray(0, n);
  for (let k = net.size - 1; k >= 0; k--) {
    const a = order[k];
    const base = a * stride;
    if (isSink[a]) late.set(projectFinish, base);
    const s = predStart[a];
    const links = predStart[a + 1] - s;
    for (let j = s; j < s + links; j++) if (firstLink[j]) late.set(projectFinish, predIndex[j] * stride);
    if (links === 0 || links > 3) {
      critical[a] += criticalIn(late, finish, tolerance, base, n);
      for (let j = s; j < s + links; j++) {
        const pb = predIndex[j] * stride;
        const lag = predLag[j];
        for (let i = 0; i < n; i++) {
          const c = late[base + i] - duration[base + i] - lag;
          if (c < late[pb + i]) late[pb + i] = c;
        }
      }
      continue;
    }
    let count = 0;
    const pb = predIndex[s] * stride;
    const lp = predLag[s];
    if (links === 1) {
      for (let i = 0; i < n; i++) {
        const l = late[base + i];
        count += +(l - finish[base + i] <= tolerance[i]);
        const c = l - duration[base + i] - lp;
        if (c < late[pb + i]) late[pb + i] = c;
      }
    } else if (links === 2) {
      const qb = predIndex[s + 1] * stride;
      const lq = predLag[s + 1];
      for (let i = 0; i < n; i++) {
        const l = late[base + i];
        count += +(l - finish[base + i] <= tolerance[i]);
        const ls = l - duration[base + i];
        const cp = ls - lp;
        if (cp < late[pb + i]) late[pb + i] = cp;
        const cq = ls - lq;
        if (cq < late[qb + i]) late[qb + i] = cq;
      }
    } else {
      const qb = predIndex[s + 1] * stride;
      const lq = predLag[s + 1];
      const rb = predIndex[s + 2] * stride;
      const lr = predLag[s + 2];
      for (let i = 0; i < n; i++) {
        const l = late[base + i];
        count += +(l - finish[base + i] <= tolerance[i]);
        const ls = l - duration[base + i];
        const cp = ls - lp;
        if (cp < late[pb + i]) late[pb + i] = cp;
        const cq = ls - lq;
        if (cq < late[qb + i]) late[qb + i] = cq;
        const cr = ls - lr;
        if (cr < late[rb + i]) late[rb + i] = cr;
      }
    }
    critical[a] += count;
  }
}
