import { describe, expect, it } from 'vitest';
import { estimateMsLeft, MIN_RATE_SPAN_MS } from '@/lib/runs/time-left';
import { formatTimeLeft } from '@/lib/runs/format';

// Common practice: remaining time = remaining work ÷ measured rate, with the rate measured after
// the start-up cost (here: from the first finished block), as download and build tools do.
describe('the time left of a run', () => {
  it('says nothing (estimating…) until the rate has been watched long enough', () => {
    expect(estimateMsLeft(undefined, undefined, 10_000, 0)).toBeNull();
    const first = { at: 1000, done: 500 };
    expect(estimateMsLeft(first, first, 10_000, 1000)).toBeNull();
    expect(estimateMsLeft(first, { at: 1000 + MIN_RATE_SPAN_MS - 1, done: 900 }, 10_000, 1800)).toBeNull();
    expect(estimateMsLeft(first, { at: 2000, done: 500 }, 10_000, 2000)).toBeNull();
  });

  it('does not count the start-up again: a 4-second run is estimated in seconds, not minutes', () => {
    // Start-up of 1 s, then 500 iterations in the first block, then 2,500 per second.
    const first = { at: 1000, done: 500 };
    const latest = { at: 2000, done: 3000 };
    // (10,000 − 3,000) iterations at 2.5 per ms = 2,800 ms.
    expect(estimateMsLeft(first, latest, 10_000, 2000)).toBeCloseTo(2800, 6);
    // The estimate from the run's start would have been 2 s × 0.7 / 0.3 ≈ 4.7 s, and far more
    // at the first block (1 s × 0.95 / 0.05 = 19 s).
  });

  it('counts down between reports and never goes below zero', () => {
    const first = { at: 0, done: 0 };
    const latest = { at: 1000, done: 1000 };
    expect(estimateMsLeft(first, latest, 2000, 1400)).toBeCloseTo(600, 6);
    expect(estimateMsLeft(first, latest, 2000, 5000)).toBe(0);
  });
});

describe('the time left as written', () => {
  it('is rounded as a person would say it, and says estimating… when unknown', () => {
    expect(formatTimeLeft(12_300)).toBe('about 13 s');
    expect(formatTimeLeft(185_000)).toBe('about 3 min');
    expect(formatTimeLeft(Number.NaN)).toBe('estimating…');
  });
});
