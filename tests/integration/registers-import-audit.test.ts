// A file meant for another register is named for what it looks like, in one message; and the
// audit trail holds only changes: a save that changes no field leaves no entry.
import { beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { newOrganisation, type Client } from './helpers/http';
import { upload as uploadFile } from './helpers/files';
import { count } from './helpers/db';

const settings = (code: string) => ({
  name: `Import and audit ${code}`,
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

const upload = (
  client: Client,
  path: string,
  name: string,
  data: Uint8Array | string,
  register: string,
  mode: string,
) => uploadFile(client, path, { name, data }, { register, mode });

// 56 lines as the line-items export writes them (the headers of lib/registers/columns.ts).
const lineItemsCsv = [
  'WBS code,Description,Basis,Distribution,Low,Most likely,High,Base',
  ...Array.from({ length: 56 }, (_, i) => `3.${i + 1},Line ${i + 1},Lump sum,triangular,100,120,200,`),
].join('\n');

describe('a file chosen on the wrong register', () => {
  let client: Client;
  let projectId: number;
  beforeAll(async () => {
    client = (await newOrganisation('import-kind')).client;
    projectId = (await client.post('/api/projects', settings('IK-1'))).json.project.id;
  });

  it('says that a line-items CSV dropped on the risk register looks like a line-items file, once', async () => {
    for (const mode of ['preview', 'commit']) {
      const res = await upload(
        client,
        `/api/projects/${projectId}/import`,
        'lines.csv',
        lineItemsCsv,
        'risks',
        mode,
      );
      expect(res.status).toBe(400);
      expect(res.json.error.message).toContain('looks like a line items file');
      expect(res.json.error.message).toContain('Line items tab');
      expect(res.json.error.message).not.toContain('undefined');
      expect(res.json.error.issues).toHaveLength(1);
    }
    expect(await count('RiskEvents', 'projectId = ?', [projectId])).toBe(0);
    // The same file on its own register imports.
    const right = await upload(
      client,
      `/api/projects/${projectId}/import`,
      'lines.csv',
      lineItemsCsv,
      'items',
      'commit',
    );
    expect(right.status).toBe(200);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(56);
  });

  it('names the sheet of a workbook whose only sheet is a schedule', async () => {
    const wb = new ExcelJS.Workbook();
    const sheet = wb.addWorksheet('Schedule');
    sheet.addRow(['Code', 'Name', 'Distribution', 'Low', 'Most likely', 'High', 'Predecessors']);
    sheet.addRow(['A1', 'Mobilise', 'pert', 5, 8, 14, '']);
    const data = new Uint8Array(await wb.xlsx.writeBuffer());
    const res = await upload(
      client,
      `/api/projects/${projectId}/import`,
      'plan.xlsx',
      data,
      'risks',
      'preview',
    );
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/^Sheet "Schedule" looks like a schedule file/);
  });
});

describe('the audit trail records no save that changed nothing', () => {
  let client: Client;
  let projectId: number;
  const entries = (entity: string) =>
    count('AuditEntries', 'projectId = ? AND entity = ?', [projectId, entity]);

  beforeAll(async () => {
    client = (await newOrganisation('audit-nochange')).client;
    projectId = (await client.post('/api/projects', settings('AN-1'))).json.project.id;
  });

  it('leaves no entry for notes or settings saved unchanged, and one for a real change', async () => {
    const notes = (await client.get(`/api/projects/${projectId}/notes`)).json.notes;
    const first = await client.put(`/api/projects/${projectId}/notes`, {
      assumptions: 'Dry season works.',
      version: notes.version,
    });
    expect(first.status).toBe(200);
    expect(await entries('project-notes')).toBe(1);
    const again = await client.put(`/api/projects/${projectId}/notes`, {
      assumptions: 'Dry season works.',
      exclusions: '',
      version: first.json.notes.version,
    });
    expect(again.status).toBe(200);
    expect(await entries('project-notes')).toBe(1);

    const project = (await client.get(`/api/projects/${projectId}`)).json.project;
    const projectEntries = await entries('project');
    const same = await client.put(`/api/projects/${projectId}`, {
      ...settings('AN-1'),
      version: project.version,
    });
    expect(same.status).toBe(200);
    expect(await entries('project')).toBe(projectEntries);
    const renamed = await client.put(`/api/projects/${projectId}`, {
      ...settings('AN-1'),
      name: 'Renamed',
      version: same.json.project.version,
    });
    expect(renamed.status).toBe(200);
    expect(await entries('project')).toBe(projectEntries + 1);
  });

  it('leaves no entry for a register row saved with the same values', async () => {
    const url = `/api/projects/${projectId}/items`;
    const made = await client.post(url, {
      upserts: [
        { key: 'a', code: '1.1', description: 'Piling', distType: 'triangular', low: 1, mode: 2, high: 3 },
      ],
    });
    expect(made.status).toBe(200);
    const row = made.json.rows[0];
    const before = await entries('cost-item');
    const unchanged = await client.post(url, { upserts: [{ ...row }] });
    expect(unchanged.status).toBe(200);
    expect(await entries('cost-item')).toBe(before);
    const changed = await client.post(url, { upserts: [{ ...row, description: 'Bored piling' }] });
    expect(changed.status).toBe(200);
    expect(await entries('cost-item')).toBe(before + 1);
  });
});
