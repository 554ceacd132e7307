// Sensitivity (tornado): Spearman's coefficient of each input with the totals, against the
// closed form for normals and against Spearman by sorting on the same iterations.
import { describe, expect, it } from 'vitest';
import { BLOCK_SIZE, blockLength, GRADE_UNIT } from '../block';
import {
  blocksBetween,
  prepareRun,
  rankRun,
  resultOf,
  secondPassInThread,
  simulateRound,
  simulateSync,
} from '../engine';
import { allocateRound, blockCrossSums, blockSink } from '../run-data';
import { item, model, normal, spearmanBySorting, uniform } from './helpers';

describe('rank correlation with the total', () => {
  // X ~ N(0, 3²), Y ~ N(0, 4²), T = X + Y: Pearson(X, T) = 3/5, and for a bivariate normal
  // Spearman = (6/π) arcsin(r/2) (Pearson 1907): 0.5822 for X, 0.7859 for Y.
  it('matches the closed form for a sum of normals', () => {
    const r = simulateSync(model({ items: [item('X', normal(0, 3)), item('Y', normal(0, 4))] }), {
      iterations: 20_000,
      seed: 6,
    });
    const byId = Object.fromEntries(r.sensitivity.cost.map((s) => [s.id, s]));
    expect(Math.abs(byId.X.rankCorrelation - (6 / Math.PI) * Math.asin(0.3))).toBeLessThan(0.015);
    expect(Math.abs(byId.Y.rankCorrelation - (6 / Math.PI) * Math.asin(0.4))).toBeLessThan(0.015);
    expect(r.sensitivity.cost.map((s) => s.id)).toEqual(['Y', 'X']);
    expect(r.sensitivity.cost.reduce((s, x) => s + x.varianceShare, 0)).toBeCloseTo(1, 12);
  });

  it('agrees with Spearman by sorting, risks included (ties of non-occurrence)', () => {
    const m = model({
      items: [item('C1', uniform(0, 10)), item('C2', { type: 'triangular', low: 0, mode: 1, high: 8 })],
      risks: [{ id: 'R1', probability: 0.3, cost: uniform(5, 15), delay: uniform(2, 4), activity: 'A1' }],
      activities: [
        { id: 'A1', duration: uniform(10, 20) },
        { id: 'A2', duration: uniform(5, 30) },
      ],
      correlations: [{ a: 'C1', b: 'A1', rho: 0.4 }],
    });
    const run = prepareRun(m, { iterations: 8000, seed: 21 });
    const { plan } = run;
    const store = allocateRound(plan, 0, 8000, false);
    const blocks = simulateRound(run, store);
    const totals = rankRun(run, [store]);
    const result = resultOf(run, blocks, totals, secondPassInThread(run, [store], totals), {
      elapsedMs: 0,
      warnings: [],
    });
    const { cost, duration } = store;
    plan.sensitivity.forEach((input, row) => {
      // The stored grade is a monotone function of the input's value (ties kept), so Spearman of
      // the grades with a total is Spearman of the input with it.
      const g = new Float64Array(8000);
      for (const b of blocksBetween(0, 8000)) {
        const n = blockLength(b, 8000);
        const { grades } = blockSink(store, b, n);
        for (let i = 0; i < n; i++) g[b * BLOCK_SIZE + i] = (grades[row * n + i] + 0.5) * GRADE_UNIT;
      }
      if (input.cost) {
        const engine = result.sensitivity.cost.find((s) => s.id === input.id)!.rankCorrelation;
        expect(Math.abs(engine - spearmanBySorting(g, cost))).toBeLessThan(0.01);
      }
      if (input.duration) {
        const engine = result.sensitivity.duration.find((s) => s.id === input.id)!.rankCorrelation;
        expect(Math.abs(engine - spearmanBySorting(g, duration))).toBeLessThan(0.01);
      }
    });
    expect(result.sensitivity.duration.map((s) => s.id).sort()).toEqual(['A1', 'A2', 'R1']);
    expect(result.sensitivity.cost.map((s) => s.id).sort()).toEqual(['C1', 'C2', 'R1']);
  });
});

describe('rank cross sums of a block', () => {
  // Plumbing: the block's Σ k·R (grades read two per word, one pass for both totals) against the
  // sum as its definition reads, term by term in order. Every term is a whole grade times a
  // half-integer rank, so both sums are exact and must agree to the bit, on the extreme grades
  // too; a run's last block of odd length takes the plain loop.
  it('equals the plain sum of grade × mid-rank, for even and odd block lengths', () => {
    const m = model({
      items: [item('C1', uniform(0, 10)), item('C2', normal(5, 1))],
      // A risk with a cost and a delay feeds both tornadoes.
      risks: [{ id: 'R1', probability: 0.3, cost: uniform(5, 15), delay: uniform(2, 4), activity: 'A1' }],
      activities: [
        { id: 'A1', duration: uniform(10, 20) },
        { id: 'A2', duration: uniform(5, 30) },
      ],
    });
    const total = BLOCK_SIZE + 999;
    const { plan } = prepareRun(m, { iterations: total, seed: 3 });
    const store = allocateRound(plan, 0, total, false);
    let state = 12345;
    const next = () => (state = (Math.imul(state, 1103515245) + 12345) >>> 0);
    for (let i = 0; i < store.grades.length; i++) store.grades[i] = i % 7 === 0 ? 65535 : next() >>> 16;
    const costRanks = Float64Array.from({ length: total }, () => (next() % (2 * total)) / 2 + 1);
    const durationRanks = Float64Array.from({ length: total }, () => (next() % (2 * total)) / 2 + 1);
    const rows = plan.sensitivity.length;
    expect(plan.sensitivity.some((s) => s.cost && s.duration)).toBe(true);
    for (const b of blocksBetween(0, total)) {
      const n = blockLength(b, total);
      const { grades } = blockSink(store, b, n);
      const got = blockCrossSums(plan, store, b, n, costRanks, durationRanks);
      for (let r = 0; r < rows; r++) {
        let c = 0;
        let d = 0;
        for (let i = 0; i < n; i++) {
          c += grades[r * n + i] * costRanks[b * BLOCK_SIZE + i];
          d += grades[r * n + i] * durationRanks[b * BLOCK_SIZE + i];
        }
        expect(got[2 * r]).toBe(plan.sensitivity[r].cost ? c : 0);
        expect(got[2 * r + 1]).toBe(plan.sensitivity[r].duration ? d : 0);
      }
    }
  });
});
