// The engine's core door (lib/sim) must stay loadable in a browser: client components import
// it. Bundling it for the browser platform fails on any Node.js built-in reachable from it.
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';

describe('the core door of the engine', () => {
  it('reaches no Node.js built-in, worker or app module', async () => {
    const out = await build({
      entryPoints: ['lib/sim/index.ts'],
      bundle: true,
      platform: 'browser',
      format: 'esm',
      write: false,
      metafile: true,
      logLevel: 'silent',
    });
    const inputs = Object.keys(out.metafile.inputs);
    expect(inputs.filter((f) => f.startsWith('lib/sim/runtime/'))).toEqual([]);
    // Outside the engine, only the packages it computes with (seedrandom's optional use of
    // Node's crypto, for seeding itself from entropy, is left out of browser bundles by the
    // package itself, and the engine never asks for it).
    const packages = /^node_modules\/(jstat|zod|seedrandom)\//;
    const outside = inputs.filter((f) => !f.startsWith('lib/sim/core/') && f !== 'lib/sim/index.ts');
    expect(outside.filter((f) => !packages.test(f) && f !== '(disabled):crypto')).toEqual([]);
  });

  it('would fail on a Node.js built-in (the check can fail)', async () => {
    await expect(
      build({
        stdin: { contents: "import { randomInt } from 'node:crypto'; console.log(randomInt(2));" },
        bundle: true,
        platform: 'browser',
        write: false,
        logLevel: 'silent',
      }),
    ).rejects.toThrow(/node:crypto/);
  });
});
