// The engine in one thread: validate, compile, run the blocks, roll up. `simulateSync` is the
// plain form (tests, small models); runSimulation (../runtime) adds threads, progress and cancel.

import { type BlockSummary, blockLength, BLOCK_SIZE, simulateBlock } from './block';
import { compileModel, type Plan } from './compile';
import type { ResolvedSettings, SimulationOptions } from './options';
import { resolveSettings } from './options';
import { runKeyFromSeed } from './random/run-key';
import { type RankedTotals, rankTotals, rollUp, type TotalsRollUp } from './rollup';
import {
  allocateRound,
  type BlockSecondPass,
  blockSecondPass,
  blockSink,
  concatRounds,
  type RoundStore,
  type SecondPassInput,
} from './run-data';
import { allocationFromBand, allocationWindow, bandCovers } from './stats/allocation';
import type { AllocationBand } from './stats/allocation-band';
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

/** The blocks' sums in block order (they may arrive in any). */
export function inBlockOrder(blocks: BlockSummary[]): BlockSummary[] {
  return [...blocks].sort((a, b) => a.block - b.block);
}

/**
 * The result, from the blocks' sums (any order), the ranked totals and the second pass in block
 * order; `early` the part of the roll-up computed already (rollUpTotals over inBlockOrder(blocks)).
 */
export function resultOf(
  run: PreparedRun,
  blocks: BlockSummary[],
  totals: RankedTotals,
  second: BlockSecondPass[],
  info: { elapsedMs: number; warnings: string[] },
  early?: TotalsRollUp,
): SimulationResult {
  const ordered = inBlockOrder(blocks);
  return rollUp(
    run.plan,
    ordered,
    totals,
    second,
    { seed: run.settings.seed, sampling: run.settings.sampling, ...info },
    early,
  );
}

/** What the second pass over the blocks needs, once the totals are ranked. */
export function secondPassInput(run: PreparedRun, totals: RankedTotals): SecondPassInput {
  return {
    key: run.key,
    sampling: run.settings.sampling,
    costRanks: totals.costRanks,
    durationRanks: totals.durationRanks,
    window: allocationWindow(run.plan, totals.costSorted),
  };
}

/** The blocks' allocation bands by block number (none for blocks that kept none). */
export function bandsOf(blocks: BlockSummary[] = []): Map<number, AllocationBand> {
  return new Map(blocks.flatMap((b) => (b.band ? [[b.block, b.band] as const] : [])));
}

/** Whether block b's allocation must be recomputed: its band does not cover the window. */
export function recomputes(bands: Map<number, AllocationBand>, input: SecondPassInput, b: number): boolean {
  return !bandCovers(bands.get(b), input.window);
}

/**
 * Fills in, from the bands, the allocation sums of the blocks the second pass did not recompute.
 * `second` in the order of the rounds' blocks.
 */
export function allocationFromBands(
  run: PreparedRun,
  rounds: RoundStore[],
  second: BlockSecondPass[],
  bands: Map<number, AllocationBand>,
  input: SecondPassInput,
): BlockSecondPass[] {
  let k = 0;
  for (const store of rounds) {
    for (const b of blocksBetween(store.start, store.total)) {
      const s = second[k++];
      if (s.allocation.length === 0)
        s.allocation = allocationFromBand(run.plan, store, b, bands.get(b)!, input.window);
    }
  }
  return second;
}

/**
 * The second pass (rank cross sums, allocation sums) over all blocks, in this thread; `blocks`
 * (any order) bring their allocation bands, without them every block is recomputed.
 */
export function secondPassInThread(
  run: PreparedRun,
  rounds: RoundStore[],
  totals: RankedTotals,
  blocks?: BlockSummary[],
): BlockSecondPass[] {
  const input = secondPassInput(run, totals);
  const bands = bandsOf(blocks);
  const second = rounds.flatMap((store) =>
    blocksBetween(store.start, store.total).map((b) =>
      blockSecondPass(run.plan, store, b, blockLength(b, store.total), input, recomputes(bands, input, b)),
    ),
  );
  return allocationFromBands(run, rounds, second, bands, input);
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
  return resultOf(run, blocks, totals, secondPassInThread(run, rounds, totals, blocks), {
    elapsedMs: performance.now() - started,
    warnings,
  });
}
