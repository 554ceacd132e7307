import { describe, expect, it } from 'vitest';
import { contingencyAt, contingencyOver } from '@/lib/domain/contingency';
import { PERCENTILE_KEYS, probabilityOf } from '@/lib/domain/percentiles';
import type { PercentileKey, TotalSummary } from '@/lib/sim';

const percentiles = Object.fromEntries(PERCENTILE_KEYS.map((k, i) => [k, 100 + 5 * i])) as Record<
  PercentileKey,
  number
>;
const summary: Pick<TotalSummary, 'base' | 'percentiles'> = { base: 100, percentiles };

describe('contingency', () => {
  it('is the percentile less the base, and its share of the base', () => {
    // Contingency at P_p = P_p − base (common practice in cost risk analysis): P80 is the 9th key,
    // 100 + 5·8 = 140, so 40 over a base of 100, a share of 0.4.
    expect(contingencyAt(summary, 'P80')).toEqual({ level: 'P80', value: 140, amount: 40, shareOfBase: 0.4 });
    expect(contingencyAt(summary, 'P50').amount).toBe(25);
  });

  it('is negative when the level lies below the base', () => {
    expect(contingencyOver(200, 'P10', 150)).toEqual({
      level: 'P10',
      value: 150,
      amount: -50,
      shareOfBase: -0.25,
    });
  });

  it('has no share of a base of 0', () => {
    expect(contingencyOver(0, 'P80', 30).shareOfBase).toBeNull();
  });
});

describe('percentile keys', () => {
  it('are the engine’s, in increasing order, each naming its probability', () => {
    expect(PERCENTILE_KEYS).toEqual([
      'P5',
      'P10',
      'P20',
      'P30',
      'P40',
      'P50',
      'P60',
      'P70',
      'P80',
      'P90',
      'P95',
    ]);
    // "Pn" is the n-th percentile, the quantile at n/100 (definition).
    for (const k of PERCENTILE_KEYS) expect(probabilityOf(k)).toBeCloseTo(Number(k.slice(1)) / 100, 12);
  });
});
