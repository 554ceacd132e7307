import { describe, expect, it } from 'vitest';
import { trendRows, type BaselineSource } from '@/lib/brief/trend';

const cost = (base: number, p50: number, p80: number) => ({
  cost: { base, percentiles: { P50: p50, P80: p80 } } as unknown as BaselineSource['result']['cost'],
});

describe('trend rows', () => {
  it('orders baselines by date and measures the P80 contingency drawdown', () => {
    const rows = trendRows([
      {
        approvalId: 2,
        runId: 20,
        runNumber: 2,
        decidedAt: '2026-06-01T00:00:00.000Z',
        stage: 'Detailed design',
        estimateClass: 2,
        sponsorName: 'S',
        result: cost(1000, 1080, 1150),
      },
      {
        approvalId: 1,
        runId: 10,
        runNumber: 1,
        decidedAt: '2026-01-01T00:00:00.000Z',
        stage: 'Feasibility',
        estimateClass: 4,
        sponsorName: 'S',
        result: cost(900, 1050, 1200),
      },
    ]);
    expect(rows.map((r) => r.runId)).toEqual([10, 20]);
    // Contingency = P80 − base: 1200 − 900 = 300, then 1150 − 1000 = 150, a drawdown of 150.
    expect(rows.map((r) => r.contingencyP80)).toEqual([300, 150]);
    expect(rows.map((r) => r.contingencyChange)).toEqual([null, -150]);
    expect(rows[1]).toMatchObject({ base: 1000, p50: 1080, p80: 1150, stage: 'Detailed design' });
  });

  it('is empty without baselines', () => {
    expect(trendRows([])).toEqual([]);
  });
});
