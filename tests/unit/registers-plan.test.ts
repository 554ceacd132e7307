// The batch planner decides, without a database, what a batch of register rows writes: these
// tests give it a project's registers and a batch, and read the plan (or the refusal) it returns.
import { describe, expect, it } from 'vitest';
import { parseRows, type RegisterKind } from '@/lib/validation/registers';
import {
  planBatch,
  type ParsedBatch,
  type PlanOptions,
  type RegisterSnapshot,
  type WritePlan,
} from '@/lib/services/registers/plan';
import { sameFields } from '@/lib/services/registers/plan-diff';
import type { ActivityRow, CorrelationRow, LineItemRow, RiskRow } from '@/lib/services/registers/rows';

const PROJECT = 41;
const ORG = 7;

const item = (id: number, code: string, extra: Partial<LineItemRow> = {}): LineItemRow => ({
  id,
  version: 1,
  sortOrder: id,
  code,
  description: `Line ${code}`,
  basis: 'lump-sum',
  activityCode: null,
  distType: 'triangular',
  range: null,
  low: 100,
  mode: 120,
  high: 200,
  mean: null,
  sd: null,
  base: null,
  ownerName: null,
  notes: null,
  ...extra,
});

const activity = (id: number, code: string, predecessors: string[] = []): ActivityRow => ({
  id,
  version: 1,
  sortOrder: id,
  code,
  name: `Activity ${code}`,
  distType: 'pert',
  range: null,
  low: 5,
  mode: 10,
  high: 20,
  mean: null,
  sd: null,
  predecessors: predecessors.map((p) => ({ code: p, lag: 0 })),
  existence: null,
});

const risk = (id: number, code: string, extra: Partial<RiskRow> = {}): RiskRow => ({
  id,
  version: 1,
  sortOrder: id,
  code,
  title: `Risk ${code}`,
  cause: null,
  event: null,
  effect: null,
  ownerName: null,
  status: 'open',
  response: 'reduce',
  probability: 0.2,
  costType: 'fixed',
  costLow: null,
  costMode: 1000,
  costHigh: null,
  delayType: null,
  delayLow: null,
  delayMode: null,
  delayHigh: null,
  costMean: null,
  costSd: null,
  delayMean: null,
  delaySd: null,
  activityCodes: [],
  itemCodes: [],
  sizes: 'linked',
  mitigationType: null,
  mitigationLow: null,
  mitigationCost: null,
  mitigationHigh: null,
  postProbability: null,
  postCostLow: null,
  postCostMode: null,
  postCostHigh: null,
  postCostMean: null,
  postCostSd: null,
  postDelayLow: null,
  postDelayMode: null,
  postDelayHigh: null,
  postDelayMean: null,
  postDelaySd: null,
  ...extra,
});

const correlation = (id: number, aCode: string, bCode: string, rho = 0.4): CorrelationRow => ({
  id,
  version: 1,
  sortOrder: 0,
  aCode,
  bCode,
  rho,
});

function snapshot(parts: Partial<RegisterSnapshot> = {}): RegisterSnapshot {
  const activities = parts.activities ?? [];
  return {
    projectId: PROJECT,
    organizationId: ORG,
    items: [],
    risks: [],
    activities,
    correlations: [],
    drivers: [],
    activityIdByCode: new Map(activities.map((a) => [a.code, a.id])),
    ...parts,
  };
}

/** The rows as the route handler hands them over: parsed by the registers' own schemas. */
function batch(kind: RegisterKind, upserts: object[], rest: Omit<ParsedBatch, 'upserts'> = { deletes: [] }) {
  const { data, issues } = parseRows<RegisterKind>(kind, upserts);
  expect(issues).toEqual([]);
  return { upserts: data, ...rest };
}

const fieldsOf = ({
  id: _i,
  version: _v,
  sortOrder: _s,
  ...fields
}: {
  id: number;
  version: number;
  sortOrder: number;
}) => fields;

