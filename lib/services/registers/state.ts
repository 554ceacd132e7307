import 'server-only';
// Everything a register write needs to check itself against: the registers of one project.

import type { Transaction } from 'sequelize';
import { Activity, Correlation, CostItem, RiskDriver, RiskEvent } from '@/models';
import type { RegisterKind } from '@/lib/validation/registers';
import {
  activityRow,
  correlationRow,
  driverRow,
  itemRow,
  riskRow,
  type ActivityRow,
  type AnyRow,
  type CorrelationRow,
  type DriverRow,
  type LineItemRow,
  type RiskRow,
} from './rows';

export type RegisterState = {
  projectId: number;
  organizationId: number;
  items: LineItemRow[];
  risks: RiskRow[];
  activities: ActivityRow[];
  correlations: CorrelationRow[];
  drivers: DriverRow[];
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
  const want = (k: RegisterKind) =>
    !only || only === k || (k === 'activities' && only !== 'correlations' && only !== 'drivers');
  // Plain rows (raw), not model instances: they become register rows at once below, and building
  // an instance per row cost more than the read itself.
  const read = { where, order: ORDER, transaction, raw: true };
  const [activities, items, risks, correlations, drivers] = await Promise.all([
    want('activities') ? Activity.findAll(read) : [],
    want('items') ? CostItem.findAll(read) : [],
    want('risks') ? RiskEvent.findAll(read) : [],
    want('correlations') ? Correlation.findAll({ ...read, order: [['id', 'ASC']] }) : [],
    want('drivers') ? RiskDriver.findAll(read) : [],
  ]);
  const activityCodeById = new Map(activities.map((a) => [a.id, a.code]));
  return {
    projectId,
    organizationId,
    activities: activities.map(activityRow),
    items: items.map((i) => itemRow(i, activityCodeById)),
    risks: risks.map((r) => riskRow(r, activityCodeById)),
    correlations: correlations.map(correlationRow),
    drivers: drivers.map(driverRow),
    activityIdByCode: new Map(activities.map((a) => [a.code, a.id])),
    activityCodeById,
  };
}

/**
 * Rows of one register as they are now, past the transaction's snapshot (a locking read sees
 * what another transaction committed since this one first read): the conflict reply shows them.
 */
export async function currentRows(
  kind: RegisterKind,
  ids: number[],
  state: Pick<RegisterState, 'projectId' | 'organizationId' | 'activityCodeById'>,
  transaction: Transaction,
): Promise<AnyRow[]> {
  const options = {
    where: { projectId: state.projectId, organizationId: state.organizationId, id: ids },
    lock: transaction.LOCK.UPDATE,
    transaction,
  };
  const codes = state.activityCodeById;
  switch (kind) {
    case 'items':
      return (await CostItem.findAll(options)).map((r) => itemRow(r, codes));
    case 'risks':
      return (await RiskEvent.findAll(options)).map((r) => riskRow(r, codes));
    case 'activities':
      return (await Activity.findAll(options)).map(activityRow);
    case 'correlations':
      return (await Correlation.findAll(options)).map(correlationRow);
    case 'drivers':
      return (await RiskDriver.findAll(options)).map(driverRow);
  }
}

// Names of the registers live in a module without models, so that pure code can use them.
export { ENTITY, REGISTER_LABEL, rowCode } from './kinds';
