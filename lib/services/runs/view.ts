import 'server-only';
// What the pages and the API see of a run: its state, settings and headline figures, never the
// large snapshot or result (those have their own reads).

import type { SimulationRun } from '@/models/simulation-run';
import type { RunView } from '@/lib/view-types/runs';
import { engineDifference } from './engine-match';
import { msLeftOf } from './progress-rate';

export type { RunView };

type Row = SimulationRun & { startedBy?: { id: number; name: string } | null };

export function toRunView(run: Row, queuePosition: number | null = null, now = Date.now()): RunView {
  const p = run.progress;
  const settings = run.settings;
  const planned = settings.precision ? settings.precision.maxIterations : settings.iterations;
  const msLeft = run.status === 'running' && p < 1 ? msLeftOf(run.progressMarks, planned, now) : null;
  return {
    id: run.id,
    projectId: run.projectId,
    number: run.number,
    status: run.status,
    settings,
    progress: p,
    iterationsDone: run.iterationsDone,
    iterationsPlanned: planned,
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
    modelNotices: jsonList(run.modelNotices),
  };
}

/** MariaDB may hand a JSON column back as text. */
function jsonList(value: unknown): string[] {
  const list = typeof value === 'string' ? JSON.parse(value) : value;
  return Array.isArray(list) ? list.map(String) : [];
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
