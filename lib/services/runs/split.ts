import 'server-only';
/**
 * The database side of a run split across workers (queue mode): whether a run is split and into
 * which chunk ranges, the run as a part rebuilds it, the parts' shared progress, and the outcome
 * merged from the parts. The engine's bounded form (@/lib/sim: firstPassPart, secondPassRequest,
 * secondPassPart, finishBounded) gives the same result to the bit for any split; the BullMQ side
 * is lib/queue/split-run.ts.
 */

import { BOUNDED_FROM, boundedChunks, prepareRun, type PreparedRun } from '@/lib/sim';
import { Project, SimulationRun } from '@/models';
import type { RunSettings } from '@/lib/validation/runs';
import { positiveInt } from '@/lib/queue/redis';

/**
 * Runs of at least this many iterations are split into parts across workers. By default the runs
 * the engine runs bounded anyway (more than BOUNDED_FROM), so a run's numbers are the same in
 * either mode; a lower threshold makes smaller runs bounded (and split) too.
 */
export const splitFrom = () => positiveInt('OUTTURN_SPLIT_FROM', BOUNDED_FROM + 1);
/** At most this many parts per pass (each part covers whole chunks of the bounded form). */
export const splitParts = () => positiveInt('OUTTURN_SPLIT_PARTS', 8);

/** A part's chunks: [from, to). */
export type ChunkRange = [number, number];

/**
 * The chunk ranges of a run to split, or null when it runs whole: below the threshold, or with a
 * precision goal (those keep their iterations in memory, capped at 1,000,000).
 */
export function splitRangesOf(settings: RunSettings): ChunkRange[] | null {
  if (settings.precision || settings.iterations < splitFrom()) return null;
  const chunks = boundedChunks(settings.iterations);
  const per = Math.ceil(chunks / Math.min(splitParts(), chunks));
  const ranges: ChunkRange[] = [];
  for (let from = 0; from < chunks; from += per) ranges.push([from, Math.min(chunks, from + per)]);
  return ranges;
}

export type HeldRun = {
  run: PreparedRun;
  snapshot: unknown;
  settings: RunSettings;
  currency: string | null;
};

// The last runs rebuilt in this process: the parts of one run on one worker share the compile.
const rebuilt = new Map<string, HeldRun>();

/**
 * The run as this attempt holds it (the row 'running' with the token), rebuilt from its stored
 * snapshot and settings with the seed given explicitly, so every part belongs to the same run;
 * null when the row is no longer this attempt's (cancelled, or handed to another attempt).
 */
export async function heldRun(runId: number, token: string): Promise<HeldRun | null> {
  const row = await SimulationRun.findOne({
    where: { id: runId, status: 'running', attemptToken: token },
    attributes: ['id', 'projectId', 'settings'],
  });
  if (!row) return null;
  const key = `${runId}:${token}`;
  const known = rebuilt.get(key);
  if (known) return known;
  const [full, project] = await Promise.all([
    SimulationRun.findByPk(runId, { attributes: ['inputSnapshot'] }),
    Project.findByPk(row.projectId, { attributes: ['currency'] }),
  ]);
  if (!full) return null;
  const snapshot = JSON.parse(full.inputSnapshot);
  const s = row.settings;
  const held = {
    run: prepareRun(snapshot, { iterations: s.iterations, seed: s.seed, sampling: s.sampling }),
    snapshot,
    settings: s,
    currency: project?.currency ?? null,
  };
  if (rebuilt.size >= 4) rebuilt.delete(rebuilt.keys().next().value!);
  rebuilt.set(key, held);
  return held;
}

/**
 * The progress of all the parts (work done of 2 × iterations: both passes count), written only
 * while the row names the attempt; false when it does not any more (the part should stop).
 */
export async function writeSplitProgress(
  runId: number,
  token: string,
  iterations: number,
  done: number,
  first: { at: number; done: number },
): Promise<boolean> {
  const share = Math.min(1, done / (2 * iterations));
  const [written] = await SimulationRun.update(
    {
      progress: share,
      iterationsDone: Math.min(iterations, Math.round(done / 2)),
      progressMarks: { first, latest: { at: Date.now(), done: share * iterations } },
    },
    { where: { id: runId, status: 'running', attemptToken: token } },
  );
  return written > 0;
}

/** The run's status now, to tell a cancel from a hand-over when a part found the row taken. */
export async function statusOf(runId: number): Promise<string | null> {
  const row = await SimulationRun.findByPk(runId, { attributes: ['id', 'status'] });
  return row?.status ?? null;
}

/** The chunk ranges of a run just claimed, or null when it runs whole (see splitRangesOf). */
export async function splitRangesFor(runId: number): Promise<ChunkRange[] | null> {
  const row = await SimulationRun.findByPk(runId, { attributes: ['id', 'settings'] });
  return row ? splitRangesOf(row.settings) : null;
}
