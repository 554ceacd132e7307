// The 128-bit key of a run, derived from the user's seed with seedrandom (ARC4-based, so any
// number or string seeds it reproducibly). All per-block streams derive from this key.

import seedrandom from 'seedrandom';

export function runKeyFromSeed(seed: number | string): Uint32Array {
  const prng = seedrandom(`outturn:${String(seed)}`);
  const key = new Uint32Array(4);
  for (let i = 0; i < 4; i++) key[i] = prng.int32() >>> 0;
  return key;
}
