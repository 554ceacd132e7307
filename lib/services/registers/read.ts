import 'server-only';
// Reading a register and a project's audit trail.

import { Op } from 'sequelize';
import { AuditEntry, SimulationRun, User } from '@/models';
import { describeAudit } from '@/lib/audit/describe';
import type { Actor } from '@/lib/auth/actor';
import type { AuditView } from '@/lib/view-types/audit';
import type { RegisterKind } from '@/lib/validation/registers';
import { findProject } from '../projects';
import type { RegisterRow } from './rows';
import { loadState } from './state';

export async function listRegister<K extends RegisterKind>(
  actor: Actor,
  projectId: number,
  kind: K,
): Promise<RegisterRow[K][]> {
  const project = await findProject(actor, projectId);
  const state = await loadState(project.id, actor.organizationId, undefined, kind);
  return state[kind] as RegisterRow[K][];
}

/**
 * Several registers of a project at once, for a page that sends them along with its HTML (one
 * project lookup, one read of each register).
 */
export async function listRegisters<K extends RegisterKind>(
  actor: Actor,
  projectId: number,
  kinds: K[],
): Promise<{ [P in K]: RegisterRow[P][] }> {
  const project = await findProject(actor, projectId);
  // loadState reads one register and the activities it names, or all four.
  const first = kinds[0];
  const one = first !== 'correlations' && kinds.every((k) => k === first || k === 'activities');
  const state = await loadState(project.id, actor.organizationId, undefined, one ? first : undefined);
  return Object.fromEntries(kinds.map((k) => [k, state[k]])) as { [P in K]: RegisterRow[P][] };
}

/** The project's audit trail, newest first, in pages of `limit` before the entry `before`. */
export async function listAudit(
  actor: Actor,
  projectId: number,
  { before, limit = 100 }: { before?: number; limit?: number } = {},
): Promise<{ entries: AuditView[]; next: number | null }> {
  const project = await findProject(actor, projectId);
  const size = Math.min(Math.max(1, limit), 500);
  const where: Record<string | symbol, unknown> = {
    organizationId: actor.organizationId,
    projectId: project.id,
  };
  if (before) where.id = { [Op.lt]: before };
  const rows = await AuditEntry.findAll({
    where,
    order: [['id', 'DESC']],
    limit: size + 1,
    include: [{ model: User, as: 'user', attributes: ['name', 'email'] }],
  });
  const page = rows.slice(0, size).map((e) => ({
    entry: e,
    before: typeof e.before === 'string' ? JSON.parse(e.before) : e.before,
    after: typeof e.after === 'string' ? JSON.parse(e.after) : e.after,
  }));
  // Runs are named by their number in the project: one read for every run the page mentions.
  const runIds = page
    .filter(({ entry }) => entry.entity === 'run' || entry.entity === 'brief' || entry.entity === 'approval')
    .map(({ entry, after }) => Number(entry.entity === 'approval' ? after?.runId : entry.entityId))
    .filter((id) => Number.isInteger(id) && id > 0);
  const runNumbers = new Map<number, number>(
    runIds.length
      ? (
          await SimulationRun.findAll({
            where: { id: [...new Set(runIds)], projectId: project.id, organizationId: actor.organizationId },
            attributes: ['id', 'number'],
          })
        ).map((r) => [r.id, r.number])
      : [],
  );
  return {
    entries: page.map(({ entry: e, before, after }) => {
      const user = (e as unknown as { user?: { name: string; email: string } }).user;
      return {
        id: e.id,
        at: e.createdAt.toISOString(),
        who: user ? user.name || user.email : 'Someone no longer a member',
        entity: e.entity,
        entityId: e.entityId,
        action: e.action,
        before,
        after,
        ...describeAudit(
          { entity: e.entity, entityId: e.entityId, action: e.action, before, after },
          runNumbers,
        ),
      };
    }),
    next: rows.length > size ? page[page.length - 1].entry.id : null,
  };
}
