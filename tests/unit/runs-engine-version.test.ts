// A stored run records the engine version and block size it was computed with; a run whose
// record differs from the current engine (or has none) says so in its view, and its sample is
// never computed again by the other engine.
import { describe, expect, it } from 'vitest';
import { BLOCK_SIZE, ENGINE_VERSION, type Model } from '@/lib/sim';
import { CURRENT_ENGINE, engineDifference } from '@/lib/services/runs/engine-match';
import { sampleOfRun } from '@/lib/services/runs/sample';
import { toRunView } from '@/lib/services/runs/view';
import type { SimulationRun } from '@/models/simulation-run';

const model: Model = {
  format: 'outturn-model',
  version: 1,
  items: [{ id: 'C1', dist: { type: 'triangular', low: 900, mode: 1000, high: 1400 } }],
};
const settings = { iterations: 3000, seed: 7, sampling: 'lhs' as const };

function row(fields: Partial<SimulationRun>): SimulationRun {
  const at = new Date('2026-12-01T10:00:00Z');
  return {
    id: 1,
    projectId: 1,
    status: 'succeeded',
    settings: { ...settings, precision: null },
    progress: 1,
    iterationsDone: 3000,
    failureReason: null,
    inputHash: 'h',
    createdAt: at,
    startedAt: at,
    finishedAt: at,
    summary: null,
    engineVersion: null,
    blockSize: null,
    ...fields,
  } as SimulationRun;
}

describe('the engine a run was computed with', () => {
  it('is the current engine for a run recorded with it: no notice', () => {
    const view = toRunView(row({ engineVersion: ENGINE_VERSION, blockSize: BLOCK_SIZE }));
    expect(view.engine).toEqual({ version: ENGINE_VERSION, blockSize: BLOCK_SIZE, notice: null });
  });

  it('says so when the run was made by another engine version', () => {
    const view = toRunView(row({ engineVersion: '0.9.0', blockSize: BLOCK_SIZE }));
    expect(view.engine.version).toBe('0.9.0');
    expect(view.engine.notice).toContain('engine 0.9.0');
    expect(view.engine.notice).toContain(`current engine ${ENGINE_VERSION}`);
  });

  it('says so when the run used another block size', () => {
    const view = toRunView(row({ engineVersion: ENGINE_VERSION, blockSize: BLOCK_SIZE / 2 }));
    expect(view.engine.notice).toContain(`blocks of ${BLOCK_SIZE / 2} iterations`);
  });

  it('says so for a finished run from before the engine was recorded', () => {
    expect(toRunView(row({})).engine.notice).toMatch(/before runs recorded their engine/);
  });

  it('has no notice for a run that has not started yet', () => {
    expect(toRunView(row({ status: 'queued', startedAt: null, finishedAt: null })).engine.notice).toBeNull();
  });

  it('refuses to compute the sample of a run made by another engine, and computes it for the current one', async () => {
    await expect(
      sampleOfRun(model, { ...settings, engineVersion: '0.9.0', blockSize: BLOCK_SIZE }),
    ).rejects.toThrow(/cannot be computed again.*engine 0\.9\.0/);
    await expect(
      sampleOfRun(model, { ...settings, engineVersion: ENGINE_VERSION, blockSize: 2 * BLOCK_SIZE }),
    ).rejects.toMatchObject({ status: 409 });
    await expect(sampleOfRun(model, { ...settings, engineVersion: null, blockSize: null })).rejects.toThrow(
      /before runs recorded their engine/,
    );
    const sample = await sampleOfRun(model, { ...settings, ...CURRENT_ENGINE });
    expect(sample.n).toBe(3000);
    expect(engineDifference(CURRENT_ENGINE)).toBeNull();
  });
});
