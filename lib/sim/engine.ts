// The engine in one thread: validate, compile, run the blocks, roll up. `simulateSync` is the
// plain form (tests, small models); runSimulation in ./run adds threads, progress and cancel.

import { type BlockOutput, blockLength, BLOCK_SIZE, simulateBlock } from './block';
import { compileModel, type Plan } from './compile';
import type { SimulationOptions, ResolvedSettings } from './options';
import { resolveSettings } from './options';
import { runKeyFromSeed } from './random/run-key';
import { rollUp } from './rollup';
import { nextRound } from './schedule-of-rounds';
import type { SimulationResult } from './types';
import { parseModel } from './validate';

export interface PreparedRun {
  plan: Plan;
  settings: ResolvedSettings;
  key: Uint32Array;
  model: ReturnType<typeof parseModel>;
}

export function prepareRun(modelJson: unknown, options: SimulationOptions = {}): PreparedRun {
  const model = parseModel(modelJson);
  const settings = resolveSettings(model, options);
  return { model, plan: compileModel(model), settings, key: runKeyFromSeed(settings.seed) };
}

export function blocksBetween(from: number, to: number): number[] {
  const out: number[] = [];
  for (let b = Math.ceil(from / BLOCK_SIZE); b * BLOCK_SIZE < to; b++) out.push(b);
  return out;
}

export function simulateSync(modelJson: unknown, options: SimulationOptions = {}): SimulationResult {
  const started = performance.now();
  const { plan, settings, key } = prepareRun(modelJson, options);
  const blocks: BlockOutput[] = [];
  const warnings: string[] = [];
  let done = 0;
  for (let round = nextRound(settings, plan, 0, blocks, warnings); round !== null;) {
    const total = round;
    for (const b of blocksBetween(done, total)) {
      blocks.push(simulateBlock(plan, key, settings.sampling, b, blockLength(b, total)));
    }
    done = total;
    round = nextRound(settings, plan, done, blocks, warnings);
  }
  return rollUp(plan, blocks, {
    seed: settings.seed,
    sampling: settings.sampling,
    elapsedMs: performance.now() - started,
    warnings,
  });
}