function planned(
  state: RegisterSnapshot,
  kind: RegisterKind,
  b: ParsedBatch,
  options?: PlanOptions,
): WritePlan {
  const outcome = planBatch(state, kind, b, options);
  if (!outcome.ok) throw new Error(`refused: ${JSON.stringify(outcome.refusal)}`);
  return outcome.plan;
}

function refusal(state: RegisterSnapshot, kind: RegisterKind, b: ParsedBatch, options?: PlanOptions) {
  const outcome = planBatch(state, kind, b, options);
  if (outcome.ok) throw new Error('the batch was planned, a refusal was expected');
  return outcome.refusal;
}

const nothingWritten = (plan: WritePlan, kind: RegisterKind) => {
  const w = plan.writes[kind];
  return w.inserts.length + w.updates.length + w.moves.length + w.deletes.length === 0;
};

describe('planning inserts', () => {
  it('inserts new rows after the last place, scoped to the project and organisation, and audits each', () => {
    const state = snapshot({ items: [item(1, '1.1'), item(2, '1.2')] });
    const plan = planned(
      state,
      'items',
      batch('items', [
        { code: '2.1', description: 'Piling', distType: 'pert', low: 10, mode: 20, high: 40, key: 'n1' },
        { code: '2.2', description: 'Ducts', distType: null, base: 5000 },
      ]),
    );
    const { inserts, updates, deletes } = plan.writes.items;
    expect(updates).toEqual([]);
    expect(deletes).toEqual([]);
    expect(inserts.map((i) => i.key)).toEqual(['2.1', '2.2']);
    expect(inserts[0].values).toMatchObject({
      projectId: PROJECT,
      organizationId: ORG,
      code: '2.1',
      sortOrder: 3,
      dist: { type: 'pert', low: 10, mode: 20, high: 40 },
      ratePerDay: null,
    });
    expect(inserts[1].values).toMatchObject({ code: '2.2', sortOrder: 4, base: 5000, dist: null });
    expect(plan.audit).toEqual([
      expect.objectContaining({ kind: 'items', action: 'create', entityId: { insert: 0 }, before: null }),
      expect.objectContaining({ kind: 'items', action: 'create', entityId: { insert: 1 }, before: null }),
    ]);
    // The audit records the row's fields, never its id, version or place.
    expect(plan.audit[0].after).not.toHaveProperty('id');
    expect(plan.audit[0].after).not.toHaveProperty('key');
    expect(plan.reply.map((r) => [r.row.key, r.insert])).toEqual([
      ['n1', 0],
      [undefined, 1],
    ]);
    expect(plan).toMatchObject({ created: 2, updated: 0, deleted: [], cascaded: [] });
  });
});

