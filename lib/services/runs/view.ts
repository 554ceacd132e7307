import 'server-only';
// What the pages and the API see of a run: its state, settings and headline figures, never the
// large snapshot or result (those have their own reads).

import type { SimulationRun, RunStatus, RunSummary } from '@/models/simulation-run';
import type { RunSettings } from '@/lib/validation/runs';
import { engineDifference } from './engine-match';

export type RunView = {
  id: number;
  projectId: number;
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
  /** Estimated milliseconds left, for a running run that has made some progress. */
  msLeft: number | null;
  summary: RunSummary | null;
  /**
   * The engine the run was computed by (null for runs from before it was recorded, and for runs
   * not started yet), and, when the current engine would compute other numbers for it, why.
   */
  engine: { version: string | null; blockSize: number | null; notice: string | null };
};

type Row = SimulationRun & { startedBy?: { id: number; name: string } | null };

export function toRunView(run: Row, queuePosition: number | null = null, now = Date.now()): RunView {
  const started = run.startedAt ? new Date(run.startedAt).getTime() : null;
  const p = run.progress;
  const msLeft =
    run.status === 'running' && started !== null && p > 0 && p < 1 ? ((now - started) * (1 - p)) / p : null;
  const settings = run.settings;
  return {
    id: run.id,
    projectId: run.projectId,
    status: run.status,
    settings,
    progress: p,
    iterationsDone: run.iterationsDone,
    iterationsPlanned: settings.precision ? settings.precision.maxIterations : settings.iterations,
    failureReason: run.failureReason ?? null,
    inputHash: run.inputHash,
    startedBy: run.startedBy ? { id: run.startedBy.id, name: run.startedBy.name } : null,
    createdAt: new Date(run.createdAt).toISOString(),
    startedAt: run.startedAt ? new Date(run.startedAt).toISOString() : null,
    finishedAt: run.finishedAt ? new Date(run.finishedAt).toISOString() : null,
    queuePosition: run.status === 'queued' ? queuePosition : null,
    msLeft,
    summary: run.summary ?? null,
    engine: engineOf(run),
  };
}

function engineOf(run: Row): RunView['engine'] {
  const recorded = { engineVersion: run.engineVersion ?? null, blockSize: run.blockSize ?? null };
  // A run that has not started (or never did) has no numbers to compare yet.
  const hasNumbers = run.status === 'succeeded' || recorded.engineVersion !== null;
  return {
    version: recorded.engineVersion,
    blockSize: recorded.blockSize,
    notice: hasNumbers ? engineDifference(recorded) : null,
  };
}
