// Reproducibility: the same model, seed, sampling and iterations give the same result to the
// bit with 1 and with 2 worker threads; runs report progress and can be cancelled.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { simulateSync, type SimulationResult } from '../../index';
import { runSimulation } from '../index';

const project = JSON.parse(readFileSync('tests/fixtures/sim/small-project.json', 'utf8'));
const projectV2 = JSON.parse(readFileSync('tests/fixtures/sim/v2-project.json', 'utf8'));
const withoutTime = (r: SimulationResult) => ({ ...r, elapsedMs: 0 });

describe('determinism across threads', () => {
  it.each(['lhs', 'mc'] as const)('gives the same result with 1 and 2 threads (%s)', async (sampling) => {
    const options = { iterations: 12_345, seed: 77, sampling };
    const one = await runSimulation(project, { ...options, threads: 1 });
    const two = await runSimulation(project, { ...options, threads: 2 });
    expect(withoutTime(two)).toStrictEqual(withoutTime(one));
    expect(withoutTime(simulateSync(project, options))).toStrictEqual(withoutTime(one));
    expect(one.iterations).toBe(12_345);
  });

  it.each(['lhs', 'mc'] as const)(
    'gives the same result with 1 and 2 threads for a version 2 model (%s)',
    async (sampling) => {
      const options = { iterations: 9_001, seed: 3, sampling };
      const one = await runSimulation(projectV2, { ...options, threads: 1 });
      const two = await runSimulation(projectV2, { ...options, threads: 2 });
      expect(withoutTime(two)).toStrictEqual(withoutTime(one));
      expect(withoutTime(simulateSync(projectV2, options))).toStrictEqual(withoutTime(one));
      expect(one.mitigation?.used).toBe('post');
      expect(one.allocation?.iterations).toBeGreaterThan(0);
    },
  );

  // Plumbing (the engine against itself): the calling thread computing beside its workers, and
  // blocks claimed by whichever thread is free, change nothing.
  it.each([2, 3])(
    'gives the same result when the calling thread computes too (%i threads)',
    async (threads) => {
      const options = { iterations: 9_001, seed: 3, sampling: 'lhs' as const };
      const one = await runSimulation(projectV2, { ...options, threads: 1 });
      const here = await runSimulation(projectV2, { ...options, threads, computeHere: true });
      expect(withoutTime(here)).toStrictEqual(withoutTime(one));
    },
  );

  it('changes with the seed, and a string seed works', () => {
    const a = simulateSync(project, { iterations: 2000, seed: 1 });
    const b = simulateSync(project, { iterations: 2000, seed: 2 });
    const c = simulateSync(project, { iterations: 2000, seed: 'gate-3' });
    expect(a.cost.mean).not.toBe(b.cost.mean);
    expect(c.seed).toBe('gate-3');
    expect(simulateSync(project, { iterations: 2000, seed: 'gate-3' }).cost).toEqual(c.cost);
  });

  it('takes the settings of the model when no option is given, and draws a seed when none is set', () => {
    const r = simulateSync(project);
    expect([r.iterations, r.seed, r.sampling]).toEqual([5000, 11, 'lhs']);
    const { settings: _settings, ...bare } = project;
    const s = simulateSync(bare, { iterations: 1000 });
    expect(typeof s.seed).toBe('number');
    expect(simulateSync(bare, { iterations: 1000, seed: s.seed }).cost).toEqual(s.cost);
  });
});

describe('progress and cancellation', () => {
  it('reports progress up to the total', async () => {
    const seen: number[] = [];
    await runSimulation(project, {
      iterations: 5500,
      seed: 1,
      threads: 2,
      onProgress: (p) => seen.push(p.done),
    });
    expect(seen.at(-1)).toBe(5500);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
  });

  it('reports progress up to the total when the calling thread computes too', async () => {
    const seen: number[] = [];
    await runSimulation(project, {
      iterations: 5500,
      seed: 1,
      threads: 2,
      computeHere: true,
      onProgress: (p) => seen.push(p.done),
    });
    expect(seen.at(-1)).toBe(5500);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
  });

  it.each([
    [1, false],
    [2, false],
    [2, true],
  ])('can be cancelled (%i threads, this thread computing: %s)', async (threads, computeHere) => {
    const controller = new AbortController();
    const run = runSimulation(project, {
      iterations: 400_000,
      seed: 1,
      threads,
      computeHere,
      signal: controller.signal,
      onProgress: (p) => {
        if (p.done >= 3000) controller.abort();
      },
    });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
  });

  it('refuses to start when already cancelled', async () => {
    await expect(runSimulation(project, { signal: AbortSignal.abort() })).rejects.toMatchObject({
      name: 'AbortError',
    });
  });
});
