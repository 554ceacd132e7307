import 'server-only';
// Writing many register rows in one statement. The register models do not declare
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

type Table = (typeof TABLES)[keyof typeof TABLES];

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

function prepare(rows: Record<string, unknown>[]) {
  const now = new Date();
  return rows.map((r) => {
    const out: Record<string, unknown> = { createdAt: now, updatedAt: now };
    for (const [k, v] of Object.entries(r))
      out[k] = JSON_COLUMNS.has(k) && v !== null && v !== undefined ? JSON.stringify(v) : v;
    return out;
  });
}

export async function insertRows(table: Table, rows: Record<string, unknown>[], transaction: Transaction) {
  const prepared = prepare(rows);
  // Chunks keep each statement well under the server's packet limit.
  for (let i = 0; i < prepared.length; i += 1000) {
    await sequelize.getQueryInterface().bulkInsert(table, prepared.slice(i, i + 1000), { transaction });
  }
}

/**
 * Updates existing rows (matched by id) with one INSERT … ON DUPLICATE KEY UPDATE. Only for
 * rows whose codes do not change: a code taken from another row would match that row's key.
 */
export async function upsertRows(table: Table, rows: Record<string, unknown>[], transaction: Transaction) {
  const prepared = prepare(rows);
  if (!prepared.length) return;
  const updateOnDuplicate = Object.keys(prepared[0]).filter((k) => k !== 'id' && k !== 'createdAt');
  for (let i = 0; i < prepared.length; i += 1000) {
    await sequelize
      .getQueryInterface()
      .bulkInsert(table, prepared.slice(i, i + 1000), { transaction, updateOnDuplicate } as object);
  }
}
