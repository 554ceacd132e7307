/**
 * A smooth SVG path through points of a cumulative curve that never turns back: monotone cubic
 * Hermite interpolation (F. N. Fritsch and R. E. Carlson, "Monotone piecewise cubic
 * interpolation", SIAM J. Numer. Anal. 17, 1980). The tangents are the mean of the neighbouring
 * secants, set to 0 at a local extremum and scaled down where α² + β² > 9, so that the curve
 * between two points stays between their values: an S-curve drawn this way never shows a
 * probability falling as the amount rises.
 */
export type XY = { x: number; y: number };

/** Tangents m_k (dy/dx) at each point, by the Fritsch–Carlson rule. */
export function monotoneTangents(p: readonly XY[]): number[] {
  const n = p.length;
  if (n < 2) return new Array(n).fill(0);
  const secant = Array.from({ length: n - 1 }, (_, k) => {
    const dx = p[k + 1].x - p[k].x;
    return dx === 0 ? 0 : (p[k + 1].y - p[k].y) / dx;
  });
  const m = p.map((_, k) =>
    k === 0 ? secant[0] : k === n - 1 ? secant[n - 2] : (secant[k - 1] + secant[k]) / 2,
  );
  for (let k = 0; k < n - 1; k++) {
    if (secant[k] === 0) {
      m[k] = 0;
      m[k + 1] = 0;
      continue;
    }
    const a = m[k] / secant[k];
    const b = m[k + 1] / secant[k];
    if (a < 0) m[k] = 0;
    if (b < 0) m[k + 1] = 0;
    const s = a * a + b * b;
    if (s > 9) {
      const t = 3 / Math.sqrt(s);
      m[k] = t * a * secant[k];
      m[k + 1] = t * b * secant[k];
    }
  }
  return m;
}

/** The path ("M … C …") through screen points, as cubic Bézier segments with those tangents. */
export function monotonePath(p: readonly XY[]): string {
  if (p.length === 0) return '';
  const m = monotoneTangents(p);
  const f = (v: number) => v.toFixed(2);
  let d = `M${f(p[0].x)},${f(p[0].y)}`;
  for (let k = 0; k < p.length - 1; k++) {
    const h = (p[k + 1].x - p[k].x) / 3;
    d += `C${f(p[k].x + h)},${f(p[k].y + m[k] * h)} ${f(p[k + 1].x - h)},${f(p[k + 1].y - m[k + 1] * h)} ${f(p[k + 1].x)},${f(p[k + 1].y)}`;
  }
  return d;
}
