import 'server-only';
import type { Transaction } from 'sequelize';
import { AuditEntry } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { recordsAChange } from '@/lib/domain/audit-changes';

export type AuditChange = {
  entity: string;
  entityId: string | number | null;
  action: 'create' | 'update' | 'delete' | 'import' | string;
  before: unknown;
  after: unknown;
  projectId?: number | null;
};

/** The stored form of one change, for one entry or a batch of them. */
export function auditRow(actor: Actor, change: AuditChange) {
  return {
    organizationId: actor.organizationId,
    projectId: change.projectId ?? null,
    userId: actor.userId,
    entity: change.entity,
    entityId: change.entityId === null ? null : String(change.entityId),
    action: change.action,
    before: change.before ?? null,
    after: change.after ?? null,
  };
}

/**
 * Appends one entry to the audit trail inside the caller's transaction; an update that changed
 * no field is not recorded (see `recordsAChange`).
 */
export async function recordAudit(
  actor: Actor,
  change: AuditChange,
  transaction?: Transaction,
): Promise<void> {
  if (!recordsAChange(change)) return;
  await AuditEntry.create(auditRow(actor, change), { transaction });
}
