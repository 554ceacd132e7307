/**
 * What changed in the inputs between two runs' snapshots (model files): lines added, removed
 * and changed, matched by id (correlations by their pair), with the fields that differ; plus
 * changes to the targets and the run settings.
 */

import type { Model } from '@/lib/sim';
import { canonicalJson } from './canonical-json';

export type LineKind = 'item' | 'risk' | 'activity' | 'driver' | 'correlation';

export type LineChange = {
  kind: LineKind;
  id: string;
  name?: string;
  change: 'added' | 'removed' | 'changed';
  /** For a changed line: each differing field with its value before and after. */
  fields: { field: string; before: unknown; after: unknown }[];
};

export type SnapshotDiff = {
  lines: LineChange[];
  /** Top-level differences outside the registers: targets, settings, currency, name. */
  other: { field: string; before: unknown; after: unknown }[];
};

type Line = { id: string; name?: string; [k: string]: unknown };

function linesOf(model: Model, kind: LineKind): Line[] {
  switch (kind) {
    case 'item':
      return model.items as unknown as Line[];
    case 'risk':
      return (model.risks ?? []) as unknown as Line[];
    case 'activity':
      return (model.activities ?? []) as unknown as Line[];
    case 'driver':
      return (model.drivers ?? []) as unknown as Line[];
    case 'correlation':
      // A pair is the same pair whichever way round it is written.
      return (model.correlations ?? []).map((c) => ({ id: [c.a, c.b].sort().join(' ↔ '), rho: c.rho }));
  }
}

const same = (a: unknown, b: unknown) => canonicalJson(a) === canonicalJson(b);

function fieldChanges(before: Record<string, unknown>, after: Record<string, unknown>, skip: string[] = []) {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])]
    .filter((k) => !skip.includes(k))
    .sort();
  return keys
    .filter((k) => !same(before[k], after[k]))
    .map((k) => ({ field: k, before: before[k] ?? null, after: after[k] ?? null }));
}

export function diffSnapshots(before: Model, after: Model): SnapshotDiff {
  const lines: LineChange[] = [];
  for (const kind of ['item', 'risk', 'activity', 'driver', 'correlation'] as const) {
    const old = new Map(linesOf(before, kind).map((l) => [l.id, l]));
    const now = new Map(linesOf(after, kind).map((l) => [l.id, l]));
    for (const [id, line] of now) {
      const prev = old.get(id);
      if (!prev) lines.push({ kind, id, name: line.name, change: 'added', fields: [] });
      else {
        const fields = fieldChanges(prev, line, ['id']);
        if (fields.length) lines.push({ kind, id, name: line.name ?? prev.name, change: 'changed', fields });
      }
    }
    for (const [id, line] of old) {
      if (!now.has(id)) lines.push({ kind, id, name: line.name, change: 'removed', fields: [] });
    }
  }
  const top = (m: Model) => ({
    name: m.name,
    currency: m.currency,
    targets: m.targets,
    settings: m.settings,
  });
  return { lines, other: fieldChanges(top(before), top(after)) };
}
