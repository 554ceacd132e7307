import 'server-only';
// Records of the register tables ↔ the flat rows the grids, files and API speak.
// Distributions are stored as the engine's DistSpec JSON; rows carry them as cells. A risk names
// its activities and cost lines by code, as an activity names its predecessors.

import type { Activity, Correlation, CostItem, RiskDriver, RiskEvent } from '@/models';
import type { PredecessorLink } from '@/lib/registers/predecessors';
import { partsFromSpec, specFromParts, type DistParts } from '@/lib/registers/dist-fields';
import type { DistSpec } from '@/lib/sim';
import {
  anyPostCell,
  IMPACT_CELLS,
  impactParts,
  mitigationParts,
  type ImpactPrefix,
} from '@/lib/registers/risk-fields';
import {
  type ActivityData,
  type CorrelationData,
  type DriverData,
  type LineItemData,
  type RegisterKind,
  type RiskData,
  type Saved,
} from '@/lib/validation/registers';

export type LineItemRow = Saved<LineItemData>;
export type RiskRow = Saved<RiskData>;
export type ActivityRow = Saved<ActivityData>;
export type CorrelationRow = Saved<CorrelationData>;
export type DriverRow = Saved<DriverData>;
export type RegisterRow = {
  items: LineItemRow;
  risks: RiskRow;
  activities: ActivityRow;
  correlations: CorrelationRow;
  drivers: DriverRow;
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

/** The basis a line item is read as: a lump sum, or a rate per day of an activity or of the project. */
function basisOf(r: Pick<CostItem, 'span'>, perDay: boolean): LineItemData['basis'] {
  if (!perDay) return 'lump-sum';
  return r.span === 'project' ? 'per-project-day' : 'per-day';
}

/** The columns of a line item that its base amount depends on. */
export type ItemBaseColumns = Pick<CostItem, 'base' | 'dist' | 'ratePerDay' | 'activityId' | 'span'>;

/** The cells of a line's row that its base amount is read from (the projects list reads only these). */
export function itemBaseCells(r: ItemBaseColumns, activityCode: ReadonlyMap<number, string>) {
  const rate = json<DistSpec | number | null>(r.ratePerDay);
  const perDay = rate !== null && rate !== undefined;
  const spec: DistSpec | null = perDay ? numberOrSpec(rate) : json<DistSpec | null>(r.dist);
  const basis = basisOf(r, perDay);
  return {
    basis,
    activityCode: basis === 'per-day' && r.activityId ? (activityCode.get(r.activityId) ?? null) : null,
    ...cells(spec),
    base: r.base ?? null,
  };
}

export function itemRow(r: CostItem, activityCode: Map<number, string>): LineItemRow {
  const { basis, activityCode: linked, base, ...dist } = itemBaseCells(r, activityCode);
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code: r.code,
    description: r.description,
    basis,
    activityCode: linked,
    ...dist,
    base,
    ownerName: r.ownerName ?? null,
    notes: r.notes ?? null,
  };
}

export function itemAttributes(d: LineItemData, activityId: ReadonlyMap<string, number>) {
  const spec = d.distType ? specOf({ ...d, type: d.distType }) : null;
  const perDay = d.basis !== 'lump-sum';
  return {
    code: d.code,
    description: d.description,
    base: d.base,
    dist: perDay ? null : spec,
    ratePerDay: perDay && spec ? (spec.type === 'fixed' ? spec.value : spec) : null,
    activityId: d.basis === 'per-day' && d.activityCode ? (activityId.get(d.activityCode) ?? null) : null,
    span: d.basis === 'per-project-day' ? ('project' as const) : null,
    ownerName: d.ownerName,
    notes: d.notes,
  };
}

/** A stored number-or-distribution (a rate, a response's cost) as a distribution. */
const numberOrSpec = (v: DistSpec | number): DistSpec =>
  typeof v === 'number' ? { type: 'fixed', value: v } : v;

function impactCells(spec: DistSpec | null, prefix: ImpactPrefix) {
  const p = spec ? partsFromSpec(spec) : null;
  const out: Record<string, unknown> = {};
  for (const cell of IMPACT_CELLS) {
    const part = cell === 'Mode' ? 'mode' : (cell.toLowerCase() as 'low' | 'high' | 'mean' | 'sd');
    out[`${prefix}${cell}`] = p?.[part] ?? null;
  }
  if (prefix === 'cost' || prefix === 'delay') out[`${prefix}Type`] = p?.type ?? null;
  return out;
}

