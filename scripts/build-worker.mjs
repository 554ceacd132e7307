// Bundles the simulation engine's worker thread (lib/sim/runtime/worker.ts) into
// .build/sim-worker.mjs, the file the engine's thread pool loads; and, run as a script, the
// command line (scripts/simulate.ts) into .build/simulate.cjs, started by .build/simulate.mjs
// (scripts/simulate-start.mjs), so that `npm run simulate` starts plain JavaScript instead of
// compiling TypeScript on every start, and the queue worker (scripts/worker.ts) into
// .build/outturn-worker.mjs for `npm run worker`. The engine never builds them itself; this
// script does, run by scripts/build.sh before `next build`, by the simulate and bench scripts,
// and (the worker alone, as the unit tests' global set-up, through the default export) by
// Vitest. It writes beside each target and renames, so a process loading a file never sees half
// of it, and leaves a target whose content did not change as it is.

import { build } from 'esbuild';
import { readFileSync, renameSync, unlinkSync } from 'node:fs';
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
  // An unchanged bundle keeps its file, and so the code cache made from it (see
  // scripts/simulate-start.mjs): `npm run simulate` builds before every run.
  if (sameContent(tmp, outfile)) unlinkSync(tmp);
  else renameSync(tmp, outfile);
  return outfile;
}

function sameContent(a, b) {
  try {
    return readFileSync(a).equals(readFileSync(b));
  } catch {
    return false;
  }
}

export function buildWorker(root = process.cwd()) {
  return bundle(root, ['lib', 'sim', 'runtime', 'worker.ts'], 'sim-worker.mjs');
}

/**
 * The command line, its packages bundled in (one file loads faster than a package's many), but
 * for the thread pool, which finds its own worker file in node_modules. CommonJS, for its start
 * (scripts/simulate-start.mjs, the file `node .build/simulate.mjs` runs) to compile it with V8's
 * code cache.
 */
export async function buildCli(root = process.cwd()) {
  await bundle(root, ['scripts', 'simulate.ts'], 'simulate.cjs', { format: 'cjs', external: ['piscina'] });
  return bundle(root, ['scripts', 'simulate-start.mjs'], 'simulate.mjs');
}

/**
 * The queue worker (scripts/worker.ts, `npm run worker`): the server code it shares with the app
 * (services, models) bundled in, with the `@/` paths of tsconfig.json; packages stay in
 * node_modules. `server-only` guards server modules against client bundles; a worker is server
 * code, so it gets the package's empty module (as under the react-server condition).
 */
export function buildQueueWorker(root = process.cwd()) {
  const serverOnly = {
    name: 'server-only',
    setup(b) {
      b.onResolve({ filter: /^server-only$/ }, () => ({
        path: path.join(root, 'node_modules', 'server-only', 'empty.js'),
      }));
    },
  };
  return bundle(root, ['scripts', 'worker.ts'], 'outturn-worker.mjs', {
    packages: 'external',
    plugins: [serverOnly],
  });
}

/** Vitest's global set-up: the unit tests run the engine's threads on a fresh worker. */
export default async function setup() {
  await buildWorker();
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  // On stderr: the command line's stdout is its summary alone.
  for (const outfile of [await buildWorker(), await buildCli(), await buildQueueWorker()])
    console.error(`built ${path.relative(process.cwd(), outfile)}`);
}
