// The base (deterministic) estimate: each line's base amount, or its distribution's base
// (mode, midpoint, mean, median or value; see "base" in docs/model-format.md); a per-day line is
// its rate's base times its activity's base duration.

import { specFromParts, baseOf, type DistParts, type DistType } from './dist-fields';

type LineCells = Omit<DistParts, 'type'> & {
  distType: DistType | null;
  base: number | null;
  basis: 'lump-sum' | 'per-day';
  activityCode: string | null;
};
type ActivityCells = Omit<DistParts, 'type'> & { code: string; distType: DistType };

export function activityBaseDurations(activities: ActivityCells[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const a of activities) {
    const r = specFromParts({ ...a, type: a.distType });
    if (r.ok) out.set(a.code, baseOf(r.spec));
  }
  return out;
}

/** The line's base amount, or null when its cells do not yet describe one. */
export function lineBase(line: LineCells, durations: Map<string, number>): number | null {
  if (line.basis === 'per-day') {
    if (!line.distType || !line.activityCode) return line.base;
    const r = specFromParts({ ...line, type: line.distType });
    const days = durations.get(line.activityCode);
    if (line.base !== null) return line.base;
    return r.ok && days !== undefined ? baseOf(r.spec) * days : null;
  }
  if (line.base !== null) return line.base;
  if (!line.distType) return null;
  const r = specFromParts({ ...line, type: line.distType });
  return r.ok ? baseOf(r.spec) : null;
}

export function baseEstimate(lines: LineCells[], activities: ActivityCells[]): number {
  const durations = activityBaseDurations(activities);
  return lines.reduce((sum, l) => sum + (lineBase(l, durations) ?? 0), 0);
}
