import 'server-only';
// The audit trail of a batch: one entry per row changed, written in one statement inside the
// batch's transaction (a paste of 500 rows is 500 entries, not 500 round trips).

import type { Transaction } from 'sequelize';
import { AuditEntry } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { recordsAChange } from '@/lib/domain/audit-changes';
import { type AuditChange, auditRow } from '../audit';

export async function recordAuditMany(
  actor: Actor,
  projectId: number,
  changes: Omit<AuditChange, 'projectId'>[],
  transaction: Transaction,
): Promise<void> {
  // The planner leaves unchanged rows out already; this holds the same rule for every caller.
  const real = changes.filter(recordsAChange);
  if (real.length === 0) return;
  await AuditEntry.bulkCreate(
    real.map((c) => auditRow(actor, { ...c, projectId })),
    { transaction },
  );
}
