// Euler allocation of contingency: against Tasche's closed form for jointly normal inputs, shares
// that add up to the contingency, and a second pass that recomputes exactly the window's totals.
import { describe, expect, it } from 'vitest';
import { BLOCK_SIZE } from '../block';
import { prepareRun, rankRun, secondPassInThread, simulateRound, simulateSync } from '../engine';
import type { Model } from '../formats';
import { allocateRound } from '../run-data';
import { allocationWindow } from '../stats/allocation';
import { item, normal, uniform } from './helpers';

const v2 = (parts: Partial<Model>): Model => ({ format: 'outturn-model', version: 2, items: [], ...parts });

describe('Euler allocation', () => {
  it('matches Tasche (1999) for independent normal items', () => {
    // Tasche (1999), "Risk contributions and performance measurement": for jointly normal X_i
    // with total S, the contribution at the quantile s_q is E[X_i | S = s_q]
    //   = μ_i + Cov(X_i, S)/Var(S)·(s_q − μ_S) = μ_i + σ_i²/σ_S · z_q  (independent X_i).
    // The base of a normal is its mean, so share_i = σ_i²·z_q/σ_S; z_0.8 = 0.841621 (Φ⁻¹ tables).
    const sds = { C1: 10, C2: 20, C3: 30 };
    const res = simulateSync(
      v2({
        items: [item('C1', normal(100, 10)), item('C2', normal(200, 20)), item('C3', normal(50, 30))],
      }),
      { iterations: 100_000, seed: 12 },
    );
    const a = res.allocation!;
    const sdS = Math.sqrt(10 ** 2 + 20 ** 2 + 30 ** 2);
    expect(a.level).toBe('P80');
    expect(a.iterations).toBeGreaterThanOrEqual(1000);
    expect(a.iterations).toBeLessThan(1100);
    for (const [id, sd] of Object.entries(sds)) {
      // Monte Carlo error: sd(X_i | S) = σ_i·√(1 − σ_i²/σ_S²) over ~1000 iterations, at most 0.6.
      expect(Math.abs(a.items[id] - (sd * sd * 0.841621) / sdS)).toBeLessThan(1.5);
    }
    expect(a.contingency).toBeCloseTo(res.cost.contingency.P80, 9);
  });

  it('matches Tasche at P50 for a correlated pair (the covariance term)', () => {
    // At the median s_q = μ_S, so every contribution is its mean and every share 0 for normals
    // whose base is the mean, whatever the correlation (Tasche 1999, as above, with z_0.5 = 0).
    const res = simulateSync(
      v2({
        items: [item('C1', normal(100, 10)), item('C2', normal(200, 40))],
        correlations: [{ a: 'C1', b: 'C2', rho: 0.6 }],
        settings: { contingencyLevel: 'P50' },
      }),
      { iterations: 100_000, seed: 4 },
    );
    const a = res.allocation!;
    expect(a.level).toBe('P50');
    expect(Math.abs(a.items.C1)).toBeLessThan(0.6);
    expect(Math.abs(a.items.C2)).toBeLessThan(1.2);
  });

  it('gives shares that add up to the contingency, risks and time-dependent costs included', () => {
    const res = simulateSync(
      v2({
        items: [
          item('C1', uniform(900, 1300)),
          { id: 'C2', ratePerDay: uniform(8, 12), activity: 'A1' },
          { id: 'C3', ratePerDay: 5, span: 'project' },
        ],
        activities: [
          { id: 'A1', duration: uniform(20, 40) },
          { id: 'A2', duration: uniform(10, 30), predecessors: ['A1'] },
        ],
        risks: [
          { id: 'R1', probability: 0.4, cost: uniform(100, 300), delay: uniform(5, 10), activities: ['A1'] },
          { id: 'R2', probability: 0.2, cost: uniform(200, 400), items: ['C1'] },
          {
            id: 'R3',
            probability: 0.5,
            cost: uniform(50, 150),
            post: { probability: 0.1 },
            mitigationCost: 20,
          },
        ],
      }),
      { iterations: 50_000, seed: 9 },
    );
    const a = res.allocation!;
    // R2 names C1, so its share is inside C1's; R1 and R3 name no item.
    expect(Object.keys(a.risks).sort()).toEqual(['R1', 'R3']);
    expect(Object.keys(a.items).sort()).toEqual(['C1', 'C2', 'C3']);
    const sum = [...Object.values(a.items), ...Object.values(a.risks)].reduce((s, x) => s + x, 0);
    // The window's mean total lies within its narrow band around the P-value (about 1% of the
    // iterations on either side of it).
    expect(Math.abs(sum - a.contingency)).toBeLessThan(0.01 * a.contingency);
    // A risk of probability 0.4 whose cost is at least 100 adds cost at the high P-level.
    expect(a.risks.R1).toBeGreaterThan(0);
  });

  it('recomputes in the second pass exactly the totals of the window', () => {
    const m = v2({
      items: [item('C1', normal(1000, 100)), { id: 'C2', ratePerDay: uniform(8, 12), activity: 'A1' }],
      activities: [{ id: 'A1', duration: uniform(20, 40) }],
      drivers: [{ id: 'D1', factor: uniform(0.9, 1.3), applies: ['C1', 'A1'] }],
      risks: [
        { id: 'R1', probability: 0.3, cost: uniform(100, 300), delay: uniform(1, 5), activities: ['A1'] },
      ],
      correlations: [{ a: 'C1', b: 'R1', rho: 0.5 }],
    });
    const n = 3 * BLOCK_SIZE + 17;
    const run = prepareRun(m, { iterations: n, seed: 5 });
    const store = allocateRound(run.plan, 0, n, false);
    simulateRound(run, store);
    const totals = rankRun(run, [store]);
    const second = secondPassInThread(run, [store], totals);
    const { lo, hi } = allocationWindow(run.plan, totals.costSorted);
    let count = 0;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      if (store.cost[i] >= lo && store.cost[i] <= hi) {
        count++;
        sum += store.cost[i];
      }
    }
    const slots = run.plan.costItems.length + run.plan.rateItems.length + run.plan.risks.length;
    let recomputed = 0;
    let recount = 0;
    for (const s of second) {
      for (let k = 0; k < slots; k++) recomputed += s.allocation[k];
      recount += s.allocation[slots];
    }
    expect(recount).toBe(count);
    expect(count).toBeGreaterThan(0);
    expect(Math.abs(recomputed - sum)).toBeLessThan(1e-9 * sum);
  });

  it("reads from the blocks' bands the sums the recomputation gives", () => {
    const m = v2({
      items: [
        item('C1', normal(1000, 100)),
        { id: 'C2', ratePerDay: uniform(8, 12), activity: 'A1' },
        { id: 'C3', base: 50 },
        { id: 'C4', ratePerDay: 2, span: 'project' },
      ],
      activities: [{ id: 'A1', duration: uniform(20, 40) }],
      risks: [
        { id: 'R1', probability: 0.3, cost: uniform(100, 300), delay: uniform(1, 5), activities: ['A1'] },
        {
          id: 'R2',
          probability: 0.5,
          cost: uniform(50, 150),
          post: { probability: 0.2 },
          mitigationCost: 10,
        },
      ],
    });
    const n = 4 * BLOCK_SIZE;
    const run = prepareRun(m, { iterations: n, seed: 8 });
    const store = allocateRound(run.plan, 0, n, false);
    const blocks = simulateRound(run, store);
    expect(blocks.every((b) => b.band !== undefined)).toBe(true);
    const totals = rankRun(run, [store]);
    const fromBands = secondPassInThread(run, [store], totals, blocks);
    const recomputed = secondPassInThread(run, [store], totals);
    fromBands.forEach((s, k) => {
      const r = recomputed[k].allocation;
      expect(s.allocation[r.length - 1]).toBe(r[r.length - 1]);
      s.allocation.forEach((x, slot) =>
        expect(Math.abs(x - r[slot])).toBeLessThanOrEqual(1e-9 * Math.abs(r[slot])),
      );
    });
  });
});
