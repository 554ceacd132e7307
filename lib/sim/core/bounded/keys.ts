/**
 * Order-preserving bucket keys of doubles, for histograms that need no range in advance and merge
 * exactly. The IEEE-754 bits of a double, the sign bit flipped and every bit flipped for a
 * negative number, order as the numbers do (Knuth 1998, TAOCP vol. 3, §5.2.5, as in
 * ../math/ranks); the top bits of that key name a bucket:
 *
 *   fine key   = top 28 bits: sign, exponent, 16 bits of mantissa (width ≤ 2⁻¹⁶ of the value)
 *   coarse key = top 24 bits: sign, exponent, 12 bits of mantissa (width ≤ 2⁻¹² of the value)
 *
 * A coarse key is its fine keys shifted right by 4, so coarse buckets are unions of fine ones.
 */

const scratch = new Float64Array(1);
const words = new Uint32Array(scratch.buffer);
const HI = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;
const LO = 1 - HI;

/** Top 32 bits of the order-preserving key of x. */
function topWord(x: number): number {
  scratch[0] = x;
  const h = words[HI];
  return h >>> 31 === 1 ? ~h >>> 0 : (h ^ 0x80000000) >>> 0;
}

export const FINE_SHIFT = 4;
export const COARSE_SHIFT = 8;

export const fineKey = (x: number): number => topWord(x) >>> FINE_SHIFT;
export const coarseKey = (x: number): number => topWord(x) >>> COARSE_SHIFT;
export const coarseOfFine = (key: number): number => key >>> (COARSE_SHIFT - FINE_SHIFT);

/** The smallest double whose key (at `shift`) is `key`. */
export function lowerEdge(key: number, shift: number): number {
  const u = (key * 2 ** shift) >>> 0;
  if (u >>> 31 === 1) {
    words[HI] = (u ^ 0x80000000) >>> 0;
    words[LO] = 0;
  } else {
    words[HI] = ~u >>> 0;
    words[LO] = 0xffffffff;
  }
  return scratch[0];
}

/** The middle of a bucket (its lower edge and the next bucket's), the value a bucket stands for. */
export function bucketMiddle(key: number, shift: number): number {
  return (lowerEdge(key, shift) + lowerEdge(key + 1, shift)) / 2;
}
