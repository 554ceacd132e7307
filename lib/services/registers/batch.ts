import 'server-only';
// Saving rows of a register: one batch (a cell edit, a paste, an import, a delete of many rows)
// is one transaction, all or nothing. Each changed row names the version it was read at; a
// stale version answers 409 with the current rows so that the grid can show the other person's
// values and keep the user's own to re-apply. What to write is decided by planBatch (plan.ts,
// no database); writePlan (write-plan.ts) writes it.

import type { Transaction } from 'sequelize';
import { Project, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, conflict, forbidden, type FieldIssue } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { batchSchema, parseRows, type RegisterKind } from '@/lib/validation/registers';
import { findProject } from '../projects';
import { assertWritable } from '../write-access';
import {
  defaultLabel,
  planBatch,
  type Conflict,
  type ParsedBatch,
  type PlanOptions,
  type Refusal,
} from './plan';
import type { RegisterRow } from './rows';
import { currentRows, loadState } from './state';
import { StaleWrite, writePlan, type WriteScope } from './write-plan';

export type { Conflict, ParsedBatch } from './plan';
export { rowCode } from './kinds';

export type BatchOptions = PlanOptions;

export type BatchResult<K extends RegisterKind = RegisterKind> = {
  rows: (RegisterRow[K] & { key?: string })[];
  deleted: number[];
  /** Other registers changed by the batch (renamed or removed codes): refetch them. */
  cascaded: RegisterKind[];
  created: number;
  updated: number;
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
  const { data, issues } = parseRows<RegisterKind>(kind, batch.upserts, options.label ?? defaultLabel);
  if (issues.length) throw badRequest(summarise(issues), issues);
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  const parsed: ParsedBatch = { upserts: data, deletes: batch.deletes, order: batch.order };
  return sequelize.transaction((transaction) =>
    applyBatch({ actor, projectId: project.id }, kind, parsed, options, transaction),
  );
}

/** Applies a parsed batch inside the caller's transaction (imports chain several). */
export async function applyBatch<K extends RegisterKind>(
  { actor, projectId }: WriteScope,
  kind: K,
  batch: ParsedBatch,
  options: BatchOptions,
  transaction: Transaction,
): Promise<BatchResult<K>> {
  // One writer per project at a time: cross-row rules (codes, network) hold under concurrency.
  await Project.findOne({
    where: { id: projectId, organizationId: actor.organizationId },
    lock: transaction.LOCK.UPDATE,
    transaction,
  });
  const state = await loadState(projectId, actor.organizationId, transaction);
  const outcome = planBatch(state, kind, batch, options);
  if (!outcome.ok) throw refused(outcome.refusal);
  const { plan } = outcome;
  try {
    const ids = await writePlan(plan, { actor, projectId }, transaction);
    const rows = plan.reply.map(({ row, insert }) =>
      insert === undefined ? row : { ...row, id: ids[kind][insert] },
    );
    return {
      rows: rows as BatchResult<K>['rows'],
      deleted: plan.deleted,
      cascaded: plan.cascaded,
      created: plan.created,
      updated: plan.updated,
    };
  } catch (error) {
    // A row changed between the read and the write (a writer that skipped the project lock).
    if (!(error instanceof StaleWrite)) throw error;
    const current = new Map(
      (await currentRows(error.kind, error.ids, state, transaction)).map((r) => [r.id, r]),
    );
    throw refused({
      reason: 'stale',
      conflicts: error.ids.map((id) => ({ id, current: current.get(id) ?? null })),
    });
  }
}

function refused(refusal: Refusal) {
  if (refusal.reason === 'invalid') return badRequest(summarise(refusal.issues), refusal.issues);
  const conflicts: Conflict[] = refusal.conflicts;
  return conflict(
    conflicts.length === 1
      ? 'Someone else changed this row since you loaded it. Their values are shown; yours are kept to re-apply.'
      : `Someone else changed ${conflicts.length} of these rows since you loaded them. Their values are shown; yours are kept to re-apply.`,
    { conflicts },
  );
}
