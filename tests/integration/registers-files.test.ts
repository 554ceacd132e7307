import { describe, expect, it, beforeAll } from 'vitest';
import ExcelJS from 'exceljs';
import { newOrganisation, type Client } from './helpers/http';
import { download, upload } from './helpers/files';
import { count } from './helpers/db';

const projectInput = (code: string) => ({
  name: `Files test ${code}`,
  code,
  currency: 'EUR',
  estimateClass: 3,
  stage: 'Feasibility',
  baseDate: '2027-01-04',
});

const model = {
  format: 'outturn-model',
  version: 1,
  name: 'Round trip',
  currency: 'EUR',
  items: [
    {
      id: '1.1',
      name: 'Earthworks',
      base: 1200000,
      dist: { type: 'pert', low: 1000000, mode: 1200000, high: 1800000 },
    },
    {
      id: '1.2',
      name: 'Site staff',
      ratePerDay: { type: 'triangular', low: 4000, mode: 5000, high: 7000 },
      activity: 'A2',
    },
    { id: '1.3', name: 'Crane', dist: { type: 'lognormal', p10: 80000, p90: 160000 } },
    { id: '1.4', name: 'Fee', dist: { type: 'normal', mean: 300000, sd: 20000 } },
    { id: '1.5', name: 'Licence', base: 25000 },
    {
      id: '1.6',
      name: 'Ranges as P10–P90',
      dist: { type: 'triangular', low: 90, mode: 100, high: 130, range: 'p10-p90' },
    },
  ],
  risks: [
    {
      id: 'R1',
      name: 'Rock',
      probability: 0.3,
      cost: { type: 'pert', low: 50000, mode: 100000, high: 300000 },
      delay: { type: 'triangular', low: 5, mode: 10, high: 30 },
      activity: 'A2',
    },
  ],
  activities: [
    {
      id: 'A1',
      name: 'Design',
      duration: { type: 'triangular', low: 20, mode: 30, high: 50 },
      predecessors: [],
    },
    {
      id: 'A2',
      name: 'Build',
      duration: { type: 'pert', low: 100, mode: 120, high: 180 },
      predecessors: [{ id: 'A1', lag: 5 }],
    },
  ],
  correlations: [{ a: '1.1', b: 'A2', rho: 0.4 }],
};

