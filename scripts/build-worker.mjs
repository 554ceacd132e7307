// Bundles the simulation engine's worker thread (lib/sim/runtime/worker.ts) into
// .build/sim-worker.mjs, the file the engine's thread pool loads. The engine never builds it
// itself; this script does, run by scripts/build.sh before `next build`, by the simulate and
// bench scripts, and (as the unit tests' global set-up, through the default export) by Vitest.
// It writes beside the target and renames, so a process loading the file never sees half of it.

import { build } from 'esbuild';
import { renameSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export async function buildWorker(root = process.cwd()) {
  const outfile = path.join(root, '.build', 'sim-worker.mjs');
  const tmp = `${outfile}.${process.pid}.tmp.mjs`;
  await build({
    entryPoints: [path.join(root, 'lib', 'sim', 'runtime', 'worker.ts')],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile: tmp,
    logLevel: 'warning',
  });
  renameSync(tmp, outfile);
  return outfile;
}

/** Vitest's global set-up: the unit tests run the engine's threads on a fresh worker. */
export default async function setup() {
  await buildWorker();
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const outfile = await buildWorker();
  console.log(`built ${path.relative(process.cwd(), outfile)}`);
}
