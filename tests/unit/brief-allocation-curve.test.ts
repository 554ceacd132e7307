import { describe, expect, it } from 'vitest';
import { allocationByTopWbs, topLevelWbs } from '@/lib/brief/allocation';
import { monotoneCubic, smoothPath } from '@/lib/brief/chart-geometry';

/** The point at t of a cubic Bézier (de Casteljau). */
function bezier(p0: number, p1: number, p2: number, p3: number, t: number) {
  const u = 1 - t;
  return u * u * u * p0 + 3 * u * u * t * p1 + 3 * u * t * t * p2 + t * t * t * p3;
}

describe('the smooth S-curve', () => {
  // Fritsch & Carlson (1980): with their tangent limits the piecewise cubic through monotone data
  // is monotone, and it passes through every data point.
  const cdf = [
    { x: 10, y: 0 },
    { x: 40, y: 0.05 },
    { x: 42, y: 0.1 },
    { x: 50, y: 0.5 },
    { x: 51, y: 0.8 },
    { x: 70, y: 0.95 },
    { x: 120, y: 1 },
  ];

  it('passes through every point and never falls between them', () => {
    const { start, segments } = monotoneCubic(cdf);
    expect(start).toEqual(cdf[0]);
    expect(segments.map((s) => s.to)).toEqual(cdf.slice(1));
    let previous = { x: -Infinity, y: -Infinity };
    let from = cdf[0];
    for (const s of segments) {
      for (let k = 0; k <= 50; k++) {
        const t = k / 50;
        const x = bezier(from.x, s.c1.x, s.c2.x, s.to.x, t);
        const y = bezier(from.y, s.c1.y, s.c2.y, s.to.y, t);
        expect(x).toBeGreaterThanOrEqual(previous.x - 1e-9);
        expect(y).toBeGreaterThanOrEqual(previous.y - 1e-9);
        expect(y).toBeLessThanOrEqual(1 + 1e-9);
        previous = { x, y };
      }
      from = s.to;
    }
  });

  it('keeps a straight line straight (Hermite interpolation is exact on linear data)', () => {
    const { segments } = monotoneCubic([
      { x: 0, y: 0 },
      { x: 3, y: 6 },
      { x: 6, y: 12 },
    ]);
    expect(segments[0].c1).toEqual({ x: 1, y: 2 });
    expect(segments[0].c2).toEqual({ x: 2, y: 4 });
  });

  it('drops repeated x values and writes an SVG path', () => {
    expect(
      smoothPath([
        { x: 0, y: 0 },
        { x: 0, y: 0.2 },
        { x: 3, y: 3 },
      ]),
    ).toBe('M0,0 C1,1 2,2 3,3');
    expect(smoothPath([])).toBe('');
  });
});

describe('contingency by top-level WBS', () => {
  it('sums each branch, keeps risks tied to no line on their own row, and adds up', () => {
    const brief = allocationByTopWbs(
      {
        level: 'P80',
        contingency: 200,
        iterations: 100,
        items: { '1.1': 100, '1.2': 50, '2.1': 30 },
        risks: { R9: 20 },
      },
      {
        items: [
          { id: '1.1', name: 'Piling' },
          { id: '1.2', name: 'Frame' },
          { id: '2', name: 'Fit-out' },
          { id: '2.1', name: 'Services' },
        ],
      },
    );
    expect(brief.rows).toEqual([
      { wbs: '1', name: 'WBS 1', count: 2, amount: 150, share: 0.75 },
      { wbs: '2', name: 'Fit-out', count: 1, amount: 30, share: 0.15 },
      { wbs: null, name: 'Risk events tied to no line item', count: 1, amount: 20, share: 0.1 },
    ]);
    expect(brief.total).toBe(brief.contingency);
  });

  it('reads the first level of dotted, dashed and plain codes', () => {
    expect(['3.2.1', '3-4', '12', 'C7/2'].map(topLevelWbs)).toEqual(['3', '3', '12', 'C7']);
  });
});
