import 'server-only';
// The audit trail of a batch: one entry per row changed, written in one statement inside the
// batch's transaction (a paste of 500 rows is 500 entries, not 500 round trips).

import type { Transaction } from 'sequelize';
import { AuditEntry } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { type AuditChange, auditRow } from '../audit';

export async function recordAuditMany(
  actor: Actor,
  projectId: number,
  changes: Omit<AuditChange, 'projectId'>[],
  transaction: Transaction,
): Promise<void> {
  if (changes.length === 0) return;
  await AuditEntry.bulkCreate(
    changes.map((c) => auditRow(actor, { ...c, projectId })),
    { transaction },
  );
}