function mitigationCells(stored: DistSpec | number | null) {
  if (stored === null || stored === undefined)
    return { mitigationType: null, mitigationLow: null, mitigationCost: null, mitigationHigh: null };
  const p = partsFromSpec(numberOrSpec(stored));
  return {
    mitigationType: p.type,
    mitigationLow: p.low ?? null,
    mitigationCost: p.mode ?? null,
    mitigationHigh: p.high ?? null,
  };
}

/** The activities a risk delays: its codes, or the single link of a row written before them. */
export function riskActivityCodes(r: RiskEvent, activityCode: ReadonlyMap<number, string>): string[] {
  const codes = json<string[] | null>(r.activityCodes);
  if (codes) return codes;
  const single = r.activityId ? activityCode.get(r.activityId) : undefined;
  return single ? [single] : [];
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
    activityCodes: riskActivityCodes(r, activityCode),
    itemCodes: json<string[] | null>(r.itemCodes) ?? [],
    sizes: r.sizes ?? 'linked',
    ...mitigationCells(json(r.mitigationCost)),
    postProbability: r.postProbability ?? null,
    ...impactCells(json(r.postCostImpact), 'postCost'),
    ...impactCells(json(r.postDelayImpact), 'postDelay'),
  } as RiskRow;
}

export function riskAttributes(d: RiskData) {
  const spec = (prefix: ImpactPrefix) => {
    const parts = impactParts(d, prefix);
    const post = prefix === 'postCost' || prefix === 'postDelay';
    if (!parts || (post && !anyPostCell(d, prefix))) return null;
    return specOf(parts);
  };
  const mitigation = mitigationParts(d);
  const mitigationSpec = mitigation ? specOf(mitigation) : null;
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
    // Links by code (carried on rename by the register save); the single id link is retired.
    activityId: null,
    activityCodes: d.activityCodes,
    itemCodes: d.itemCodes,
    sizes: d.sizes,
    postProbability: d.postProbability,
    postCostImpact: spec('postCost'),
    postDelayImpact: spec('postDelay'),
    // A fixed amount is stored as a number, as before ranges were possible.
    mitigationCost: mitigationSpec?.type === 'fixed' ? mitigationSpec.value : mitigationSpec,
  };
}

/** The columns of an activity that the project's base durations depend on. */
export type ActivityBaseColumns = Pick<Activity, 'code' | 'duration' | 'predecessors' | 'existence'>;

/** The cells of an activity's row that base durations are read from (the projects list reads only these). */
export function activityBaseCells(r: ActivityBaseColumns) {
  return {
    code: r.code,
    ...cells(json(r.duration)),
    predecessors: (json<PredecessorLink[] | null>(r.predecessors) ?? []).map((p) =>
      p.type && p.type !== 'FS'
        ? { code: p.code, type: p.type, lag: p.lag ?? 0 }
        : { code: p.code, lag: p.lag ?? 0 },
    ),
  };
}

export function activityRow(r: Activity): ActivityRow {
  const { code, predecessors, ...duration } = activityBaseCells(r);
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code,
    name: r.name,
    ...duration,
    predecessors,
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

export function driverRow(r: RiskDriver): DriverRow {
  const { distType, range, low, mode, high } = cells(json<DistSpec>(r.factor));
  return {
    id: r.id,
    version: r.version,
    sortOrder: r.sortOrder,
    code: r.code,
    name: r.name,
    standsFor: r.standsFor ?? null,
    probability: r.probability,
    distType,
    range,
    entry: r.entry,
    low,
    mode,
    high,
    applies: json<string[]>(r.applies),
  } as DriverRow;
}

export function driverAttributes(d: DriverData) {
  return {
    code: d.code,
    name: d.name,
    standsFor: d.standsFor,
    probability: d.probability,
    factor: specOf({ ...d, type: d.distType }),
    entry: d.entry,
    applies: d.applies,
  };
}

/** The row without its id, version and place: what the audit trail records. */
export function rowData<T extends { id?: number; version?: number; sortOrder?: number; key?: string }>(
  row: T,
) {
  const { id: _id, version: _v, sortOrder: _s, key: _k, ...data } = row;
  return data;
}
