// A distribution as the flat cells of a grid row (type, range, low, mode, high, mean, sd) and
// back to the engine's DistSpec. The engine's factories check the parameters, so the messages
// the grid shows are the engine's own, moved onto the cell that holds the parameter.

import { createDistribution, InputError, type Distribution, type DistSpec } from '@/lib/sim';

export const DIST_TYPES = ['fixed', 'uniform', 'triangular', 'pert', 'normal', 'lognormal'] as const;
export type DistType = (typeof DIST_TYPES)[number];
export const RANGE_KINDS = ['min-max', 'p10-p90'] as const;
export type RangeKind = (typeof RANGE_KINDS)[number];

export const DIST_LABELS: Record<DistType, string> = {
  fixed: 'Fixed',
  uniform: 'Uniform',
  triangular: 'Triangular',
  pert: 'PERT',
  normal: 'Normal',
  lognormal: 'Lognormal',
};

export type DistPart = 'low' | 'mode' | 'high' | 'mean' | 'sd';
export type DistParts = {
  type: DistType;
  range?: RangeKind | null;
  low?: number | null;
  mode?: number | null;
  high?: number | null;
  mean?: number | null;
  sd?: number | null;
};

const PART_NAMES: Record<DistPart, string> = {
  low: 'low',
  mode: 'most likely',
  high: 'high',
  mean: 'mean',
  sd: 'standard deviation',
};

/** The parts a distribution type reads; lognormal reads low/high (as P10/P90) or mean/sd. */
export function partsUsed(type: DistType, parts?: Partial<DistParts>): DistPart[] {
  switch (type) {
    case 'fixed':
      return ['mode'];
    case 'uniform':
      return ['low', 'high'];
    case 'triangular':
    case 'pert':
      return ['low', 'mode', 'high'];
    case 'normal':
      return ['mean', 'sd'];
    case 'lognormal':
      return parts && (parts.mean != null || parts.sd != null) && parts.low == null && parts.high == null
        ? ['mean', 'sd']
        : ['low', 'high'];
  }
}

const given = (v: number | null | undefined) => v !== null && v !== undefined;
const bothLognormalForms = (p: Partial<DistParts>) =>
  (given(p.low) || given(p.high)) && (given(p.mean) || given(p.sd));

/** Whether a cell takes a value under the type: a lognormal takes low/high or mean/SD, never a mode. */
export function partApplies(type: DistType, part: DistPart): boolean {
  if (type === 'lognormal') return part !== 'mode';
  return partsUsed(type).includes(part);
}

export type PartIssue = { part: DistPart | 'type'; message: string };
export type SpecResult = { ok: true; spec: DistSpec } | { ok: false; issues: PartIssue[] };

// Engine parameter names → our cells.
const ENGINE_TO_PART: Record<string, DistPart> = {
  value: 'mode',
  low: 'low',
  mode: 'mode',
  high: 'high',
  mean: 'mean',
  sd: 'sd',
  p10: 'low',
  p90: 'high',
};

/** DistSpec from cells, or the issues naming the cells at fault. */
export function specFromParts(parts: DistParts): SpecResult {
  if (parts.type === 'lognormal' && bothLognormalForms(parts))
    return {
      ok: false,
      issues: [
        {
          part: 'mean',
          message:
            'A lognormal takes low and high (its P10 and P90) or mean and SD, not both: clear one pair.',
        },
      ],
    };
  const missing = partsUsed(parts.type, parts)
    .filter((p) => parts[p] === null || parts[p] === undefined)
    .map((p) => ({ part: p, message: `Enter the ${PART_NAMES[p]} value.` }));
  if (missing.length) return { ok: false, issues: missing };
  const v = (p: DistPart) => parts[p] as number;
  let spec: DistSpec;
  switch (parts.type) {
    case 'fixed':
      spec = { type: 'fixed', value: v('mode') };
      break;
    case 'uniform':
      spec = { type: 'uniform', low: v('low'), high: v('high') };
      break;
    case 'triangular':
    case 'pert':
      spec =
        parts.range === 'p10-p90'
          ? { type: parts.type, low: v('low'), mode: v('mode'), high: v('high'), range: 'p10-p90' }
          : { type: parts.type, low: v('low'), mode: v('mode'), high: v('high') };
      break;
    case 'normal':
      spec = { type: 'normal', mean: v('mean'), sd: v('sd') };
      break;
    case 'lognormal':
      spec = partsUsed('lognormal', parts).includes('mean')
        ? { type: 'lognormal', mean: v('mean'), sd: v('sd') }
        : { type: 'lognormal', p10: v('low'), p90: v('high') };
      break;
  }
  try {
    createDistribution(spec, { where: '', field: '' });
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const part = ENGINE_TO_PART[e.field] ?? 'type';
    return {
      ok: false,
      issues: [{ part, message: `The ${PART_NAMES[part as DistPart] ?? 'distribution'} ${e.problem}.` }],
    };
  }
  return { ok: true, spec };
}

/** The cells of a DistSpec (the inverse of specFromParts). */
export function partsFromSpec(spec: DistSpec): DistParts {
  switch (spec.type) {
    case 'fixed':
      return { type: 'fixed', mode: spec.value };
    case 'uniform':
      return { type: 'uniform', low: spec.low, high: spec.high };
    case 'triangular':
    case 'pert':
      return {
        type: spec.type,
        low: spec.low,
        mode: spec.mode,
        high: spec.high,
        range: spec.range ?? 'min-max',
      };
    case 'normal':
      return { type: 'normal', mean: spec.mean, sd: spec.sd };
    case 'lognormal':
      return 'p10' in spec
        ? { type: 'lognormal', low: spec.p10, high: spec.p90 }
        : { type: 'lognormal', mean: spec.mean, sd: spec.sd };
  }
}

export type DistSummary = { mean: number; base: number; p10: number; p90: number };

const summaries = new Map<string, DistSummary>();

/** Mean, base and P10–P90 of a distribution, memoised by its parameters (grids ask often). */
export function summarise(spec: DistSpec): DistSummary {
  const key = JSON.stringify(spec);
  let s = summaries.get(key);
  if (!s) {
    const d: Distribution = createDistribution(spec, { where: '', field: '' });
    s = { mean: d.mean, base: d.base, p10: d.quantile(0.1), p90: d.quantile(0.9) };
    if (summaries.size > 20_000) summaries.clear();
    summaries.set(key, s);
  }
  return s;
}

const means = new Map<string, number>();

/** The mean alone: no quantiles, so no tables are built (totals over thousands of lines). */
export function meanOf(spec: DistSpec): number {
  const key = JSON.stringify(spec);
  let m = means.get(key);
  if (m === undefined) {
    m = createDistribution(spec, { where: '', field: '' }).mean;
    if (means.size > 20_000) means.clear();
    means.set(key, m);
  }
  return m;
}
