import 'server-only';
// Simulation runs: the service (start, read, cancel, snapshot, result), the comparison of two
// runs, and the recovery of runs interrupted by a restart (called from instrumentation.ts).
export {
  startRun,
  listRuns,
  getRun,
  getRunOutcome,
  getRunSnapshot,
  cancelRun,
  latestRunSummaries,
  type RunOutcome,
  type LatestRunSummary,
} from './runs';
export { compareRuns, type RunComparison } from './compare';
export { allocationFile } from './allocation-file';
export { latestCriticality, type LatestCriticality } from './latest-criticality';
export { recoverInterruptedRuns, INTERRUPTED_REASON } from './recover';
export type { RunView } from './view';
export type { RunSample } from './sample';