describe('planning updates', () => {
  const state = snapshot({ items: [item(1, '1.1', { version: 3 }), item(2, '1.2', { version: 5 })] });

  it('updates a changed row at the version it was read, and audits the fields before and after', () => {
    const plan = planned(
      state,
      'items',
      batch('items', [{ ...fieldsOf(item(1, '1.1')), base: 150, id: 1, version: 3 }]),
    );
    expect(plan.writes.items.updates).toEqual([
      {
        id: 1,
        expectedVersion: 3,
        values: expect.objectContaining({ base: 150, code: '1.1', projectId: PROJECT }),
      },
    ]);
    expect(plan.audit).toHaveLength(1);
    expect(plan.audit[0]).toMatchObject({ action: 'update', entityId: 1 });
    expect(plan.audit[0].before).toMatchObject({ base: null });
    expect(plan.audit[0].after).toMatchObject({ base: 150 });
    expect(plan.reply[0].row).toMatchObject({ id: 1, version: 4, base: 150 });
    expect(plan.updated).toBe(1);
  });

  it('refuses a row read at an older version with the current row, and plans nothing', () => {
    const r = refusal(
      state,
      'items',
      batch('items', [
        { ...fieldsOf(item(1, '1.1')), base: 150, id: 1, version: 3 },
        { ...fieldsOf(item(2, '1.2')), base: 175, id: 2, version: 4 },
      ]),
    );
    expect(r).toEqual({ reason: 'stale', conflicts: [{ id: 2, current: state.items[1] }] });
  });

  it('answers a row that is not in this project (deleted, or another organisation’s) as gone', () => {
    const r = refusal(state, 'items', {
      upserts: batch('items', [{ ...fieldsOf(item(1, '1.1')), id: 9001, version: 1 }]).upserts,
      deletes: [{ id: 9002, version: 1 }],
    });
    expect(r).toEqual({
      reason: 'stale',
      conflicts: [
        { id: 9001, current: null },
        { id: 9002, current: null },
      ],
    });
  });

  it('asks for the version of a saved row, naming the row', () => {
    const r = refusal(state, 'items', batch('items', [{ ...fieldsOf(item(1, '1.1')), base: 1, id: 1 }]));
    expect(r).toEqual({
      reason: 'invalid',
      issues: [
        {
          path: 'rows[0].version',
          message: 'Row 1 (1.1): the version read is required to change a saved row.',
        },
      ],
    });
  });

  it('writes and audits nothing for a row saved unchanged, and answers it at its version', () => {
    const plan = planned(
      state,
      'items',
      batch('items', [{ ...fieldsOf(state.items[0]), id: 1, version: 3 }]),
    );
    expect(nothingWritten(plan, 'items')).toBe(true);
    expect(plan.audit).toEqual([]);
    expect(plan.reply).toEqual([{ row: expect.objectContaining({ id: 1, version: 3 }) }]);
    expect(plan.updated).toBe(1);
  });

  it('matches rows of a file to saved rows by code when asked, with their versions', () => {
    const plan = planned(
      state,
      'items',
      batch('items', [
        { ...fieldsOf(item(2, '1.2')), notes: 'from the file' },
        { ...fieldsOf(item(0, '1.9')) },
      ]),
      { matchByCode: true, auditAction: 'import' },
    );
    expect(plan.writes.items.updates.map((u) => [u.id, u.expectedVersion])).toEqual([[2, 5]]);
    expect(plan.writes.items.inserts.map((i) => i.key)).toEqual(['1.9']);
    expect(plan.audit.map((a) => a.action)).toEqual(['import', 'import']);
    expect(plan).toMatchObject({ created: 1, updated: 1 });
  });
});

describe('planning deletes and their cascades', () => {
  const state = snapshot({
    activities: [activity(1, 'A1'), activity(2, 'A2', ['A1']), activity(3, 'A3', ['A1', 'A2'])],
    items: [item(10, '1.1')],
    correlations: [correlation(20, 'A1', 'A2'), correlation(21, 'A2', '1.1'), correlation(22, 'A3', '1.1')],
  });

  it('drops a deleted activity from its successors and deletes the correlations that name it', () => {
    const plan = planned(state, 'activities', { upserts: [], deletes: [{ id: 1, version: 1 }] });
    const w = plan.writes;
    expect(w.activities.deletes).toEqual([{ id: 1, expectedVersion: 1 }]);
    expect(w.activities.updates.map((u) => [u.id, u.expectedVersion, u.values.predecessors])).toEqual([
      [2, 1, []],
      [3, 1, [{ code: 'A2', lag: 0 }]],
    ]);
    expect(w.correlations.deletes).toEqual([{ id: 20, expectedVersion: 1 }]);
    expect(w.correlations.updates).toEqual([]);
    expect(plan.audit.map((a) => [a.kind, a.action, a.entityId])).toEqual([
      ['activities', 'delete', 1],
      ['activities', 'update', 2],
      ['activities', 'update', 3],
      ['correlations', 'delete', 20],
    ]);
    expect(plan).toMatchObject({ deleted: [1], cascaded: ['correlations'], updated: 2 });
    // The successors come back with their new versions so that the grid shows them.
    expect(plan.reply.map((r) => [r.row.id, r.row.version])).toEqual([
      [2, 2],
      [3, 2],
    ]);
  });

  it('refuses to delete an activity that a per-day line uses, naming the line', () => {
    const used = snapshot({
      ...state,
      items: [item(10, '1.1', { basis: 'per-day', activityCode: 'A2', distType: 'fixed', mode: 900 })],
    });
    const r = refusal(used, 'activities', { upserts: [], deletes: [{ id: 2, version: 1 }] });
    expect(r.reason).toBe('invalid');
    expect(r.reason === 'invalid' && r.issues[0].message).toBe(
      'Activity A2 is used by line 1.1; change those first.',
    );
  });

  it('refuses a delete read at an older version', () => {
    const r = refusal(state, 'activities', { upserts: [], deletes: [{ id: 3, version: 2 }] });
    expect(r).toEqual({ reason: 'stale', conflicts: [{ id: 3, current: state.activities[2] }] });
  });
});

