// Inserting many register rows in one statement. The register models do not declare
// organizationId as an attribute (only as a foreign-key type), so a model insert would drop
// it; a query-interface insert writes the columns exactly as given.

import type { Transaction } from 'sequelize';
import { sequelize } from '@/models';

export const TABLES = {
  items: 'CostItems',
  risks: 'RiskEvents',
  activities: 'Activities',
  correlations: 'Correlations',
} as const;

const JSON_COLUMNS = new Set([
  'dist',
  'ratePerDay',
  'duration',
  'predecessors',
  'costImpact',
  'delayImpact',
  'postCostImpact',
  'postDelayImpact',
]);

export async function insertRows(
  table: (typeof TABLES)[keyof typeof TABLES],
  rows: Record<string, unknown>[],
  transaction: Transaction,
): Promise<void> {
  if (!rows.length) return;
  const now = new Date();
  const prepared = rows.map((r) => {
    const out: Record<string, unknown> = { createdAt: now, updatedAt: now };
    for (const [k, v] of Object.entries(r))
      out[k] = JSON_COLUMNS.has(k) && v !== null && v !== undefined ? JSON.stringify(v) : v;
    return out;
  });
  // Chunks keep each statement well under the server's packet limit.
  for (let i = 0; i < prepared.length; i += 1000) {
    await sequelize.getQueryInterface().bulkInsert(table, prepared.slice(i, i + 1000), { transaction });
  }
}
