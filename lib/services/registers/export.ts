import 'server-only';
// Downloading registers as CSV (one register) or XLSX (every register, one sheet each).
// Exports are reads: allowed to sponsors and while the organisation is read-only.

import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { forbidden } from '@/lib/errors';
import { REGISTER_KINDS, type RegisterKind } from '@/lib/validation/registers';
import { findProject } from '../projects';
import { writeCsv, writeXlsx } from './files';
import { loadState } from './state';

export async function exportRegisters(
  actor: Actor,
  projectId: number,
  format: 'csv' | 'xlsx',
  kind: RegisterKind | 'all',
): Promise<{ fileName: string; contentType: string; body: Buffer | string }> {
  if (!can(actor.role, 'project:export')) throw forbidden();
  const project = await findProject(actor, projectId);
  const state = await loadState(project.id, actor.organizationId);
  const stamp = new Date().toISOString().slice(0, 10);
  const rowsOf = (k: RegisterKind) => state[k] as unknown as Record<string, unknown>[];
  if (format === 'csv') {
    const k = kind === 'all' ? 'items' : kind;
    return {
      fileName: `${project.code}-${k}-${stamp}.csv`,
      contentType: 'text/csv; charset=utf-8',
      body: '\uFEFF' + writeCsv(k, rowsOf(k)),
    };
  }
  const kinds: RegisterKind[] = kind === 'all' ? [...REGISTER_KINDS] : [kind];
  const body = await writeXlsx(Object.fromEntries(kinds.map((k) => [k, rowsOf(k)])));
  return {
    fileName: `${project.code}-${kind === 'all' ? 'registers' : kind}-${stamp}.xlsx`,
    contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    body,
  };
}
