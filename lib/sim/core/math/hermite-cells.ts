/**
 * A quantile function stored as cubic Hermite cells on u = g/G, g = 0…G (Burden & Faires,
 * "Numerical Analysis", 9th ed., §3.4): node[2g] is the value at g/G and node[2g + 1] its slope
 * times the cell width 1/G. Within a cell, at t ∈ [0, 1] between its ends (x0, m0) and (x1, m1),
 *
 *   H(t) = x0 + t·(m0 + t·(3d − 2m0 − m1 + t·(m0 + m1 − 2d))),   d = x1 − x0.
 *
 * The normal and beta quantile tables share this layout and the batch read below.
 */

/** The cubic of cell g at t ∈ [0, 1]. */
export function hermiteCell(node: Float64Array, g: number, t: number): number {
  const x0 = node[2 * g];
  const m0 = node[2 * g + 1];
  const d = node[2 * g + 2] - x0;
  const m1 = node[2 * g + 3];
  return x0 + t * (m0 + t * (3 * d - 2 * m0 - m1 + t * (m0 + m1 - 2 * d)));
}

/** The exact quantile function, for the cells where the cubic is not accurate enough. */
export interface ExactQuantile {
  invert(u: number): number;
}

/**
 * out[i] = shift + scale · x(u[i]) for i < n: the cell's cubic, or `exact.invert(u[i])` where the
 * cell is flagged (the cubic is not accurate enough there) or u[i] is not inside (0, 1). (A
 * method of an object rather than a function argument: every table of one kind then shares one
 * call target, which the compiler can inline.)
 */
export function hermiteCellsInto(
  node: Float64Array,
  flagged: Uint8Array,
  G: number,
  exact: ExactQuantile,
  u: Float64Array,
  out: Float64Array,
  n: number,
  shift: number,
  scale: number,
): void {
  for (let i = 0; i < n; i++) {
    const s = u[i] * G;
    const g = s | 0;
    if (g >= G || flagged[g] === 1 || !(s > 0)) {
      out[i] = shift + scale * exact.invert(u[i]);
      continue;
    }
    const t = s - g;
    const j = 2 * g;
    const x0 = node[j];
    const m0 = node[j + 1];
    const d = node[j + 2] - x0;
    const m1 = node[j + 3];
    out[i] = shift + scale * (x0 + t * (m0 + t * (3 * d - 2 * m0 - m1 + t * (m0 + m1 - 2 * d))));
  }
}
