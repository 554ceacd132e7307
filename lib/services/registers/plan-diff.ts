import 'server-only';
// The second half of planning a batch: the registers before and after, compared row by row.
// What differs in the stored columns is what is written (a row saved with the same values is
// neither written nor audited), each write of a saved row naming the version it was read at.

import type { RegisterKind } from '@/lib/validation/registers';
import type { NextState } from './checks';
import { matchKey } from './kinds';
import type {
  AuditIntent,
  PlannedRow,
  PlanOptions,
  RegisterSnapshot,
  RegisterWrites,
  RowValues,
  WritePlan,
  Writes,
} from './plan';
import {
  activityAttributes,
  correlationAttributes,
  driverAttributes,
  itemAttributes,
  riskAttributes,
  rowData,
  type RegisterRow,
} from './rows';

type Registers = { [K in RegisterKind]: RegisterRow[K][] };

type ValuesOf = { [K in RegisterKind]: (row: RegisterRow[K], state: RegisterSnapshot) => RowValues[K] };

const scopeOf = (s: RegisterSnapshot) => ({ projectId: s.projectId, organizationId: s.organizationId });

const VALUES: ValuesOf = {
  items: (r, s) => ({ ...itemAttributes(r, s.activityIdByCode), sortOrder: r.sortOrder, ...scopeOf(s) }),
  risks: (r, s) => ({ ...riskAttributes(r), sortOrder: r.sortOrder, ...scopeOf(s) }),
  activities: (r, s) => ({ ...activityAttributes(r), sortOrder: r.sortOrder, ...scopeOf(s) }),
  correlations: (r, s) => ({ ...correlationAttributes(r), ...scopeOf(s) }),
  drivers: (r, s) => ({ ...driverAttributes(r), sortOrder: r.sortOrder, ...scopeOf(s) }),
};

/** A row's stored columns without its place (a move alone is not a change of content). */
function stored(values: object): object {
  const { sortOrder: _place, ...rest } = values as { sortOrder?: number };
  return rest;
}

/** The same fields, whatever their order: a row saved unchanged is neither written nor audited. */
export function sameFields(a: object, b: object): boolean {
  return stable(a) === stable(b);
}

function stable(value: unknown): string {
  return JSON.stringify(value, (_key, v) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v).sort(([x], [y]) => (x < y ? -1 : x > y ? 1 : 0)))
      : v,
  );
}

export function planWrites(
  state: RegisterSnapshot,
  next: NextState,
  kind: RegisterKind,
  batchIndex: ReadonlyMap<number, number>,
  deleted: ReadonlySet<number>,
  options: PlanOptions,
): WritePlan {
  const writes: Writes = {
    items: emptyWrites(),
    risks: emptyWrites(),
    activities: emptyWrites(),
    correlations: emptyWrites(),
    drivers: emptyWrites(),
  };
  const plan: WritePlan = {
    kind,
    writes,
    audit: [],
    reply: [],
    deleted: [...deleted],
    cascaded: [],
    created: 0,
    updated: 0,
  };
  // Line items link activities by id: a renamed activity changes none of their columns. Risks and
  // drivers name their activities and cost lines by code, so a rename or removal there rewrites them.
  const written: RegisterKind[] =
    kind === 'correlations'
      ? [kind]
      : kind === 'activities' || kind === 'items'
        ? [kind, 'risks', 'correlations', 'drivers']
        : [kind, 'correlations'];
  for (const k of written) {
    const diff = diffRegister(k, state, next, writes, options, k === kind ? batchIndex : new Map());
    plan.audit.push(...diff.audit);
    if (k === kind) {
      plan.reply = diff.reply;
      plan.created = diff.created;
      plan.updated = diff.updated;
    } else if (diff.changed) plan.cascaded.push(k);
  }
  return plan;
}

function emptyWrites<V>(): RegisterWrites<V> {
  return { deletes: [], updates: [], moves: [], inserts: [] };
}

function diffRegister<K extends RegisterKind>(
  kind: K,
  state: RegisterSnapshot,
  next: NextState,
  writes: Writes,
  options: PlanOptions,
  batchIndex: ReadonlyMap<number, number>,
) {
  const out: RegisterWrites<RowValues[K]> = writes[kind];
  const values: ValuesOf[K] = VALUES[kind];
  const registersBefore: Registers = state;
  const registersAfter: Registers = next;
  const before = registersBefore[kind];
  const after: (RegisterRow[K] & { key?: string })[] = registersAfter[kind];
  const audit: AuditIntent[] = [];
  const reply: { row: PlannedRow; insert?: number }[] = [];
  const matched: PlannedRow[] = [];
  const cascadedRows: PlannedRow[] = [];
  const inserted: { row: PlannedRow; insert: number }[] = [];
  const movedOnly: PlannedRow[] = [];
  const beforeById = new Map(before.map((r) => [r.id, r]));
  const afterIds = new Set(after.map((r) => r.id));

  for (const old of before) {
    if (afterIds.has(old.id)) continue;
    out.deletes.push({ id: old.id, expectedVersion: old.version });
    audit.push({ kind, action: 'delete', entityId: old.id, before: rowData(old), after: null });
  }
  for (const row of after) {
    const old = beforeById.get(row.id);
    if (!old || row === old) continue;
    const inBatch = batchIndex.has(row.id);
    // Compared as stored, not as typed: an empty range and "min-max" store the same distribution.
    if (!sameFields(stored(values(old, state)), stored(values(row, state)))) {
      const saved = { ...row, version: old.version + 1 };
      out.updates.push({
        id: row.id,
        expectedVersion: old.version,
        values: values(row, state),
      });
      audit.push({
        kind,
        action: inBatch ? (options.auditAction ?? 'update') : 'update',
        entityId: row.id,
        before: rowData(old),
        after: rowData(saved),
      });
      (inBatch ? matched : cascadedRows).push(saved);
      continue;
    }
    if (row.sortOrder !== old.sortOrder)
      out.moves.push({ id: row.id, expectedVersion: old.version, values: values(row, state) });
    if (inBatch) matched.push(row);
    else if (row.sortOrder !== old.sortOrder) movedOnly.push(row);
  }
  // New rows are inserted in the batch's order, whatever their place.
  const fresh = after.filter((r) => r.id < 0).sort((a, b) => b.id - a.id);
  for (const row of fresh) {
    const insert = out.inserts.length;
    out.inserts.push({ key: matchKey(kind, row), values: values(row, state) });
    const action = options.auditAction ?? 'create';
    audit.push({ kind, action, entityId: { insert }, before: null, after: rowData(row) });
    inserted.push({ row, insert });
  }
  reply.push(
    ...matched.map((row) => ({ row })),
    ...cascadedRows.map((row) => ({ row })),
    ...inserted,
    ...movedOnly.map((row) => ({ row })),
  );
  const changed = out.deletes.length + out.updates.length + out.moves.length + out.inserts.length > 0;
  return {
    audit,
    reply,
    changed,
    created: inserted.length,
    updated: matched.length + cascadedRows.length,
  };
}
