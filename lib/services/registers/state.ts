import 'server-only';
// Everything a register write needs to check itself against: the four registers of one project.

import type { Transaction } from 'sequelize';
import { Activity, Correlation, CostItem, RiskEvent } from '@/models';
import type { RegisterKind } from '@/lib/validation/registers';
import {
  activityRow,
  correlationRow,
  itemRow,
  riskRow,
  type ActivityRow,
  type CorrelationRow,
  type LineItemRow,
  type RiskRow,
} from './rows';

export type RegisterState = {
  items: LineItemRow[];
  risks: RiskRow[];
  activities: ActivityRow[];
  correlations: CorrelationRow[];
  activityIdByCode: Map<string, number>;
  activityCodeById: Map<number, string>;
};

const ORDER: [string, string][] = [
  ['sortOrder', 'ASC'],
  ['id', 'ASC'],
];

export async function loadState(
  projectId: number,
  organizationId: number,
  transaction?: Transaction,
  only?: RegisterKind,
): Promise<RegisterState> {
  const where = { projectId, organizationId };
  // A read of one register loads only it (and the activities its rows name).
  const want = (k: RegisterKind) => !only || only === k || (k === 'activities' && only !== 'correlations');
  const [activities, items, risks, correlations] = await Promise.all([
    want('activities') ? Activity.findAll({ where, order: ORDER, transaction }) : [],
    want('items') ? CostItem.findAll({ where, order: ORDER, transaction }) : [],
    want('risks') ? RiskEvent.findAll({ where, order: ORDER, transaction }) : [],
    want('correlations') ? Correlation.findAll({ where, order: [['id', 'ASC']], transaction }) : [],
  ]);
  const activityCodeById = new Map(activities.map((a) => [a.id, a.code]));
  return {
    activities: activities.map(activityRow),
    items: items.map((i) => itemRow(i, activityCodeById)),
    risks: risks.map((r) => riskRow(r, activityCodeById)),
    correlations: correlations.map(correlationRow),
    activityIdByCode: new Map(activities.map((a) => [a.code, a.id])),
    activityCodeById,
  };
}

export const MODELS = {
  items: CostItem,
  risks: RiskEvent,
  activities: Activity,
  correlations: Correlation,
} as const;

export const ENTITY: Record<RegisterKind, string> = {
  items: 'cost-item',
  risks: 'risk-event',
  activities: 'activity',
  correlations: 'correlation',
};

export const REGISTER_LABEL: Record<RegisterKind, string> = {
  items: 'line item',
  risks: 'risk event',
  activities: 'activity',
  correlations: 'correlation',
};

/** The code a row is known by (a pair for correlations). */
export function rowCode(kind: RegisterKind, row: { code?: string; aCode?: string; bCode?: string }): string {
  return kind === 'correlations' ? `${row.aCode}–${row.bCode}` : String(row.code);
}
