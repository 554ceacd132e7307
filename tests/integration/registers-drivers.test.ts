// The drivers register through the app: a grid save, the cell rules, correlations that name a
// driver, a WBS branch stored as typed and resolved when the model is built, CSV, XLSX and
// model-file round trips, and the run snapshot. A percentage change c is the factor 1 + c/100
// (the definition; common practice).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { newOrganisation, type Client } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';
import { download, upload } from './helpers/files';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

const MODEL = {
  format: 'outturn-model',
  version: 1,
  name: 'Drivers test',
  currency: 'EUR',
  items: [
    {
      id: '1.1',
      name: 'Site set-up',
      dist: { type: 'triangular', low: 90_000, mode: 100_000, high: 130_000 },
    },
    { id: '3.1', name: 'Piling', dist: { type: 'pert', low: 800_000, mode: 900_000, high: 1_300_000 } },
    { id: '3.2', name: 'Slab', dist: { type: 'pert', low: 400_000, mode: 450_000, high: 600_000 } },
  ],
  risks: [
    {
      id: 'R1',
      name: 'Obstructions',
      probability: 0.3,
      cost: { type: 'uniform', low: 50_000, high: 150_000 },
    },
  ],
  activities: [
    {
      id: 'A1',
      name: 'Piling works',
      duration: { type: 'triangular', low: 20, mode: 25, high: 40 },
      predecessors: [],
    },
    {
      id: 'A2',
      name: 'Slab works',
      duration: { type: 'triangular', low: 15, mode: 20, high: 30 },
      predecessors: ['A1'],
    },
  ],
  correlations: [],
};

const GROUND = {
  code: 'D1',
  name: 'Ground conditions',
  standsFor: 'Made ground across the piling area',
  distType: 'triangular',
  range: 'min-max',
  entry: 'change',
  low: '-5%',
  mode: '0%',
  high: '+20%',
  applies: '3.*, A1',
};

const strip = (r: Record<string, unknown>) => {
  const { id: _i, version: _v, sortOrder: _s, ...rest } = r;
  return rest;
};

/** A JSON column, as the driver hands it back (text or already parsed). */
const parsed = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

let client: Client;
let projectId: number;
const url = (path: string) => `/api/projects/${projectId}${path}`;

beforeAll(async () => {
  client = (await newOrganisation('drivers')).client;
  projectId = await projectWithRegisters(client, MODEL);
});

afterAll(closeDb);

