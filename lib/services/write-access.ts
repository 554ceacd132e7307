import type { Transaction } from 'sequelize';

/**
 * Refuses edits and runs while the organisation is read-only (a subscription past due, or
 * cancelled and ended). Every service that writes project data or starts a run calls this;
 * reads and exports do not. The subscription state arrives with billing.
 */
export async function assertWritable(_organizationId: number, _transaction?: Transaction): Promise<void> {
  return;
}
