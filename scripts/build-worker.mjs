// Bundles the simulation engine's worker thread (lib/sim/worker.ts) into .build/sim-worker.mjs,
// the file the engine's thread pool loads. The engine also builds it on demand when it is
// missing or stale; run this ahead of `next build` so a production server never has to.
// The options must stay equal to those in lib/sim/exec/worker-file.ts.

import { build } from 'esbuild';
import path from 'node:path';

const root = process.cwd();
const outfile = path.join(root, '.build', 'sim-worker.mjs');
await build({
  entryPoints: [path.join(root, 'lib', 'sim', 'worker.ts')],
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  outfile,
  logLevel: 'warning',
});
console.log(`built ${path.relative(root, outfile)}`);
