import 'server-only';
// Deciding what one batch of one register writes, without a database. In: the registers
// as read under the project's lock, and a parsed batch (upserts, deletes, a new order). Out:
// a write plan (inserts, updates with the versions they expect, moves, deletes, the codes they
// carry into other registers, and the audit entries), or why the batch is refused. The plan is
// all or nothing: write-plan.ts executes it in one transaction.

import type { CreationAttributes } from 'sequelize';
import type { Activity, Correlation, CostItem, RiskDriver, RiskEvent } from '@/models';
import type { FieldIssue } from '@/lib/errors';
import type { RegisterData, RegisterKind, RowMeta } from '@/lib/validation/registers';
import { crossCheck, type NextState, type RowLocator } from './checks';
import { matchKey } from './kinds';
import { activityInUse, carryCodes } from './plan-cascade';
import { reorder } from './plan-order';
import { planWrites } from './plan-diff';
import {
  type ActivityRow,
  type AnyRow,
  type CorrelationRow,
  type DriverRow,
  type LineItemRow,
  type RiskRow,
} from './rows';

/**
 * The registers of one project of one organisation that a batch is planned against, with the
 * ids of the activities that per-day lines and risks link to.
 */
export type RegisterSnapshot = NextState & {
  projectId: number;
  organizationId: number;
  activityIdByCode: ReadonlyMap<string, number>;
};

/** One parsed row of a batch: its fields, and the id and version read when it is a saved row. */
export type BatchRow = RegisterData[RegisterKind] & RowMeta;

export type ParsedBatch = {
  upserts: BatchRow[];
  deletes: { id: number; version: number }[];
  order?: (number | string)[];
};

export type PlanOptions = {
  /** Rows without an id update the saved row with the same code (imports). */
  matchByCode?: boolean;
  /** Names row i of the batch in messages ("Row 4", or "Row 6 of the file"). */
  label?: (index: number, row: unknown) => string;
  /** The audit action of created and updated rows ('import' for files); default create/update. */
  auditAction?: string;
};

type RegisterModels = {
  items: CostItem;
  risks: RiskEvent;
  activities: Activity;
  correlations: Correlation;
  drivers: RiskDriver;
};

/** The record a row is written as: its columns, project and organisation (the version is the writer's). */
export type RowValues = { [K in RegisterKind]: CreationAttributes<RegisterModels[K]> };

/** What to write in one register. Every write of a saved row names the version it expects. */
export type RegisterWrites<V> = {
  deletes: { id: number; expectedVersion: number }[];
  /** Content changes: the row's version becomes expectedVersion + 1. */
  updates: { id: number; expectedVersion: number; values: V }[];
  /** A new place only (`values.sortOrder`): the row's content and version stay. */
  moves: { id: number; expectedVersion: number; values: V }[];
  /** `key` finds the new row's id once written (its code, or its pair of codes). */
  inserts: { key: string; values: V }[];
};

export type Writes = { [K in RegisterKind]: RegisterWrites<RowValues[K]> };

/** An audit entry; a new row is named by its place in the inserts until it has an id. */
export type AuditIntent = {
  kind: RegisterKind;
  action: string;
  entityId: number | { insert: number };
  before: object | null;
  after: object | null;
};

export type PlannedRow = AnyRow & { key?: string };

export type WritePlan = {
  kind: RegisterKind;
  writes: Writes;
  audit: AuditIntent[];
  /** The rows of the batch's register to send back; a new row gets its id from its insert. */
  reply: { row: PlannedRow; insert?: number }[];
  deleted: number[];
  /** Other registers changed by the batch (renamed or removed codes): the grid refetches them. */
  cascaded: RegisterKind[];
  created: number;
  updated: number;
};

export type Conflict = { id: number; current: AnyRow | null };

export type Refusal =
  { reason: 'invalid'; issues: FieldIssue[] } | { reason: 'stale'; conflicts: Conflict[] };

export type PlanOutcome = { ok: true; plan: WritePlan } | { ok: false; refusal: Refusal };

export const defaultLabel = (i: number, row: unknown) => {
  const r = row as { code?: string; aCode?: string; bCode?: string };
  const code = r.code ?? (r.aCode ? `${r.aCode}–${r.bCode}` : undefined);
  return `Row ${i + 1}${code ? ` (${code})` : ''}`;
};

/** The fields of a batch row, without its id, version and client key. */
function fieldsOf(u: BatchRow) {
  const { id: _id, version: _version, key: _key, ...fields } = u;
  return fields;
}

