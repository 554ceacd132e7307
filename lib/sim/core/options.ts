// Run options and how they combine with the model's settings (options win, then settings,
// then the defaults below).

import { BLOCK_SIZE } from './block';
import type { Model, Sampling } from './formats';

export interface PrecisionGoal {
  /** Wanted relative half-width of the 95% interval of the P-value (e.g. 0.005 for ±0.5%). */
  relative: number;
  /** The P-level whose value must be known, in (0, 1); default 0.8 (P80). */
  level?: number;
  /** Never run more iterations than this. */
  maxIterations: number;
}

export interface SimulationOptions {
  iterations?: number;
  seed?: number | string;
  sampling?: Sampling;
  /**
   * Keep running (doubling the iterations, in whole blocks) until the P-value of the goal's level
   * (P80 by default) of cost, and of duration
   * when there is a schedule, is known to the wanted relative precision, or the cap is reached.
   * `iterations` is then the first round's size.
   */
  precision?: PrecisionGoal;
}

export const DEFAULT_ITERATIONS = 10_000;
export const DEFAULT_SAMPLING: Sampling = 'lhs';

export interface ResolvedSettings {
  iterations: number;
  seed: number | string;
  sampling: Sampling;
  precision: PrecisionGoal | null;
}

export function resolveSettings(model: Model, options: SimulationOptions): ResolvedSettings {
  const s = model.settings ?? {};
  let iterations = options.iterations ?? s.iterations ?? DEFAULT_ITERATIONS;
  if (!Number.isInteger(iterations) || iterations < 1) {
    throw new RangeError(`iterations must be a positive integer (got ${iterations})`);
  }
  const sampling = options.sampling ?? s.sampling ?? DEFAULT_SAMPLING;
  if (sampling !== 'mc' && sampling !== 'lhs')
    throw new RangeError(`sampling must be "mc" or "lhs" (got ${sampling})`);
  // Without a seed, draw one and report it, so the run can still be reproduced.
  const seed = options.seed ?? s.seed ?? drawSeed();
  const precision = options.precision ?? null;
  if (precision) {
    if (!(precision.relative > 0)) throw new RangeError(`precision.relative must be greater than 0`);
    if (precision.level !== undefined && !(precision.level > 0 && precision.level < 1))
      throw new RangeError(`precision.level must lie between 0 and 1 (got ${precision.level})`);
    if (!(precision.maxIterations >= 1)) throw new RangeError(`precision.maxIterations must be at least 1`);
    // Rounds are whole blocks so that each round extends the previous one.
    iterations = Math.min(precision.maxIterations, Math.ceil(iterations / BLOCK_SIZE) * BLOCK_SIZE);
  }
  return { iterations, seed, sampling, precision };
}

/** A seed in [1, 2³¹ − 1), drawn from the platform's cryptographic generator (Web Crypto). */
function drawSeed(): number {
  const range = 2 ** 31 - 2;
  // Rejection keeps every seed equally likely: the 32-bit draws above the last whole multiple of
  // the range are thrown away.
  const limit = Math.floor(2 ** 32 / range) * range;
  const word = new Uint32Array(1);
  do globalThis.crypto.getRandomValues(word);
  while (word[0] >= limit);
  return 1 + (word[0] % range);
}
