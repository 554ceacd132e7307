import { describe, expect, it } from 'vitest';
import { BLOCK_SIZE, simulateSync, type Model } from '@/lib/sim';
import { CURRENT_ENGINE } from '@/lib/services/runs/engine-match';
import { sampleOfRun } from '@/lib/services/runs/sample';

const model: Model = {
  format: 'outturn-model',
  version: 1,
  items: [
    { id: 'C1', dist: { type: 'triangular', low: 900, mode: 1000, high: 1400 } },
    { id: 'C2', ratePerDay: 12, activity: 'A2' },
  ],
  risks: [
    {
      id: 'R1',
      probability: 0.25,
      cost: { type: 'uniform', low: 50, high: 150 },
      delay: { type: 'fixed', value: 5 },
      activity: 'A1',
    },
  ],
  activities: [
    { id: 'A1', duration: { type: 'pert', low: 10, mode: 14, high: 25 } },
    { id: 'A2', duration: { type: 'triangular', low: 20, mode: 24, high: 35 }, predecessors: ['A1'] },
  ],
  correlations: [{ a: 'C1', b: 'A2', rho: 0.4 }],
  targets: { cost: 1700, duration: 42 },
};

const nearestRank = (values: number[], p: number) => {
  // Reference: the nearest-rank percentile x(⌈np⌉) (Hyndman & Fan 1996, definition 1), the
  // definition the result file documents.
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.ceil(values.length * p) - 1];
};

describe('the sample of a run', () => {
  it('holds the run’s own iterations: its P80 and joint share equal the result’s when it holds them all', async () => {
    const settings = { iterations: 3000, seed: 11, sampling: 'lhs' as const };
    const result = simulateSync(model, settings);
    const sample = await sampleOfRun(model, { ...settings, ...CURRENT_ENGINE });
    expect(sample.n).toBe(3000);
    expect(sample.of).toBe(3000);
    expect(nearestRank(sample.cost, 0.8)).toBe(result.cost.percentiles.P80);
    expect(nearestRank(sample.duration!, 0.5)).toBe(result.duration!.percentiles.P50);
    let both = 0;
    for (let i = 0; i < sample.n; i++) if (sample.cost[i] <= 1700 && sample.duration![i] <= 42) both++;
    expect(both / sample.n).toBe(result.joint!.probability);
  });

  it('is capped, and then is the first iterations of the longer run', async () => {
    // Blocks are whole units of the run, so a run of two blocks is the first two blocks of any
    // longer run with the same seed.
    const two = 2 * BLOCK_SIZE;
    const long = await sampleOfRun(
      model,
      { iterations: 10 * BLOCK_SIZE, seed: 11, sampling: 'lhs', ...CURRENT_ENGINE },
      two,
    );
    const short = await sampleOfRun(model, { iterations: two, seed: 11, sampling: 'lhs', ...CURRENT_ENGINE });
    expect(long.n).toBe(two);
    expect(long.of).toBe(10 * BLOCK_SIZE);
    expect(long.cost).toEqual(short.cost);
    expect(long.duration).toEqual(short.duration);
  });
});
