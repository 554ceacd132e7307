import { describe, expect, it } from 'vitest';
import {
  contingencyInterval,
  criticalityRows,
  empiricalCurve,
  inputNames,
  responseValueAt,
  scenarioCurve,
  swingRows,
  histogram,
  percentileCurve,
  sampleCharts,
  topDrivers,
} from '@/lib/runs/outcome-data';
import type { TotalSummary } from '@/lib/sim';

describe('chart data shaping', () => {
  it('bins values into equal-width bins that hold every value once', () => {
    const values = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    const h = histogram(values, 5);
    expect(h.edges).toEqual([0, 2, 4, 6, 8, 10]);
    // [0,2) [2,4) [4,6) [6,8) [8,10]: the maximum falls in the last bin.
    expect(h.counts).toEqual([2, 2, 2, 2, 3]);
    expect(h.counts.reduce((a, b) => a + b, 0)).toBe(values.length);
  });

  it('draws the empirical S-curve from 0 to 1, rising', () => {
    const values = Array.from({ length: 1000 }, (_, i) => (i * 7919) % 1000);
    const curve = empiricalCurve(values, 100);
    expect(curve[0]).toEqual({ x: 0, y: 0 });
    expect(curve[curve.length - 1]).toEqual({ x: 999, y: 1 });
    for (let i = 1; i < curve.length; i++) {
      expect(curve[i].x).toBeGreaterThanOrEqual(curve[i - 1].x);
      expect(curve[i].y).toBeGreaterThan(curve[i - 1].y);
    }
    // F(x) of 0…999 is (x + 1)/1000 at each sampled point.
    for (const p of curve.slice(1)) expect(p.y).toBeCloseTo((p.x + 1) / 1000, 12);
  });

  const summary = {
    base: 100,
    mean: 0,
    sd: 0,
    min: 80,
    max: 200,
    percentiles: {
      P5: 90,
      P10: 95,
      P20: 100,
      P30: 105,
      P40: 110,
      P50: 115,
      P60: 120,
      P70: 126,
      P80: 133,
      P90: 145,
      P95: 160,
    },
    percentileCI95: { P10: [94, 96], P50: [114, 116], P80: [132, 134], P90: [144, 146] },
    contingency: { P50: 15, P80: 33, P90: 45 },
  } as TotalSummary;

  it('draws the S-curve through every percentile the engine reports, from min to max', () => {
    expect(percentileCurve(summary).map((p) => p.y)).toEqual([
      0, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 1,
    ]);
  });

  it('keeps the 15 strongest drivers by absolute rank correlation', () => {
    const entries = Array.from({ length: 20 }, (_, i) => ({
      id: `C${i}`,
      rankCorrelation: (i % 2 ? -1 : 1) * i * 0.01,
      varianceShare: 0,
    }));
    const top = topDrivers(entries);
    expect(top).toHaveLength(15);
    expect(top[0].id).toBe('C19');
    expect(top[0].rankCorrelation).toBeCloseTo(-0.19, 12);
    expect(top.map((t) => t.id)).not.toContain('C4');
  });

  it('thins the scatter evenly and sorts it along the duration axis, keeping each pair together', () => {
    const duration = Array.from({ length: 5000 }, (_, i) => (i * 7919) % 5000);
    const cost = duration.map((d) => 10 * d + 3);
    const charts = sampleCharts({ n: 5000, of: 10_000, cost, duration }, 2500);
    expect(charts.scatter).toHaveLength(2500);
    for (let i = 1; i < charts.scatter.length; i++)
      expect(charts.scatter[i].x).toBeGreaterThanOrEqual(charts.scatter[i - 1].x);
    for (const p of charts.scatter) expect(p.y).toBe(10 * p.x + 3);
    expect(charts.cost.counts.reduce((a, b) => a + b, 0)).toBe(5000);
  });

  it('gives the contingency interval: the result’s own, else the P-value’s less the base', () => {
    // contingency = P − base and the base is a constant, so its interval is the P-value's shifted
    // by the base (common practice; docs/result-format.md, contingencyCI95).
    expect(contingencyInterval(summary, 'P80')).toEqual([32, 34]);
    expect(
      contingencyInterval({ ...summary, contingencyCI95: { P50: [1, 2], P80: [3, 4], P90: [5, 6] } }, 'P80'),
    ).toEqual([3, 4]);
    expect(contingencyInterval(summary, 'P70')).toBeNull();
  });

  it('reads the responses’ value at a level as pre less post, both from the same percentiles', () => {
    const pre = { ...summary.percentiles, P80: 140 };
    expect(responseValueAt(pre, summary.percentiles, 'P80')).toEqual({ pre: 140, post: 133, saving: 7 });
    expect(scenarioCurve(summary.percentiles).map((p) => p.y)).toEqual([
      0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95,
    ]);
  });

  it('orders swings by their width as changes from the mean, skipping entries without one', () => {
    const rows = swingRows(
      [
        { id: 'C1', rankCorrelation: 0.6, varianceShare: 0.5, kind: 'item', swing: [90, 130] },
        { id: 'D1', rankCorrelation: 0.3, varianceShare: 0.2, kind: 'driver', swing: [95, 160] },
        { id: 'R1', rankCorrelation: -0.1, varianceShare: 0.1, kind: 'risk', swing: [108, 104] },
        { id: 'A1', rankCorrelation: 0.2, varianceShare: 0.2 },
      ],
      110,
    );
    // Widths by hand: D1 65, C1 40, R1 4.
    expect(rows.map((r) => r.id)).toEqual(['D1', 'C1', 'R1']);
    expect(rows[0]).toMatchObject({ low: -15, high: 50, kind: 'driver' });
    expect(rows[2]).toMatchObject({ low: -2, high: -6 });
  });

  it('lists activities by criticality with their schedule sensitivity index where known', () => {
    const rows = criticalityRows({ A1: 1, A2: 0.4, A3: 1 }, [
      { id: 'A3', rankCorrelation: 0.5, varianceShare: 0.5, kind: 'activity', ssi: 0.7 },
      { id: 'A1', rankCorrelation: 0.1, varianceShare: 0.1, kind: 'activity', ssi: 0.2 },
    ]);
    expect(rows.map((r) => [r.id, r.ssi])).toEqual([
      ['A3', 0.7],
      ['A1', 0.2],
      ['A2', null],
    ]);
  });

  it('names every kind of input by its code', () => {
    const names = inputNames({
      format: 'outturn-model',
      version: 2,
      items: [{ id: 'C1', name: 'Piling' }],
      risks: [{ id: 'R1', name: 'Flood', probability: 0.1 }],
      activities: [{ id: 'A1', name: 'Dig', duration: { type: 'fixed', value: 5 } }],
      drivers: [{ id: 'D1', name: 'Ground', factor: { type: 'fixed', value: 1 }, applies: ['C1'] }],
    });
    expect(names).toEqual({ C1: 'Piling', R1: 'Flood', A1: 'Dig', D1: 'Ground' });
  });
});
