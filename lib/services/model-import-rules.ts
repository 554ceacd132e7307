import 'server-only';
// The register rules applied to a model file before it replaces a project's registers: each
// entry is turned into the row a person would have typed and checked with the register's own
// row schema (code pattern, length limits, non-negative durations, magnitude bounds), and no
// register may hold more rows than one import accepts.

import type { FieldIssue } from '@/lib/errors';
import { partsFromSpec } from '@/lib/registers/dist-fields';
import { linkFromModel } from '@/lib/registers/predecessors';
import type { DistSpec, Model, ModelActivity, ModelDriver, ModelItem, ModelRisk } from '@/lib/sim';
import { parseRows, type ImpactPrefix, type RegisterKind } from '@/lib/validation/registers';
import { MAX_FILE_ROWS } from './registers/files';

/** Model array → register it fills. */
const REGISTERS = {
  items: 'items',
  risks: 'risks',
  activities: 'activities',
  correlations: 'correlations',
  drivers: 'drivers',
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
    basis: !perDay ? 'lump-sum' : item.span === 'project' ? 'per-project-day' : 'per-day',
    activityCode: perDay ? (item.activity ?? null) : null,
    ...cells(spec),
    base: item.base ?? null,
  };
}

function impact(prefix: ImpactPrefix, spec: DistSpec | undefined) {
  const c = cells(spec);
  return {
    ...(prefix === 'cost' || prefix === 'delay' ? { [`${prefix}Type`]: c.distType } : {}),
    [`${prefix}Low`]: c.low,
    [`${prefix}Mode`]: c.mode,
    [`${prefix}High`]: c.high,
    [`${prefix}Mean`]: c.mean,
    [`${prefix}Sd`]: c.sd,
  };
}

function mitigation(cost: ModelRisk['mitigationCost']) {
  if (cost === undefined) return {};
  const c = cells(typeof cost === 'number' ? { type: 'fixed', value: cost } : cost);
  return { mitigationType: c.distType, mitigationLow: c.low, mitigationCost: c.mode, mitigationHigh: c.high };
}

function riskRow(risk: ModelRisk) {
  return {
    code: risk.id,
    title: risk.name || risk.id,
    probability: risk.probability,
    ...impact('cost', risk.cost),
    ...impact('delay', risk.delay),
    activityCodes: risk.activities ?? (risk.activity !== undefined ? [risk.activity] : []),
    itemCodes: risk.items ?? [],
    sizes: risk.sizes ?? 'linked',
    postProbability: risk.post?.probability ?? null,
    ...impact('postCost', risk.post?.cost),
    ...impact('postDelay', risk.post?.delay),
    ...mitigation(risk.mitigationCost),
  };
}

/**
 * What a risk register row cannot hold of a risk: a post impact of another type than the impact
 * before it (the post cells share its type), and a P10–P90 range on an impact (its cells are
 * bounds).
 */
function riskShapeIssues(risks: readonly ModelRisk[]): FieldIssue[] {
  const issues: FieldIssue[] = [];
  risks.forEach((r, i) => {
    const at = `risks[${i}] (${r.id})`;
    const specs: [string, DistSpec | undefined][] = [
      ['cost', r.cost],
      ['delay', r.delay],
      ['post.cost', r.post?.cost],
      ['post.delay', r.post?.delay],
    ];
    for (const [field, spec] of specs) {
      if (spec && 'range' in spec && spec.range === 'p10-p90')
        issues.push({
          path: `risks[${i}].${field}`,
          message: `${at}, ${field}: the risk register holds low and high as bounds; give a min–max range.`,
        });
    }
    for (const what of ['cost', 'delay'] as const) {
      const post = r.post?.[what];
      const pre = r[what];
      if (post && pre && post.type !== pre.type)
        issues.push({
          path: `risks[${i}].post.${what}`,
          message: `${at}, post.${what}: the risk register gives the ${what} after mitigation the type of the ${what} before it (${pre.type}, got ${post.type}).`,
        });
    }
  });
  return issues;
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

function driverRow(driver: ModelDriver) {
  const { mean: _mean, sd: _sd, ...factor } = cells(driver.factor);
  return {
    code: driver.id,
    name: driver.name || driver.id,
    probability: driver.probability ?? 1,
    entry: 'factor',
    ...factor,
    applies: driver.applies,
  };
}

/** Issues of every entry that breaks a register rule, e.g. "items[3] (C4), code: Use letters…". */
export function registerRuleIssues(model: Model): FieldIssue[] {
  const shape = riskShapeIssues(model.risks ?? []);
  if (shape.length) return shape;
  const registers: [keyof typeof REGISTERS, unknown[]][] = [
    ['items', model.items.map(itemRow)],
    ['risks', (model.risks ?? []).map(riskRow)],
    ['activities', (model.activities ?? []).map(activityRow)],
    ['correlations', (model.correlations ?? []).map((c) => ({ aCode: c.a, bCode: c.b, rho: c.rho }))],
    ['drivers', (model.drivers ?? []).map(driverRow)],
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
