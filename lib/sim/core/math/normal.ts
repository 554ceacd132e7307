/**
 * Standard normal density, distribution function and quantile.
 *
 *   φ(z) = exp(−z²/2) / √(2π)
 *   Φ(z): Hart's double-precision rational approximation (Hart et al. 1968, "Computer
 *         Approximations", algorithm 5666) as laid out by G. West (2005), "Better approximations
 *         to cumulative normal functions", Wilmott Magazine, pp. 70–76. Absolute error < 1e-14.
 *   Φ⁻¹(p): Wichura (1988), "Algorithm AS 241: The percentage points of the normal
 *         distribution", Applied Statistics 37(3):477–484 (PPND16, relative error ~1e-16).
 */

const INV_SQRT_2PI = 0.3989422804014327;

// Hart's coefficients for |z| < 7.07, highest power first.
const HART_NUM = [
  3.52624965998911e-2, 0.700383064443688, 6.37396220353165, 33.912866078383, 112.079291497871,
  221.213596169931, 220.206867912376,
];
const HART_DEN = [
  8.83883476483184e-2, 1.75566716318264, 16.064177579207, 86.7807322029461, 296.564248779674,
  637.333633378831, 793.826512519948, 440.413735824752,
];

/** c[0]·xⁿ + … + c[n] by Horner's rule, in the same order of operations as written out. */
function horner(c: readonly number[], x: number): number {
  let v = c[0];
  for (let i = 1; i < c.length; i++) v = v * x + c[i];
  return v;
}

export function normalPdf(z: number): number {
  return INV_SQRT_2PI * Math.exp(-0.5 * z * z);
}

export function normalCdf(z: number): number {
  if (Number.isNaN(z)) return NaN;
  const x = Math.abs(z);
  let tail: number;
  if (x > 37) {
    tail = 0;
  } else {
    const e = Math.exp(-0.5 * x * x);
    if (x < 7.07106781186547) {
      tail = (e * horner(HART_NUM, x)) / horner(HART_DEN, x);
    } else {
      // Continued fraction x + 1/(x + 2/(x + 3/(x + 4/(x + 0.65)))), evaluated from the inside.
      let d = x + 0.65;
      for (let k = 4; k >= 1; k--) d = x + k / d;
      tail = e / d / 2.506628274631;
    }
  }
  return z > 0 ? 1 - tail : tail;
}

/** Φ⁻¹(p) for p in (0, 1); ±Infinity at 0 and 1. */
export function normalQuantile(p: number): number {
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) {
    const r = 0.180625 - q * q;
    return (
      (q *
        (((((((2509.0809287301226727 * r + 33430.575583588128105) * r + 67265.770927008700853) * r +
          45921.953931549871457) *
          r +
          13731.693765509461125) *
          r +
          1971.5909503065514427) *
          r +
          133.14166789178437745) *
          r +
          3.387132872796366608)) /
      (((((((5226.495278852854561 * r + 28729.085735721942674) * r + 39307.89580009271061) * r +
        21213.794301586595867) *
        r +
        5394.1960214247511077) *
        r +
        687.1870074920579083) *
        r +
        42.313330701600911252) *
        r +
        1)
    );
  }
  let r = q < 0 ? p : 1 - p;
  if (r <= 0) return q < 0 ? -Infinity : Infinity;
  r = Math.sqrt(-Math.log(r));
  let x: number;
  if (r <= 5) {
    r -= 1.6;
    x =
      (((((((7.7454501427834140764e-4 * r + 0.0227238449892691845833) * r + 0.24178072517745061177) * r +
        1.27045825245236838258) *
        r +
        3.64784832476320460504) *
        r +
        5.7694972214606914055) *
        r +
        4.6303378461565452959) *
        r +
        1.42343711074968357734) /
      (((((((1.05075007164441684324e-9 * r + 5.475938084995344946e-4) * r + 0.0151986665636164571966) * r +
        0.14810397642748007459) *
        r +
        0.68976733498510000455) *
        r +
        1.6763848301838038494) *
        r +
        2.05319162663775882187) *
        r +
        1);
  } else {
    r -= 5;
    x =
      (((((((2.01033439929228813265e-7 * r + 2.71155556874348757815e-5) * r + 0.0012426609473880784386) * r +
        0.026532189526576123093) *
        r +
        0.29656057182850489123) *
        r +
        1.7848265399172913358) *
        r +
        5.4637849111641143699) *
        r +
        6.6579046435011037772) /
      (((((((2.04426310338993978564e-15 * r + 1.4215117583164458887e-7) * r + 1.8463183175100546818e-5) * r +
        7.868691311456132591e-4) *
        r +
        0.0148753612908506148525) *
        r +
        0.13692988092273580531) *
        r +
        0.59983220655588793769) *
        r +
        1);
  }
  return q < 0 ? -x : x;
}

/** Two-sided critical value z with P(|Z| ≤ z) = confidence. */
export function zForConfidence(confidence: number): number {
  return normalQuantile(1 - (1 - confidence) / 2);
}
