/**
 * Stream ids: each random column's stream is keyed by a 32-bit hash of its input's id (and role),
 * not by its position in the model, so adding or removing a line re-draws no other input.
 * Hash: FNV-1a over the UTF-16 code units (Fowler, Noll & Vo; the 32-bit offset basis 2166136261
 * and prime 16777619), finished with the MurmurHash3 mixer (Appleby 2011) to spread nearby ids.
 * Two labels that hash alike (about one pair in 2³² ⁄ m² for m columns) are told apart by
 * re-hashing the later label (in model order) with a counter, which only ever touches that pair.
 */

export function hashLabel(label: string): number {
  let h = 2166136261;
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 16777619);
  }
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

/** One distinct stream id per label, in order. */
export function streamIdsFor(labels: string[]): Uint32Array {
  const out = new Uint32Array(labels.length);
  const taken = new Set<number>();
  labels.forEach((label, i) => {
    let h = hashLabel(label);
    for (let k = 1; taken.has(h); k++) h = hashLabel(`${label}#${k}`);
    taken.add(h);
    out[i] = h;
  });
  return out;
}
