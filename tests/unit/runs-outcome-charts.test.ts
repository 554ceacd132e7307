// The pure shaping behind the outcome's own charts: axis ticks and the half-axis decision, hexagon
// bins and the quadrant shares around the targets, and the smooth S-curve path.
import { describe, expect, it } from 'vitest';
import { dataAxis, placement, signedAxis, ticksOver } from '@/lib/runs/chart-scale';
import { hexBins, quadrantShares, quadrantsFromProbabilities } from '@/lib/runs/density';
import { monotoneCubic } from '@/lib/brief/chart-geometry';

describe('axis ticks', () => {
  it('steps by 1, 2 or 5 × 10^k and encloses the data', () => {
    // Heckbert's nice numbers (Graphics Gems, 1990): 2,179–3,904 in about five steps → 500s.
    const t = ticksOver(2179, 3904, 4);
    expect(t.step).toBe(500);
    expect(t.values).toEqual([2000, 2500, 3000, 3500, 4000]);
    expect(ticksOver(0, 1, 5).values).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });

  it('runs a data axis over the data alone, with the nice ticks inside it', () => {
    const t = dataAxis(50.3, 60.4, 6, 0);
    expect(t.min).toBe(50.3);
    expect(t.max).toBe(60.4);
    // Steps of 2 (Heckbert: 10.1 / 6 ≈ 1.7 → 2), only those within 50.3–60.4.
    expect(t.values).toEqual([52, 54, 56, 58, 60]);
  });

  it('uses a half axis from 0 when every driver pushes the same way', () => {
    const up = signedAxis([0.64, 0.31, 0.05]);
    expect(up.half).toBe('positive');
    expect(up.min).toBe(0);
    // 0.64 rounded up to the next tick of 0.2 (common practice: the axis ends on a tick).
    expect(up.max).toBeCloseTo(0.8, 12);
    expect(up.values[0]).toBe(0);
    expect(up.values.every((v) => v >= 0)).toBe(true);

    const down = signedAxis([-0.2, -0.45]);
    expect(down.half).toBe('negative');
    expect(down.max).toBe(0);
    // 0.45 in steps of 0.2 ends on the tick at 0.6.
    expect(down.min).toBeCloseTo(-0.6, 12);
    expect(down.values.at(-1)).toBe(0);
  });

  it('keeps a symmetric axis when drivers push both ways, and never beyond ±1', () => {
    const both = signedAxis([0.63, -0.12]);
    expect(both.half).toBeNull();
    expect(both.min).toBeCloseTo(-both.max, 12);
    expect(both.values).toContain(0);
    const full = signedAxis([0.99, -0.98]);
    expect(full.max).toBe(1);
    expect(full.min).toBe(-1);
  });

  it('says on which side of a plotted range a target lies', () => {
    expect(placement(5, { min: 0, max: 10 })).toBe('inside');
    expect(placement(-1, { min: 0, max: 10 })).toBe('below');
    expect(placement(11, { min: 0, max: 10 })).toBe('above');
  });
});

describe('hexagon bins', () => {
  const r = 10;
  const dx = r * Math.sqrt(3);
  const dy = r * 1.5;

  it('counts points by hand on a small lattice', () => {
    // Centres of a pointy-top lattice (Carr et al. 1987): row j at y = 1.5·r·j, odd rows shifted
    // by half a column. Three points near (0, 0), two near the odd-row centre (dx/2, dy), one far.
    const points = [
      { x: 0, y: 0 },
      { x: 2, y: -3 },
      { x: -4, y: 5 },
      { x: dx / 2 + 1, y: dy - 1 },
      { x: dx / 2 - 3, y: dy + 2 },
      { x: 5 * dx, y: 0 },
    ];
    const cells = hexBins(points, r);
    const at = (x: number, y: number) =>
      cells.find((c) => Math.abs(c.x - x) < 1e-9 && Math.abs(c.y - y) < 1e-9)?.count;
    expect(at(0, 0)).toBe(3);
    expect(at(dx / 2, dy)).toBe(2);
    expect(at(5 * dx, 0)).toBe(1);
    expect(cells.reduce((s, c) => s + c.count, 0)).toBe(points.length);
  });

  it('puts each point in the hexagon whose centre is nearest (the lattice’s Voronoi cell)', () => {
    const centres: { x: number; y: number }[] = [];
    for (let j = -4; j <= 4; j++)
      for (let i = -4; i <= 4; i++) centres.push({ x: (i + (j & 1) / 2) * dx, y: j * dy });
    let seed = 7;
    const next = () => ((seed = (seed * 48271) % 2147483647) / 2147483647) * 80 - 40;
    for (let k = 0; k < 500; k++) {
      const p = { x: next(), y: next() };
      const [cell] = hexBins([p], r);
      const nearest = centres.reduce((best, c) =>
        Math.hypot(c.x - p.x, c.y - p.y) < Math.hypot(best.x - p.x, best.y - p.y) ? c : best,
      );
      expect(Math.hypot(cell.x - p.x, cell.y - p.y)).toBeCloseTo(
        Math.hypot(nearest.x - p.x, nearest.y - p.y),
        9,
      );
    }
  });
});

