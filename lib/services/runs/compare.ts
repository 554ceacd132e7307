import 'server-only';
// Two runs of one project side by side: their headline figures, their S-curves and what
// changed in the inputs between their snapshots.

import type { Actor } from '@/lib/auth/actor';
import { diffSnapshots, type SnapshotDiff } from '@/lib/runs/snapshot-diff';
import { getRunOutcome, type RunOutcome } from './runs';

export type RunComparison = { a: RunOutcome; b: RunOutcome; diff: SnapshotDiff };

export async function compareRuns(
  actor: Actor,
  projectId: number,
  aId: number,
  bId: number,
): Promise<RunComparison> {
  // The comparison reads the figures and the inputs, never the charts' sample.
  const [a, b] = await Promise.all([
    getRunOutcome(actor, projectId, aId, { withSample: false }),
    getRunOutcome(actor, projectId, bId, { withSample: false }),
  ]);
  return { a, b, diff: diffSnapshots(a.snapshot, b.snapshot) };
}
