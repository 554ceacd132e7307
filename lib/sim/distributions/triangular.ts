/**
 * Triangular distribution on [a, b] with mode c.
 *
 *   F(x) = (x − a)² / ((b − a)(c − a))          for a ≤ x ≤ c
 *        = 1 − (b − x)² / ((b − a)(b − c))      for c < x ≤ b
 *   Q(u) = a + √(u (b − a)(c − a))              for u < F_c = (c − a)/(b − a)
 *        = b − √((1 − u)(b − a)(b − c))         otherwise
 *   E = (a + b + c)/3;   Var = (a² + b² + c² − ab − ac − bc)/18.
 *
 * With `range: "p10-p90"` the given low/high are the 10th/90th percentiles and the bounds are
 * fitted (./fit-p10-p90), the mode held fixed.
 *
 * References: Kotz & van Dorp (2004), "Beyond Beta", World Scientific, ch. 1; Johnson, Kotz &
 * Balakrishnan (1995), "Continuous Univariate Distributions", vol. 2, 2nd ed., ch. 26 §9.
 */

import { type DistLocation, requireBetween, requireFinite, requireGreater } from './checks';
import { fitBoundsToP10P90 } from './fit-p10-p90';
import type { Distribution } from './types';

export interface ThreePointParams {
  low: number;
  mode: number;
  high: number;
  range?: 'min-max' | 'p10-p90';
}

/** Quantile of the triangular on [0, 1] with mode r. */
export function standardTriangularQuantile(r: number, u: number): number {
  return u < r ? Math.sqrt(u * r) : 1 - Math.sqrt((1 - u) * (1 - r));
}

export function checkThreePoint(p: ThreePointParams, at: DistLocation): void {
  requireFinite(at, 'low', p.low);
  requireFinite(at, 'mode', p.mode);
  requireFinite(at, 'high', p.high);
  requireGreater(at, 'high', p.high, 'low', p.low);
  requireBetween(at, 'mode', p.mode, p.low, p.high);
}

export function createTriangular(p: ThreePointParams, at: DistLocation): Distribution {
  checkThreePoint(p, at);
  const c = p.mode;
  let a = p.low;
  let b = p.high;
  if (p.range === 'p10-p90')
    ({ low: a, high: b } = fitBoundsToP10P90(p.low, c, p.high, standardTriangularQuantile));
  const w = b - a;
  const left = (b - a) * (c - a);
  const right = (b - a) * (b - c);
  const fc = (c - a) / w;
  const quantile = (u: number) => (u < fc ? a + Math.sqrt(u * left) : b - Math.sqrt((1 - u) * right));
  const mean = (a + b + c) / 3;
  return {
    kind: 'triangular',
    mean,
    variance: (a * a + b * b + c * c - a * b - a * c - b * c) / 18,
    base: c,
    support: [a, b],
    degenerate: false,
    quantile,
    cdf: (x) =>
      x <= a ? 0 : x >= b ? 1 : x <= c ? ((x - a) * (x - a)) / left : 1 - ((b - x) * (b - x)) / right,
    quantileInto(u, out, n) {
      // Locals, not captured bindings, in the hot loop (V8 re-reads mutable captured ones).
      const lo = a;
      const hi = b;
      const f = fc;
      const l = left;
      const r = right;
      for (let i = 0; i < n; i++) {
        const v = u[i];
        out[i] = v < f ? lo + Math.sqrt(v * l) : hi - Math.sqrt((1 - v) * r);
      }
    },
  };
}
