// Magnitude bounds of the register rows and of the model file, and the check that keeps a run
// with non-finite figures from succeeding. 1e308 is near the largest IEEE-754 double
// (≈1.797e308, the standard's binary64 format); a triangular(-1e308, 0, 1e308) input overflows
// any sum of two samples to ±Infinity, and Infinity − Infinity is NaN.
import { describe, expect, it } from 'vitest';
import { MAX_DAYS, MAX_MONEY, parseRows, rowIssues } from '@/lib/validation/registers';
import { validateModel } from '@/lib/sim';
import { nonFiniteReason } from '@/lib/services/runs/finite';

const line = {
  code: 'C1',
  description: 'Earthworks',
  distType: 'triangular',
  low: 100,
  mode: 120,
  high: 200,
};
const activity = { code: 'A1', name: 'Dig', distType: 'triangular', low: 1, mode: 2, high: 3 };
const risk = {
  code: 'R1',
  title: 'Rock',
  probability: 0.2,
  costType: 'triangular',
  costLow: 1,
  costMode: 2,
  costHigh: 3,
};

describe('register rows refuse magnitudes no project needs', () => {
  it('refuses a line of triangular(-1e308, 0, 1e308) and states the bound', () => {
    const issues = rowIssues('items', { ...line, low: -1e308, mode: 0, high: 1e308 });
    expect(issues.low).toBe('Low must lie within ±10,000,000,000,000 (got -1e+308).');
    expect(issues.high).toBe('High must lie within ±10,000,000,000,000 (got 1e+308).');
  });
  it('accepts amounts at the bound', () => {
    expect(rowIssues('items', { ...line, low: 0, mode: 1, high: MAX_MONEY })).toEqual({});
  });
  it('refuses durations beyond 100,000 days and names the row in a batch', () => {
    const { issues } = parseRows('activities', [{ ...activity, high: MAX_DAYS + 1 }]);
    expect(issues).toEqual([
      {
        path: 'rows[0].high',
        message: 'Row 1 (A1), high: High must lie within ±100,000 days (got 100001).',
      },
    ]);
    expect(rowIssues('activities', { ...activity, high: MAX_DAYS })).toEqual({});
  });
  it('refuses huge risk costs, delays and lags', () => {
    expect(rowIssues('risks', { ...risk, costHigh: 1e14 }).costHigh).toContain('±10,000,000,000,000');
    expect(
      rowIssues('risks', {
        ...risk,
        delayType: 'uniform',
        delayLow: 1,
        delayHigh: 1e9,
        activityCode: 'A1',
      }).delayHigh,
    ).toContain('±100,000 days');
    expect(rowIssues('activities', { ...activity, predecessors: [{ code: 'A0', lag: 1e9 }] })).toHaveProperty(
      'predecessors',
    );
  });
});

const model = (items: unknown[], activities?: unknown[]) => ({
  format: 'outturn-model',
  version: 1,
  items,
  ...(activities ? { activities } : {}),
});

describe('the model file refuses magnitudes no project needs', () => {
  it('names the entry of triangular(-1e308, 0, 1e308) and states the bound', () => {
    const r = validateModel(
      model([{ id: 'X1', dist: { type: 'triangular', low: -1e308, mode: 0, high: 1e308 } }]),
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues).toContainEqual({
      path: 'items[0] (X1).dist.low',
      message: 'must be ≥ -10000000000000 (got -1e+308)',
    });
    expect(r.issues).toContainEqual({
      path: 'items[0] (X1).dist.high',
      message: 'must be ≤ 10000000000000 (got 1e+308)',
    });
  });
  it('names an activity whose duration exceeds 100,000 days', () => {
    const r = validateModel(
      model([{ id: 'C1', base: 1 }], [{ id: 'A1', duration: { type: 'uniform', low: 1, high: 1e7 } }]),
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues).toEqual([
      { path: 'activities[0] (A1).duration.high', message: 'must be within ±100000 days (got 10000000)' },
    ]);
  });
  it('accepts amounts and durations at the bounds', () => {
    const r = validateModel(
      model(
        [{ id: 'C1', dist: { type: 'uniform', low: -1e13, high: 1e13 } }],
        [{ id: 'A1', duration: { type: 'uniform', low: 0, high: 1e5 } }],
      ),
    );
    expect(r.ok).toBe(true);
  });
});

describe('a result with non-finite figures', () => {
  const total = (P50: number) => ({
    base: 1,
    mean: 1,
    sd: 0,
    min: 1,
    max: 1,
    percentiles: { P5: 1, P10: 1, P20: 1, P30: 1, P40: 1, P50, P60: 1, P70: 1, P80: 1, P90: 1, P95: 1 },
    percentileCI95: { P10: [1, 1], P50: [1, 1], P80: [1, 1], P90: [1, 1] },
    contingency: { P50: 0, P80: 0, P90: 0 },
  });
  it('is refused with a reason naming the figure', () => {
    expect(nonFiniteReason({ cost: total(NaN) } as never)).toMatch(/no usable cost figures \(P50 = NaN\)/);
    expect(nonFiniteReason({ cost: total(1), duration: total(Infinity) } as never)).toMatch(
      /duration figures \(P50 = Infinity\)/,
    );
  });
  it('passes when every figure is finite', () => {
    expect(nonFiniteReason({ cost: total(1), duration: total(2) } as never)).toBeNull();
  });
});
