// The rounds of a run: one round of the asked iterations, or, with a precision goal, doubling
// rounds until the P80 interval is narrow enough or the cap is reached. Shared by the
// in-thread and the pooled runner so both make the same decisions from the same totals.

import { BLOCK_SIZE } from './block';
import type { Plan } from './compile';
import type { ResolvedSettings } from './options';
import { concatRounds, type RoundStore } from './run-data';
import { relativeHalfWidth } from './stats/precision';
import { percentileIntervalOfSorted, percentileOfSorted } from './stats/summary';

/** Worst relative half-width of the interval of the P-value at `level` (default P80) over the totals. */
export function p80Precision(plan: Plan, rounds: RoundStore[], level = 0.8): number {
  const totals = [concatRounds(rounds, (r) => r.cost)];
  if (plan.network) totals.push(concatRounds(rounds, (r) => r.duration));
  let worst = 0;
  for (const t of totals) {
    const sorted = t.slice().sort();
    worst = Math.max(
      worst,
      relativeHalfWidth(percentileOfSorted(sorted, level), percentileIntervalOfSorted(sorted, level)),
    );
  }
  return worst;
}

/** Iterations at the end of the next round, or null when the run is complete. */
export function nextRound(
  settings: ResolvedSettings,
  plan: Plan,
  done: number,
  rounds: RoundStore[],
  warnings: string[],
): number | null {
  if (done === 0) return settings.iterations;
  const goal = settings.precision;
  if (!goal) return null;
  const level = goal.level ?? 0.8;
  const reached = p80Precision(plan, rounds, level);
  if (reached <= goal.relative) return null;
  if (done >= goal.maxIterations) {
    warnings.push(
      `P${Math.round(level * 100)} was to be known to ±${(goal.relative * 100).toFixed(2)}% but reached ±${(reached * 100).toFixed(2)}% ` +
        `at the cap of ${goal.maxIterations} iterations.`,
    );
    return null;
  }
  return Math.min(goal.maxIterations, Math.max(done * 2, done + BLOCK_SIZE));
}
