import { afterAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';
import { canonicalJson } from '@/lib/runs/canonical-json';

const run = promisify(execFile);

afterAll(closeDb);

describe('a stored run is reproducible from its snapshot', () => {
  it('stores the same P80 as the command line for the same snapshot, seed, sampling and iterations', async () => {
    const { client } = await newOrganisation('runs-reproduce');
    const projectId = await projectWithRegisters(client);
    const seed = 424242;
    const iterations = 12_345;
    const started = await client.post(`/api/projects/${projectId}/runs`, {
      iterations,
      seed,
      sampling: 'lhs',
      costTarget: 5_300_000,
      finishTarget: '2027-11-30',
    });
    expect(started.status).toBe(201);
    expect(started.json.run.status).toMatch(/queued|running/);
    const runId = started.json.run.id;
    await waitForRun(client, projectId, runId, (r) => r.status === 'succeeded');

    const download = await client.get(`/api/projects/${projectId}/runs/${runId}/snapshot`);
    expect(download.status).toBe(200);
    expect(download.headers.get('content-disposition')).toMatch(
      /^attachment; filename=".+-run-\d+\.model\.json"$/,
    );
    const snapshot = JSON.parse(download.text);
    // A new organisation's joint confidence is the default, 70 %.
    expect(snapshot.settings).toEqual({
      iterations,
      seed,
      sampling: 'lhs',
      contingencyLevel: 'P80',
      jointConfidence: 0.7,
    });

    // The stored hash is SHA-256 of the snapshot's canonical JSON (computed here independently).
    const [stored] = await rows<{ inputHash: string; result: string }>(
      'SELECT inputHash, result FROM SimulationRuns WHERE id = ?',
      [runId],
    );
    expect(stored.inputHash).toBe(createHash('sha256').update(canonicalJson(snapshot)).digest('hex'));

    // Reference: the engine's command line (scripts/simulate.ts) run on the downloaded file.
    const dir = mkdtempSync(path.join(tmpdir(), 'outturn-runs-'));
    const file = path.join(dir, 'snapshot.json');
    const out = path.join(dir, 'r.json');
    writeFileSync(file, download.text);
    await run(
      'node_modules/.bin/tsx',
      [
        'scripts/simulate.ts',
        file,
        '--seed',
        String(seed),
        '--iterations',
        String(iterations),
        '--sampling',
        'lhs',
        '--out',
        out,
      ],
      { cwd: process.cwd(), timeout: 120_000 },
    );
    const cli = JSON.parse(readFileSync(out, 'utf8'));
    const result = JSON.parse(stored.result);
    expect(result.iterations).toBe(iterations);
    expect(result.cost.percentiles.P80).toBe(cli.cost.percentiles.P80);
    expect(result.duration.percentiles.P80).toBe(cli.duration.percentiles.P80);
    expect(result.joint.probability).toBe(cli.joint.probability);

    // The API's result is the stored one, and the run's summary carries the same P80.
    const api = await client.get(`/api/projects/${projectId}/runs/${runId}/result`);
    expect(api.json.result.cost.percentiles.P80).toBe(cli.cost.percentiles.P80);
    expect(api.json.run.summary.cost.P80).toBe(cli.cost.percentiles.P80);
    expect(api.json.sample.n).toBe(5000);

    // The projects list shows this run's P50 / P80 as the project's latest, in its currency (EUR).
    const whole = (v: number) => `€${v.toLocaleString('en-GB', { maximumFractionDigits: 0 })}`;
    const html = (await client.get('/projects')).text.replace(/<!-- -->/g, '');
    expect(html).toContain(`${whole(cli.cost.percentiles.P50)} / ${whole(cli.cost.percentiles.P80)}`);
  });
});
