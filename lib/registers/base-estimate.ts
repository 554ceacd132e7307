// The base estimate of register rows as the grids and the projects list hold them (flat cells):
// each row becomes the model entry it exports as, and its base is lib/domain's rule, the engine's
// (durations floored at 0 days; a per-day line is its rate's base times its activity's base; a
// per-project-day line its rate's base times the project's base duration).

import { baseDuration, baseProjectDuration, itemBase } from '@/lib/domain/base-estimate';
import type { ModelActivity, ModelItem } from '@/lib/sim';
import { specFromParts, type DistParts, type DistType } from './dist-fields';
import { linkToModel, type PredecessorLink } from './predecessors';

type LineCells = Omit<DistParts, 'type'> & {
  distType: DistType | null;
  base: number | null;
  basis: 'lump-sum' | 'per-day' | 'per-project-day';
  activityCode: string | null;
};
type ActivityCells = Omit<DistParts, 'type'> & {
  code: string;
  distType: DistType;
  predecessors?: PredecessorLink[];
  /** A probabilistic branch's probability: below 1 it is left out of the base, as in the engine. */
  existence?: number | null;
};

/** Base durations by activity code, of the rows whose cells describe a duration. */
export function activityBaseDurations(activities: ActivityCells[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const a of activities) {
    const r = specFromParts({ ...a, type: a.distType });
    if (r.ok) out.set(a.code, baseDuration(r.spec));
  }
  return out;
}

/** The project's base duration from the schedule rows; null while a row is incomplete. */
export function projectBaseDuration(activities: ActivityCells[]): number | null {
  const entries: ModelActivity[] = [];
  for (const a of activities) {
    const r = specFromParts({ ...a, type: a.distType });
    if (!r.ok) return null;
    entries.push({
      id: a.code,
      duration: r.spec,
      predecessors: (a.predecessors ?? []).map(linkToModel),
      ...(a.existence !== null && a.existence !== undefined ? { existence: a.existence } : {}),
    });
  }
  return baseProjectDuration(entries);
}

/** The line as a model entry, or null when its cells do not yet describe one. */
function itemOf(line: LineCells): Omit<ModelItem, 'id'> | null {
  const base = line.base ?? undefined;
  if (!line.distType) return base === undefined ? null : { base };
  const r = specFromParts({ ...line, type: line.distType });
  if (!r.ok) return base === undefined ? null : { base };
  if (line.basis === 'per-project-day') return { base, ratePerDay: r.spec, span: 'project' };
  if (line.basis === 'per-day') {
    if (!line.activityCode) return base === undefined ? null : { base };
    return { base, ratePerDay: r.spec, activity: line.activityCode };
  }
  return { base, dist: r.spec };
}

/** The line's base amount, or null when its cells do not yet describe one. */
export function lineBase(
  line: LineCells,
  durations: Map<string, number>,
  projectDays: number | null = null,
): number | null {
  const item = itemOf(line);
  return item ? itemBase(item, durations, projectDays) : null;
}

/** The base estimate of the rows: Σ line bases (lines not yet complete count 0). */
export function baseEstimate(lines: LineCells[], activities: ActivityCells[]): number {
  const durations = activityBaseDurations(activities);
  const projectDays = projectBaseDuration(activities);
  return lines.reduce((sum, l) => sum + (lineBase(l, durations, projectDays) ?? 0), 0);
}
