/**
 * Filling one column of uniforms for one block of iterations.
 *
 *  - Plain Monte Carlo: u_i independent U(0, 1).
 *  - Latin hypercube: u_i = (π(i) + v_i)/n with π a random permutation of 0…n−1 and v_i ~ U(0, 1),
 *    so each of the n equal strata of (0, 1) holds exactly one value (stratified within each block).
 *    McKay, Beckman & Conover (1979), Technometrics 21(2):239–245.
 *  - Fisher–Yates shuffle: Knuth (1997), TAOCP vol. 2, §3.4.2, algorithm P; the jitters come
 *    from the same draws (see Sfc32.shuffleWithFractions).
 */

import type { Sfc32 } from './sfc32';

export function fillMonteCarlo(rng: Sfc32, out: Float64Array, n: number): void {
  rng.fill01(out, n);
}

/** Stratum π(i) and jitter v_i from one draw per position (Sfc32.shuffleWithFractions). */
export function fillLatinHypercube(rng: Sfc32, out: Float64Array, n: number, perm: Int32Array): void {
  rng.latinHypercube(perm, out, n);
}
