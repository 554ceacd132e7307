/**
 * Fast inverse of the regularized incomplete beta function x = I⁻¹_u(α, β) for fixed (α, β),
 * for sampling many values from one beta (PERT) distribution. Two tables, built once:
 *
 *  1. x-space: the distribution function F(x) = I_x(α, β) at K + 1 cosine-spaced nodes
 *     x_k = (1 − cos(πk/K))/2 (exact at the second and last-but-one node by jstat's continued
 *     fraction, Press et al. 2007, "Numerical Recipes", 3rd ed., §6.4; in between by Gauss–Legendre
 *     quadrature of the density), with the density f(x) = x^(α−1)(1−x)^(β−1)/B(α, β). On each
 *     interval F is the cubic Hermite interpolant H of its end values and their exact slopes,
 *     the density (Burden & Faires, "Numerical Analysis", 9th ed., §3.4; no slope limiting
 *     is applied: the slopes are the true function's), and u = H(t) is solved by Newton's
 *     method. The first and last intervals, where F behaves like a non-integer power, use
 *     jstat's exact inverse.
 *  2. u-space: the quantile function itself at G + 1 equally spaced u, from table 1, with its
 *     exact derivative dx/du = 1/f(x), as a cubic Hermite interpolant per cell (same form). A
 *     sample costs one lookup and a cubic. Cells where that cubic strays from table 1 by more than 5e-9 (near
 *     the ends, where the quantile function has unbounded derivatives; checked at mid-cell,
 *     from each end inwards) use table 1 instead.
 *
 * Accuracy against jstat.ibetainv is checked in the unit tests (absolute, on [0, 1]).
 */

import jStat from 'jstat';
import { hermiteCell, hermiteCellsInto } from './hermite-cells';

const K = 256;
const CELLS = 4 * K;
const NEWTON_STEPS = 3;
const G = 512;
const TOLERANCE = 5e-9;
const CLEAR_RUN = 24;
// Gauss–Legendre, 3 points on [−1, 1] (Abramowitz & Stegun 1964, table 25.4).
const GL_NODES = [-0.7745966692414834, 0, 0.7745966692414834];
const GL_WEIGHTS = [0.5555555555555556, 0.8888888888888888, 0.5555555555555556];

export interface BetaQuantileTable {
  /** x in [0, 1] with I_x(α, β) = u. */
  quantile(u: number): number;
  /** out[i] = a + w · quantile(u[i]). */
  scaledQuantileInto(u: Float64Array, out: Float64Array, n: number, a: number, w: number): void;
}

/** Table 1: an accurate inverse through the x-space table. */
/** The cosine-spaced nodes, the same for every table. */
const X_NODES = Float64Array.from({ length: K + 1 }, (_, k) =>
  k === K ? 1 : 0.5 * (1 - Math.cos((Math.PI * k) / K)),
);

// What every table evaluates at the same points, computed once: log sin and log cos of the
// quadrature's half-angles (interval k, node q at 3k + q), and log x, log(1 − x) at the nodes.
const QUADRATURE_STEP = Math.PI / K;
const HALF_ANGLES = Float64Array.from({ length: 3 * (K - 2) }, (_, i) => {
  const k = 1 + Math.floor(i / 3);
  return 0.5 * QUADRATURE_STEP * (k + 0.5 * (GL_NODES[i % 3] + 1));
});
const LOG_SIN = HALF_ANGLES.map((a) => Math.log(Math.sin(a)));
const LOG_COS = HALF_ANGLES.map((a) => Math.log(Math.cos(a)));
const LOG_X = X_NODES.map((x) => Math.log(x));
const LOG_1M_X = X_NODES.map((x) => Math.log1p(-x));

/** The beta density from log x and log(1 − x); 0 where it under- or overflows to NaN. */
function densityOfLogs(alpha: number, beta: number, lnB: number, logX: number, log1mX: number): number {
  return Math.exp((alpha - 1) * logX + (beta - 1) * log1mX - lnB) || 0;
}

