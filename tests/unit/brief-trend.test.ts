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

  it('measures each change within its own scenario and the schedule margin at P80', () => {
    const row = (
      approvalId: number,
      month: string,
      scenario: 'pre' | 'post',
      c: [number, number],
      d: [number, number],
    ) => ({
      approvalId,
      runId: approvalId * 10,
      runNumber: approvalId,
      decidedAt: `2026-${month}-01T00:00:00.000Z`,
      stage: 'Gate',
      estimateClass: 3,
      sponsorName: 'S',
      riskValues: scenario,
      result: {
        ...cost(c[0], c[1], c[1]),
        duration: {
          base: d[0],
          percentiles: { P50: d[1], P80: d[1] },
        } as unknown as BaselineSource['result']['cost'],
      },
    });
    const rows = trendRows([
      row(1, '01', 'pre', [1000, 1400], [200, 260]),
      row(2, '02', 'post', [1000, 1250], [200, 240]),
      row(3, '03', 'pre', [1000, 1300], [200, 250]),
    ]);
    expect(rows.map((r) => r.scenario)).toEqual(['pre', 'post', 'pre']);
    // Contingency P80 − base: 400, 250, 300; the third compares with the first (both pre), 300 − 400.
    expect(rows.map((r) => r.contingencyChange)).toEqual([null, null, -100]);
    // Schedule margin, duration P80 − base duration: 60, 40, 50 working days; 50 − 60 for the third.
    expect(rows.map((r) => r.scheduleMarginP80)).toEqual([60, 40, 50]);
    expect(rows.map((r) => r.scheduleMarginChange)).toEqual([null, null, -10]);
  });

  it('is empty without baselines', () => {
    expect(trendRows([])).toEqual([]);
  });
});
