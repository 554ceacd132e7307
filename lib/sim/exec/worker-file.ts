// Where the bundled worker lives and how it is (re)built. Worker threads need plain JavaScript
// that Node can load on its own, whatever runs the main thread (tsx, Vitest, a Next.js server),
// so lib/sim/worker.ts is bundled by esbuild into one ESM file. scripts/build-worker.mjs does the
// same ahead of time (keep the two option sets equal); here it is done on demand when the file is
// missing or older than the engine's sources.

import { existsSync, readdirSync, renameSync, statSync } from 'node:fs';
import path from 'node:path';

export const defaultWorkerFile = () =>
  path.join(/* turbopackIgnore: true */ process.cwd(), '.build', 'sim-worker.mjs');
const sourceDir = () => path.join(/* turbopackIgnore: true */ process.cwd(), 'lib', 'sim');

// The paths below are only known at run time; the comments keep Next.js's file tracing from
// taking them for the whole project.
function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(/* turbopackIgnore: true */ dir, { withFileTypes: true })) {
    const p = path.join(/* turbopackIgnore: true */ dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(p));
    else if (entry.name.endsWith('.ts'))
      newest = Math.max(newest, statSync(/* turbopackIgnore: true */ p).mtimeMs);
  }
  return newest;
}

let building: Promise<string> | null = null;

/** The worker file, built first if it is missing or stale (and the sources are at hand). */
export async function ensureWorkerFile(file = defaultWorkerFile()): Promise<string> {
  const src = sourceDir();
  const haveSources = existsSync(/* turbopackIgnore: true */ path.join(src, 'worker.ts'));
  const built = existsSync(/* turbopackIgnore: true */ file);
  if (built && (!haveSources || statSync(/* turbopackIgnore: true */ file).mtimeMs >= newestSource(src)))
    return file;
  if (!haveSources) {
    throw new Error(
      `The simulation worker ${file} is missing; build it with "node scripts/build-worker.mjs".`,
    );
  }
  building ??= buildWorker(path.join(src, 'worker.ts'), file).finally(() => (building = null));
  return building;
}

async function buildWorker(entry: string, outfile: string): Promise<string> {
  // Kept out of bundlers' reach: esbuild is a build tool, loaded only when a build is needed.
  const esbuild = await import(/* webpackIgnore: true */ /* turbopackIgnore: true */ 'esbuild');
  // Write beside the target, then rename: concurrent processes never see a half-written file.
  const tmp = `${outfile}.${process.pid}.${Date.now()}.tmp.mjs`;
  await esbuild.build({
    entryPoints: [entry],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile: tmp,
    logLevel: 'silent',
  });
  renameSync(/* turbopackIgnore: true */ tmp, outfile);
  return outfile;
}
