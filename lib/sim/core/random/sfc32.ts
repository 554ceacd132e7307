/**
 * sfc32, a small fast chaotic generator with a 128-bit state including a counter (period ≥ 2³²),
 * and the derivation of one independent stream per (run key, block, variable).
 *
 *   t = a + b + d;  d = d + 1;  a = b ⊕ (b ≫ 9);  b = c + (c ≪ 3);  c = rotl(c, 21) + t;  → t
 *
 * Reference: C. Doty-Humphrey, PractRand test suite (2014), "sfc" family, where sfc32 passes the
 * full battery. Stream states are spread with the MurmurHash3 32-bit finaliser (Appleby 2011) and
 * the generator is run 12 steps before use, as its author recommends for seeding.
 */

const TWO_POW_M32 = 2 ** -32;

function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

function combine(h: number, v: number): number {
  return fmix32((h ^ Math.imul(v + 0x7f4a7c15, 0x9e3779b1)) >>> 0);
}

/** 0, 1, 2, …: copied into a permutation to start it (a copy is several times faster than a loop). */
let identity = new Int32Array(0);

function startIdentity(perm: Int32Array, n: number): void {
  if (identity.length < n) identity = Int32Array.from({ length: Math.max(n, 2048) }, (_, i) => i);
  perm.set(identity.subarray(0, n));
}

// The state lives in an Int32Array: 32-bit values do not fit V8's small integers, and object
// fields holding them would allocate a heap number on every step.
export class Sfc32 {
  private readonly s: Int32Array;

  constructor(a = 0, b = 0, c = 0, d = 1) {
    this.s = new Int32Array(4);
    this.seed(a, b, c, d);
  }

  seed(a: number, b: number, c: number, d: number): this {
    const s = this.s;
    s[0] = a;
    s[1] = b;
    s[2] = c;
    s[3] = d;
    for (let i = 0; i < 12; i++) this.nextU32();
    return this;
  }

  nextU32(): number {
    const s = this.s;
    const a = s[0];
    const b = s[1];
    const c = s[2];
    const d = s[3];
    const t = (((a + b) | 0) + d) | 0;
    s[3] = (d + 1) | 0;
    s[0] = b ^ (b >>> 9);
    s[1] = (c + (c << 3)) | 0;
    s[2] = (((c << 21) | (c >>> 11)) + t) | 0;
    return t >>> 0;
  }

  /** Uniform on the open interval (0, 1), 32-bit resolution: (k + ½)/2³². */
  next01(): number {
    return (this.nextU32() + 0.5) * TWO_POW_M32;
  }

  /** out[0…n−1] ← n successive next01() values (the bulk form, for hot loops). */
  fill01(out: Float64Array, n: number): void {
    const s = this.s;
    let a = s[0];
    let b = s[1];
    let c = s[2];
    let d = s[3];
    for (let i = 0; i < n; i++) {
      const t = (((a + b) | 0) + d) | 0;
      d = (d + 1) | 0;
      a = b ^ (b >>> 9);
      b = (c + (c << 3)) | 0;
      c = (((c << 21) | (c >>> 11)) + t) | 0;
      out[i] = ((t >>> 0) + 0.5) * TWO_POW_M32;
    }
    s[0] = a;
    s[1] = b;
    s[2] = c;
    s[3] = d;
  }

  /**
   * perm[0…n−1] ← a uniformly random permutation of 0…n−1 (Fisher–Yates, from the last position
   * down) and frac[0…n−1] ← independent uniforms on (0, 1), from one draw per position: at
   * position i the draw x = U·(i + 1) gives the swap index ⌊x⌋ and frac[i] = x − ⌊x⌋, which given
   * ⌊x⌋ is uniform and independent of everything else (x is uniform on [0, i + 1)). The products
   * are exact in double precision, and frac never reaches 0 or 1 since U = (k + ½)/2³².
   */
  shuffleWithFractions(perm: Int32Array, frac: Float64Array, n: number): void {
    this.shuffle(perm, frac, n, false);
  }

  /**
   * Latin hypercube column in one pass: out[i] = (π(i) + frac_i)/n with π and frac as in
   * shuffleWithFractions (position i is final once the shuffle has passed it).
   */
  latinHypercube(perm: Int32Array, out: Float64Array, n: number): void {
    this.shuffle(perm, out, n, true);
  }

  /** The shuffle; out[i] is frac_i, or with `strata` (π(i) + frac_i)/n. */
  private shuffle(perm: Int32Array, out: Float64Array, n: number, strata: boolean): void {
    const inv = 1 / n;
    startIdentity(perm, n);
    const s = this.s;
    let a = s[0];
    let b = s[1];
    let c = s[2];
    let d = s[3];
    for (let i = n - 1; i >= 0; i--) {
      const t = (((a + b) | 0) + d) | 0;
      d = (d + 1) | 0;
      a = b ^ (b >>> 9);
      b = (c + (c << 3)) | 0;
      c = (((c << 21) | (c >>> 11)) + t) | 0;
      const x = ((t >>> 0) + 0.5) * TWO_POW_M32 * (i + 1);
      // ⌊x⌋, as 0 ≤ x < 2³¹.
      const j = x | 0;
      const q = perm[j];
      perm[j] = perm[i];
      perm[i] = q;
      out[i] = strata ? (q + (x - j)) * inv : x - j;
    }
    s[0] = a;
    s[1] = b;
    s[2] = c;
    s[3] = d;
  }
}

/**
 * The stream of `variable` in `block` under the run key (4 × 32 bits); `reuse` is re-seeded
 * instead of allocating a generator.
 */
export function streamFor(key: Uint32Array, block: number, variable: number, reuse?: Sfc32): Sfc32 {
  const s0 = combine(combine(key[0], block), variable);
  const s1 = combine(combine(key[1] ^ s0, variable), block);
  const s2 = combine(combine(key[2] ^ s1, block ^ 0x5bd1e995), variable);
  const s3 = combine(key[3] ^ s2, 0x27d4eb2f);
  return reuse ? reuse.seed(s0, s1, s2, s3) : new Sfc32(s0, s1, s2, s3);
}
