// Intervals ("95 % interval") in one style: "€25.1m – €25.6m", and once only when both ends
// read the same in the shown digits ("20 Mar 2030 (exact)"), as happens when every iteration
// gave the same figure.

/** Both ends written with `format`, or the one figure with "(exact)" when they read the same. */
export function formatInterval(low: number, high: number, format: (v: number) => string): string {
  const a = format(low);
  const b = format(high);
  return a === b ? `${a} (exact)` : `${a} – ${b}`;
}
