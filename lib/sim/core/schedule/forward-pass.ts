/**
 * Forward and backward passes of the critical path method over one block of iterations,
 * vectorised over the iterations: activity by activity in topological order,
 *
 *   start_a = max(0, max_{p ∈ pred(a)} finish_p + lag_pa),   finish_a = start_a + duration_a,
 *   project duration T = max_a finish_a  (over every activity, so negative lags are safe);
 *
 * then in reverse order, late finishes from T:
 *
 *   LF_a = min(T, min_{s ∈ succ(a)} LF_s − duration_s − lag_as),   total float_a = LF_a − finish_a.
 *
 * An activity is critical in an iteration when its total float is zero (within 1e-9 of T), so
 * every tied path counts and the order of predecessors does not matter. Criticality index: the
 * share of iterations in which it is critical.
 * Kelley & Walker (1959), "Critical-path planning and scheduling", Proc. Eastern Joint Computer
 * Conference, pp. 160–173; the criticality index: Van Slyke (1963), Operations Research 11(5):839–860.
 */

import type { Network } from './network';

/** Relative tolerance of "zero total float". */
export const FLOAT_TOLERANCE = 1e-9;

export interface ForwardPassBuffers {
  /** Distance between activity columns (≥ the block size). */
  stride: number;
  /** Column-major by activity: finish[a·stride + i]. */
  finish: Float64Array;
  /** Late finish, same layout. */
  late: Float64Array;
}

export function allocateForwardPass(size: number, stride: number): ForwardPassBuffers {
  return { stride, finish: new Float64Array(size * stride), late: new Float64Array(size * stride) };
}

/**
 * duration[a·stride + i], i < n → total[i] (project duration) and critical[a] += iterations in
 * which a is critical; with critical null, the project duration alone (no backward pass).
 */
export function forwardPass(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  critical: Int32Array | null,
): void {
  const { finish, late, stride } = buf;
  const { order, predStart, predIndex, predLag } = net;
  total.fill(-Infinity, 0, n);
  for (let k = 0; k < net.size; k++) {
    const a = order[k];
    const base = a * stride;
    const s = predStart[a];
    const e = predStart[a + 1];
    for (let i = 0; i < n; i++) finish[base + i] = 0;
    for (let j = s; j < e; j++) {
      const pb = predIndex[j] * stride;
      const lag = predLag[j];
      for (let i = 0; i < n; i++) {
        const c = finish[pb + i] + lag;
        if (c > finish[base + i]) finish[base + i] = c;
      }
    }
    for (let i = 0; i < n; i++) {
      const f = finish[base + i] + duration[base + i];
      finish[base + i] = f;
      if (f > total[i]) total[i] = f;
    }
  }
  if (!critical) return;
  // Backward pass.
  for (let a = 0; a < net.size; a++) late.set(total.subarray(0, n), a * stride);
  for (let k = net.size - 1; k >= 0; k--) {
    const a = order[k];
    const base = a * stride;
    for (let j = predStart[a]; j < predStart[a + 1]; j++) {
      const pb = predIndex[j] * stride;
      const lag = predLag[j];
      for (let i = 0; i < n; i++) {
        const c = late[base + i] - duration[base + i] - lag;
        if (c < late[pb + i]) late[pb + i] = c;
      }
    }
  }
  for (let a = 0; a < net.size; a++) {
    const base = a * stride;
    let count = 0;
    for (let i = 0; i < n; i++) {
      if (late[base + i] - finish[base + i] <= FLOAT_TOLERANCE * Math.max(1, Math.abs(total[i]))) count++;
    }
    critical[a] += count;
  }
}