describe('import and export', () => {
  let client: Client;
  let projectId: number;

  beforeAll(async () => {
    client = (await newOrganisation('reg-files')).client;
    projectId = (await client.post('/api/projects', projectInput('FIL-1'))).json.project.id;
  });

  it('imports a model file and exports it back unchanged', async () => {
    const imported = await client.request(`/api/projects/${projectId}/import`, {
      method: 'POST',
      body: model,
    });
    expect(imported.status).toBe(200);
    expect(imported.json.imported).toEqual({
      items: 6,
      risks: 1,
      activities: 2,
      correlations: 1,
      drivers: 0,
    });
    const exported = await client.get(`/api/projects/${projectId}/export?format=model`);
    expect(exported.status).toBe(200);
    expect(exported.headers.get('content-disposition')).toContain('FIL-1-model.json');
    const { name: _n, ...back } = exported.json;
    const { name: _m, ...sent } = model;
    // The registers write version 2: a risk names its activities as a list.
    const { activity: _a, ...risk } = sent.risks[0];
    // The export also states the project's own settings (projectInput above).
    const project = { stage: 'Feasibility', estimateClass: 3, baseDate: '2027-01-04' };
    expect(back).toEqual({ ...sent, version: 2, project, risks: [{ ...risk, activities: ['A2'] }] });
    expect(
      await count('AuditEntries', "projectId = ? AND entity = 'model' AND action = 'import'", [projectId]),
    ).toBe(1);
  });

  it('refuses an invalid model file naming the entry and leaves the registers as they were', async () => {
    const bad = {
      ...model,
      items: [...model.items, { id: '1.9', dist: { type: 'triangular', low: 5, mode: 9, high: 1 } }],
    };
    const res = await client.request(`/api/projects/${projectId}/import`, { method: 'POST', body: bad });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toContain('items[6] (1.9).dist.high');
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(6);
  });

  it('exports XLSX with every register and imports it back to the same rows', async () => {
    const before = {
      items: (await client.get(`/api/projects/${projectId}/items`)).json.rows,
      risks: (await client.get(`/api/projects/${projectId}/risks`)).json.rows,
    };
    const file = await download(client, `/api/projects/${projectId}/export?format=xlsx`);
    expect(file.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(file.bytes.buffer as ArrayBuffer);
    expect(wb.worksheets.map((w) => w.name)).toEqual([
      'Line items',
      'Risk events',
      'Schedule',
      'Correlations',
      'Drivers',
    ]);
    expect(wb.getWorksheet('Schedule')!.getRow(3).getCell(10).value).toBe('A1+5');

    const other = (await client.post('/api/projects', projectInput('FIL-2'))).json.project.id;
    const preview = await upload(
      client,
      `/api/projects/${other}/import`,
      { name: 'back.xlsx', data: file.bytes },
      { register: 'all', mode: 'preview' },
    );
    expect(preview.status).toBe(200);
    expect(preview.json.sheets.map((s: any) => [s.kind, s.total, s.invalid])).toEqual([
      ['items', 6, 0],
      ['risks', 1, 0],
      ['activities', 2, 0],
      ['correlations', 1, 0],
      ['drivers', 0, 0],
    ]);
    expect(await count('CostItems', 'projectId = ?', [other])).toBe(0);
    const commit = await upload(
      client,
      `/api/projects/${other}/import`,
      { name: 'back.xlsx', data: file.bytes },
      { register: 'all', mode: 'commit' },
    );
    expect(commit.status).toBe(200);
    const strip = (r: any) => {
      const { id: _i, version: _v, sortOrder: _s, ...rest } = r;
      return rest;
    };
    expect((await client.get(`/api/projects/${other}/items`)).json.rows.map(strip)).toEqual(
      before.items.map(strip),
    );
    expect((await client.get(`/api/projects/${other}/risks`)).json.rows.map(strip)).toEqual(
      before.risks.map(strip),
    );
  });

  it('escapes formula-like text in CSV downloads and reads it back as text', async () => {
    const items = (await client.get(`/api/projects/${projectId}/items`)).json.rows;
    const first = items[0];
    const res = await client.put(`/api/projects/${projectId}/items/${first.id}`, {
      ...first,
      description: '=HYPERLINK("x")',
      notes: '@SUM(1)',
    });
    expect(res.status).toBe(200);
    const csv = await client.get(`/api/projects/${projectId}/export?format=csv&register=items`);
    expect(csv.status).toBe(200);
    expect(csv.text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(csv.text).toContain(`'@SUM(1)`);
    expect(csv.text).not.toMatch(/(^|,)=HYPERLINK/m);
    const back = await upload(
      client,
      `/api/projects/${projectId}/import`,
      { name: 'items.csv', data: csv.text },
      { register: 'items', mode: 'commit' },
    );
    expect(back.status).toBe(200);
    expect(back.json.sheets[0]).toMatchObject({ created: 0, updated: 6 });
    const again = (await client.get(`/api/projects/${projectId}/items`)).json.rows[0];
    expect(again.description).toBe('=HYPERLINK("x")');
  });

  it('previews row-by-row problems and refuses to commit any of a file with one bad row', async () => {
    const csv =
      'WBS,Description,Distribution,Low,Most likely,High\n5.1,Good,triangular,1,2,3\n5.2,Bad,triangular,5,9,1\n';
    const preview = await upload(
      client,
      `/api/projects/${projectId}/import`,
      { name: 'bad.csv', data: csv },
      { register: 'items', mode: 'preview' },
    );
    expect(preview.status).toBe(200);
    const sheet = preview.json.sheets[0];
    expect(sheet).toMatchObject({ total: 2, valid: 1, invalid: 1, creates: 2 });
    expect(sheet.rows.find((r: any) => r.line === 3).issues.high).toContain('greater than low');
    const commit = await upload(
      client,
      `/api/projects/${projectId}/import`,
      { name: 'bad.csv', data: csv },
      { register: 'items', mode: 'commit' },
    );
    expect(commit.status).toBe(400);
    expect(commit.json.error.message).toContain('CSV, line 3 (5.2), high');
    expect(await count('CostItems', "projectId = ? AND code LIKE '5.%'", [projectId])).toBe(0);
  });

  it('refuses files over 20,000 rows or 10 MB with a clear message', async () => {
    const many = [
      'WBS,Description,Distribution,Most likely',
      ...Array.from({ length: 20_001 }, (_, i) => `X${i},Line,fixed,1`),
    ].join('\n');
    const rowsRes = await upload(
      client,
      `/api/projects/${projectId}/import`,
      { name: 'many.csv', data: many },
      { register: 'items', mode: 'preview' },
    );
    expect(rowsRes.status).toBe(400);
    expect(rowsRes.json.error.message).toContain('20,001 rows; up to 20,000 rows');
    const big = 'WBS,Description\n' + 'x'.repeat(10 * 1024 * 1024 + 10);
    const sizeRes = await upload(
      client,
      `/api/projects/${projectId}/import`,
      { name: 'big.csv', data: big },
      { register: 'items', mode: 'preview' },
    );
    expect(sizeRes.status).toBe(413);
    expect(sizeRes.json.error.message).toContain('files up to 10 MB');
  });
});