function xSpaceInverse(alpha: number, beta: number, lnB: number): XSpaceInverse {
  const x = X_NODES;
  const F = new Float64Array(K + 1);
  const coef = new Float64Array(4 * K);
  // F at the nodes. Exact at x₁ and x_{K−1}; in between, the masses of the intervals by 3-point
  // Gauss–Legendre in θ, where x = sin²(θ/2) makes the nodes equally spaced and the integrand
  // f(x) dx/dθ = sin^(2α−1)(θ/2) cos^(2β−1)(θ/2) / B(α, β) smooth away from the ends; the partial
  // sums are then scaled to join the two exact values.
  const F1 = jStat.ibeta(x[1], alpha, beta);
  const FK1 = 1 - jStat.ibeta(1 - x[K - 1], beta, alpha);
  const ea = 2 * alpha - 1;
  const eb = 2 * beta - 1;
  F[0] = 0;
  F[1] = 0;
  for (let k = 1; k < K - 1; k++) {
    let mass = 0;
    for (let q = 0; q < GL_NODES.length; q++) {
      const i = 3 * (k - 1) + q;
      mass += GL_WEIGHTS[q] * Math.exp(ea * LOG_SIN[i] + eb * LOG_COS[i]);
    }
    F[k + 1] = F[k] + mass;
  }
  const scale = (FK1 - F1) / F[K - 1];
  for (let k = 1; k < K; k++) F[k] = F1 + F[k] * scale;
  F[K] = 1;
  const density = X_NODES.map((_, k) => densityOfLogs(alpha, beta, lnB, LOG_X[k], LOG_1M_X[k]));
  for (let k = 0; k < K; k++) {
    const h = x[k + 1] - x[k];
    const m0 = density[k] * h;
    const m1 = density[k + 1] * h;
    const d = F[k + 1] - F[k];
    coef[4 * k] = F[k];
    coef[4 * k + 1] = m0;
    coef[4 * k + 2] = 3 * d - 2 * m0 - m1;
    coef[4 * k + 3] = -2 * d + m0 + m1;
  }
  // cellStart[g]: the last node k with F[k] ≤ g/CELLS, so the search moves a few steps at most.
  const cellStart = new Int32Array(CELLS + 1);
  for (let g = 0, k = 0; g <= CELLS; g++) {
    while (k < K - 1 && F[k + 1] <= g / CELLS) k++;
    cellStart[g] = k;
  }
  return new XSpaceInverse(alpha, beta, F, coef, cellStart);
}

class XSpaceInverse {
  constructor(
    readonly alpha: number,
    readonly beta: number,
    readonly F: Float64Array,
    readonly coef: Float64Array,
    readonly cellStart: Int32Array,
  ) {}

  invert(u: number): number {
    const { F, coef } = this;
    const x = X_NODES;
    if (!(u > 0)) return 0;
    if (!(u < 1)) return 1;
    let k = this.cellStart[(u * CELLS) | 0];
    while (k < K - 1 && F[k + 1] <= u) k++;
    if (k === 0 || k === K - 1) return jStat.ibetainv(u, this.alpha, this.beta);
    const j = 4 * k;
    const c0 = coef[j];
    const c1 = coef[j + 1];
    const c2 = coef[j + 2];
    const c3 = coef[j + 3];
    // Newton on H(t) = u from the linear guess; H is increasing on the interval.
    let t = (u - c0) / (F[k + 1] - c0);
    for (let it = 0; it < NEWTON_STEPS; it++) {
      const der = c1 + t * (2 * c2 + 3 * t * c3);
      if (!(der > 0)) break;
      t -= (c0 + t * (c1 + t * (c2 + t * c3)) - u) / der;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
    }
    return x[k] + t * (x[k + 1] - x[k]);
  }
}

/** A class (not closures) so the engine's call site sees one target for every table. */
/** Touches one value per 64-byte line of the table. */
function prefetch(nd: Float64Array, fl: Uint8Array): number {
  let s = 0;
  for (let k = 0; k < nd.length; k += 8) s += nd[k];
  for (let k = 0; k < fl.length; k += 64) s += fl[k];
  return s;
}

class QuantileTable implements BetaQuantileTable {
  /** Keeps the prefetch sweep from being optimised away. */
  private sink = 0;
  private readonly one = new Float64Array(1);
  private readonly result = new Float64Array(1);
  constructor(
    readonly node: Float64Array,
    readonly flagged: Uint8Array,
    readonly slow: XSpaceInverse,
  ) {}

  /** The cubic of cell g at t ∈ [0, 1]. */
  cubic(g: number, t: number): number {
    return hermiteCell(this.node, g, t);
  }

  quantile(u: number): number {
    this.one[0] = u;
    this.scaledQuantileInto(this.one, this.result, 1, 0, 1);
    return this.result[0];
  }

  scaledQuantileInto(u: Float64Array, out: Float64Array, n: number, a: number, w: number): void {
    const nd = this.node;
    const fl = this.flagged;
    // Read the table once in order first: a sequential sweep brings it into cache far faster
    // than the scattered lookups below would, one miss at a time.
    if (n >= 256) this.sink = prefetch(nd, fl);
    hermiteCellsInto(nd, fl, G, this.slow, u, out, n, a, w);
  }
}

// Tables by shape, so a shape is built once per thread (and a long-lived server reuses them).
const CACHE_LIMIT = 1024;
const cache = new Map<string, QuantileTable>();
const keyOf = (alpha: number, beta: number) => `${alpha}:${beta}`;

function remember(key: string, table: QuantileTable): QuantileTable {
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(key, table);
  return table;
}

/** The table of shape (α, β), built on first request. */
export function betaQuantileTable(alpha: number, beta: number): BetaQuantileTable {
  const key = keyOf(alpha, beta);
  return cache.get(key) ?? remember(key, buildTable(alpha, beta));
}