describe('quadrant shares around the targets', () => {
  // Ten (finish, cost) outcomes counted by hand against a finish target of 100 and a cost of 50:
  // within both: (90,40) (100,50) (95,45) (80,30) → 4; within cost, late: (110,45) (120,20) → 2;
  // on time, over cost: (99,60) → 1; over cost and late: (101,51) (130,70) (150,90) → 3.
  const points = [
    { x: 90, y: 40 },
    { x: 100, y: 50 },
    { x: 95, y: 45 },
    { x: 80, y: 30 },
    { x: 110, y: 45 },
    { x: 120, y: 20 },
    { x: 99, y: 60 },
    { x: 101, y: 51 },
    { x: 130, y: 70 },
    { x: 150, y: 90 },
  ];

  it('matches a hand count, "within" meaning at or below the target', () => {
    expect(quadrantShares(points, 100, 50)).toEqual({
      both: 0.4,
      lateOnly: 0.2,
      overOnly: 0.1,
      neither: 0.3,
    });
  });

  it('gives the same four shares from P(cost), P(finish) and P(both) by inclusion–exclusion', () => {
    // By hand: cost ≤ 50 in 6 of 10, finish ≤ 100 in 5 of 10, both in 4 of 10.
    const q = quadrantsFromProbabilities(0.6, 0.5, 0.4);
    expect(q.both).toBeCloseTo(0.4, 12);
    expect(q.lateOnly).toBeCloseTo(0.2, 12);
    expect(q.overOnly).toBeCloseTo(0.1, 12);
    expect(q.neither).toBeCloseTo(0.3, 12);
  });
});

/** The tangent dy/dx at each point, read back from the cubic segments' control points. */
function monotoneTangents(points: { x: number; y: number }[]): number[] {
  const { segments } = monotoneCubic(points);
  const m = segments.map((s, k) => (s.c1.y - points[k].y) / ((s.to.x - points[k].x) / 3));
  const last = segments[segments.length - 1];
  m.push((last.to.y - last.c2.y) / ((last.to.x - points[points.length - 2].x) / 3));
  return m;
}

describe('the smooth S-curve', () => {
  it('keeps Fritsch–Carlson tangents at 0 on a flat stretch and never against the data', () => {
    // Fritsch & Carlson (1980): where two neighbouring points are equal the interpolant is flat.
    const m = monotoneTangents([
      { x: 0, y: 0 },
      { x: 1, y: 0.5 },
      { x: 2, y: 0.5 },
      { x: 3, y: 1 },
    ]);
    expect(m[1]).toBe(0);
    expect(m[2]).toBe(0);
    expect(m.every((t) => t >= 0)).toBe(true);
  });

  it('scales tangents into the monotone region α² + β² ≤ 9', () => {
    const p = [
      { x: 0, y: 0 },
      { x: 1, y: 0.01 },
      { x: 1.1, y: 1 },
      { x: 2, y: 1.01 },
    ];
    const m = monotoneTangents(p);
    for (let k = 0; k < p.length - 1; k++) {
      const d = (p[k + 1].y - p[k].y) / (p[k + 1].x - p[k].x);
      const a = m[k] / d;
      const b = m[k + 1] / d;
      expect(a * a + b * b).toBeLessThanOrEqual(9 + 1e-9);
    }
  });
});
