// What the pages see of a run: its state, settings and headline figures, never the large
// snapshot or result (those have their own reads). The runs service produces it; no server code
// here, so client components may import it. Status and summary are the run record's own types.
import type { RunSettings } from '@/lib/validation/runs';
import type { RunStatus, RunSummary } from '@/models/simulation-run';

export type { RunStatus, RunSummary };

export type RunView = {
  id: number;
  projectId: number;
  /** The run's number within its project (Run 1 is its first run): the name people read. */
  number: number;
  status: RunStatus;
  settings: RunSettings;
  progress: number;
  iterationsDone: number;
  /** The iterations the run is heading for now (with a precision goal: its cap). */
  iterationsPlanned: number;
  failureReason: string | null;
  inputHash: string;
  startedBy: { id: number; name: string } | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  /** 1 for the next to start, for a run waiting in its organisation's queue. */
  queuePosition: number | null;
  /** Estimated milliseconds left, from the measured block rate; null while it is not known yet. */
  msLeft: number | null;
  summary: RunSummary | null;
  /**
   * The engine the run was computed by (null for runs from before it was recorded, and for runs
   * not started yet), and, when the current engine would compute other numbers for it, why.
   */
  engine: { version: string | null; blockSize: number | null; notice: string | null };
  /** What the registers → model export left out of the run's model or changed (the status rules). */
  modelNotices: string[];
};