describe('planning a rename', () => {
  const state = snapshot({
    activities: [activity(1, 'A1'), activity(2, 'A2', ['A1'])],
    items: [item(10, '1.1', { basis: 'per-day', activityCode: 'A1', distType: 'fixed', mode: 900 })],
    risks: [risk(30, 'R1', { delayType: 'fixed', delayMode: 4, activityCodes: ['A1'], itemCodes: ['1.1'] })],
    correlations: [correlation(20, 'A1', 'A2'), correlation(21, '1.1', 'R1')],
  });

  it('carries the new code into predecessors, correlations and risks; per-day lines keep their link', () => {
    const plan = planned(
      state,
      'activities',
      batch('activities', [{ ...fieldsOf(state.activities[0]), code: 'A0', id: 1, version: 1 }]),
    );
    const w = plan.writes;
    expect(w.activities.updates.map((u) => [u.id, u.values.code, u.values.predecessors])).toEqual([
      [1, 'A0', []],
      [2, 'A2', [{ code: 'A0', lag: 0 }]],
    ]);
    expect(w.correlations.updates).toEqual([
      {
        id: 20,
        expectedVersion: 1,
        values: expect.objectContaining({ aCode: 'A0', bCode: 'A2', organizationId: ORG }),
      },
    ]);
    // Lines link the activity by id: nothing of theirs changes, and the checks see the new code.
    expect(nothingWritten(plan, 'items')).toBe(true);
    // Risks name their activities by code: the rename is written into them.
    expect(plan.writes.risks.updates.map((u) => [u.id, u.values.activityCodes])).toEqual([[30, ['A0']]]);
    expect(plan.cascaded).toEqual(['risks', 'correlations']);
    expect(plan.reply.map(({ row }) => [row.id, 'code' in row && row.code, row.version])).toEqual([
      [1, 'A0', 2],
      [2, 'A2', 2],
    ]);
  });

  it('renames a line item that a correlation names', () => {
    const plan = planned(
      state,
      'items',
      batch('items', [{ ...fieldsOf(state.items[0]), code: '1.1a', id: 10, version: 1 }]),
    );
    expect(plan.writes.correlations.updates.map((u) => [u.id, u.values.aCode, u.values.bCode])).toEqual([
      [21, '1.1a', 'R1'],
    ]);
    expect(plan.writes.items.updates.map((u) => [u.id, u.values.code, u.values.activityId])).toEqual([
      [10, '1.1a', 1],
    ]);
    // The risk's cost line follows the rename.
    expect(plan.writes.risks.updates.map((u) => [u.id, u.values.itemCodes])).toEqual([[30, ['1.1a']]]);
  });

  it('drops a removed line item from the cost lines of the risks that named it', () => {
    const plan = planned(state, 'items', { upserts: [], deletes: [{ id: 10, version: 1 }] });
    expect(plan.writes.risks.updates.map((u) => [u.id, u.values.itemCodes])).toEqual([[30, []]]);
  });

  it('refuses to remove an activity a risk delays, naming the risk', () => {
    const r = refusal(state, 'activities', { upserts: [], deletes: [{ id: 1, version: 1 }] });
    expect(r.reason).toBe('invalid');
    expect(JSON.stringify(r)).toContain('risk R1');
  });
});

