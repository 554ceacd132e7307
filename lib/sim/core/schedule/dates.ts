/**
 * One deterministic pass of the schedule (the passes of ./forward-pass on a single iteration):
 * each activity's early start and finish, late finish and total float, the project's duration
 * and the activities on the critical path (zero total float). For checks and displays outside a
 * run: the network's health, its diagram.
 */

import type { ModelActivity } from '../formats';
import { allocateForwardPass, forwardPass } from './forward-pass';
import { buildNetwork } from './network';

export interface ActivityDates {
  earlyStart: number;
  earlyFinish: number;
  lateFinish: number;
  totalFloat: number;
  critical: boolean;
}

export interface ScheduleDates {
  duration: number;
  activities: Record<string, ActivityDates>;
}

/** Dates of a sound network (it passed checkNetwork) with the given durations, in model order. */
export function scheduleDates(activities: ModelActivity[], durations: ArrayLike<number>): ScheduleDates {
  const net = buildNetwork(activities);
  const buf = allocateForwardPass(net.size, 1);
  const total = new Float64Array(1);
  const critical = new Int32Array(net.size);
  const d = Float64Array.from(durations, (x) => Math.max(0, x));
  forwardPass(net, d, 1, buf, total, net.size ? critical : null);
  const out: Record<string, ActivityDates> = {};
  activities.forEach((a, i) => {
    const ef = buf.finish[i];
    out[a.id] = {
      earlyStart: ef - d[i],
      earlyFinish: ef,
      lateFinish: buf.late[i],
      totalFloat: buf.late[i] - ef,
      critical: critical[i] === 1,
    };
  });
  return { duration: net.size ? total[0] : 0, activities: out };
}
