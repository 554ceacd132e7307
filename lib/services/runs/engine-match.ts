import 'server-only';
// Whether the current engine computes a stored run's numbers again to the bit. Blocks of
// iterations depend on the engine version and the block size as well as on (model, seed,
// sampling), so a run records both when it starts; a run whose record differs, or that has none
// (runs from before the record was kept), is never recomputed without saying so.

import { BLOCK_SIZE, ENGINE_VERSION } from '@/lib/sim';

export type RecordedEngine = { engineVersion: string | null; blockSize: number | null };

export const CURRENT_ENGINE: RecordedEngine = { engineVersion: ENGINE_VERSION, blockSize: BLOCK_SIZE };

const describe = (e: RecordedEngine) =>
  `engine ${e.engineVersion ?? 'unknown'} with blocks of ${e.blockSize ?? 'unknown'} iterations`;

/** Why the current engine would give other numbers for this run; null when it gives the same. */
export function engineDifference(run: RecordedEngine): string | null {
  if (run.engineVersion === ENGINE_VERSION && run.blockSize === BLOCK_SIZE) return null;
  const current = describe(CURRENT_ENGINE);
  if (run.engineVersion === null || run.blockSize === null) {
    return (
      `This run was made before runs recorded their engine; the current ${current} may give ` +
      `other numbers from the same snapshot and seed.`
    );
  }
  return (
    `This run was made by ${describe(run)}; the current ${current} gives other numbers ` +
    `from the same snapshot and seed.`
  );
}