describe('row errors and the whole batch', () => {
  const state = snapshot({
    activities: [activity(1, 'A1')],
    items: [item(10, '1.1')],
    risks: [risk(30, 'R1')],
  });

  it('refuses a code used twice in the batch or by another register, naming each row', () => {
    const r = refusal(
      state,
      'items',
      batch('items', [
        { ...fieldsOf(item(0, '2.1')) },
        { ...fieldsOf(item(0, '2.1')) },
        { ...fieldsOf(item(0, 'A1')) },
      ]),
    );
    expect(r.reason === 'invalid' && r.issues.map((i) => i.path)).toEqual(['rows[1].code', 'rows[2].code']);
    expect(r.reason === 'invalid' && r.issues[0].message).toBe(
      'Row 2 (2.1), code: 2.1 is already the code of another line item; codes are unique in a project.',
    );
    expect(r.reason === 'invalid' && r.issues[1].message).toMatch(
      /^Row 3 \(A1\), code: A1 is already the code of an? activity/,
    );
  });

  it('plans nothing when one row of many breaks a rule across rows', () => {
    const rows = Array.from({ length: 40 }, (_, i) => fieldsOf(item(0, `5.${i + 1}`)));
    rows[27] = { ...rows[27], basis: 'per-day', activityCode: 'Z9', distType: 'fixed', mode: 10 };
    const r = refusal(state, 'items', batch('items', rows), { label: (i) => `Line ${i + 2} of the file` });
    expect(r).toEqual({
      reason: 'invalid',
      issues: [
        {
          path: 'rows[27].activityCode',
          message: 'Line 29 of the file, activityCode: unknown activity "Z9".',
        },
      ],
    });
  });

  it('refuses a cycle in the activity network', () => {
    const r = refusal(
      state,
      'activities',
      batch('activities', [
        { ...fieldsOf(activity(1, 'A1', ['A9'])), id: 1, version: 1 },
        fieldsOf(activity(0, 'A9', ['A1'])),
      ]),
    );
    expect(r.reason === 'invalid' && r.issues.map((i) => i.message).join(' ')).toMatch(/cycle/);
  });
});

describe('planning a new order', () => {
  it('moves rows at their versions, without a content write or an audit entry', () => {
    const state = snapshot({
      items: [
        item(1, '1.1', { sortOrder: 0 }),
        item(2, '1.2', { sortOrder: 1 }),
        item(3, '1.3', { sortOrder: 2 }),
      ],
    });
    const plan = planned(state, 'items', { upserts: [], deletes: [], order: [3, 1, 2] });
    const w = plan.writes.items;
    expect(w.updates).toEqual([]);
    expect(w.moves.map((m) => [m.id, m.expectedVersion, m.values.sortOrder])).toEqual([
      [3, 1, 0],
      [1, 1, 1],
      [2, 1, 2],
    ]);
    expect(plan.audit).toEqual([]);
    expect(plan.reply.map((r) => [r.row.id, r.row.sortOrder, r.row.version])).toEqual([
      [3, 0, 1],
      [1, 1, 1],
      [2, 2, 1],
    ]);
  });
});

describe('comparing fields', () => {
  it('ignores the order of keys and sees a change in a nested list', () => {
    expect(sameFields({ a: 1, b: { x: 1, y: 2 } }, { b: { y: 2, x: 1 }, a: 1 })).toBe(true);
    expect(sameFields({ p: [{ code: 'A', lag: 0 }] }, { p: [{ code: 'A', lag: 1 }] })).toBe(false);
  });
});
