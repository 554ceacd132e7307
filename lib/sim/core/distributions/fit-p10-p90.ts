/**
 * Bounds of a three-point distribution from a P10–P90 judgement: given P10 = L, mode m and
 * P90 = H, find the absolute bounds a < b with F(L) = 0.1 and F(H) = 0.9, the mode held fixed.
 *
 * Write the distribution as a + w·Z, where Z lives on [0, 1] with mode r and quantiles z₁₀(r),
 * z₉₀(r). Then L = a + w z₁₀, H = a + w z₉₀ and m = a + w r, so the shape r solves
 *
 *     g(r) = (r − z₁₀(r)) / (z₉₀(r) − z₁₀(r)) = (m − L) / (H − L) =: θ ∈ [0, 1],
 *
 * a one-dimensional equation (g(0) < 0 and g(1) > 1, so a root exists) solved by bisection;
 * then w = (H − L)/(z₉₀ − z₁₀) and a = L − w z₁₀, b = a + w.
 */

export interface FittedBounds {
  low: number;
  high: number;
}

/** `standardQuantile(r, u)`: quantile of the family member on [0, 1] with mode r. */
export function fitBoundsToP10P90(
  p10: number,
  mode: number,
  p90: number,
  standardQuantile: (r: number, u: number) => number,
): FittedBounds {
  const theta = (mode - p10) / (p90 - p10);
  const g = (r: number) => {
    const z10 = standardQuantile(r, 0.1);
    const z90 = standardQuantile(r, 0.9);
    return (r - z10) / (z90 - z10) - theta;
  };
  let lo = 0;
  let hi = 1;
  for (let it = 0; it < 100 && hi - lo > 1e-14; it++) {
    const mid = 0.5 * (lo + hi);
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  const r = 0.5 * (lo + hi);
  const z10 = standardQuantile(r, 0.1);
  const z90 = standardQuantile(r, 0.9);
  const w = (p90 - p10) / (z90 - z10);
  const low = p10 - w * z10;
  return { low, high: low + w };
}