/** Tables of several shapes packed in one SharedArrayBuffer: cheap to hand to every thread. */
export interface PackedBetaTables {
  buffer: SharedArrayBuffer;
  /** (α, β) per table, in pack order. */
  shapes: Float64Array;
}

const DOUBLES = K + 1 + 4 * K + 2 * (G + 1);
const BYTES_PER_TABLE = Math.ceil((8 * DOUBLES + 4 * (CELLS + 1) + G) / 8) * 8;

function views(buffer: SharedArrayBuffer, i: number) {
  const at = i * BYTES_PER_TABLE;
  const d = new Float64Array(buffer, at, DOUBLES);
  return {
    F: d.subarray(0, K + 1),
    coef: d.subarray(K + 1, 5 * K + 1),
    node: d.subarray(5 * K + 1),
    cellStart: new Int32Array(buffer, at + 8 * DOUBLES, CELLS + 1),
    flagged: new Uint8Array(buffer, at + 8 * DOUBLES + 4 * (CELLS + 1), G),
  };
}

/** The bytes of a PackedBetaTables buffer holding `count` tables. */
export function packedBetaTablesBytes(count: number): number {
  return Math.max(8, count * BYTES_PER_TABLE);
}

/** `buffer`: where to pack them (packedBetaTablesBytes long), when another thread holds it already. */
export function packBetaTables(
  shapes: readonly (readonly [number, number])[],
  buffer = new SharedArrayBuffer(packedBetaTablesBytes(shapes.length)),
): PackedBetaTables {
  const flat = new Float64Array(2 * shapes.length);
  shapes.forEach(([alpha, beta], i) => {
    const t = betaQuantileTable(alpha, beta) as QuantileTable;
    const v = views(buffer, i);
    v.F.set(t.slow.F);
    v.coef.set(t.slow.coef);
    v.node.set(t.node);
    v.cellStart.set(t.slow.cellStart);
    v.flagged.set(t.flagged);
    flat[2 * i] = alpha;
    flat[2 * i + 1] = beta;
  });
  return { buffer, shapes: flat };
}

export function unpackBetaTables(pack: PackedBetaTables): void {
  for (let i = 0; i < pack.shapes.length / 2; i++) {
    const alpha = pack.shapes[2 * i];
    const beta = pack.shapes[2 * i + 1];
    const key = keyOf(alpha, beta);
    if (cache.has(key)) continue;
    const v = views(pack.buffer, i);
    remember(
      key,
      new QuantileTable(v.node, v.flagged, new XSpaceInverse(alpha, beta, v.F, v.coef, v.cellStart)),
    );
  }
}

/** A new table (uncached; betaQuantileTable is the usual entry). */
export function createBetaQuantileTable(alpha: number, beta: number): BetaQuantileTable {
  return buildTable(alpha, beta);
}

function buildTable(alpha: number, beta: number): QuantileTable {
  const lnB = jStat.betaln(alpha, beta);
  const density = (t: number) => densityOfLogs(alpha, beta, lnB, Math.log(t), Math.log1p(-t));
  const inverse = xSpaceInverse(alpha, beta, lnB);
  const slow = (u: number) => inverse.invert(u);

  // Table 2: cubic Hermite cells of x(u) on u = g/G, slope h/f(x) per cell.
  const nodeX = new Float64Array(G + 1);
  const nodeSlope = new Float64Array(G + 1);
  for (let g = 0; g <= G; g++) {
    nodeX[g] = g === 0 ? 0 : g === G ? 1 : slow(g / G);
    nodeSlope[g] = 1 / G / density(nodeX[g]);
  }
  // Interleaved (x, slope) per node: a cell reads its two ends, 32 bytes, and the whole table is
  // half the size of stored cubic coefficients (it has to come into cache for every column).
  const node = new Float64Array(2 * (G + 1));
  for (let g = 0; g <= G; g++) {
    node[2 * g] = nodeX[g];
    node[2 * g + 1] = nodeSlope[g];
  }
  const flagged = new Uint8Array(G);
  const table = new QuantileTable(node, flagged, inverse);
  const bad = (g: number) => {
    const ok = Number.isFinite(node[2 * g + 1]) && Number.isFinite(node[2 * g + 3]);
    return !(ok && Math.abs(table.cubic(g, 0.5) - slow((g + 0.5) / G)) <= TOLERANCE);
  };
  // The cubic fails only towards the ends, where the quantile function has unbounded
  // derivatives, and fits better and better inwards: check from each end until CLEAR_RUN cells
  // in a row fit (the unit tests check the whole table against jstat).
  for (const [from, step] of [
    [0, 1],
    [G - 1, -1],
  ] as const) {
    for (let g = from, run = 0; g >= 0 && g < G && run < CLEAR_RUN; g += step) {
      flagged[g] = bad(g) ? 1 : 0;
      run = flagged[g] ? 0 : run + 1;
    }
  }
  return table;
}
