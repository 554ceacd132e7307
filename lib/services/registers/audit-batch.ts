import 'server-only';
// The audit trail of a batch: one entry per row changed, written in one statement inside the
// batch's transaction (a paste of 500 rows is 500 entries, not 500 round trips).

import type { Transaction } from 'sequelize';
import { AuditEntry } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import type { AuditChange } from '../audit';

export async function recordAuditMany(
  actor: Actor,
  projectId: number,
  changes: Omit<AuditChange, 'projectId'>[],
  transaction: Transaction,
): Promise<void> {
  if (changes.length === 0) return;
  await AuditEntry.bulkCreate(
    changes.map((c) => ({
      organizationId: actor.organizationId,
      projectId,
      userId: actor.userId,
      entity: c.entity,
      entityId: c.entityId === null ? null : String(c.entityId),
      action: c.action,
      before: c.before ?? null,
      after: c.after ?? null,
    })),
    { transaction },
  );
}
