/**
 * Forward pass of the critical path method over one block of iterations, vectorised over the
 * iterations: activity by activity in topological order,
 *
 *   start_a = max(0, max_{p ∈ pred(a)} finish_p + lag_pa),   finish_a = start_a + duration_a,
 *   project duration = max_a finish_a  (over the activities that nothing follows).
 *
 * The predecessor attaining the maximum is the activity's driver (ties: the first listed).
 * Criticality: in each iteration, the chain of drivers back from the latest-finishing activity
 * is the critical path; each activity's count of iterations on it gives the criticality index.
 * Kelley & Walker (1959), "Critical-path planning and scheduling", Proc. Eastern Joint Computer
 * Conference, pp. 160–173; the criticality index: Van Slyke (1963), Operations Research 11(5):839–860.
 */

import type { Network } from './network';

export interface ForwardPassBuffers {
  /** Distance between activity columns (≥ the block size). */
  stride: number;
  /** Column-major by activity: finish[a·stride + i]. */
  finish: Float64Array;
  /** Driving predecessor of activity a in iteration i, −1 when it starts at time 0. */
  driver: Int32Array;
  /** Latest-finishing activity per iteration. */
  last: Int32Array;
}

export function allocateForwardPass(size: number, stride: number): ForwardPassBuffers {
  return {
    stride,
    finish: new Float64Array(size * stride),
    driver: new Int32Array(size * stride),
    last: new Int32Array(stride),
  };
}

/**
 * duration[a·stride + i], i < n → total[i] (project duration) and critical[a] += iterations on the
 * critical path.
 */
export function forwardPass(
  net: Network,
  duration: Float64Array,
  n: number,
  buf: ForwardPassBuffers,
  total: Float64Array,
  critical: Int32Array,
): void {
  const { finish, driver, last, stride } = buf;
  const { order, predStart, predIndex, predLag, isSink } = net;
  for (let k = 0; k < net.size; k++) {
    const a = order[k];
    const base = a * stride;
    const s = predStart[a];
    const e = predStart[a + 1];
    if (s === e) {
      for (let i = 0; i < n; i++) {
        finish[base + i] = duration[base + i];
        driver[base + i] = -1;
      }
      continue;
    }
    let p = predIndex[s];
    let lag = predLag[s];
    let pb = p * stride;
    for (let i = 0; i < n; i++) {
      finish[base + i] = finish[pb + i] + lag;
      driver[base + i] = p;
    }
    for (let j = s + 1; j < e; j++) {
      p = predIndex[j];
      lag = predLag[j];
      pb = p * stride;
      for (let i = 0; i < n; i++) {
        const c = finish[pb + i] + lag;
        if (c > finish[base + i]) {
          finish[base + i] = c;
          driver[base + i] = p;
        }
      }
    }
    for (let i = 0; i < n; i++) {
      let start = finish[base + i];
      if (start < 0) {
        start = 0;
        driver[base + i] = -1;
      }
      finish[base + i] = start + duration[base + i];
    }
  }
  total.fill(-Infinity, 0, n);
  for (let k = 0; k < net.size; k++) {
    const a = order[k];
    if (!isSink[a]) continue;
    const base = a * stride;
    for (let i = 0; i < n; i++) {
      if (finish[base + i] > total[i]) {
        total[i] = finish[base + i];
        last[i] = a;
      }
    }
  }
  for (let i = 0; i < n; i++) {
    let a = last[i];
    while (a >= 0) {
      critical[a]++;
      a = driver[a * stride + i];
    }
  }
}
