// Outputs of version 2 checked against outside references: the swing (truncated-normal means),
// joint confidence (the product of independent marginals) and its frontier, intervals on every
// P-value and on contingency.
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import type { Model } from '../formats';
import { item, normal, uniform } from './helpers';

const v2 = (parts: Partial<Model>): Model => ({ format: 'outturn-model', version: 2, items: [], ...parts });

describe('swing', () => {
  it('is the truncated-normal mean at each end for a normal item', () => {
    // E[X | X ≤ μ + zσ] = μ − σ φ(z)/Φ(z) (Johnson, Kotz & Balakrishnan, vol. 1, §13.10.1);
    // with z = Φ⁻¹(0.1) = −1.28155, φ(z) = 0.175498, so the low end is μ − 1.75498σ.
    const res = simulateSync(
      v2({
        items: [item('C1', normal(100, 10)), item('C2', uniform(0, 0.001))],
      }),
      { iterations: 40_000, seed: 5 },
    );
    const c1 = res.sensitivity.cost.find((e) => e.id === 'C1')!;
    expect(c1.swing![0]).toBeCloseTo(100 - 17.5498, 1);
    expect(c1.swing![1]).toBeCloseTo(100 + 17.5498, 1);
    expect(c1.kind).toBe('item');
  });
});

describe('joint confidence', () => {
  const m = v2({
    items: [item('C1', uniform(0, 100))],
    activities: [{ id: 'A1', duration: uniform(0, 100) }],
    targets: { cost: 80, duration: 80 },
  });
  const res = simulateSync(m, { iterations: 40_000, seed: 7, sampling: 'mc' });

  it('at P-levels is the product of the marginals for independent totals', () => {
    // P(C ≤ c_k, D ≤ d_k) = k·k for independent C and D.
    const at = res.joint!.atPLevels!;
    expect(at.P50).toBeCloseTo(0.25, 1);
    expect(at.P80).toBeCloseTo(0.64, 1);
    expect(Math.abs(at.P90 - 0.81)).toBeLessThan(0.01);
  });

  it('has a frontier with P(C ≤ c)·P(D ≤ d) = level for independent totals', () => {
    // Independent uniforms on (0, 100): c(d) = 100 · level / (d/100).
    const { level, points } = res.joint!.frontier!;
    expect(level).toBe(0.7);
    expect(points.length).toBeGreaterThanOrEqual(10);
    for (const p of points.filter((q) => q.duration >= 80)) {
      expect(Math.abs(p.cost - (100 * 0.7) / (p.duration / 100))).toBeLessThan(2);
    }
    for (let k = 1; k < points.length; k++) expect(points[k].cost).toBeLessThanOrEqual(points[k - 1].cost);
  });
});

describe('intervals', () => {
  it('cover every P-value, and contingency by the same interval shifted by the base', () => {
    const res = simulateSync(v2({ items: [item('C1', normal(100, 10))] }), {
      iterations: 5000,
      seed: 1,
    });
    const { percentiles, percentileCI95, contingencyCI95, base } = res.cost;
    for (const [k, v] of Object.entries(percentiles)) {
      const [lo, hi] = percentileCI95[k as keyof typeof percentiles];
      expect(lo).toBeLessThanOrEqual(v);
      expect(hi).toBeGreaterThanOrEqual(v);
    }
    expect(contingencyCI95!.P80).toEqual([percentileCI95.P80[0] - base, percentileCI95.P80[1] - base]);
  });
});
