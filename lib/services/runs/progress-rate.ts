import 'server-only';
// The block rate of the runs this server process is running: the first and the latest progress
// report of each, kept in memory (the runner and the pages share one process), for the time
// left shown beside the progress bar.
import { estimateMsLeft, type ProgressMark } from '@/lib/runs/time-left';

const marks = new Map<number, { first: ProgressMark; latest: ProgressMark }>();

export function noteProgress(runId: number, done: number, at = Date.now()): void {
  const seen = marks.get(runId);
  if (!seen) marks.set(runId, { first: { at, done }, latest: { at, done } });
  else seen.latest = { at, done };
}

export function forgetProgress(runId: number): void {
  marks.delete(runId);
}

/** Milliseconds left of a running run, or null while its rate is not known yet. */
export function msLeftOf(runId: number, planned: number, now = Date.now()): number | null {
  const seen = marks.get(runId);
  return estimateMsLeft(seen?.first, seen?.latest, planned, now);
}
