import 'server-only';
// The time left of a running run from the progress marks its executor writes to the row, so
// that whichever process serves the page (any web instance) gives the same estimate.
import { estimateMsLeft } from '@/lib/runs/time-left';
import type { ProgressMarks } from '@/models/simulation-run';

/** MariaDB may hand a JSON column back as text. */
function marksOf(value: unknown): ProgressMarks | null {
  const marks = typeof value === 'string' ? JSON.parse(value) : value;
  return marks && typeof marks === 'object' && 'first' in marks && 'latest' in marks
    ? (marks as ProgressMarks)
    : null;
}

/** Milliseconds left of a running run, or null while its rate is not known yet. */
export function msLeftOf(progressMarks: unknown, planned: number, now = Date.now()): number | null {
  const marks = marksOf(progressMarks);
  return estimateMsLeft(marks?.first, marks?.latest, planned, now);
}
