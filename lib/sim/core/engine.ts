// The engine in one thread: validate, compile, run the blocks, roll up. `simulateSync` is the
// plain form (tests, small models); runSimulation (../runtime) adds threads, progress and cancel.

import { type BlockSummary, blockLength, BLOCK_SIZE, simulateBlock } from './block';
import { compileModel, type Plan } from './compile';
import type { ResolvedSettings, SimulationOptions } from './options';
import { resolveSettings } from './options';
import { runKeyFromSeed } from './random/run-key';
import { type RankedTotals, rankTotals, rollUp } from './rollup';
import { allocateRound, blockCrossSums, blockSink, concatRounds, type RoundStore } from './run-data';
import { nextRound } from './round-plan';
import type { Model, SimulationResult } from './formats';
import { parseModel } from './validate';

export interface PreparedRun {
  plan: Plan;
  settings: ResolvedSettings;
  key: Uint32Array;
  model: Model;
}

/** Validated model, settings and run key: all a worker thread needs to start. */
export function resolveRun(modelJson: unknown, options: SimulationOptions = {}): Omit<PreparedRun, 'plan'> {
  const model = parseModel(modelJson);
  const settings = resolveSettings(model, options);
  return { model, settings, key: runKeyFromSeed(settings.seed) };
}

export function prepareRun(modelJson: unknown, options: SimulationOptions = {}): PreparedRun {
  const run = resolveRun(modelJson, options);
  return { ...run, plan: compileModel(run.model) };
}

/** Blocks covering iterations [from, to); from is a multiple of BLOCK_SIZE. */
export function blocksBetween(from: number, to: number): number[] {
  const out: number[] = [];
  for (let b = Math.ceil(from / BLOCK_SIZE); b * BLOCK_SIZE < to; b++) out.push(b);
  return out;
}

/** A round's blocks computed in this thread. */
export function simulateRound(run: PreparedRun, store: RoundStore): BlockSummary[] {
  return blocksBetween(store.start, store.total).map((b) => {
    const n = blockLength(b, store.total);
    return simulateBlock(run.plan, run.key, run.settings.sampling, b, n, blockSink(store, b, n));
  });
}

/** The run's totals in iteration order, sorted and ranked (`shared` for worker threads). */
export function rankRun(run: PreparedRun, rounds: RoundStore[], shared = false): RankedTotals {
  const totals = rankTotals(
    concatRounds(rounds, (r) => r.cost),
    run.plan.network ? concatRounds(rounds, (r) => r.duration) : null,
    shared,
  );
  if (run.plan.hasPost) {
    totals.altCost = concatRounds(rounds, (r) => r.altCost);
    totals.altDuration = run.plan.network ? concatRounds(rounds, (r) => r.altDuration) : null;
  }
  return totals;
}

/** The result, from the blocks' sums (any order), the ranked totals and the cross sums in block order. */
export function resultOf(
  run: PreparedRun,
  blocks: BlockSummary[],
  totals: RankedTotals,
  cross: Float64Array[],
  info: { elapsedMs: number; warnings: string[] },
): SimulationResult {
  const ordered = [...blocks].sort((a, b) => a.block - b.block);
  return rollUp(run.plan, ordered, totals, cross, {
    seed: run.settings.seed,
    sampling: run.settings.sampling,
    ...info,
  });
}

/** The cross sums of all blocks, in this thread. */
export function crossSumsInThread(
  run: PreparedRun,
  rounds: RoundStore[],
  totals: RankedTotals,
): Float64Array[] {
  return rounds.flatMap((store) =>
    blocksBetween(store.start, store.total).map((b) =>
      blockCrossSums(run.plan, store, b, blockLength(b, store.total), totals.costRanks, totals.durationRanks),
    ),
  );
}

export function simulateSync(modelJson: unknown, options: SimulationOptions = {}): SimulationResult {
  const started = performance.now();
  const run = prepareRun(modelJson, options);
  const rounds: RoundStore[] = [];
  const blocks: BlockSummary[] = [];
  const warnings: string[] = [];
  let done = 0;
  for (let round = nextRound(run.settings, run.plan, 0, rounds, warnings); round !== null;) {
    const store = allocateRound(run.plan, done, round, false);
    blocks.push(...simulateRound(run, store));
    rounds.push(store);
    done = round;
    round = nextRound(run.settings, run.plan, done, rounds, warnings);
  }
  const totals = rankRun(run, rounds);
  return resultOf(run, blocks, totals, crossSumsInThread(run, rounds, totals), {
    elapsedMs: performance.now() - started,
    warnings,
  });
}
