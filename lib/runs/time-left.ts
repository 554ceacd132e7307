// The time left of a run, from its measured block rate. The first blocks of a run pay for
// compiling the model and starting the worker threads; an estimate from the run's start
// (elapsed × (1 − p) / p) counts that start-up again for every block still to come and says
// "5 minutes" for a 4-second run. So the rate is measured from the first block that finished to
// the latest one, and no estimate is given until that span is long enough to mean something.

export type ProgressMark = { at: number; done: number };

/** How long the rate must have been watched before an estimate is given. */
export const MIN_RATE_SPAN_MS = 750;

/**
 * Milliseconds left for `planned` iterations, or null ("estimating…") while the rate is not yet
 * known: fewer than two marks apart by MIN_RATE_SPAN_MS, or no iteration done between them.
 */
export function estimateMsLeft(
  first: ProgressMark | undefined,
  latest: ProgressMark | undefined,
  planned: number,
  now: number,
): number | null {
  if (!first || !latest) return null;
  const span = latest.at - first.at;
  const gained = latest.done - first.done;
  if (span < MIN_RATE_SPAN_MS || gained <= 0) return null;
  const perMs = gained / span;
  const left = (planned - latest.done) / perMs - Math.max(0, now - latest.at);
  return Math.max(0, left);
}