describe('the drivers register', () => {
  it('saves a driver typed as changes, stores factors and the branch as typed, 100% when no probability is given', async () => {
    const saved = await client.post(url('/drivers'), { upserts: [GROUND] });
    expect(saved.status).toBe(200);
    expect(saved.json.rows[0]).toMatchObject({
      code: 'D1',
      probability: 1,
      low: 0.95,
      mode: 1,
      high: 1.2,
      entry: 'change',
      applies: ['3.*', 'A1'],
    });
    const [stored] = await rows<{ applies: unknown; factor: unknown }>(
      'SELECT applies, factor FROM RiskDrivers WHERE projectId = ?',
      [projectId],
    );
    expect(parsed(stored.applies)).toEqual(['3.*', 'A1']);
    expect(parsed(stored.factor)).toEqual({ type: 'triangular', low: 0.95, mode: 1, high: 1.2 });
  });

  it('refuses a factor that can go below zero, unknown codes and codes of other registers, naming each, and writes nothing', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ code: 'D2', range: 'p10-p90', low: 0.3, mode: 1, high: 1.7 }, 'lets the factor go below zero'],
      [{ code: 'D2', low: -0.2 }, 'below zero'],
      [{ code: 'D2', applies: '3.*, C99' }, 'unknown code "C99"'],
      [{ code: 'D2', applies: '7.*' }, '"7.*" covers no line item or activity'],
      [{ code: 'D2', applies: 'R1' }, 'R1 is not a line item or an activity'],
      [{ code: '1.1' }, '1.1 is already the code of a line item'],
    ];
    for (const [change, message] of cases) {
      const res = await client.post(url('/drivers'), { upserts: [{ ...GROUND, ...change }] });
      expect(res.status, message).toBe(400);
      expect(res.json.error.message).toContain(message);
    }
    expect(await count('RiskDrivers', 'projectId = ?', [projectId])).toBe(1);
  });

  it('lets a correlation name a driver, and refuses one that names an unknown driver', async () => {
    const ok = await client.post(url('/correlations'), { upserts: [{ aCode: 'D1', bCode: 'R1', rho: 0.5 }] });
    expect(ok.status).toBe(200);
    const bad = await client.post(url('/correlations'), {
      upserts: [{ aCode: 'D9', bCode: 'R1', rho: 0.5 }],
    });
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toContain('unknown input "D9"');
  });

  it('resolves the branch when the model is built, so a line added under it joins; renames carry into the list', async () => {
    expect(
      (
        await client.post(url('/items'), {
          upserts: [{ code: '3.3', description: 'Walls', distType: 'fixed', mode: 50_000 }],
        })
      ).status,
    ).toBe(200);
    const a1 = (await client.get(url('/activities'))).json.rows.find(
      (r: { code: string }) => r.code === 'A1',
    );
    const renamed = await client.put(url(`/activities/${a1.id}`), { ...a1, code: 'A1P' });
    expect(renamed.status).toBe(200);
    expect(renamed.json.row.code).toBe('A1P');
    const driver = (await client.get(url('/drivers'))).json.rows[0];
    expect(driver.applies).toEqual(['3.*', 'A1P']);
    const model = (await client.get(url('/export?format=model'))).json;
    expect(model.version).toBe(2);
    expect(model.drivers).toEqual([
      {
        id: 'D1',
        name: 'Ground conditions',
        factor: { type: 'triangular', low: 0.95, mode: 1, high: 1.2 },
        applies: ['3.1', '3.2', '3.3', 'A1P'],
      },
    ]);
    expect(model.correlations).toContainEqual({ a: 'D1', b: 'R1', rho: 0.5 });
  });

  it('goes out to CSV and back unchanged', async () => {
    const before = (await client.get(url('/drivers'))).json.rows;
    const csv = await client.get(url('/export?format=csv&register=drivers'));
    expect(csv.status).toBe(200);
    expect(csv.text).toContain('Applies to');
    expect(csv.text).toContain('"3.*, A1P"');
    const edited = csv.text.replace('Ground conditions', 'Ground and groundwater');
    const back = await upload(
      client,
      url('/import'),
      { name: 'drivers.csv', data: edited },
      { register: 'drivers', mode: 'commit' },
    );
    expect(back.status).toBe(200);
    expect(back.json.sheets[0]).toMatchObject({ created: 0, updated: 1 });
    const after = (await client.get(url('/drivers'))).json.rows;
    expect(after.map(strip)).toEqual(
      before.map((r: Record<string, unknown>) => ({ ...strip(r), name: 'Ground and groundwater' })),
    );
  });

  it('reads a CSV range typed as percentage changes and names a bad cell by line', async () => {
    const csv =
      'Code,Name,Distribution,Low,Most likely,High,Applies to\nD5,Market,uniform,-10%,,+15%,"3.1, 3.2"\nD6,Bad,triangular,0.9,1,lots,3.1\n';
    const preview = await upload(
      client,
      url('/import'),
      { name: 'd.csv', data: csv },
      { register: 'drivers', mode: 'preview' },
    );
    expect(preview.status).toBe(200);
    expect(preview.json.sheets[0]).toMatchObject({ total: 2, valid: 1, invalid: 1 });
    const commit = await upload(
      client,
      url('/import'),
      { name: 'd.csv', data: csv },
      { register: 'drivers', mode: 'commit' },
    );
    expect(commit.status).toBe(400);
    expect(commit.json.error.message).toContain('CSV, line 3 (D6), high');
    const good = await upload(
      client,
      url('/import'),
      { name: 'd.csv', data: csv.split('\n').slice(0, 2).join('\n') },
      { register: 'drivers', mode: 'commit' },
    );
    expect(good.status).toBe(200);
    const market = (await client.get(url('/drivers'))).json.rows.find(
      (r: { code: string }) => r.code === 'D5',
    );
    expect(market).toMatchObject({ distType: 'uniform', low: 0.9, high: 1.15, applies: ['3.1', '3.2'] });
  });

  it('goes out to XLSX and into another project unchanged', async () => {
    const before = (await client.get(url('/drivers'))).json.rows;
    const file = await download(client, url('/export?format=xlsx'));
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(file.bytes.buffer as ArrayBuffer);
    expect(wb.getWorksheet('Drivers')!.getRow(1).values).toContain('Applies to');
    const other = await projectWithRegisters(client, MODEL);
    const commit = await upload(
      client,
      `/api/projects/${other}/import`,
      { name: 'all.xlsx', data: file.bytes },
      { register: 'all', mode: 'commit' },
    );
    expect(commit.status).toBe(200);
    const copied = (await client.get(`/api/projects/${other}/drivers`)).json.rows;
    expect(copied.map(strip)).toEqual(before.map(strip));
    expect(
      (await client.get(`/api/projects/${other}/correlations`)).json.rows.map(
        (r: { aCode: string }) => r.aCode,
      ),
    ).toContain('D1');
  });

  it('goes out in the model file and back into another project, which exports the same model', async () => {
    const model = (await client.get(url('/export?format=model'))).json;
    const other = await projectWithRegisters(client, MODEL);
    const imported = await client.post(`/api/projects/${other}/import`, model);
    expect(imported.status).toBe(200);
    expect(imported.json.imported.drivers).toBe(model.drivers.length);
    const again = (await client.get(`/api/projects/${other}/export?format=model`)).json;
    expect(again.drivers).toEqual(model.drivers);
    expect(again.correlations).toEqual(model.correlations);
  });

  it('puts the drivers into a run snapshot, and the run names the driver among what moves cost', async () => {
    const started = await client.post(url('/runs'), { iterations: 2000, seed: 7 });
    expect(started.status).toBe(201);
    await waitForRun(client, projectId, started.json.run.id, (r) => r.status === 'succeeded');
    const snapshot = JSON.parse((await client.get(url(`/runs/${started.json.run.id}/snapshot`))).text);
    const model = (await client.get(url('/export?format=model'))).json;
    expect(snapshot.drivers).toEqual(model.drivers);
    const [stored] = await rows<{ result: string }>('SELECT result FROM SimulationRuns WHERE id = ?', [
      started.json.run.id,
    ]);
    const result = parsed(stored.result);
    expect(result.sensitivity.cost.find((s: { id: string }) => s.id === 'D1')).toMatchObject({
      kind: 'driver',
    });
  });
});
