import 'server-only';
// Records of the four register tables ↔ the flat rows the grids, files and API speak.
// Distributions are stored as the engine's DistSpec JSON; rows carry them as cells.

import type { Activity, Correlation, CostItem, RiskEvent } from '@/models';
import type { PredecessorLink } from '@/lib/registers/predecessors';
import { partsFromSpec, specFromParts, type DistParts } from '@/lib/registers/dist-fields';
import type { DistSpec } from '@/lib/sim';
import {
  impactParts,
  type ActivityData,
  type CorrelationData,
  type LineItemData,
  type RegisterKind,
  type RiskData,
  type Saved,
} from '@/lib/validation/registers';

export type LineItemRow = Saved<LineItemData>;
export type RiskRow = Saved<RiskData>;
export type ActivityRow = Saved<ActivityData>;
export type CorrelationRow = Saved<CorrelationData>;
export type RegisterRow = {
  items: LineItemRow;
  risks: RiskRow;
  activities: ActivityRow;
  correlations: CorrelationRow;
};
export type AnyRow = RegisterRow[RegisterKind];

/** MariaDB hands JSON columns back as text through some paths; accept both. */
export function json<T>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}

const EMPTY_PARTS = { low: null, mode: null, high: null, mean: null, sd: null };

function cells(spec: DistSpec | null) {
  if (!spec) return { distType: null, range: null, ...EMPTY_PARTS };
  const p = partsFromSpec(spec);
  return {
    distType: p.type,
    range: p.range ?? null,
    low: p.low ?? null,
    mode: p.mode ?? null,
    high: p.high ?? null,
    mean: p.mean ?? null,
    sd: p.sd ?? null,
  };
}

export function specOf(parts: DistParts): DistSpec {
  const r = specFromParts(parts);
  if (!r.ok) throw new Error(`invalid distribution reached the database layer: ${r.issues[0].message}`);
  return r.spec;
}

export function itemRow(r: CostItem, activityCode: Map<number, string>): LineItemRow {
  const rate = json<DistSpec | number | null>(r.ratePerDay);
  const perDay = rate !== null && rate !== undefined;
  const spec: DistSpec | null = perDay
    ? typeof rate === 'number'
      ? { type: 'fixed', value: rate }
      : rate
    : json<DistSpec | null>(r.dist);
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code: r.code,
    description: r.description,
    basis: perDay ? 'per-day' : 'lump-sum',
    activityCode: perDay && r.activityId ? (activityCode.get(r.activityId) ?? null) : null,
    ...cells(spec),
    base: r.base ?? null,
    ownerName: r.ownerName ?? null,
    notes: r.notes ?? null,
  };
}

export function itemAttributes(d: LineItemData, activityId: ReadonlyMap<string, number>) {
  const spec = d.distType ? specOf({ ...d, type: d.distType }) : null;
  const perDay = d.basis === 'per-day';
  return {
    code: d.code,
    description: d.description,
    base: d.base,
    dist: perDay ? null : spec,
    ratePerDay: perDay && spec ? (spec.type === 'fixed' ? spec.value : spec) : null,
    activityId: perDay && d.activityCode ? (activityId.get(d.activityCode) ?? null) : null,
    ownerName: d.ownerName,
    notes: d.notes,
  };
}

function impactCells(spec: DistSpec | null, prefix: 'cost' | 'delay' | 'postCost' | 'postDelay') {
  const p = spec ? partsFromSpec(spec) : null;
  const out: Record<string, unknown> = {
    [`${prefix}Low`]: p?.low ?? null,
    [`${prefix}Mode`]: p?.mode ?? null,
    [`${prefix}High`]: p?.high ?? null,
  };
  if (!prefix.startsWith('post')) out[`${prefix}Type`] = p?.type ?? null;
  return out;
}

export function riskRow(r: RiskEvent, activityCode: Map<number, string>): RiskRow {
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code: r.code,
    title: r.title,
    cause: r.cause ?? null,
    event: r.event ?? null,
    effect: r.effect ?? null,
    ownerName: r.ownerName ?? null,
    status: r.status,
    response: r.response,
    probability: r.probability,
    ...impactCells(json(r.costImpact), 'cost'),
    ...impactCells(json(r.delayImpact), 'delay'),
    activityCode: r.activityId ? (activityCode.get(r.activityId) ?? null) : null,
    mitigationCost: r.mitigationCost ?? null,
    postProbability: r.postProbability ?? null,
    ...impactCells(json(r.postCostImpact), 'postCost'),
    ...impactCells(json(r.postDelayImpact), 'postDelay'),
  } as RiskRow;
}

const anySet = (d: RiskData, prefix: string) =>
  ['Low', 'Mode', 'High'].some((k) => (d as Record<string, unknown>)[`${prefix}${k}`] !== null);

export function riskAttributes(d: RiskData, activityId: ReadonlyMap<string, number>) {
  const spec = (prefix: 'cost' | 'delay' | 'postCost' | 'postDelay') => {
    const parts = impactParts(d, prefix);
    if (!parts || (prefix.startsWith('post') && !anySet(d, prefix))) return null;
    return specOf(parts);
  };
  return {
    code: d.code,
    title: d.title,
    cause: d.cause,
    event: d.event,
    effect: d.effect,
    ownerName: d.ownerName,
    status: d.status,
    response: d.response,
    probability: d.probability,
    costImpact: spec('cost'),
    delayImpact: spec('delay'),
    activityId: d.activityCode ? (activityId.get(d.activityCode) ?? null) : null,
    postProbability: d.postProbability,
    postCostImpact: spec('postCost'),
    postDelayImpact: spec('postDelay'),
    mitigationCost: d.mitigationCost,
  };
}

export function activityRow(r: Activity): ActivityRow {
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code: r.code,
    name: r.name,
    ...cells(json(r.duration)),
    predecessors: (json<PredecessorLink[] | null>(r.predecessors) ?? []).map((p) =>
      p.type && p.type !== 'FS'
        ? { code: p.code, type: p.type, lag: p.lag ?? 0 }
        : { code: p.code, lag: p.lag ?? 0 },
    ),
    existence: r.existence ?? null,
  } as ActivityRow;
}

export function activityAttributes(d: ActivityData) {
  return {
    code: d.code,
    name: d.name,
    duration: specOf({ ...d, type: d.distType }),
    predecessors: d.predecessors.map((p) =>
      p.type && p.type !== 'FS' ? { code: p.code, type: p.type, lag: p.lag } : { code: p.code, lag: p.lag },
    ),
    existence: d.existence,
  };
}

export function correlationRow(r: Correlation): CorrelationRow {
  return { id: r.id, version: r.version, sortOrder: 0, aCode: r.aCode, bCode: r.bCode, rho: r.rho };
}

export function correlationAttributes(d: CorrelationData) {
  return { aCode: d.aCode, bCode: d.bCode, rho: d.rho };
}

/** The row without its id, version and place: what the audit trail records. */
export function rowData<T extends { id?: number; version?: number; sortOrder?: number; key?: string }>(
  row: T,
) {
  const { id: _id, version: _v, sortOrder: _s, key: _k, ...data } = row;
  return data;
}
