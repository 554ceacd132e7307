/**
 * The cost-against-finish density map: iterations binned into hexagons, and the share of outcomes
 * in each of the four quadrants around the cost and finish targets.
 *
 * Hexagonal binning (D. B. Carr et al., "Scatterplot matrix techniques for large N", JASA 82,
 * 1987): the plane is tiled by regular hexagons of circumradius r, pointy side up, centres on a
 * lattice with columns dx = r·√3 apart and rows dy = 1.5·r apart, odd rows shifted by dx/2. A
 * point belongs to the hexagon whose centre is nearest, which is found by rounding to the two
 * nearest candidate centres and keeping the closer (measured in screen units, so the choice is
 * exact, not approximate). Binning is done in screen units so that the
 * hexagons are regular on screen.
 */

export type Pair = { x: number; y: number };

export type HexCell = { x: number; y: number; count: number };

/** Counts of points per hexagon of circumradius `radius`, the points in the hexagons' own units. */
export function hexBins(points: readonly Pair[], radius: number): HexCell[] {
  const dx = radius * Math.sqrt(3);
  const dy = radius * 1.5;
  const cells = new Map<string, HexCell>();
  for (const { x, y } of points) {
    const py = y / dy;
    let pj = Math.round(py);
    const px = x / dx - (pj & 1) / 2;
    let pi = Math.round(px);
    const py1 = py - pj;
    // Near a row boundary the nearest centre may be on the neighbouring row: compare the two.
    if (Math.abs(py1) * 3 > 1) {
      const px1 = px - pi;
      const pi2 = pi + (px < pi ? -1 : 1) / 2;
      const pj2 = pj + (py < pj ? -1 : 1);
      const px2 = px - pi2;
      const py2 = py - pj2;
      // Distances in screen units (columns and rows are not equally far apart).
      if ((px1 * dx) ** 2 + (py1 * dy) ** 2 > (px2 * dx) ** 2 + (py2 * dy) ** 2) {
        pi = pi2 + (pj & 1 ? 1 : -1) / 2;
        pj = pj2;
      }
    }
    const key = `${pi},${pj}`;
    const cell = cells.get(key);
    if (cell) cell.count++;
    else cells.set(key, { x: (pi + (pj & 1) / 2) * dx, y: pj * dy, count: 1 });
  }
  return [...cells.values()];
}

/** The six corners of a pointy-top hexagon of circumradius r around (x, y), as an SVG path. */
export function hexagonPath(x: number, y: number, r: number): string {
  const corners = Array.from({ length: 6 }, (_, k) => {
    const a = (Math.PI / 3) * k + Math.PI / 6;
    return `${(x + r * Math.cos(a)).toFixed(2)},${(y + r * Math.sin(a)).toFixed(2)}`;
  });
  return `M${corners.join('L')}Z`;
}

/**
 * Shares of outcomes around the targets (x: duration, y: cost). "within" means at or below the
 * target, as in the result file's probabilities. A missing target leaves that split undefined.
 */
export type Quadrants = {
  /** Within both targets. */
  both: number;
  /** Within the cost target, finishing late. */
  lateOnly: number;
  /** On time, over the cost target. */
  overOnly: number;
  /** Over cost and late. */
  neither: number;
};

/** The four shares counted from sample points. */
export function quadrantShares(
  points: readonly Pair[],
  durationTarget: number,
  costTarget: number,
): Quadrants {
  const q = { both: 0, lateOnly: 0, overOnly: 0, neither: 0 };
  for (const p of points) {
    const onTime = p.x <= durationTarget;
    const withinCost = p.y <= costTarget;
    if (onTime && withinCost) q.both++;
    else if (withinCost) q.lateOnly++;
    else if (onTime) q.overOnly++;
    else q.neither++;
  }
  const n = points.length || 1;
  return { both: q.both / n, lateOnly: q.lateOnly / n, overOnly: q.overOnly / n, neither: q.neither / n };
}

/**
 * The four shares over all iterations, from the three probabilities a result holds: P(cost within),
 * P(finish within) and P(both). By inclusion–exclusion: late only = P(cost) − P(both), over only
 * = P(finish) − P(both), neither = 1 − P(cost) − P(finish) + P(both).
 */
export function quadrantsFromProbabilities(cost: number, finish: number, both: number): Quadrants {
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  return {
    both: clamp(both),
    lateOnly: clamp(cost - both),
    overOnly: clamp(finish - both),
    neither: clamp(1 - cost - finish + both),
  };
}