export function planBatch(
  state: RegisterSnapshot,
  kind: RegisterKind,
  batch: ParsedBatch,
  options: PlanOptions = {},
): PlanOutcome {
  const label = options.label ?? defaultLabel;
  const current: AnyRow[] = state[kind];
  const byId = new Map(current.map((r) => [r.id, r]));
  const upserts = options.matchByCode ? matchSavedRows(kind, current, batch.upserts) : batch.upserts;

  const stale = staleRows(upserts, batch.deletes, byId, label);
  if (stale) return { ok: false, refusal: stale };

  // The register as it will be. New rows carry a provisional negative id (-1 for the batch's
  // first row) until the database gives them theirs: it names them in messages and the plan.
  const batchIndex = new Map<number, number>();
  const changes = new Map<number, BatchRow>();
  upserts.forEach((u, i) => {
    batchIndex.set(u.id ?? -(i + 1), i);
    if (u.id) changes.set(u.id, u);
  });
  const deleted = new Set(batch.deletes.map((d) => d.id));
  let maxOrder = current.reduce((m, r) => Math.max(m, r.sortOrder), 0);
  let rows: PlannedRow[] = current
    .filter((r) => !deleted.has(r.id))
    .map((r) => {
      const u = changes.get(r.id);
      return u ? ({ ...r, ...fieldsOf(u) } as PlannedRow) : r;
    });
  upserts.forEach((u, i) => {
    if (u.id) return;
    const row = { ...fieldsOf(u), id: -(i + 1), version: 1, sortOrder: ++maxOrder } as PlannedRow;
    rows.push(u.key ? { ...row, key: u.key } : row);
  });
  if (batch.order && kind !== 'correlations') rows = reorder(rows, batch.order);

  const codes = codeChanges(kind, current, changes, deleted);
  const next = carryCodes(kind, withRegister(state, kind, rows), codes);

  const touched = new Set<RegisterKind>([kind]);
  if (next.correlations !== state.correlations) touched.add('correlations');
  const where: RowLocator = (k, row) => {
    const i = k === kind ? batchIndex.get((row as { id: number }).id) : undefined;
    return i === undefined ? null : { path: `rows[${i}]`, label: label(i, upserts[i]) };
  };
  const issues = [...activityInUse(kind, state, codes.removed), ...crossCheck(next, touched, where)];
  if (issues.length) return { ok: false, refusal: { reason: 'invalid', issues } };

  return { ok: true, plan: planWrites(state, next, kind, batchIndex, deleted, options) };
}

/** Rows of a file that carry no id take the id and version of the saved row with their code. */
function matchSavedRows(kind: RegisterKind, current: AnyRow[], upserts: BatchRow[]): BatchRow[] {
  const byKey = new Map(current.map((r) => [matchKey(kind, r), r]));
  return upserts.map((u) => {
    const found = u.id ? undefined : byKey.get(matchKey(kind, u));
    return found ? { ...u, id: found.id, version: found.version } : u;
  });
}

/** A saved row changed without its version is refused; one read at an older version conflicts. */
function staleRows(
  upserts: BatchRow[],
  deletes: ParsedBatch['deletes'],
  byId: ReadonlyMap<number, AnyRow>,
  label: (i: number, row: unknown) => string,
): Refusal | null {
  const conflicts: Conflict[] = [];
  const missingVersion: FieldIssue[] = [];
  upserts.forEach((u, i) => {
    if (!u.id) return;
    if (!u.version) {
      missingVersion.push({
        path: `rows[${i}].version`,
        message: `${label(i, u)}: the version read is required to change a saved row.`,
      });
      return;
    }
    const cur = byId.get(u.id);
    if (!cur || cur.version !== u.version) conflicts.push({ id: u.id, current: cur ?? null });
  });
  for (const d of deletes) {
    const cur = byId.get(d.id);
    if (!cur || cur.version !== d.version) conflicts.push({ id: d.id, current: cur ?? null });
  }
  if (missingVersion.length) return { reason: 'invalid', issues: missingVersion };
  if (conflicts.length) return { reason: 'stale', conflicts };
  return null;
}

/** Codes the batch renames or removes (correlations have no code of their own). */
function codeChanges(
  kind: RegisterKind,
  current: AnyRow[],
  changes: ReadonlyMap<number, BatchRow>,
  deleted: ReadonlySet<number>,
) {
  const renamed = new Map<string, string>();
  const removed = new Set<string>();
  if (kind === 'correlations') return { renamed, removed };
  for (const r of current) {
    const code = (r as { code: string }).code;
    if (deleted.has(r.id)) removed.add(code);
    const u = changes.get(r.id);
    if (u && 'code' in u && u.code !== code) renamed.set(code, u.code);
  }
  return { renamed, removed };
}

function withRegister(state: NextState, kind: RegisterKind, rows: AnyRow[]): NextState {
  const registers = {
    items: state.items,
    risks: state.risks,
    activities: state.activities,
    correlations: state.correlations,
    drivers: state.drivers,
  };
  switch (kind) {
    case 'items':
      return { ...registers, items: rows as LineItemRow[] };
    case 'risks':
      return { ...registers, risks: rows as RiskRow[] };
    case 'activities':
      return { ...registers, activities: rows as ActivityRow[] };
    case 'correlations':
      return { ...registers, correlations: rows as CorrelationRow[] };
    case 'drivers':
      return { ...registers, drivers: rows as DriverRow[] };
  }
}
