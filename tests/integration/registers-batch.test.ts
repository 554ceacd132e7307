import { describe, expect, it, beforeAll } from 'vitest';
import mariadb from 'mariadb';
import { newOrganisation, type Client } from './helpers/http';
import { count, rows } from './helpers/db';

const projectInput = (code: string) => ({
  name: `Register test ${code}`,
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

const line = (code: string, extra: object = {}) => ({
  code,
  description: `Line ${code}`,
  distType: 'triangular',
  low: 100,
  mode: 120,
  high: 200,
  ...extra,
});
const activity = (code: string, predecessors: { code: string; lag: number }[] = []) => ({
  code,
  name: `Activity ${code}`,
  distType: 'pert',
  low: 5,
  mode: 10,
  high: 20,
  predecessors,
});

describe('saving register rows', () => {
  let client: Client;
  let projectId: number;
  let url: (r: string) => string;

  beforeAll(async () => {
    client = (await newOrganisation('reg-batch')).client;
    projectId = (await client.post('/api/projects', projectInput('BAT-1'))).json.project.id;
    url = (r) => `/api/projects/${projectId}/${r}`;
  });

  it('refuses invalid rows with 400 naming the row and the field, and writes none of the batch', async () => {
    const res = await client.post(url('items'), {
      upserts: [line('1.1'), line('1.2', { mode: 300 }), line('1.3', { low: 'abc' })],
    });
    expect(res.status).toBe(400);
    const paths = res.json.error.issues.map((i: any) => i.path);
    expect(paths).toEqual(['rows[1].mode', 'rows[2].low']);
    expect(res.json.error.issues[0].message).toMatch(/^Row 2 \(1\.2\), mode: .*between low and high/);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(0);
  });

  it('rolls back the whole batch when a cross-row rule fails after the first rows', async () => {
    const res = await client.post(url('items'), {
      upserts: [
        line('2.1'),
        line('2.2', { basis: 'per-day', activityCode: 'Z9', distType: 'fixed', mode: 900 }),
      ],
    });
    expect(res.status).toBe(400);
    expect(res.json.error.issues[0]).toMatchObject({ path: 'rows[1].activityCode' });
    expect(res.json.error.message).toContain('unknown activity "Z9"');
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(0);
    expect(await count('AuditEntries', "projectId = ? AND entity = 'cost-item'", [projectId])).toBe(0);
  });

  it('saves a valid batch, audits each row and answers 409 with the current row on a stale version', async () => {
    const saved = await client.post(url('items'), {
      upserts: [line('3.1', { key: 'a' }), line('3.2', { key: 'b' })],
    });
    expect(saved.status).toBe(200);
    expect(saved.json.rows.map((r: any) => r.key)).toEqual(['a', 'b']);
    const [first] = saved.json.rows;
    expect(
      await count('AuditEntries', "projectId = ? AND entity = 'cost-item' AND action = 'create'", [
        projectId,
      ]),
    ).toBe(2);

    const mine = await client.put(`${url('items')}/${first.id}`, { ...first, base: 150 });
    expect(mine.status).toBe(200);
    expect(mine.json.row).toMatchObject({ base: 150, version: 2 });

    const stale = await client.put(`${url('items')}/${first.id}`, { ...first, base: 175 });
    expect(stale.status).toBe(409);
    expect(stale.json.error.details.conflicts[0].current).toMatchObject({
      id: first.id,
      version: 2,
      base: 150,
    });
    const [row] = await rows<{ base: number; version: number }>(
      'SELECT base, version FROM CostItems WHERE id = ?',
      [first.id],
    );
    expect(row).toEqual({ base: 150, version: 2 });

    const audit = await rows<{ before: string; after: string }>(
      "SELECT `before`, `after` FROM AuditEntries WHERE projectId = ? AND entity = 'cost-item' AND action = 'update'",
      [projectId],
    );
    expect(audit).toHaveLength(1);
    const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);
    expect(parse(audit[0].before).base).toBeNull();
    expect(parse(audit[0].after).base).toBe(150);
  });

  it('rolls back a multi-row delete when one row is stale', async () => {
    const list = (await client.get(url('items'))).json.rows;
    const res = await client.post(url('items'), {
      deletes: list.map((r: any, i: number) => ({ id: r.id, version: i === 0 ? r.version + 7 : r.version })),
    });
    expect(res.status).toBe(409);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(list.length);
    const del = await client.del(`${url('items')}/${list[1].id}?version=${list[1].version}`);
    expect(del.status).toBe(200);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(list.length - 1);
    expect((await client.del(`${url('items')}/${list[0].id}`)).status).toBe(400);
  });

  it('names the activities of a cycle and refuses it', async () => {
    const made = await client.post(url('activities'), {
      upserts: [
        activity('A1'),
        activity('A2', [{ code: 'A1', lag: 0 }]),
        activity('A3', [{ code: 'A2', lag: 5 }]),
      ],
    });
    expect(made.status).toBe(200);
    const a1 = made.json.rows.find((r: any) => r.code === 'A1');
    const cycle = await client.put(`${url('activities')}/${a1.id}`, {
      ...a1,
      predecessors: [{ code: 'A3', lag: 0 }],
    });
    expect(cycle.status).toBe(400);
    expect(cycle.json.error.message).toMatch(
      /A1 → .*A3.* form a cycle|A3 → .*A1.* form a cycle|form a cycle/,
    );
    expect(cycle.json.error.message).toContain('A2');
    const unknown = await client.put(`${url('activities')}/${a1.id}`, {
      ...a1,
      predecessors: [{ code: 'Q7', lag: 0 }],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.json.error.message).toContain('unknown activity "Q7"');
  });

  it('carries a renamed activity into predecessors and correlations, and refuses to remove one in use', async () => {
    const acts = (await client.get(url('activities'))).json.rows;
    const a1 = acts.find((r: any) => r.code === 'A1');
    const corr = await client.post(url('correlations'), {
      upserts: [{ aCode: 'A1', bCode: 'A2', rho: 0.4 }],
    });
    expect(corr.status).toBe(200);
    const renamed = await client.put(`${url('activities')}/${a1.id}`, { ...a1, code: 'A0' });
    expect(renamed.status).toBe(200);
    expect(renamed.json.cascaded).toContain('correlations');
    const after = (await client.get(url('activities'))).json.rows;
    expect(after.find((r: any) => r.code === 'A2').predecessors).toEqual([{ code: 'A0', lag: 0 }]);
    expect((await client.get(url('correlations'))).json.rows[0]).toMatchObject({ aCode: 'A0', bCode: 'A2' });

    const used = await client.post(url('items'), {
      upserts: [line('9.1', { basis: 'per-day', activityCode: 'A3', distType: 'fixed', mode: 1000 })],
    });
    expect(used.status).toBe(200);
    const a3 = after.find((r: any) => r.code === 'A3');
    const refused = await client.del(`${url('activities')}/${a3.id}?version=${a3.version}`);
    expect(refused.status).toBe(400);
    expect(refused.json.error.message).toContain('Activity A3 is used by line 9.1');
  });

  it('keeps codes unique across the registers and correlations between known inputs', async () => {
    const clash = await client.post(url('risks'), {
      upserts: [{ code: 'A2', title: 'Clash', probability: 0.2, costType: 'fixed', costMode: 1000 }],
    });
    expect(clash.status).toBe(400);
    expect(clash.json.error.issues[0].path).toBe('rows[0].code');
    const ghost = await client.post(url('correlations'), {
      upserts: [{ aCode: 'A2', bCode: 'NOPE', rho: 0.3 }],
    });
    expect(ghost.status).toBe(400);
    expect(ghost.json.error.message).toContain('unknown input "NOPE"');
    const range = await client.post(url('correlations'), {
      upserts: [{ aCode: 'A2', bCode: 'A3', rho: 1.5 }],
    });
    expect(range.status).toBe(400);
    expect(range.json.error.issues[0].path).toBe('rows[0].rho');
  });

  it('reorders rows without changing their versions', async () => {
    const list = (await client.get(url('items'))).json.rows;
    const order = [...list].reverse().map((r: any) => r.id);
    const res = await client.post(url('items'), { order });
    expect(res.status).toBe(200);
    const after = (await client.get(url('items'))).json.rows;
    expect(after.map((r: any) => r.id)).toEqual(order);
    expect(after.map((r: any) => r.version).sort()).toEqual(list.map((r: any) => r.version).sort());
  });

  it('lists the audit trail newest first with who changed what', async () => {
    const res = await client.get(`/api/projects/${projectId}/audit?limit=3`);
    expect(res.status).toBe(200);
    expect(res.json.entries).toHaveLength(3);
    expect(res.json.entries[0].id).toBeGreaterThan(res.json.entries[1].id);
    expect(res.json.entries[0].who).toContain('reg-batch owner');
    const older = await client.get(`/api/projects/${projectId}/audit?limit=3&before=${res.json.next}`);
    expect(older.json.entries[0].id).toBeLessThan(res.json.entries[2].id);
  });
});

describe('saving many rows at the versions they were read', () => {
  let client: Client;
  let projectId: number;
  let url: string;

  const saved = async () =>
    rows<{ id: number; base: number | null; version: number }>(
      'SELECT id, base, version FROM CostItems WHERE projectId = ? ORDER BY id',
      [projectId],
    );
  const audited = () => count('AuditEntries', "projectId = ? AND entity = 'cost-item'", [projectId]);

  beforeAll(async () => {
    client = (await newOrganisation('reg-bulk')).client;
    projectId = (await client.post('/api/projects', projectInput('BAT-2'))).json.project.id;
    url = `/api/projects/${projectId}/items`;
    const made = await client.post(url, {
      upserts: Array.from({ length: 120 }, (_, i) => line(`7.${i + 1}`)),
    });
    expect(made.status).toBe(200);
  });

  it('refuses a paste of 120 rows with one stale version: 409 with the current row, nothing written', async () => {
    const list = (await client.get(url)).json.rows;
    const before = await saved();
    const auditBefore = await audited();
    const res = await client.post(url, {
      upserts: list.map((r: any, i: number) => ({
        ...r,
        base: 500 + i,
        version: i === 77 ? r.version + 1 : r.version,
      })),
    });
    expect(res.status).toBe(409);
    expect(res.json.error.details.conflicts).toEqual([
      { id: list[77].id, current: expect.objectContaining({ id: list[77].id, version: list[77].version }) },
    ]);
    expect(await saved()).toEqual(before);
    expect(await audited()).toBe(auditBefore);
  });

  it('fails the whole paste when a row changes between the read and the write', async () => {
    const list = (await client.get(url)).json.rows;
    const before = await saved();
    const auditBefore = await audited();
    const target = list[60];
    // Another writer that skips the project's lock: it holds row 61 until it commits.
    const other = await mariadb.createConnection({
      host: process.env.DB_HOST ?? '127.0.0.1',
      port: Number(process.env.DB_PORT ?? 3307),
      user: process.env.DB_USER ?? 'outturn',
      password: process.env.DB_PASSWORD,
      database: process.env.DB_NAME ?? 'outturn_test',
    });
    try {
      await other.beginTransaction();
      await other.query('UPDATE CostItems SET base = 999, version = version + 1 WHERE id = ?', [target.id]);
      const pending = client.post(url, {
        upserts: list.map((r: any, i: number) => ({ ...r, base: 700 + i })),
      });
      // Long enough for the save to read the register and block on row 61; if it has not got
      // that far, it reads the committed row instead and refuses the batch just the same.
      await new Promise((resolve) => setTimeout(resolve, 1500));
      await other.commit();
      const res = await pending;
      expect(res.status).toBe(409);
      expect(res.json.error.details.conflicts).toEqual([
        { id: target.id, current: expect.objectContaining({ base: 999, version: target.version + 1 }) },
      ]);
    } finally {
      await other.end();
    }
    const after = await saved();
    expect(after.filter((r) => r.id !== target.id)).toEqual(before.filter((r) => r.id !== target.id));
    expect(after.find((r) => r.id === target.id)).toEqual({
      id: target.id,
      base: 999,
      version: target.version + 1,
    });
    expect(await audited()).toBe(auditBefore);
  });

  it('writes and audits only the rows whose fields changed', async () => {
    const list = (await client.get(url)).json.rows;
    const auditBefore = await audited();
    const res = await client.post(url, {
      upserts: list.slice(0, 30).map((r: any, i: number) => (i < 3 ? { ...r, notes: `changed ${i}` } : r)),
    });
    expect(res.status).toBe(200);
    expect(res.json.updated).toBe(30);
    const versions = new Map<number, number>(res.json.rows.map((r: any) => [r.id, r.version]));
    expect(list.slice(0, 30).map((r: any) => (versions.get(r.id) ?? 0) - r.version)).toEqual(
      Array.from({ length: 30 }, (_, i) => (i < 3 ? 1 : 0)),
    );
    expect(await audited()).toBe(auditBefore + 3);
  });

  it('treats another organisation’s row id as not found in this project and writes nothing', async () => {
    const outsider = (await newOrganisation('reg-bulk-other')).client;
    const theirProject = (await outsider.post('/api/projects', projectInput('BAT-3'))).json.project.id;
    const theirs = (await outsider.post(`/api/projects/${theirProject}/items`, { upserts: [line('8.1')] }))
      .json.rows[0];
    const countBefore = await count('CostItems', 'projectId = ?', [projectId]);
    const auditBefore = await audited();

    const res = await client.post(url, {
      upserts: [line('8.2'), { ...theirs, base: 1, id: theirs.id, version: theirs.version }],
    });
    expect(res.status).toBe(409);
    expect(res.json.error.details.conflicts).toEqual([{ id: theirs.id, current: null }]);
    const removed = await client.post(url, { deletes: [{ id: theirs.id, version: theirs.version }] });
    expect(removed.status).toBe(409);
    expect(removed.json.error.details.conflicts).toEqual([{ id: theirs.id, current: null }]);
    const put = await client.put(`${url}/${theirs.id}`, { ...theirs, base: 2 });
    expect(put.status).toBe(409);

    const [row] = await rows<{ base: number | null; version: number; projectId: number }>(
      'SELECT base, version, projectId FROM CostItems WHERE id = ?',
      [theirs.id],
    );
    expect(row).toEqual({ base: null, version: theirs.version, projectId: theirProject });
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(countBefore);
    expect(await audited()).toBe(auditBefore);
  });
});
