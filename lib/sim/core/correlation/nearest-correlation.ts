/**
 * Nearest correlation matrix in the Frobenius norm by alternating projections with Dykstra's
 * correction: Higham (2002), "Computing the nearest correlation matrix — a problem from
 * finance", IMA Journal of Numerical Analysis 22(3):329–343, Algorithm 3.3 with W = I.
 *
 *   ΔS₀ = 0, Y₀ = A;  for k = 1, 2, …:
 *     R = Y − ΔS;  X = P_S(R)  (clip negative eigenvalues);  ΔS = X − R;  Y = P_U(X)  (unit diagonal)
 *   until the relative changes of X and Y and the gap ‖Y − X‖ fall below tol.
 */

import { clipEigenvalues } from '../math/linalg';

function relDiff(a: Float64Array, b: Float64Array): number {
  let num = 0;
  let den = 0;
  for (let i = 0; i < a.length; i++) {
    num += (a[i] - b[i]) ** 2;
    den += a[i] * a[i];
  }
  return Math.sqrt(num / (den || 1));
}

export function nearestCorrelation(
  A: Float64Array,
  k: number,
  tol = 1e-10,
  maxIterations = 2000,
): Float64Array {
  let Y: Float64Array = Float64Array.from(A);
  let X: Float64Array = Float64Array.from(A);
  const dS = new Float64Array(k * k);
  for (let it = 0; it < maxIterations; it++) {
    const R = new Float64Array(k * k);
    for (let i = 0; i < k * k; i++) R[i] = Y[i] - dS[i];
    const Xn = clipEigenvalues(R, k, 0);
    for (let i = 0; i < k * k; i++) dS[i] = Xn[i] - R[i];
    const Yn = Float64Array.from(Xn);
    for (let i = 0; i < k; i++) Yn[i * k + i] = 1;
    const done = relDiff(Xn, X) <= tol && relDiff(Yn, Y) <= tol && relDiff(Yn, Xn) <= tol;
    X = Xn;
    Y = Yn;
    if (done) break;
  }
  // Symmetrise against rounding.
  for (let i = 0; i < k; i++)
    for (let j = 0; j < i; j++) {
      const s = 0.5 * (Y[i * k + j] + Y[j * k + i]);
      Y[i * k + j] = s;
      Y[j * k + i] = s;
    }
  return Y;
}
