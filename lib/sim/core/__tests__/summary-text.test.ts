// The command line's summary: the intervals of large totals stay in columns of their own.
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import { summaryText } from '../report/summary-text';
import { item, model, uniform } from './helpers';

describe('summaryText', () => {
  it('keeps each P-value interval apart from the next when the sums run to nine digits', () => {
    const res = simulateSync(
      model({ items: [item('C1', uniform(100_000_000, 140_000_000)), item('C2', uniform(10_000, 20_000))] }),
      { iterations: 4000, seed: 3 },
    );
    const text = summaryText(res, { threads: 1 });
    const row = text.split('\n').find((l) => l.startsWith('  95% interval'))!;
    // Three intervals "low–high", separated by spaces (never glued as "…075128,…").
    const cells = row.replace('  95% interval', '').trim().split(/\s+/);
    expect(cells).toHaveLength(3);
    for (const c of cells) expect(c).toMatch(/^\d{3},\d{3},\d{3}–\d{3},\d{3},\d{3}$/);
    // The P80 column's value sits above its interval: the same right edge.
    const value = text.split('\n').find((l) => l.startsWith('  value'))!;
    expect(value.length).toBe(row.length);
  });
});
