import 'server-only';
// Executing a write plan through the register models, inside the caller's transaction. Every
// statement is scoped by project and organisation, and every write of a saved row names the
// version the plan expects: a row changed by someone else since it was read matches nothing,
// and the whole plan fails with StaleWrite (the caller's transaction then rolls back).

import {
  type CreationAttributes,
  type Model,
  type ModelStatic,
  type Transaction,
  type WhereOptions,
} from 'sequelize';
import { Activity, Correlation, CostItem, RiskDriver, RiskEvent } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import type { RegisterKind } from '@/lib/validation/registers';
import { recordAuditMany } from './audit-batch';
import { ENTITY, matchKey } from './kinds';
import type { RegisterWrites, WritePlan } from './plan';

export type WriteScope = { actor: Actor; projectId: number };

/** Ids of the rows each register inserted, in the order of the plan's inserts. */
export type InsertedIds = Record<RegisterKind, number[]>;

/** Rows of one register that no longer have the version the plan expected (or are gone). */
export class StaleWrite extends Error {
  constructor(
    readonly kind: RegisterKind,
    readonly ids: number[],
  ) {
    super(`${ids.length} ${kind} row(s) changed while the batch was being saved`);
    this.name = 'StaleWrite';
  }
}

// Rows per INSERT statement: keeps each well under the server's packet limit.
const INSERT_CHUNK = 1000;

export async function writePlan(
  plan: WritePlan,
  { actor, projectId }: WriteScope,
  transaction: Transaction,
): Promise<InsertedIds> {
  const scope = { projectId, organizationId: actor.organizationId };
  const ids: InsertedIds = { items: [], risks: [], activities: [], correlations: [], drivers: [] };
  const order: RegisterKind[] = [plan.kind, ...REGISTERS.filter((k) => k !== plan.kind)];
  for (const kind of order) ids[kind] = await WRITERS[kind](plan.writes, scope, transaction);
  await recordAuditMany(
    actor,
    projectId,
    plan.audit.map((a) => ({
      entity: ENTITY[a.kind],
      entityId: typeof a.entityId === 'number' ? a.entityId : ids[a.kind][a.entityId.insert],
      action: a.action,
      before: a.before,
      after: a.after,
    })),
    transaction,
  );
  return ids;
}

const REGISTERS: RegisterKind[] = ['items', 'risks', 'activities', 'drivers', 'correlations'];

type Writer = (writes: WritePlan['writes'], scope: Scope, transaction: Transaction) => Promise<number[]>;

/** Each register's model; correlations have no place of their own, so the plan never moves one. */
const WRITERS: Record<RegisterKind, Writer> = {
  items: placedWriter(CostItem, 'items', (w) => w.items),
  risks: placedWriter(RiskEvent, 'risks', (w) => w.risks),
  activities: placedWriter(Activity, 'activities', (w) => w.activities),
  correlations: (w, scope, t) => writeRegister(Correlation, 'correlations', w.correlations, scope, t),
  drivers: placedWriter(RiskDriver, 'drivers', (w) => w.drivers),
};

type Scope = { projectId: number; organizationId: number };

/** The columns every register table shares; the writer names no other column itself. */
type Scoped = { id: number; version: number; projectId: number; organizationId: number };
type Placed = Scoped & { sortOrder: number };

async function writeRegister<M extends Model<Scoped, Partial<Scoped>>>(
  model: ModelStatic<M>,
  kind: RegisterKind,
  writes: RegisterWrites<CreationAttributes<M>>,
  scope: Scope,
  transaction: Transaction,
): Promise<number[]> {
  const where = (id: number, version: number): WhereOptions<Scoped> => ({ ...scope, id, version });
  await expectOne(
    kind,
    writes.deletes.map((d) => ({
      id: d.id,
      write: model.destroy({ where: where(d.id, d.expectedVersion), transaction }),
    })),
  );
  await expectOne(
    kind,
    writes.updates.map((u) => ({
      id: u.id,
      write: model
        .update(
          { ...u.values, ...scope, version: u.expectedVersion + 1 },
          {
            where: where(u.id, u.expectedVersion),
            transaction,
          },
        )
        .then(([affected]) => affected),
    })),
  );
  if (!writes.inserts.length) return [];
  const records = writes.inserts.map((i) => ({ ...i.values, ...scope, version: 1 }));
  for (let i = 0; i < records.length; i += INSERT_CHUNK)
    await model.bulkCreate(records.slice(i, i + INSERT_CHUNK), { transaction });
  return insertedIds(model, kind, writes.inserts, scope, transaction);
}

/** A move changes a row's place, not its content: its version and updatedAt stay. */
/** The writer of a register that keeps an order: its rows' writes, then their moves. */
function placedWriter<M extends Model<Placed, Partial<Placed>>>(
  model: ModelStatic<M>,
  kind: RegisterKind,
  writesOf: (plan: WritePlan['writes']) => RegisterWrites<CreationAttributes<M>>,
): Writer {
  return async (planWrites, scope, transaction) => {
    const writes = writesOf(planWrites);
    const ids = await writeRegister(model, kind, writes, scope, transaction);
    await writeMoves(model, kind, writes.moves, scope, transaction);
    return ids;
  };
}

async function writeMoves<M extends Model<Placed, Partial<Placed>>>(
  model: ModelStatic<M>,
  kind: RegisterKind,
  moves: RegisterWrites<CreationAttributes<M>>['moves'],
  scope: Scope,
  transaction: Transaction,
) {
  await expectOne(
    kind,
    moves.map((m) => {
      const where: WhereOptions<Placed> = { ...scope, id: m.id, version: m.expectedVersion };
      return {
        id: m.id,
        write: model
          .update({ ...m.values, ...scope }, { where, fields: ['sortOrder'], silent: true, transaction })
          .then(([affected]) => affected),
      };
    }),
  );
}

/**
 * Statements of one register are sent together (the driver pipelines them on the
 * transaction's connection) and all are awaited before a failure is reported. Each must touch
 * exactly one row: none means the row's version moved on, or the row is gone.
 */
async function expectOne(kind: RegisterKind, writes: { id: number; write: Promise<number> }[]) {
  const results = await Promise.allSettled(writes.map((w) => w.write));
  const failed = results.find((r) => r.status === 'rejected');
  if (failed) throw failed.reason;
  const stale = writes.filter((_, i) => {
    const result = results[i];
    return result.status === 'fulfilled' && result.value !== 1;
  });
  if (stale.length)
    throw new StaleWrite(
      kind,
      stale.map((w) => w.id),
    );
}

/** Ids of the rows just inserted, found again by their keys (codes are unique in a project). */
async function insertedIds<M extends Model<Scoped, Partial<Scoped>>>(
  model: ModelStatic<M>,
  kind: RegisterKind,
  inserts: { key: string }[],
  scope: Scope,
  transaction: Transaction,
): Promise<number[]> {
  const where: WhereOptions<Scoped> = scope;
  const found = await model.findAll({
    where,
    attributes: kind === 'correlations' ? ['id', 'aCode', 'bCode'] : ['id', 'code'],
    transaction,
  });
  const byKey = new Map(
    found.map((r) => {
      const saved = r.get({ plain: true });
      return [matchKey(kind, saved), saved.id];
    }),
  );
  return inserts.map((i) => {
    const id = byKey.get(i.key);
    if (id === undefined) throw new Error(`the ${kind} row ${i.key} was not found after its insert`);
    return id;
  });
}
