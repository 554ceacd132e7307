// The selection behind the joint-confidence frontier gives what sorting and indexing give.
import { describe, expect, it } from 'vitest';
import { kthSmallest } from '../stats/joint';

describe('kthSmallest', () => {
  it('equals the k-th value of the sorted array, ties and edges included', () => {
    let state = 12345;
    // A small linear congruential generator (Numerical Recipes constants) for reproducible data.
    const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32;
    for (let t = 0; t < 500; t++) {
      const m = 1 + Math.floor(next() * 200);
      const x = Float64Array.from({ length: m }, () => Math.floor(next() * (t % 2 ? 10 : 1e6)));
      const sorted = x.slice().sort();
      for (const k of [0, m - 1, Math.floor(next() * m)])
        expect(kthSmallest(x.slice(), m, k)).toBe(sorted[k]);
    }
  });
});
