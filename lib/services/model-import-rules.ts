import 'server-only';
// The register rules applied to a model file before it replaces a project's registers: each
// entry is turned into the row a person would have typed and checked with the register's own
// row schema (code pattern, length limits, non-negative durations, magnitude bounds), and no
// register may hold more rows than one import accepts.

import type { FieldIssue } from '@/lib/errors';
import { partsFromSpec } from '@/lib/registers/dist-fields';
import { linkFromModel } from '@/lib/registers/predecessors';
import type { DistSpec, Model, ModelActivity, ModelItem, ModelRisk } from '@/lib/sim';
import { parseRows, type RegisterKind } from '@/lib/validation/registers';
import { MAX_FILE_ROWS } from './registers/files';

/** Model array → register it fills. */
const REGISTERS = {
  items: 'items',
  risks: 'risks',
  activities: 'activities',
  correlations: 'correlations',
} as const;

/** Entries beyond the row limit, checked on the raw input before the (costly) full validation. */
export function rowLimitIssues(input: unknown): FieldIssue[] {
  if (input === null || typeof input !== 'object') return [];
  return Object.keys(REGISTERS).flatMap((key) => {
    const entries = (input as Record<string, unknown>)[key];
    if (!Array.isArray(entries) || entries.length <= MAX_FILE_ROWS) return [];
    return [
      {
        path: key,
        message: `${key}: ${entries.length.toLocaleString('en-GB')} entries; up to ${MAX_FILE_ROWS.toLocaleString('en-GB')} are accepted in one register.`,
      },
    ];
  });
}

function cells(spec: DistSpec | undefined) {
  const parts = spec ? partsFromSpec(spec) : null;
  return {
    distType: parts?.type ?? null,
    range: parts?.range ?? null,
    low: parts?.low ?? null,
    mode: parts?.mode ?? null,
    high: parts?.high ?? null,
    mean: parts?.mean ?? null,
    sd: parts?.sd ?? null,
  };
}

function itemRow(item: ModelItem) {
  const rate = item.ratePerDay;
  const perDay = rate !== undefined;
  const spec = perDay
    ? typeof rate === 'number'
      ? { type: 'fixed' as const, value: rate }
      : rate
    : item.dist;
  return {
    code: item.id,
    description: item.name || item.id,
    basis: perDay ? 'per-day' : 'lump-sum',
    activityCode: perDay ? (item.activity ?? null) : null,
    ...cells(spec),
    base: item.base ?? null,
  };
}

function impact(prefix: 'cost' | 'delay', spec: DistSpec | undefined) {
  const c = cells(spec);
  return {
    [`${prefix}Type`]: c.distType,
    [`${prefix}Low`]: c.low,
    [`${prefix}Mode`]: c.mode,
    [`${prefix}High`]: c.high,
  };
}

function riskRow(risk: ModelRisk) {
  return {
    code: risk.id,
    title: risk.name || risk.id,
    probability: risk.probability,
    ...impact('cost', risk.cost),
    ...impact('delay', risk.delay),
    activityCode: risk.activity ?? null,
  };
}

function activityRow(activity: ModelActivity) {
  return {
    code: activity.id,
    name: activity.name || activity.id,
    ...cells(activity.duration),
    predecessors: (activity.predecessors ?? []).map(linkFromModel),
    existence: activity.existence ?? null,
  };
}

/** Issues of every entry that breaks a register rule, e.g. "items[3] (C4), code: Use letters…". */
export function registerRuleIssues(model: Model): FieldIssue[] {
  const registers: [keyof typeof REGISTERS, unknown[]][] = [
    ['items', model.items.map(itemRow)],
    ['risks', (model.risks ?? []).map(riskRow)],
    ['activities', (model.activities ?? []).map(activityRow)],
    ['correlations', (model.correlations ?? []).map((c) => ({ aCode: c.a, bCode: c.b, rho: c.rho }))],
  ];
  return registers.flatMap(([key, rows]) => {
    const entries = (model[key] ?? []) as { id?: string; a?: string; b?: string }[];
    const label = (i: number) => {
      const e = entries[i];
      const name = e?.id ?? (e?.a !== undefined ? `${e.a}–${e.b}` : '');
      return `${key}[${i}]${name ? ` (${name})` : ''}`;
    };
    return parseRows(REGISTERS[key] as RegisterKind, rows, label).issues.map((issue) => ({
      path: issue.path.replace(/^rows/, key),
      message: issue.message,
    }));
  });
}
