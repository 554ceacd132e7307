// Version 2 risk events and line items through the whole product: every new field round-trips
// through the model file, the grid's save, CSV and XLSX; the status rules shape the run's model
// (occurred → certain, closed → left out with its correlations, with notices); and a stored run
// equals the command line's result for the same snapshot. That last check is plumbing (the app
// and the command line run the same engine); the engine's numbers are tested in tests/unit/sim.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { newOrganisation, type Client } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { download, upload } from './helpers/files';
import { projectWithRegisters, waitForRun } from './runs-fixtures';
import { QUAY_WALL as MODEL } from '../fixtures/registers/quay-wall-v2';

const exec = promisify(execFile);

const strip = (r: Record<string, unknown>) => {
  const { id: _i, version: _v, sortOrder: _s, ...rest } = r;
  return rest;
};

let client: Client;
let projectId: number;
const url = (p: string, id = projectId) => `/api/projects/${id}/${p}`;
const risksOf = async (id = projectId) =>
  (await client.get(url('risks', id))).json.rows as Record<string, any>[];
const itemsOf = async (id = projectId) =>
  (await client.get(url('items', id))).json.rows as Record<string, any>[];

beforeAll(async () => {
  client = (await newOrganisation('risks-v2')).client;
  projectId = await projectWithRegisters(client, MODEL);
});

afterAll(closeDb);

describe('version 2 risk and line fields', () => {
  it('import from a model file and export back to the same model', async () => {
    const exported = await client.get(url('export?format=model'));
    expect(exported.status).toBe(200);
    const { name: _n, ...back } = exported.json;
    // A post block makes two scenarios; the file names the headline one (before the response).
    // The export also states the project's own settings, as runs-fixtures creates the project.
    const project = { stage: 'Feasibility', estimateClass: 3, baseDate: '2027-03-01' };
    expect(back).toEqual({ ...MODEL, project, settings: { mitigation: 'pre' } });
  });

  it('reach the grid as cells, and the database as codes and distributions', async () => {
    const [r1, r2, r3] = await risksOf();
    expect(r1).toMatchObject({
      activityCodes: ['A2', 'A3'],
      itemCodes: ['1.1'],
      sizes: 'independent',
      postProbability: 0.15,
      postCostLow: 100_000,
      postCostMode: 200_000,
      postCostHigh: 400_000,
      mitigationType: 'triangular',
      mitigationLow: 40_000,
      mitigationCost: 55_000,
      mitigationHigh: 90_000,
    });
    expect(r2).toMatchObject({ costType: 'normal', costMean: -80_000, costSd: 20_000, delayLow: -10 });
    expect(r3).toMatchObject({
      delayType: 'lognormal',
      delayMean: 8,
      delaySd: 3,
      postDelayMean: 5,
      postDelaySd: 2,
      mitigationType: 'fixed',
      mitigationCost: 25_000,
    });
    expect((await itemsOf()).find((i) => i.code === '1.4')).toMatchObject({
      basis: 'per-project-day',
      activityCode: null,
      distType: 'fixed',
      mode: 6_000,
    });
    const stored = await rows<{
      code: string;
      activityCodes: unknown;
      mitigationCost: unknown;
      sizes: string;
    }>(
      'SELECT code, activityCodes, mitigationCost, sizes FROM RiskEvents WHERE projectId = ? ORDER BY sortOrder',
      [projectId],
    );
    const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);
    expect(stored.map((s) => [s.code, parse(s.activityCodes), parse(s.mitigationCost), s.sizes])).toEqual([
      ['R1', ['A2', 'A3'], MODEL.risks[0].mitigationCost, 'independent'],
      ['R2', ['A1'], null, 'linked'],
      ['R3', ['A3'], 25_000, 'linked'],
    ]);
  });

  it('save from the grid and read back unchanged', async () => {
    const [, r2] = await risksOf();
    const edited = {
      ...r2,
      activityCodes: ['A1', 'A2'],
      itemCodes: ['1.2'],
      sizes: 'independent',
      postProbability: 0.25,
      postCostMean: -60_000,
      postCostSd: 15_000,
      mitigationType: 'uniform',
      mitigationLow: 5_000,
      mitigationCost: null,
      mitigationHigh: 9_000,
    };
    const saved = await client.put(url(`risks/${r2.id}`), edited);
    expect(saved.status).toBe(200);
    const back = (await risksOf()).find((r) => r.code === 'R2')!;
    expect(strip(back)).toEqual(strip(edited));
    const line = {
      code: '1.5',
      description: 'Security',
      basis: 'per-project-day',
      distType: 'uniform',
      low: 800,
      high: 1_200,
    };
    const added = await client.post(url('items'), { upserts: [line] });
    expect(added.status).toBe(200);
    expect((await itemsOf()).find((i) => i.code === '1.5')).toMatchObject(line);
    // A per-project-day line refuses an activity; an unknown cost line is named.
    const refused = await client.post(url('items'), {
      upserts: [{ ...line, code: '1.6', activityCode: 'A1' }],
    });
    expect(refused.status).toBe(400);
    const unknown = await client.put(url(`risks/${r2.id}`), { ...back, itemCodes: ['9.9'] });
    expect(unknown.status).toBe(400);
    expect(unknown.json.error.message).toContain('unknown line item "9.9"');
  });

  it('round-trip through XLSX (every register) and CSV (one register)', async () => {
    const before = { items: (await itemsOf()).map(strip), risks: (await risksOf()).map(strip) };
    const xlsx = await download(client, url('export?format=xlsx'));
    expect(xlsx.status).toBe(200);
    const other = await projectWithRegisters(client, { ...MODEL, risks: [], correlations: [] });
    const committed = await upload(
      client,
      url('import', other),
      { name: 'back.xlsx', data: xlsx.bytes },
      {
        register: 'all',
        mode: 'commit',
      },
    );
    expect(committed.status).toBe(200);
    expect((await itemsOf(other)).map(strip)).toEqual(before.items);
    expect((await risksOf(other)).map(strip)).toEqual(before.risks);

    const csv = await download(client, url('export?format=csv&register=risks'));
    const text = new TextDecoder().decode(csv.bytes);
    expect(text).toContain('Activities');
    expect(text).toContain('"A2, A3"');
    const third = await projectWithRegisters(client, {
      ...MODEL,
      items: [...MODEL.items, { id: '1.5', name: 'Security', base: 1 }],
      risks: [],
      correlations: [],
    });
    const fromCsv = await upload(
      client,
      url('import', third),
      { name: 'risks.csv', data: csv.bytes },
      {
        register: 'risks',
        mode: 'commit',
      },
    );
    expect(fromCsv.status).toBe(200);
    expect((await risksOf(third)).map(strip)).toEqual(before.risks);
  });
});

