import { describe, expect, it } from 'vitest';
import { linearScale, niceTicks, sCurveGeometry, tornadoGeometry } from '@/lib/brief/chart-geometry';

describe('nice ticks', () => {
  it('uses steps of 1, 2 or 5 × 10^k that cover the range (Heckbert 1990)', () => {
    // Range 1,115,892 over 5 → raw step 223,178; the smallest of 1, 2, 5 × 10^5 at least that is 500,000.
    expect(niceTicks(6_533_622, 7_649_514, 5)).toEqual([6_500_000, 7_000_000, 7_500_000, 8_000_000]);
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    const ticks = niceTicks(13, 87, 4);
    expect(ticks[0]).toBeLessThanOrEqual(13);
    expect(ticks[ticks.length - 1]).toBeGreaterThanOrEqual(87);
  });

  it('widens a single value instead of dividing by zero', () => {
    const ticks = niceTicks(100, 100);
    expect(ticks[0]).toBeLessThan(100);
    expect(ticks[ticks.length - 1]).toBeGreaterThan(100);
  });
});

describe('S-curve geometry', () => {
  const box = { x: 0, y: 0, width: 500, height: 200 };
  const margin = { left: 40, bottom: 20, top: 0, right: 10 };
  const points = [
    { x: 100, y: 0 },
    { x: 150, y: 0.5 },
    { x: 200, y: 1 },
  ];
  it('puts share 0 at the bottom, share 1 at the top and the ends on the outer ticks', () => {
    const g = sCurveGeometry(points, box, [{ label: 'P80', value: 180 }], margin);
    expect(g.plot).toEqual({ x: 40, y: 0, width: 450, height: 180 });
    expect(g.line[0].y).toBe(180);
    expect(g.line[2].y).toBe(0);
    expect(g.xTicks[0].at).toBe(40);
    expect(g.xTicks[g.xTicks.length - 1].at).toBe(490);
    const scale = linearScale(g.xTicks[0].value, g.xTicks[g.xTicks.length - 1].value, 40, 490);
    expect(g.markers[0].at).toBeCloseTo(scale(180), 9);
  });
});

describe('tornado geometry', () => {
  it('draws bars from a central zero line, negative ones to the left', () => {
    const g = tornadoGeometry(
      [
        { label: 'A', value: 0.62 },
        { label: 'B', value: -0.3 },
      ],
      { x: 0, y: 0, width: 318, height: 120 },
      100,
      20,
    );
    // The axis runs to ±0.7 (0.62 rounded up to a tenth), so the plot's 200 pt (318 − 100 labels − 18 right padding) span 1.4.
    expect(g.zero).toBeCloseTo(200, 9);
    expect(g.bars[0].x).toBeCloseTo(200, 9);
    expect(g.bars[0].width).toBeCloseTo((0.62 / 1.4) * 200, 9);
    expect(g.bars[1].x + g.bars[1].width).toBeCloseTo(200, 9);
    expect(g.bars[1].width).toBeCloseTo((0.3 / 1.4) * 200, 9);
    expect(g.bars[1].y).toBeGreaterThan(g.bars[0].y);
    expect(g.ticks.map((t) => t.value)).toEqual([-0.7, -0.35, 0, 0.35, 0.7]);
  });

  it('uses a half axis from zero when every driver pushes the same way', () => {
    const box = { x: 0, y: 0, width: 318, height: 120 };
    const up = tornadoGeometry(
      [
        { label: 'A', value: 0.62 },
        { label: 'B', value: 0.3 },
      ],
      box,
      100,
      20,
    );
    // 0 to 0.8 (0.62 rounded up to a step of 0.2) over the 200 pt plot: zero on its left edge.
    expect(up.zero).toBeCloseTo(100, 9);
    expect(up.bars[0].width).toBeCloseTo((0.62 / 0.8) * 200, 9);
    expect(up.ticks.map((t) => t.value)).toEqual([0, 0.2, 0.4, 0.6, 0.8]);
    const down = tornadoGeometry([{ label: 'A', value: -0.34 }], box, 100, 20);
    expect(down.zero).toBeCloseTo(300, 9);
    expect(down.ticks.map((t) => t.value)).toEqual([-0.4, -0.3, -0.2, -0.1, 0]);
    // 0.52 rounds up to 0.6 on steps of 0.2: four round ticks, not quarters of the axis.
    const mid = tornadoGeometry([{ label: 'A', value: 0.52 }], box, 100, 20);
    expect(mid.ticks.map((t) => t.value)).toEqual([0, 0.2, 0.4, 0.6]);
  });
});
