/**
 * Small dense symmetric-matrix routines on row-major Float64Arrays (k × k).
 *
 *  - Cholesky factorisation A = L Lᵀ: Golub & Van Loan (2013), "Matrix Computations", 4th ed., §4.2.
 *  - Cyclic Jacobi eigenvalue method for symmetric matrices: ibid. §8.5.
 *  - Inverse of a lower-triangular matrix by forward substitution: ibid. §3.1.
 */

/** Lower Cholesky factor, or null when A is not (numerically) positive definite. */
export function cholesky(A: Float64Array, k: number): Float64Array | null {
  const L = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    let d = A[j * k + j];
    for (let m = 0; m < j; m++) d -= L[j * k + m] * L[j * k + m];
    if (!(d > 1e-12)) return null;
    const ljj = Math.sqrt(d);
    L[j * k + j] = ljj;
    for (let i = j + 1; i < k; i++) {
      let s = A[i * k + j];
      for (let m = 0; m < j; m++) s -= L[i * k + m] * L[j * k + m];
      L[i * k + j] = s / ljj;
    }
  }
  return L;
}

export interface Eigen {
  /** Eigenvalues (unordered). */
  values: Float64Array;
  /** Eigenvectors as columns of a row-major k × k matrix: A = V diag(values) Vᵀ. */
  vectors: Float64Array;
}

export function symmetricEigen(A: Float64Array, k: number): Eigen {
  const a = Float64Array.from(A);
  const v = new Float64Array(k * k);
  for (let i = 0; i < k; i++) v[i * k + i] = 1;
  let scale = 0;
  for (let i = 0; i < k * k; i++) scale += a[i] * a[i];
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let p = 0; p < k; p++) for (let q = p + 1; q < k; q++) off += a[p * k + q] * a[p * k + q];
    if (off <= 1e-30 * scale || off === 0) break;
    for (let p = 0; p < k; p++) {
      for (let q = p + 1; q < k; q++) {
        const apq = a[p * k + q];
        if (apq === 0) continue;
        const theta = (a[q * k + q] - a[p * k + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let r = 0; r < k; r++) {
          const arp = a[r * k + p];
          const arq = a[r * k + q];
          a[r * k + p] = c * arp - s * arq;
          a[r * k + q] = s * arp + c * arq;
        }
        for (let r = 0; r < k; r++) {
          const apr = a[p * k + r];
          const aqr = a[q * k + r];
          a[p * k + r] = c * apr - s * aqr;
          a[q * k + r] = s * apr + c * aqr;
        }
        for (let r = 0; r < k; r++) {
          const vrp = v[r * k + p];
          const vrq = v[r * k + q];
          v[r * k + p] = c * vrp - s * vrq;
          v[r * k + q] = s * vrp + c * vrq;
        }
      }
    }
  }
  const values = new Float64Array(k);
  for (let i = 0; i < k; i++) values[i] = a[i * k + i];
  return { values, vectors: v };
}

export function minEigenvalue(A: Float64Array, k: number): number {
  const { values } = symmetricEigen(A, k);
  let m = Infinity;
  for (const x of values) m = Math.min(m, x);
  return m;
}

/** V diag(max(λ, floor)) Vᵀ: the projection onto the positive semidefinite cone when floor = 0. */
export function clipEigenvalues(A: Float64Array, k: number, floor: number): Float64Array {
  const { values, vectors } = symmetricEigen(A, k);
  const out = new Float64Array(k * k);
  for (let m = 0; m < k; m++) {
    const lam = Math.max(values[m], floor);
    if (lam === 0) continue;
    for (let i = 0; i < k; i++) {
      const vi = vectors[i * k + m] * lam;
      if (vi === 0) continue;
      for (let j = 0; j < k; j++) out[i * k + j] += vi * vectors[j * k + m];
    }
  }
  return out;
}

/** Inverse of a lower-triangular matrix. */
export function invertLower(L: Float64Array, k: number): Float64Array {
  const X = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    X[j * k + j] = 1 / L[j * k + j];
    for (let i = j + 1; i < k; i++) {
      let s = 0;
      for (let m = j; m < i; m++) s -= L[i * k + m] * X[m * k + j];
      X[i * k + j] = s / L[i * k + i];
    }
  }
  return X;
}

export function multiply(A: Float64Array, B: Float64Array, k: number): Float64Array {
  const C = new Float64Array(k * k);
  for (let i = 0; i < k; i++)
    for (let m = 0; m < k; m++) {
      const aim = A[i * k + m];
      if (aim === 0) continue;
      for (let j = 0; j < k; j++) C[i * k + j] += aim * B[m * k + j];
    }
  return C;
}

/** A Aᵀ. */
export function gram(A: Float64Array, k: number): Float64Array {
  const C = new Float64Array(k * k);
  for (let i = 0; i < k; i++)
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let m = 0; m < k; m++) s += A[i * k + m] * A[j * k + m];
      C[i * k + j] = s;
      C[j * k + i] = s;
    }
  return C;
}
