import 'server-only';
// Saving rows of a register: one batch (a cell edit, a paste, an import, a delete of many rows)
// is one transaction, all or nothing. Each changed row names the version it was read at; a
// stale version answers 409 with the current rows so that the grid can show the other person's
// values and keep the user's own to re-apply.

import { QueryTypes, type Transaction } from 'sequelize';
import { Project, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, conflict, forbidden, type FieldIssue } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { batchSchema, parseRows, type RegisterKind, type RowMeta } from '@/lib/validation/registers';
import { findProject } from '../projects';
import { assertWritable } from '../write-access';
import { recordAuditMany } from './audit-batch';
import { crossCheck, type NextState } from './checks';
import {
  activityAttributes,
  correlationAttributes,
  itemAttributes,
  riskAttributes,
  rowData,
  type ActivityRow,
  type AnyRow,
  type CorrelationRow,
  type LineItemRow,
  type RegisterRow,
  type RiskRow,
} from './rows';
import { insertRows, TABLES, upsertRows } from './insert';
import { ENTITY, loadState, MODELS, rowCode, type RegisterState } from './state';

export type ParsedBatch = {
  upserts: (Record<string, unknown> & RowMeta)[];
  deletes: { id: number; version: number }[];
  order?: (number | string)[];
};

export type BatchOptions = {
  /** Rows without an id update the saved row with the same code (imports). */
  matchByCode?: boolean;
  /** Names row i of the batch in messages ("Row 4", or "Row 6 of the file"). */
  label?: (index: number, row: unknown) => string;
  auditAction?: string;
};

export type BatchResult<K extends RegisterKind = RegisterKind> = {
  rows: (RegisterRow[K] & { key?: string })[];
  deleted: number[];
  /** Other registers changed by the batch (renamed or removed codes): refetch them. */
  cascaded: RegisterKind[];
  created: number;
  updated: number;
};

export type Conflict = { id: number; current: AnyRow | null };

const defaultLabel = (i: number, row: unknown) => {
  const r = row as { code?: string; aCode?: string; bCode?: string };
  const code = r.code ?? (r.aCode ? `${r.aCode}–${r.bCode}` : undefined);
  return `Row ${i + 1}${code ? ` (${code})` : ''}`;
};

export function summarise(issues: FieldIssue[]): string {
  const head = issues
    .slice(0, 5)
    .map((i) => i.message)
    .join('; ');
  return issues.length > 5 ? `${head}; and ${issues.length - 5} more.` : head;
}

/** Validates, authorises and saves one batch of one register in its own transaction. */
export async function saveBatch<K extends RegisterKind>(
  actor: Actor,
  projectId: number,
  kind: K,
  input: unknown,
  options: BatchOptions = {},
): Promise<BatchResult<K>> {
  if (!can(actor.role, 'project:write')) throw forbidden();
  const batch = parseOrThrow(batchSchema, input);
  const { data, issues } = parseRows(kind, batch.upserts, options.label ?? defaultLabel);
  if (issues.length) throw badRequest(summarise(issues), issues);
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  return sequelize.transaction((transaction) =>
    applyBatch(
      transaction,
      actor,
      project.id,
      kind,
      { upserts: data as unknown as ParsedBatch['upserts'], deletes: batch.deletes, order: batch.order },
      options,
    ),
  ) as Promise<BatchResult<K>>;
}

const pairKey = (r: { aCode: string; bCode: string }) => [r.aCode, r.bCode].sort().join('\u0000');
const matchKey = (kind: RegisterKind, r: Record<string, unknown>) =>
  kind === 'correlations' ? pairKey(r as CorrelationRow) : String(r.code);

