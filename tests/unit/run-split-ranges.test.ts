// Which chunk ranges a split run's parts cover (lib/services/runs/split.ts). Plumbing of the
// split's bookkeeping: each pass must cover every chunk of the bounded form exactly once, in
// order, in at most OUTTURN_SPLIT_PARTS parts, or finishBounded refuses the parts.
import { afterEach, describe, expect, it } from 'vitest';
import { boundedChunks } from '@/lib/sim';
import { splitRangesOf } from '@/lib/services/runs/split';
import type { RunSettings } from '@/lib/validation/runs';

const settings = (iterations: number, precision: RunSettings['precision'] = null) =>
  ({ iterations, seed: 1, sampling: 'lhs', precision }) as RunSettings;

afterEach(() => {
  delete process.env.OUTTURN_SPLIT_FROM;
  delete process.env.OUTTURN_SPLIT_PARTS;
});

describe('the chunk ranges of a split run', () => {
  it('leaves runs below the threshold whole, and by default those of 1,000,000 iterations or fewer', () => {
    expect(splitRangesOf(settings(1_000_000))).toBeNull();
    expect(splitRangesOf(settings(1_000_001))).not.toBeNull();
    process.env.OUTTURN_SPLIT_FROM = '200000';
    expect(splitRangesOf(settings(199_999))).toBeNull();
    expect(splitRangesOf(settings(200_000))).not.toBeNull();
  });

  it('never splits a run to a precision goal (its rounds keep every iteration in memory)', () => {
    process.env.OUTTURN_SPLIT_FROM = '1000';
    expect(splitRangesOf(settings(500_000, { relativePercent: 1, maxIterations: 500_000 }))).toBeNull();
  });

  it('covers every chunk once, in order, in at most the configured number of parts', () => {
    process.env.OUTTURN_SPLIT_FROM = '1000';
    for (const [iterations, parts] of [
      [10_000_000, 8],
      [1_200_000, 8],
      [300_000, 3],
      [2_000_000, 1],
      [1_500_000, 40],
    ] as const) {
      process.env.OUTTURN_SPLIT_PARTS = String(parts);
      const ranges = splitRangesOf(settings(iterations))!;
      const chunks = boundedChunks(iterations);
      expect(ranges.length).toBeLessThanOrEqual(parts);
      expect(ranges[0][0]).toBe(0);
      expect(ranges.at(-1)![1]).toBe(chunks);
      for (let i = 1; i < ranges.length; i++) expect(ranges[i][0]).toBe(ranges[i - 1][1]);
      for (const [from, to] of ranges) expect(to).toBeGreaterThan(from);
    }
  });

  it('says which setting is wrong when it is not a whole number', () => {
    process.env.OUTTURN_SPLIT_PARTS = 'two';
    expect(() => splitRangesOf(settings(2_000_000))).toThrow(/OUTTURN_SPLIT_PARTS must be a whole number/);
  });
});