describe('the status rules and a stored run', () => {
  let runProject: number;

  beforeAll(async () => {
    runProject = await projectWithRegisters(client, MODEL);
    const [r1, , r3] = await risksOf(runProject);
    expect((await client.put(url(`risks/${r1.id}`, runProject), { ...r1, status: 'occurred' })).status).toBe(
      200,
    );
    expect((await client.put(url(`risks/${r3.id}`, runProject), { ...r3, status: 'closed' })).status).toBe(
      200,
    );
  });

  it('count an occurred risk as certain and leave a closed one out with its correlation', async () => {
    const model = (await client.get(url('export?format=model', runProject))).json;
    const r1 = model.risks.find((r: { id: string }) => r.id === 'R1');
    expect(r1.probability).toBe(1);
    expect(r1.post.probability).toBe(1);
    expect(model.risks.map((r: { id: string }) => r.id)).toEqual(['R1', 'R2']);
    expect(model.correlations).toEqual([{ a: '1.1', b: 'A2', rho: 0.4 }]);
  });

  it('store the notices with the run, and the run equals the command line on its snapshot', async () => {
    const started = await client.post(url('runs', runProject), {
      iterations: 3_000,
      seed: 2026,
      sampling: 'lhs',
      riskValues: 'post',
    });
    expect(started.status).toBe(201);
    const notices = [
      'Risk R1 (Obstructions in the bed) has occurred: it counts as certain (probability 100%) until it is moved into the base estimate.',
      'Risk R3 (Tidal window lost) is closed: it is left out of the model.',
      'The correlation R1–R3 (ρ 0.5) is left out of the model: risk R3 is closed.',
    ];
    expect(started.json.run.notices).toEqual(notices);
    const runId = started.json.run.id;
    const done = await waitForRun(client, runProject, runId, (r) =>
      ['succeeded', 'failed'].includes(r.status),
    );
    expect(done.status).toBe('succeeded');
    expect(done.modelNotices).toEqual(notices);

    const snapshot = await client.get(url(`runs/${runId}/snapshot`, runProject));
    expect(snapshot.json.settings).toEqual({
      mitigation: 'post',
      iterations: 3_000,
      seed: 2026,
      sampling: 'lhs',
      contingencyLevel: 'P80',
      jointConfidence: 0.7,
    });
    const dir = mkdtempSync(path.join(tmpdir(), 'outturn-v2-'));
    const file = path.join(dir, 'snapshot.json');
    const out = path.join(dir, 'result.json');
    writeFileSync(file, snapshot.text);
    // The command line's bundle (built with the app); the TypeScript entry when it is absent.
    const bundle = '.build/simulate.mjs';
    const [cmd, args] = existsSync(bundle)
      ? ['node', [bundle, file, '--out', out]]
      : ['node_modules/.bin/tsx', ['scripts/simulate.ts', file, '--out', out]];
    await exec(cmd, args, { cwd: process.cwd(), timeout: 120_000 });
    const { elapsedMs: _c, ...cli } = JSON.parse(readFileSync(out, 'utf8'));
    const stored = (await client.get(url(`runs/${runId}/result`, runProject))).json.result;
    const { elapsedMs: _s, ...app } = stored;
    expect(app).toEqual(cli);
    // Both scenarios are there, the response's cost counted after it.
    expect(app.mitigation.used).toBe('post');
    expect(app.mitigation.pre.cost.mean).not.toBe(app.mitigation.post.cost.mean);
  });
});
