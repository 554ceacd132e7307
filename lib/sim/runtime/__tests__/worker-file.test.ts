// The engine never builds its worker at run time: a threaded run without the worker file fails
// at once, naming the command that builds it.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BUILD_WORKER_COMMAND, runSimulation } from '../index';

const project = JSON.parse(readFileSync('tests/fixtures/sim/small-project.json', 'utf8'));

describe('the worker file', () => {
  it('missing: a threaded run fails with the command that builds it', async () => {
    await expect(
      runSimulation(project, {
        iterations: 5000,
        seed: 1,
        threads: 2,
        workerFile: '/nonexistent/sim-worker.mjs',
      }),
    ).rejects.toThrow(`build it with "${BUILD_WORKER_COMMAND}"`);
  });

  it('is not needed in one thread', async () => {
    const r = await runSimulation(project, {
      iterations: 3000,
      seed: 1,
      threads: 1,
      workerFile: '/nonexistent/sim-worker.mjs',
    });
    expect(r.iterations).toBe(3000);
  });
});
