// The schedule grid's rows as the engine's activities, for the checks and drawings made in the
// browser while the planner edits: rows without a valid code or duration are left out (the grid
// shows their errors), and links to them fall away.
import type { GridRow } from '@/components/grid/use-register-rows';
import { specFromParts, type DistType } from '@/lib/registers/dist-fields';
import { linkToModel, type PredecessorLink } from '@/lib/registers/predecessors';
import type { ModelActivity } from '@/lib/sim';

export function activitiesOfRows(rows: readonly GridRow[]): ModelActivity[] {
  const out: ModelActivity[] = [];
  for (const row of rows) {
    const code = typeof row.code === 'string' ? row.code.trim() : '';
    const type = row.distType as DistType | null;
    if (!code || !type) continue;
    const spec = specFromParts({ ...(row as object), type } as never);
    if (!spec.ok) continue;
    const links = Array.isArray(row.predecessors) ? (row.predecessors as PredecessorLink[]) : [];
    const existence = typeof row.existence === 'number' ? row.existence : undefined;
    out.push({
      id: code,
      name: typeof row.name === 'string' ? row.name : undefined,
      duration: spec.spec,
      predecessors: links.map(linkToModel),
      ...(existence !== undefined ? { existence } : {}),
    });
  }
  const known = new Set(out.map((a) => a.id));
  return out.map((a) => ({
    ...a,
    predecessors: a.predecessors!.filter((p) => known.has(typeof p === 'string' ? p : p.id)),
  }));
}
