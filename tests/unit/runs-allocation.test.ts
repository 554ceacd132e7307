// The allocation of contingency as a table that adds up (Euler allocation, Tasche 1999: the shares
// add up to the window's mean total less the base, which differs from the P-value less the base by
// the Monte Carlo error that the table states).
import { describe, expect, it } from 'vitest';
import { allocationSheet, allocationTable, byCode, byTopLevel, shownRows } from '@/lib/runs/allocation';
import type { AllocationResult } from '@/lib/sim';

const allocation: AllocationResult = {
  level: 'P80',
  contingency: 500,
  iterations: 51,
  items: { '2.10': 120, '1.1': 200, '2.9': 80.5 },
  risks: { R2: 0, R10: 95.25 },
};
const names: Record<string, string> = {
  '1.1': 'Earthworks',
  '2.9': 'Pumps',
  '2.10': 'Pipework',
  R2: 'Permit',
  R10: 'Flood',
};

describe('the allocation table', () => {
  const table = allocationTable(allocation, (c) => names[c] ?? '');

  it('lists line items in WBS order, then risks, with their names', () => {
    expect(table.rows.map((r) => r.code)).toEqual(['1.1', '2.9', '2.10', 'R2', 'R10']);
    expect(table.rows[0]).toMatchObject({ name: 'Earthworks', kind: 'item' });
    expect(table.rows[4]).toMatchObject({ name: 'Flood', kind: 'risk' });
    expect(byCode('2.10', '2.9')).toBeGreaterThan(0);
  });

  it('adds up: the sum of the rows, the contingency and the difference between them', () => {
    // By hand: 200 + 80.5 + 120 + 0 + 95.25 = 495.75; 495.75 − 500 = −4.25.
    expect(table.sum).toBeCloseTo(495.75, 9);
    expect(table.contingency).toBe(500);
    expect(table.difference).toBeCloseTo(-4.25, 9);
    expect(table.rows[0].share).toBeCloseTo(0.4, 12);
  });

  it('folds the smallest rows into one on screen and still adds up to the same sum', () => {
    const { rows, others } = shownRows(table, 3);
    // The two largest by size (200 and 120) keep their rows, in WBS order; the other three fold.
    expect(rows.map((r) => r.code)).toEqual(['1.1', '2.10']);
    expect(others?.amount).toBeCloseTo(80.5 + 0 + 95.25, 9);
    expect(rows.reduce((s, r) => s + r.amount, 0) + others!.amount).toBeCloseTo(table.sum, 9);
    expect(shownRows(table, 30).others).toBeNull();
  });

  it('sums the rows by top-level WBS, risks of their own apart, to the same sum', () => {
    const grouped = byTopLevel(table, (c) => (c === '2' ? 'Pipeline' : ''));
    // By hand: branch 1 = 200; branch 2 = 80.5 + 120 = 200.5; risks = 0 + 95.25.
    expect(grouped.rows.map((r) => [r.code, r.name, r.amount])).toEqual([
      ['1', 'All lines under 1', 200],
      ['2', 'Pipeline', 200.5],
      ['', '2 risks of their own', 95.25],
    ]);
    expect(grouped.rows.reduce((s, r) => s + r.amount, 0)).toBeCloseTo(table.sum, 9);
    expect(grouped.sum).toBe(table.sum);
  });

  it('writes every row and the three totals for a download', () => {
    const sheet = allocationSheet(table, 'EUR');
    expect(sheet).toHaveLength(1 + 5 + 3);
    expect(sheet[0][3]).toBe('Allocated at P80 (EUR)');
    const body = sheet.slice(1, 6).reduce((s, r) => s + Number(r[3]), 0);
    expect(body).toBeCloseTo(Number(sheet[6][3]), 9);
    expect(Number(sheet[6][3]) - Number(sheet[7][3])).toBeCloseTo(Number(sheet[8][3]), 9);
  });

  it('shows no share of a contingency of 0', () => {
    const zero = allocationTable({ ...allocation, contingency: 0 }, () => '');
    expect(zero.rows.every((r) => r.share === null)).toBe(true);
  });
});
