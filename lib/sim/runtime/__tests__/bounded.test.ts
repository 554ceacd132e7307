// The bounded form through the runtime: the same result to the bit in this thread, with two
// worker threads and from the core's one-thread form; progress counts both passes; cancel stops it.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { simulateBounded, SimulationCancelledError, type SimulationResult } from '../../index';
import { runSimulation } from '../index';

const projectV2 = JSON.parse(readFileSync('tests/fixtures/sim/v2-project.json', 'utf8'));
const withoutTime = (r: SimulationResult) => ({ ...r, elapsedMs: 0 });
const options = { iterations: 13_000, seed: 5, sampling: 'lhs' as const, bounded: true, chunkBlocks: 2 };

describe('bounded runs in the runtime', () => {
  it('give the same result with 1 and 2 threads and in the core (plumbing)', async () => {
    const seen: number[] = [];
    const one = await runSimulation(projectV2, {
      ...options,
      threads: 1,
      onProgress: (p) => seen.push(p.done),
    });
    const two = await runSimulation(projectV2, { ...options, threads: 2 });
    expect(withoutTime(two)).toStrictEqual(withoutTime(one));
    expect(withoutTime(simulateBounded(projectV2, options, 2))).toStrictEqual(withoutTime(one));
    expect(one.iterations).toBe(13_000);
    // Both passes count: 2 × 13,000 when done, rising block by block.
    expect(seen.at(-1)).toBe(26_000);
    expect(seen.length).toBe(14);
  });

  it('can be cancelled', async () => {
    const controller = new AbortController();
    const work = runSimulation(projectV2, {
      ...options,
      threads: 1,
      signal: controller.signal,
      onProgress: (p) => p.done >= 4000 && controller.abort(),
    });
    await expect(work).rejects.toBeInstanceOf(SimulationCancelledError);
  });

  it('refuses a precision goal', async () => {
    await expect(
      runSimulation(projectV2, { ...options, precision: { relative: 0.01, maxIterations: 20_000 } }),
    ).rejects.toThrow(/precision goal/);
  });
});
