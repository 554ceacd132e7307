// The engine's runtime door, for server code, scripts and the command line (never client
// components: it reaches Node.js built-ins and worker threads). The core is the other door,
// lib/sim (../index).
//
//   runSimulation(model, options)     → Promise<SimulationResult>  (threads, progress, cancel;
//                                        bounded memory above 1,000,000 iterations or when asked)

export { runSimulation } from './run';
export type { RunOptions } from './options';
export { defaultWorkerFile, requireWorkerFile, BUILD_WORKER_COMMAND } from './worker-file';
