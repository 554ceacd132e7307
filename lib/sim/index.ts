// Public API of the simulation engine (pure TypeScript: no Next.js, React or database).
//
//   validateModel(json)               → { ok, model } | { ok: false, issues: [{ path, message }] }
//   runSimulation(model, options)     → Promise<SimulationResult>  (threads, progress, cancel)
//   simulateSync(model, options)      → SimulationResult           (one thread, no yielding)
//   iterationsForPrecision(p, ε, c)   → iterations for a probability known to ±ε

export { runSimulation } from './run';
export { simulateSync, prepareRun } from './engine';
export { validateModel, parseModel, formatPath, type FieldIssue, type ValidationResult } from './validate';
export { modelSchema, distSchema, settingsSchema } from './schema';
export { iterationsForPrecision } from './stats/precision';
export { InputError, ModelValidationError, SimulationCancelledError } from './errors';
export { createDistribution } from './distributions';
export type { Distribution } from './distributions';
export { BLOCK_SIZE } from './block';
export { ensureWorkerFile, defaultWorkerFile } from './exec/worker-file';
export type { RunOptions, SimulationOptions, PrecisionGoal } from './options';
export type * from './types';
