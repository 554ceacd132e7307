// The run's sort order (radix sort of the totals) and what is read from it: mid-ranks, the joint
// confidence frontier. Each against a plain, slow, obviously correct loop written here, and the
// sorted copy against the built-in Float64Array sort (ECMAScript: numeric order, −0 before +0).
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { midRanksOf, sortOrder } from '../math/ranks';
import { jointFrontier } from '../stats/joint';

function columns(seed: string): Float64Array[] {
  const rnd = seedrandom(seed);
  const make = (n: number, f: () => number) => Float64Array.from({ length: n }, f);
  return [
    make(1, () => rnd()),
    make(500, () => Math.round((rnd() - 0.5) * 10)), // many ties, negatives
    make(700, () => (rnd() < 0.2 ? -0 : rnd() < 0.25 ? 0 : (rnd() - 0.6) * 1e9)), // ±0 ties
    make(3000, () => (rnd() - 0.3) * Math.exp(40 * rnd())), // wide range of magnitudes
    make(2000, () => 1.2e8 + rnd() * 1e7), // totals of one size
  ];
}

describe('sortOrder', () => {
  it('sorts as the built-in sort does and places ties in iteration order', () => {
    for (const v of columns('sort')) {
      const { sorted, order, positions } = sortOrder(v);
      const reference = v.slice().sort();
      expect(Array.from(sorted, (x) => Object.is(x, -0))).toEqual(
        Array.from(reference, (x) => Object.is(x, -0)),
      );
      expect(Array.from(sorted)).toEqual(Array.from(reference));
      for (let j = 0; j < v.length; j++) {
        expect(positions[order[j]]).toBe(j);
        // Equal values (−0 and +0 among them) keep their iteration order.
        if (j > 0 && sorted[j] === sorted[j - 1]) expect(order[j]).toBeGreaterThan(order[j - 1]);
      }
    }
  });

  it('gives mid-ranks: the average of the 1-based ranks a tie group spans (Kendall & Gibbons 1990, §3.8)', () => {
    for (const v of columns('ranks')) {
      const ranks = midRanksOf(sortOrder(v));
      for (let i = 0; i < v.length; i++) {
        let below = 0;
        let equal = 0;
        for (let j = 0; j < v.length; j++) {
          if (v[j] < v[i]) below++;
          else if (v[j] === v[i]) equal++;
        }
        expect(ranks[i]).toBe(below + (equal + 1) / 2);
      }
    }
  });
});

describe('jointFrontier', () => {
  it('finds, at each duration, the smallest cost met together with it in level·n iterations', () => {
    const rnd = seedrandom('frontier');
    const n = 1500;
    const duration = Float64Array.from({ length: n }, () => Math.round(100 + 50 * rnd()));
    const cost = Float64Array.from(duration, (d) => d * 1000 + Math.round(20_000 * rnd()));
    const level = 0.7;
    const { points } = jointFrontier(sortOrder(cost), sortOrder(duration), level);
    expect(points.length).toBeGreaterThan(0);
    const need = Math.ceil(level * n);
    for (const { duration: d, cost: c } of points) {
      // The definition: the need-th smallest cost among the iterations with duration ≤ d.
      const within = Array.from(cost)
        .filter((_, i) => duration[i] <= d)
        .sort((a, b) => a - b);
      expect(c).toBe(within[need - 1]);
    }
  });
});
