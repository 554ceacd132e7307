import type { Transaction } from 'sequelize';
import type { Role } from '@/lib/auth/roles';

/**
 * Checks that giving `role` to one more person (or moving someone from `previousRole`)
 * stays within the organisation's paid seats. Seats and billing arrive with the
 * subscription; until then every organisation may add members freely.
 */
export async function assertSeatAvailable(
  _organizationId: number,
  _role: Role,
  _previousRole: Role | null,
  _transaction: Transaction,
): Promise<void> {
  return;
}