/** Applies a parsed batch inside the caller's transaction (imports chain several). */
export async function applyBatch<K extends RegisterKind>(
  transaction: Transaction,
  actor: Actor,
  projectId: number,
  kind: K,
  batch: ParsedBatch,
  options: BatchOptions = {},
): Promise<BatchResult<K>> {
  const label = options.label ?? defaultLabel;
  // One writer per project at a time: cross-row rules (codes, network) hold under concurrency.
  await Project.findOne({ where: { id: projectId }, lock: transaction.LOCK.UPDATE, transaction });
  const state = await loadState(projectId, actor.organizationId, transaction);
  const current = state[kind] as AnyRow[];
  const byId = new Map(current.map((r) => [r.id, r]));

  if (options.matchByCode) {
    const byCode = new Map(current.map((r) => [matchKey(kind, r as never), r]));
    for (const u of batch.upserts) {
      if (u.id) continue;
      const found = byCode.get(matchKey(kind, u));
      if (found) Object.assign(u, { id: found.id, version: found.version });
    }
  }

  const conflicts: Conflict[] = [];
  const missingVersion: FieldIssue[] = [];
  batch.upserts.forEach((u, i) => {
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
  for (const d of batch.deletes) {
    const cur = byId.get(d.id);
    if (!cur) conflicts.push({ id: d.id, current: null });
    else if (cur.version !== d.version) conflicts.push({ id: d.id, current: cur });
  }
  if (missingVersion.length) throw badRequest(summarise(missingVersion), missingVersion);
  if (conflicts.length) {
    throw conflict(
      conflicts.length === 1
        ? 'Someone else changed this row since you loaded it. Their values are shown; yours are kept to re-apply.'
        : `Someone else changed ${conflicts.length} of these rows since you loaded them. Their values are shown; yours are kept to re-apply.`,
      { conflicts },
    );
  }

  // The register as it will be, in memory, to check it as a whole before writing.
  const batchIndex = new WeakMap<object, number>();
  const deleted = new Set(batch.deletes.map((d) => d.id));
  const updates = new Map<number, Record<string, unknown>>();
  batch.upserts.forEach((u) => u.id && updates.set(u.id, u));
  const changedIds = new Set<number>();
  let next: AnyRow[] = current
    .filter((r) => !deleted.has(r.id))
    .map((r) => {
      const u = updates.get(r.id);
      if (!u) return r;
      changedIds.add(r.id);
      const { key: _key, id: _id, version: _version, ...data } = u;
      const row = { ...r, ...data } as AnyRow;
      batchIndex.set(row, batch.upserts.indexOf(u));
      return row;
    });
  let maxOrder = current.reduce((m, r) => Math.max(m, r.sortOrder), 0);
  const creates: (AnyRow & { key?: string })[] = [];
  batch.upserts.forEach((u, i) => {
    if (u.id) return;
    const { id: _id, version: _version, ...data } = u;
    const row = { ...data, id: 0, version: 1, sortOrder: ++maxOrder } as AnyRow & { key?: string };
    batchIndex.set(row, i);
    creates.push(row);
  });
  next = [...next, ...creates];

  const orderChanged = new Set<AnyRow>();
  if (batch.order && kind !== 'correlations') next = reorder(next, batch.order, orderChanged);

  // Codes renamed or removed by this batch, carried into the registers that name them.
  const renamed = new Map<string, string>();
  const removedCodes = new Set<string>();
  if (kind !== 'correlations') {
    for (const r of current) {
      if (deleted.has(r.id)) removedCodes.add((r as { code: string }).code);
      const u = updates.get(r.id) as { code?: string } | undefined;
      if (u?.code && u.code !== (r as { code: string }).code)
        renamed.set((r as { code: string }).code, u.code);
    }
  }
  const nextState: NextState = {
    items: state.items,
    risks: state.risks,
    activities: state.activities,
    correlations: state.correlations,
    [kind]: next,
  } as NextState;
  const cascade = cascadeCodes(kind, nextState, state, renamed, removedCodes, changedIds);
  next = nextState[kind] as AnyRow[];
  const blockers = activityInUse(kind, state, removedCodes);

  const touched = new Set<RegisterKind>([kind, ...cascade.kinds]);
  const where = (k: RegisterKind, row: object) => {
    if (k !== kind) return null;
    const i = batchIndex.get(row);
    return i === undefined ? null : { path: `rows[${i}]`, label: label(i, batch.upserts[i]) };
  };
  const issues = [...blockers, ...crossCheck(nextState, touched, where)];
  if (issues.length) throw badRequest(summarise(issues), issues);

  // Write.
  const model = MODELS[kind] as unknown as ModelLike;
  const audit: Parameters<typeof recordAuditMany>[2] = [];
  const entity = ENTITY[kind];
  const scope = { projectId, organizationId: actor.organizationId };
  if (deleted.size) {
    await model.destroy({ where: { ...scope, id: [...deleted] }, transaction });
    for (const id of deleted)
      audit.push({ entity, entityId: id, action: 'delete', before: rowData(byId.get(id)!), after: null });
  }
  const updatedRows: AnyRow[] = [];
  const changed = next.filter((row) => changedIds.has(row.id));
  const renames = changed.some(
    (row) =>
      kind !== 'correlations' &&
      (row as { code: string }).code !== (byId.get(row.id) as { code: string }).code,
  );
  if (changed.length > 20 && !renames) {
    // Many rows, no code changes (a paste of figures): one upsert statement. The project row
    // lock and the version check above make this equivalent to row-by-row updates.
    await upsertRows(
      TABLES[kind],
      changed.map((row) => {
        const values: Record<string, unknown> = {
          ...attributesOf(kind, row, state),
          ...scope,
          id: row.id,
          version: row.version + 1,
        };
        if (kind !== 'correlations') values.sortOrder = row.sortOrder;
        return values;
      }),
      transaction,
    );
    for (const row of changed) updatedRows.push({ ...row, version: row.version + 1 });
  } else {
    for (const row of changed) updatedRows.push(await writeUpdate(kind, row, state, scope, transaction));
  }
  for (const saved of updatedRows) {
    audit.push({
      entity,
      entityId: saved.id,
      action: options.auditAction ?? 'update',
      before: rowData(byId.get(saved.id)!),
      after: rowData(saved),
    });
  }
  const sortOnly = next.filter((r) => r.id && orderChanged.has(r) && !changedIds.has(r.id));
  await writeSortOrders(kind, sortOnly, transaction);

  const createdRows: (AnyRow & { key?: string })[] = [];
  if (creates.length) {
    await insertRows(
      TABLES[kind],
      creates.map((r) => {
        const row: Record<string, unknown> = { ...attributesOf(kind, r, state), ...scope, version: 1 };
        if (kind !== 'correlations') row.sortOrder = r.sortOrder;
        return row;
      }),
      transaction,
    );
    const ids = await createdIds(kind, projectId, creates, transaction);
    creates.forEach((r, i) => {
      const saved = { ...r, id: ids[i] };
      createdRows.push(saved);
      audit.push({
        entity,
        entityId: saved.id,
        action: options.auditAction ?? 'create',
        before: null,
        after: rowData(saved),
      });
    });
  }
  // Cascaded changes in other registers (renamed predecessors and correlation inputs).
  for (const [k, rows] of cascade.updates) {
    for (const row of rows) {
      const before = (state[k] as AnyRow[]).find((r) => r.id === row.id)!;
      const saved = await writeUpdate(k, row, state, scope, transaction);
      audit.push({
        entity: ENTITY[k],
        entityId: row.id,
        action: 'update',
        before: rowData(before),
        after: rowData(saved),
      });
      if (k === kind) updatedRows.push(saved);
    }
  }
  if (cascade.deletedCorrelations.length) {
    await MODELS.correlations.destroy({
      where: { ...scope, id: cascade.deletedCorrelations.map((c) => c.id) },
      transaction,
    });
    for (const c of cascade.deletedCorrelations) {
      audit.push({
        entity: 'correlation',
        entityId: c.id,
        action: 'delete',
        before: rowData(c),
        after: null,
      });
    }
  }
  await recordAuditMany(actor, projectId, audit, transaction);

  const orderedChanges = [...updatedRows, ...createdRows, ...sortOnly];
  return {
    rows: orderedChanges as BatchResult<K>['rows'],
    deleted: [...deleted],
    cascaded: cascade.kinds.filter((k) => k !== kind),
    created: createdRows.length,
    updated: updatedRows.length,
  };
}

type ModelLike = {
  destroy(o: object): Promise<number>;
  update(values: object, o: object): Promise<[number]>;
};

function attributesOf(kind: RegisterKind, row: AnyRow, state: RegisterState): Record<string, unknown> {
  switch (kind) {
    case 'items':
      return itemAttributes(row as LineItemRow, state.activityIdByCode);
    case 'risks':
      return riskAttributes(row as RiskRow, state.activityIdByCode);
    case 'activities':
      return activityAttributes(row as ActivityRow);
    case 'correlations':
      return correlationAttributes(row as CorrelationRow);
  }
}

async function writeUpdate(
  kind: RegisterKind,
  row: AnyRow,
  state: RegisterState,
  scope: { projectId: number; organizationId: number },
  transaction: Transaction,
): Promise<AnyRow> {
  const model = MODELS[kind] as unknown as ModelLike;
  const values: Record<string, unknown> = { ...attributesOf(kind, row, state), version: row.version + 1 };
  if (kind !== 'correlations') values.sortOrder = row.sortOrder;
  const [affected] = await model.update(values, {
    where: { ...scope, id: row.id, version: row.version },
    transaction,
  });
  if (affected !== 1)
    throw conflict('Someone else changed this row while it was being saved; reload and try again.');
  return { ...row, version: row.version + 1 };
}

/** Sets sortOrder of many rows in one statement (a reorder does not change their content or version). */
async function writeSortOrders(kind: RegisterKind, rows: AnyRow[], transaction: Transaction) {
  if (!rows.length || kind === 'correlations') return;
  const table = TABLES[kind];
  const cases = rows.map(() => 'WHEN ? THEN ?').join(' ');
  await sequelize.query(`UPDATE \`${table}\` SET sortOrder = CASE id ${cases} END WHERE id IN (?)`, {
    replacements: [...rows.flatMap((r) => [r.id, r.sortOrder]), rows.map((r) => r.id)],
    type: QueryTypes.UPDATE,
    transaction,
  });
}

/** Ids of rows just inserted, found again by code (codes are unique in a project). */
async function createdIds(kind: RegisterKind, projectId: number, rows: AnyRow[], transaction: Transaction) {
  const found = (await (
    MODELS[kind] as unknown as { findAll(o: object): Promise<Record<string, unknown>[]> }
  ).findAll({
    where: { projectId },
    attributes: kind === 'correlations' ? ['id', 'aCode', 'bCode'] : ['id', 'code'],
    transaction,
  })) as unknown as Record<string, unknown>[];
  const byKey = new Map(found.map((r) => [matchKey(kind, r), r.id as number]));
  return rows.map((r) => byKey.get(matchKey(kind, r as never))!);
}

function reorder(rows: AnyRow[], order: (number | string)[], changed: Set<AnyRow>): AnyRow[] {
  const byRef = new Map<number | string, AnyRow>();
  for (const r of rows) {
    if (r.id) byRef.set(r.id, r);
    const key = (r as { key?: string }).key;
    if (key) byRef.set(key, r);
  }
  const placed = new Set<AnyRow>();
  const out: AnyRow[] = [];
  for (const ref of order) {
    const r = byRef.get(ref);
    if (r && !placed.has(r)) {
      placed.add(r);
      out.push(r);
    }
  }
  for (const r of rows) if (!placed.has(r)) out.push(r);
  return out.map((r, i) => {
    if (r.sortOrder === i) return r;
    const moved = { ...r, sortOrder: i };
    changed.add(moved);
    return moved;
  });
}

/** Removing an activity that line items or risks still use is refused, naming them. */
function activityInUse(kind: RegisterKind, state: RegisterState, removed: Set<string>): FieldIssue[] {
  if (kind !== 'activities' || removed.size === 0) return [];
  const issues: FieldIssue[] = [];
  for (const code of removed) {
    const users = [
      ...state.items.filter((i) => i.activityCode === code).map((i) => `line ${i.code}`),
      ...state.risks.filter((r) => r.activityCode === code).map((r) => `risk ${r.code}`),
    ];
    if (users.length) {
      issues.push({
        path: `activities.${code}`,
        message: `Activity ${code} is used by ${users.slice(0, 6).join(', ')}${users.length > 6 ? ` and ${users.length - 6} more` : ''}; change those first.`,
      });
    }
  }
  return issues;
}

/** Carries renamed and removed codes into predecessors and correlations. */
function cascadeCodes(
  kind: RegisterKind,
  next: NextState,
  state: RegisterState,
  renamed: Map<string, string>,
  removed: Set<string>,
  changedIds: Set<number>,
) {
  const updates = new Map<RegisterKind, AnyRow[]>();
  const kinds: RegisterKind[] = [];
  const deletedCorrelations: CorrelationRow[] = [];
  if (renamed.size === 0 && removed.size === 0) return { updates, kinds, deletedCorrelations };
  if (kind === 'activities') {
    const mine: AnyRow[] = [];
    next.activities = next.activities.map((a) => {
      const links = a.predecessors
        .filter((p) => !removed.has(p.code))
        .map((p) => ({ ...p, code: renamed.get(p.code) ?? p.code }));
      const same =
        links.length === a.predecessors.length && links.every((p, i) => p.code === a.predecessors[i].code);
      if (same) return a;
      const row = { ...a, predecessors: links };
      if (a.id && changedIds.has(a.id)) return row; // written with the batch itself
      if (a.id) mine.push(row);
      return row;
    });
    if (mine.length) updates.set('activities', mine);
    // Line items and risks link activities by id; refresh their codes for the checks only.
    next.items = next.items.map((i) =>
      i.activityCode && renamed.has(i.activityCode)
        ? { ...i, activityCode: renamed.get(i.activityCode)! }
        : i,
    );
    next.risks = next.risks.map((r) =>
      r.activityCode && renamed.has(r.activityCode)
        ? { ...r, activityCode: renamed.get(r.activityCode)! }
        : r,
    );
  }
  const correlations: CorrelationRow[] = [];
  next.correlations = state.correlations.filter((c) => {
    if (removed.has(c.aCode) || removed.has(c.bCode)) {
      deletedCorrelations.push(c);
      return false;
    }
    return true;
  });
  next.correlations = next.correlations.map((c) => {
    const a = renamed.get(c.aCode) ?? c.aCode;
    const b = renamed.get(c.bCode) ?? c.bCode;
    if (a === c.aCode && b === c.bCode) return c;
    const row = { ...c, aCode: a, bCode: b };
    correlations.push(row);
    return row;
  });
  if (correlations.length) updates.set('correlations', correlations);
  if (correlations.length || deletedCorrelations.length) kinds.push('correlations');
  if (updates.has('activities')) kinds.push('activities');
  return { updates, kinds, deletedCorrelations };
}

export { rowCode };
