// Where the bundled worker lives. Worker threads need plain JavaScript that Node can load on its
// own, whatever runs the main thread (tsx, Vitest, a Next.js server), so ./worker.ts is bundled
// into one ESM file by the build script (scripts/build-worker.mjs, run by scripts/build.sh, by
// the unit tests' global set-up and by the simulate and bench scripts). The engine never builds
// it: a missing file is an error that names the command.

import { existsSync } from 'node:fs';
import path from 'node:path';

export const BUILD_WORKER_COMMAND = 'node scripts/build-worker.mjs';

// The path is only known at run time; the comment keeps Next.js's file tracing from taking it
// for the whole project.
export const defaultWorkerFile = () =>
  path.join(/* turbopackIgnore: true */ process.cwd(), '.build', 'sim-worker.mjs');

/** The worker file, or an error saying how to build it when it is missing. */
export function requireWorkerFile(file = defaultWorkerFile()): string {
  if (!existsSync(/* turbopackIgnore: true */ file)) {
    throw new Error(
      `The simulation worker ${file} is missing; build it with "${BUILD_WORKER_COMMAND}" ` +
        `(scripts/build.sh does so before building the app).`,
    );
  }
  return file;
}
