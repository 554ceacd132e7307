// The engine's core door: pure TypeScript with no Node.js built-ins, workers, Next.js, React or
// database behind it, so client components may import it. The threaded runner for server code,
// scripts and the command line is the other door, ./runtime.
//
//   validateModel(json)               → { ok, model } | { ok: false, issues: [{ path, message }] }
//   simulateSync(model, options)      → SimulationResult           (one thread, no yielding)
//   iterationsForPrecision(p, ε, c)   → iterations for a probability known to ±ε
//   simulateBounded(model, options)   → SimulationResult in bounded memory; its parts:
//     boundedChunks, firstPassPart, secondPassRequest, secondPassPart, finishBounded
//
// Model and result shapes: docs/model-format.md and docs/result-format.md.

// Model file: validation and schemas.
export {
  validateModel,
  parseModel,
  formatPath,
  type FieldIssue,
  type ValidationResult,
} from './core/validate';
export { modelSchema, distSchema, settingsSchema } from './core/schema';
export { InputError, ModelValidationError, SimulationCancelledError } from './core/errors';
export type * from './core/formats';

// Running in one thread, and what identifies the engine's numbers.
export { simulateSync } from './core/engine';
export type { SimulationOptions, PrecisionGoal } from './core/options';
export { firstIterationBlocks, type IterationBlock } from './core/first-iterations';
export { BLOCK_SIZE } from './core/block';
export { ENGINE_VERSION } from './core/version';

// A run in bounded memory, split into parts that merge to the bit (./core/bounded).
export { prepareRun, resolveRun, type PreparedRun } from './core/engine';
export {
  boundedChunks,
  chunkIterations,
  firstPassPart,
  FirstPassFold,
  SecondPassFold,
  secondPassRequest,
  secondPassPart,
  finishBounded,
  combineFirstParts,
  FirstPartsGathering,
  simulateBounded,
  BOUNDED_FROM,
  CHUNK_BLOCKS,
  type FirstPassPart,
  type FirstPassChunk,
  type SecondPassRequest,
  type SecondPassPart,
  type SecondPassChunk,
} from './core/bounded';

// The schedule network outside a run: checks, one deterministic pass, and the passes themselves.
export { buildNetwork, type Network } from './core/schedule/network';
export { scheduleDates, type ScheduleDates, type ActivityDates } from './core/schedule/dates';
export { allocateForwardPass, forwardPass } from './core/schedule/forward-pass';
export { existenceInput } from './core/schedule/branches';

// Distributions and the base estimate.
export {
  createDistribution,
  type Distribution,
  type DistributionKind,
  type DistLocation,
} from './core/distributions';
export { baseOf, baseDurationOf } from './core/distributions/base';

// Percentiles, contingency and precision.
export { PERCENTILES, PERCENTILE_KEYS, contingencyOf } from './core/stats/percentiles';
export { iterationsForPrecision } from './core/stats/precision';

// Checks that the registers run before a model is built.
export {
  planCorrelations,
  type CorrelationRequest,
  type CorrelationPlan,
  type CorrelationGroup,
} from './core/correlation/plan';
export { checkNetwork, type NetworkProblem } from './core/schedule/network';
export { baseFinishOf } from './core/schedule/base-finish';

// The command line's printed summary.
export { summaryText, type SummaryContext } from './core/report/summary-text';
