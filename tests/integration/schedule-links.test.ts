// Link types, leads and lags, and probabilistic branches through the product: the model file,
// the schedule register as CSV and XLSX, and the run's input snapshot all carry them unchanged.
import { beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { APP_URL, newOrganisation, type Client } from './helpers/http';
import { rows } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';
import { deckActivities, deckModel } from '../fixtures/deck-links-model';

const activities = deckActivities;
const model = deckModel;

async function upload(
  client: Client,
  path: string,
  name: string,
  data: Uint8Array | string,
  register: string,
) {
  const form = new FormData();
  form.set('file', new Blob([data as BlobPart]), name);
  form.set('register', register);
  form.set('mode', 'commit');
  const cookies = (client as any).cookies as Map<string, string>;
  const res = await fetch(APP_URL + path, {
    method: 'POST',
    body: form,
    headers: { cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
  });
  return { status: res.status, text: await res.text() };
}

async function download(client: Client, path: string) {
  const cookies = (client as any).cookies as Map<string, string>;
  const res = await fetch(APP_URL + path, {
    headers: { cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
  });
  return new Uint8Array(await res.arrayBuffer());
}

const strip = (r: any) => {
  const { id: _i, version: _v, sortOrder: _s, ...rest } = r;
  return rest;
};

describe('link types and branches in the product', () => {
  let client: Client;
  let projectId: number;

  beforeAll(async () => {
    client = (await newOrganisation('schedule-links')).client;
    projectId = await projectWithRegisters(client, model);
  });

  it('stores each link with its type and lag, and the existence, as the grid reads them', async () => {
    const res = await client.get(`/api/projects/${projectId}/activities`);
    expect(res.status).toBe(200);
    const byCode = Object.fromEntries(res.json.rows.map((r: any) => [r.code, r]));
    expect(byCode.A2.predecessors).toEqual([
      { code: 'A1', type: 'SS', lag: 2 },
      { code: 'A1', type: 'FF', lag: 7 },
    ]);
    expect(byCode.A4.predecessors).toEqual([
      { code: 'A3', lag: 0 },
      { code: 'A2', lag: -1 },
      { code: 'A1', type: 'SF', lag: 20 },
    ]);
    expect(byCode.A3.existence).toBe(0.25);
    expect(byCode.A1.existence).toBeNull();
  });

  it('exports the model file with the same links and branches', async () => {
    const exported = await client.get(`/api/projects/${projectId}/export?format=model`);
    expect(exported.status).toBe(200);
    expect(exported.json.activities).toEqual(activities);
    expect(exported.json.correlations).toEqual([{ a: 'A1', b: 'A3 (existence)', rho: 0.5 }]);
  });

  it('writes the notation to CSV and reads it back into another project unchanged', async () => {
    const csv = await client.get(`/api/projects/${projectId}/export?format=csv&register=activities`);
    expect(csv.status).toBe(200);
    expect(csv.text).toContain('"A1 SS+2, A1 FF+7"');
    expect(csv.text).toContain('"A3, A2-1, A1 SF+20"');
    const before = (await client.get(`/api/projects/${projectId}/activities`)).json.rows.map(strip);

    const other = await projectWithRegisters(client, {
      ...model,
      items: [],
      activities: [],
      correlations: [],
    });
    const back = await upload(
      client,
      `/api/projects/${other}/import`,
      'schedule.csv',
      csv.text,
      'activities',
    );
    expect(back.status).toBe(200);
    expect((await client.get(`/api/projects/${other}/activities`)).json.rows.map(strip)).toEqual(before);
  });

  it('round-trips the links and the existence through XLSX', async () => {
    const bytes = await download(client, `/api/projects/${projectId}/export?format=xlsx`);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes.buffer as ArrayBuffer);
    const sheet = wb.getWorksheet('Schedule')!;
    const headers = (sheet.getRow(1).values as unknown[]).map(String);
    expect(headers).toContain('Existence');
    const before = (await client.get(`/api/projects/${projectId}/activities`)).json.rows.map(strip);

    const other = await projectWithRegisters(client, {
      ...model,
      items: [],
      activities: [],
      correlations: [],
    });
    const back = await upload(client, `/api/projects/${other}/import`, 'all.xlsx', bytes, 'all');
    expect(back.status).toBe(200);
    expect((await client.get(`/api/projects/${other}/activities`)).json.rows.map(strip)).toEqual(before);
    const correlations = (await client.get(`/api/projects/${other}/correlations`)).json.rows;
    expect(correlations.map((r: any) => [r.aCode, r.bCode, r.rho])).toEqual([['A1', 'A3 (existence)', 0.5]]);
  });

  it("freezes the links and the branch into the run's input snapshot", async () => {
    const started = await client.post(`/api/projects/${projectId}/runs`, {
      iterations: 2000,
      seed: 7,
      sampling: 'lhs',
    });
    expect(started.status).toBe(201);
    const runId = started.json.run.id;
    await waitForRun(client, projectId, runId, (r) => r.status === 'succeeded');
    const snapshot = await client.get(`/api/projects/${projectId}/runs/${runId}/snapshot`);
    expect(JSON.parse(snapshot.text).activities).toEqual(activities);
    expect(JSON.parse(snapshot.text).correlations).toEqual(model.correlations);
    const [stored] = await rows<{ result: string | object }>(
      'SELECT result FROM SimulationRuns WHERE id = ?',
      [runId],
    );
    const result = typeof stored.result === 'string' ? JSON.parse(stored.result) : stored.result;
    // The base by hand (precedence diagramming rules): A1 0–10; A2 (7 d) SS+2 and FF+7 from A1
    // starts at 10 and finishes at 17; the branch A3 is left out of the base (0 days) but passes
    // its link through, 17–17; A4 (5 d) starts after A3 at 17 (the lead from A2 allows 16, the
    // SF+20 from A1's start a finish from 20) and finishes at 22.
    expect(result.duration.base).toBe(22);
  });
});
