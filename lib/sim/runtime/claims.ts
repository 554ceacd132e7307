// Work shared out through one small SharedArrayBuffer instead of one message per block: each
// thread taking part (the workers, and the calling thread when it computes too) claims the next
// unclaimed item with an atomic add until none is left, so a thread that is ahead takes more and
// none waits for a message to learn what to do next. Which thread computes an item does not
// change what it computes.

/** Slots of the claims array. */
const NEXT = 0;
const DONE = 1;
const STOP = 2;

export type Claims = Int32Array;

export function createClaims(): Claims {
  return new Int32Array(new SharedArrayBuffer(3 * Int32Array.BYTES_PER_ELEMENT));
}

/** The next unclaimed item of `count`, or −1 when all are claimed or the work was stopped. */
export function claimNext(claims: Claims, count: number): number {
  if (Atomics.load(claims, STOP) !== 0) return -1;
  const k = Atomics.add(claims, NEXT, 1);
  return k < count ? k : -1;
}

/** Records `amount` more of the work done (iterations, for progress). */
export function markDone(claims: Claims, amount: number): void {
  Atomics.add(claims, DONE, amount);
}

export function doneSoFar(claims: Claims): number {
  return Atomics.load(claims, DONE);
}

/** Tells every thread to claim nothing more (after a cancel or a failure). */
export function stopClaims(claims: Claims): void {
  Atomics.store(claims, STOP, 1);
}
