/**
 * Filling one column of uniforms for one block of iterations.
 *
 *  - Plain Monte Carlo: u_i independent U(0, 1).
 *  - Latin hypercube: u_i = (π(i) + v_i)/n with π a random permutation of 0…n−1 and v_i ~ U(0, 1),
 *    so each of the n equal strata of (0, 1) holds exactly one value (stratified within each block).
 *    McKay, Beckman & Conover (1979), Technometrics 21(2):239–245.
 *  - Fisher–Yates shuffle: Knuth (1997), TAOCP vol. 2, §3.4.2, algorithm P.
 */

import type { Sfc32 } from './sfc32';

export function fillMonteCarlo(rng: Sfc32, out: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = rng.next01();
}

/** perm[0…n−1] ← a uniformly random permutation of 0…n−1. */
export function shuffleIdentity(rng: Sfc32, perm: Int32Array, n: number): void {
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rng.next01() * (i + 1));
    const t = perm[i];
    perm[i] = perm[j];
    perm[j] = t;
  }
}

export function fillLatinHypercube(rng: Sfc32, out: Float64Array, n: number, perm: Int32Array): void {
  shuffleIdentity(rng, perm, n);
  const inv = 1 / n;
  for (let i = 0; i < n; i++) out[i] = (perm[i] + rng.next01()) * inv;
}
