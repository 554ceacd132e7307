// Bundles the simulation engine's worker thread (lib/sim/runtime/worker.ts) into
// .build/sim-worker.mjs, the file the engine's thread pool loads, and, run as a script, the
// command line (scripts/simulate.ts) into .build/simulate.mjs, so that `npm run simulate` starts
// plain JavaScript instead of compiling TypeScript on every start. The engine never builds them
// itself; this script does, run by scripts/build.sh before `next build`, by the simulate and
// bench scripts, and (the worker alone, as the unit tests' global set-up, through the default
// export) by Vitest. It writes beside each target and renames, so a process loading a file
// never sees half of it.

import { build } from 'esbuild';
import { renameSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

async function bundle(root, entry, name, extra = {}) {
  const outfile = path.join(root, '.build', name);
  const tmp = `${outfile}.${process.pid}.tmp.mjs`;
  await build({
    entryPoints: [path.join(root, ...entry)],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile: tmp,
    logLevel: 'warning',
    ...extra,
  });
  renameSync(tmp, outfile);
  return outfile;
}

export function buildWorker(root = process.cwd()) {
  return bundle(root, ['lib', 'sim', 'runtime', 'worker.ts'], 'sim-worker.mjs');
}

/**
 * The command line, its packages bundled in (one file loads faster than a package's many), but
 * for the thread pool, which finds its own worker file in node_modules.
 */
export function buildCli(root = process.cwd()) {
  return bundle(root, ['scripts', 'simulate.ts'], 'simulate.mjs', { external: ['piscina'] });
}

/** Vitest's global set-up: the unit tests run the engine's threads on a fresh worker. */
export default async function setup() {
  await buildWorker();
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  // On stderr: the command line's stdout is its summary alone.
  for (const outfile of [await buildWorker(), await buildCli()])
    console.error(`built ${path.relative(process.cwd(), outfile)}`);
}
