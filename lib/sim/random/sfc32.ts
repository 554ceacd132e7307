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

export class Sfc32 {
  private a: number;
  private b: number;
  private c: number;
  private d: number;

  constructor(a: number, b: number, c: number, d = 1) {
    this.a = a | 0;
    this.b = b | 0;
    this.c = c | 0;
    this.d = d | 0;
    for (let i = 0; i < 12; i++) this.nextU32();
  }

  nextU32(): number {
    const t = (((this.a + this.b) | 0) + this.d) | 0;
    this.d = (this.d + 1) | 0;
    this.a = this.b ^ (this.b >>> 9);
    this.b = (this.c + (this.c << 3)) | 0;
    this.c = ((this.c << 21) | (this.c >>> 11)) + t;
    this.c |= 0;
    return t >>> 0;
  }

  /** Uniform on the open interval (0, 1), 32-bit resolution: (k + ½)/2³². */
  next01(): number {
    return (this.nextU32() + 0.5) * TWO_POW_M32;
  }
}

/** The stream of `variable` in `block` under the run key (4 × 32 bits). */
export function streamFor(key: Uint32Array, block: number, variable: number): Sfc32 {
  const s0 = combine(combine(key[0], block), variable);
  const s1 = combine(combine(key[1] ^ s0, variable), block);
  const s2 = combine(combine(key[2] ^ s1, block ^ 0x5bd1e995), variable);
  const s3 = combine(key[3] ^ s2, 0x27d4eb2f);
  return new Sfc32(s0, s1, s2, s3);
}
